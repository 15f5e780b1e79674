// Seasonal wood movement and equilibrium moisture content.
// - ΔD = D · C · (M_final − M_initial): Wood Handbook FPL-GTR-190 (2010), Eq. 13-2; linear only
//   between about 6 % and 14 % MC (same source), so we warn outside that band.
// - EMC from relative humidity and temperature: the Hailwood–Horrobin fit in USDA FPL Research
//   Note FPL-RN-0268, as quoted in the Wood Handbook.
import { getSpecies, PLYWOOD_COEFFICIENT } from './species';

export type Cut = 'flatsawn' | 'quartersawn' | 'plywood';

export const LINEAR_MC_MIN = 6;
export const LINEAR_MC_MAX = 14;

/** The coefficient per 1 % MC across the width for a species and cut (C_T flatsawn, C_R quartersawn). */
export function movementCoefficient(speciesId: string, cut: Cut): number {
  if (cut === 'plywood' || speciesId === 'plywood') return PLYWOOD_COEFFICIENT;
  const s = getSpecies(speciesId);
  if (!s) throw new Error(`Unknown species "${speciesId}"`);
  return cut === 'quartersawn' ? s.cR : s.cT;
}

/** Eq. 13-2: signed change in dimension (mm when width is mm) from mcFrom to mcTo (percent). */
export function dimensionalChange(width: number, coefficient: number, mcFrom: number, mcTo: number): number {
  return width * coefficient * (mcTo - mcFrom);
}

export interface MovementResult {
  /** Signed change, same unit as width: positive = swelling. */
  change: number;
  coefficient: number;
  /** Set when either MC lies outside the 6–14 % band where Eq. 13-2 is linear. */
  outsideLinearRange: boolean;
}

export function woodMovement(opts: { species: string; cut: Cut; width: number; mcFrom: number; mcTo: number }): MovementResult {
  const coefficient = movementCoefficient(opts.species, opts.cut);
  return {
    change: dimensionalChange(opts.width, coefficient, opts.mcFrom, opts.mcTo),
    coefficient,
    outsideLinearRange: isOutsideLinearRange(opts.mcFrom) || isOutsideLinearRange(opts.mcTo),
  };
}

export function isOutsideLinearRange(mc: number): boolean {
  return mc < LINEAR_MC_MIN || mc > LINEAR_MC_MAX;
}

/**
 * Equilibrium moisture content (percent) at relative humidity `rh` (percent, 0–100) and
 * temperature `tempC` (°C), Hailwood–Horrobin fit (FPL-RN-0268):
 * W = 349 + 1.29T + 0.0135T²; K = 0.805 + 0.000736T − 0.00000273T²;
 * K1 = 6.27 − 0.00938T − 0.000303T²; K2 = 1.91 + 0.0407T − 0.000293T²;
 * EMC = (1800/W)·[Kh/(1−Kh) + (K1Kh + 2K1K2K²h²)/(1 + K1Kh + K1K2K²h²)], h = RH/100.
 */
export function emc(rh: number, tempC: number): number {
  const T = tempC;
  const h = rh / 100;
  const W = 349 + 1.29 * T + 0.0135 * T * T;
  const K = 0.805 + 0.000736 * T - 0.00000273 * T * T;
  const K1 = 6.27 - 0.00938 * T - 0.000303 * T * T;
  const K2 = 1.91 + 0.0407 * T - 0.000293 * T * T;
  const Kh = K * h;
  return (1800 / W) * (Kh / (1 - Kh) + (K1 * Kh + 2 * K1 * K2 * Kh * Kh) / (1 + K1 * Kh + K1 * K2 * Kh * Kh));
}

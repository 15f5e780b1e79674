// Suggests the clearance per side for the next cut from a shop's fit history for one device and
// material. Common practice: sneak up on a fit — between the largest clearance that still came
// out tight and the smallest that came out loose; where cuts came out good, stay with them.
export interface CutResult {
  clearanceMm: number;
  result: 'tight' | 'good' | 'loose';
}

export interface ClearanceSuggestion {
  clearanceMm: number;
  basis: string;
  cuts: number;
}

/** The step taken when all cuts so far erred the same way (common practice: about 0.25 mm). */
export const CLEARANCE_STEP_MM = 0.25;

export function suggestClearance(cuts: CutResult[], step = CLEARANCE_STEP_MM): ClearanceSuggestion | null {
  const valid = cuts.filter((c) => Number.isFinite(c.clearanceMm) && c.clearanceMm >= 0);
  if (valid.length === 0) return null;
  const tight = valid.filter((c) => c.result === 'tight').map((c) => c.clearanceMm);
  const good = valid.filter((c) => c.result === 'good').map((c) => c.clearanceMm);
  const loose = valid.filter((c) => c.result === 'loose').map((c) => c.clearanceMm);
  const low = tight.length ? Math.max(...tight) : -Infinity; // anything at or below fitted tight
  const high = loose.length ? Math.min(...loose) : Infinity; // anything at or above fitted loose
  const r = (x: number) => Math.round(x * 1000) / 1000;

  if (good.length) {
    // Good cuts that contradict the bounds (a tighter cut with more clearance) are kept out.
    const consistent = good.filter((g) => g > low && g < high);
    const use = consistent.length ? consistent : good;
    const mean = use.reduce((s, g) => s + g, 0) / use.length;
    return { clearanceMm: r(mean), basis: `mean of ${use.length} good cut(s)`, cuts: valid.length };
  }
  if (tight.length && loose.length && low < high) {
    return { clearanceMm: r((low + high) / 2), basis: `halfway between tight at ${r(low)} mm and loose at ${r(high)} mm`, cuts: valid.length };
  }
  if (tight.length && !loose.length) {
    return { clearanceMm: r(low + step), basis: `${step} mm more than the loosest tight cut (${r(low)} mm)`, cuts: valid.length };
  }
  if (loose.length && !tight.length) {
    return { clearanceMm: r(Math.max(0, high - step)), basis: `${step} mm less than the tightest loose cut (${r(high)} mm)`, cuts: valid.length };
  }
  // Tight at or above loose: the history disagrees with itself (different bits or stock?).
  return { clearanceMm: r((low + high) / 2), basis: 'the cuts disagree: check bit and stock before trusting this', cuts: valid.length };
}

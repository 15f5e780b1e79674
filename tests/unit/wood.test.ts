import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../shared/calculators';
import { dimensionalChange, emc, movementCoefficient, woodMovement } from '../../shared/wood/movement';
import { getSpecies, PLYWOOD_COEFFICIENT } from '../../shared/wood/species';

describe('wood movement — USDA Wood Handbook FPL-GTR-190 (2010), ch. 13', () => {
  it('carries the Table 13-5 coefficients (C_R, C_T per 1 % MC)', () => {
    const table: [string, number, number][] = [
      ['white-oak', 0.0018, 0.00365],
      ['red-oak', 0.00158, 0.00369],
      ['hard-maple', 0.00165, 0.00353],
      ['black-cherry', 0.00126, 0.00248],
      ['black-walnut', 0.0019, 0.00274],
    ];
    for (const [id, cR, cT] of table) {
      expect(getSpecies(id)).toMatchObject({ cR, cT, source: 'FPL-GTR-190 Table 13-5' });
    }
  });

  it('Eq. 13-2 worked values: 200 mm flatsawn white oak 6 → 12 % swells 4.380 mm; quartersawn 2.160 mm', () => {
    expect(woodMovement({ species: 'white-oak', cut: 'flatsawn', width: 200, mcFrom: 6, mcTo: 12 }).change).toBeCloseTo(4.38, 6);
    expect(woodMovement({ species: 'white-oak', cut: 'quartersawn', width: 200, mcFrom: 6, mcTo: 12 }).change).toBeCloseTo(2.16, 6);
  });

  it('Eq. 13-2 in inches: 12 in flatsawn white oak 6 → 12 % moves 0.2628 in', () => {
    expect(dimensionalChange(12, movementCoefficient('white-oak', 'flatsawn'), 6, 12)).toBeCloseTo(0.2628, 6);
  });

  it('shrinks with a negative sign when drying', () => {
    expect(woodMovement({ species: 'white-oak', cut: 'flatsawn', width: 200, mcFrom: 12, mcTo: 6 }).change).toBeCloseTo(-4.38, 6);
  });

  it('uses about 1.5e-4 per 1 % MC for plywood (panel-industry data: 1–2 × 10⁻⁴), 1/20–1/40 of flatsawn oak', () => {
    expect(PLYWOOD_COEFFICIENT).toBeGreaterThanOrEqual(1e-4);
    expect(PLYWOOD_COEFFICIENT).toBeLessThanOrEqual(2e-4);
    expect(movementCoefficient('white-oak', 'plywood')).toBe(PLYWOOD_COEFFICIENT);
    const ratio = movementCoefficient('white-oak', 'flatsawn') / PLYWOOD_COEFFICIENT;
    expect(ratio).toBeGreaterThan(20);
    expect(ratio).toBeLessThan(40);
  });

  it('flags moisture contents outside 6–14 %, where Eq. 13-2 stops being linear', () => {
    expect(woodMovement({ species: 'red-oak', cut: 'flatsawn', width: 100, mcFrom: 6, mcTo: 14 }).outsideLinearRange).toBe(false);
    expect(woodMovement({ species: 'red-oak', cut: 'flatsawn', width: 100, mcFrom: 5, mcTo: 12 }).outsideLinearRange).toBe(true);
    expect(woodMovement({ species: 'red-oak', cut: 'flatsawn', width: 100, mcFrom: 8, mcTo: 16 }).outsideLinearRange).toBe(true);
  });
});

describe('equilibrium moisture content — Hailwood–Horrobin fit, USDA FPL-RN-0268', () => {
  // Wood Handbook EMC table at 21.1 °C (70 °F); the table's number is from memory.
  it.each([
    [30, 6.2],
    [50, 9.2],
    [65, 12.0],
    [80, 16.0],
  ])('at 21.1 °C and %i %% RH gives %f %% (±0.05)', (rh, expected) => {
    expect(Math.abs(emc(rh, 21.1) - expected)).toBeLessThanOrEqual(0.05);
  });

  it('is 0 at 0 % RH and rises with humidity', () => {
    expect(emc(0, 21.1)).toBe(0);
    for (let rh = 5; rh <= 95; rh += 5) expect(emc(rh, 21.1)).toBeGreaterThan(emc(rh - 5, 21.1));
  });
});

describe('wood-movement calculator', () => {
  it('gives the Wood Handbook worked value and no warning inside 6–14 %', () => {
    const r = runCalculator('wood-movement', { species: 'white-oak', cut: 'flatsawn', width: 200, mcFrom: 6, mcTo: 12 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.result.values.find((v) => v.key === 'change')).toMatchObject({ value: 4.38, unit: 'mm', label: 'Swelling' });
    expect(r.result.warnings).toEqual([]);
  });

  it('converts relative humidity through EMC (FPL-RN-0268) and warns outside 6–14 %', () => {
    const r = runCalculator('wood-movement', { species: 'white-oak', cut: 'quartersawn', width: 200, mode: 'rh', rhFrom: 30, rhTo: 80, temperature: 21.1 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const from = emc(30, 21.1);
    const to = emc(80, 21.1);
    expect(r.result.values.find((v) => v.key === 'signedChange')?.value).toBeCloseTo(200 * 0.0018 * (to - from), 4);
    expect(r.result.warnings.map((w) => w.code)).toEqual(['mc_outside_linear_range']);
    expect(r.result.warnings[0].fields).toEqual(['rhFrom', 'rhTo']);
  });

  it('marks species whose coefficients are from memory', () => {
    const r = runCalculator('wood-movement', { species: 'white-ash' });
    expect(r.ok && r.result.warnings.map((w) => w.code)).toEqual(['coefficient_from_memory']);
  });
});

import { describe, expect, it } from 'vitest';
import { CALCULATORS, getCalculator, runCalculator } from '../../shared/calculators';

const value = (id: string, params: Record<string, unknown>, key: string) => {
  const r = runCalculator(id, params);
  if (!r.ok) throw new Error(`${id}: ${r.message}`);
  const v = r.result.values.find((x) => x.key === key);
  if (!v) throw new Error(`${id}: no ${key}`);
  return v.value as number;
};

describe('taper (pure geometry: θ = atan((W_wide − W_narrow) / L))', () => {
  it('2 in → 1 in over 24 in on one edge: 2.3859°', () => {
    expect(value('taper', { wide: 50.8, narrow: 25.4, length: 609.6, edges: 'one' }, 'anglePerEdge')).toBeCloseTo(2.3859, 4);
    expect(value('taper', { wide: 50.8, narrow: 25.4, length: 609.6, edges: 'one' }, 'offsetPerEdge')).toBeCloseTo(25.4, 6);
  });
  it('split over two edges: 1.1935° each, half the offset', () => {
    expect(value('taper', { wide: 50.8, narrow: 25.4, length: 609.6, edges: 'two' }, 'anglePerEdge')).toBeCloseTo(1.1935, 4);
    expect(value('taper', { wide: 50.8, narrow: 25.4, length: 609.6, edges: 'two' }, 'offsetPerEdge')).toBeCloseTo(12.7, 6);
  });
  it('refuses a narrow end wider than the wide end, on the field', () => {
    const r = runCalculator('taper', { wide: 25, narrow: 50 });
    expect(r).toMatchObject({ ok: false, fields: { narrow: expect.stringMatching(/Narrow end/) } });
  });
});

describe('compound bevel (blade tilt = asin(cos S·sin(180°/N)), miter gauge = atan(sin S·tan(180°/N)); table-saw manual charts)', () => {
  it.each([
    [4, 5, 44.78, 4.98],
    [4, 10, 44.14, 9.85],
    [4, 15, 43.08, 14.51],
    [4, 20, 41.64, 18.88],
    [4, 45, 30.0, 35.26],
    [6, 30, 25.66, 16.1],
  ])('N = %i, S = %i° → %f° / %f°', (sides, splay, tilt, gauge) => {
    expect(value('compound-bevel', { sides, splay }, 'bladeTilt')).toBeCloseTo(tilt, 2);
    expect(value('compound-bevel', { sides, splay }, 'miterGauge')).toBeCloseTo(gauge, 2);
  });
  it('with no splay is a plain miter: 45° tilt, gauge square, for four sides', () => {
    expect(value('compound-bevel', { sides: 4, splay: 0 }, 'bladeTilt')).toBeCloseTo(45, 9);
    expect(value('compound-bevel', { sides: 4, splay: 0 }, 'miterGauge')).toBe(0);
  });
});

describe('frame miter (each piece cut at α/2; common practice)', () => {
  it.each([
    [90, 45],
    [85, 42.5],
    [95, 47.5],
  ])('corner %i° → %f° per piece', (cornerAngle, cut) => {
    expect(value('frame-miter', { cornerAngle }, 'cutAngle')).toBeCloseTo(cut, 9);
    expect(value('frame-miter', { cornerAngle }, 'sawSetting')).toBeCloseTo(90 - cut, 9);
  });
  it('a regular frame of N pieces has corners of 180° − 360°/N (pure geometry): hexagon 120° → 60°', () => {
    expect(value('frame-miter', { mode: 'pieces', pieces: 6 }, 'cornerAngle')).toBeCloseTo(120, 9);
    expect(value('frame-miter', { mode: 'pieces', pieces: 6 }, 'cutAngle')).toBeCloseTo(60, 9);
    expect(value('frame-miter', { mode: 'pieces', pieces: 8 }, 'cutAngle')).toBeCloseTo(67.5, 9);
  });
});

describe('calculator registry', () => {
  it('lists the four calculators, each computing from its defaults', () => {
    expect(CALCULATORS.map((c) => c.id)).toEqual(['wood-movement', 'taper', 'compound-bevel', 'frame-miter']);
    for (const c of CALCULATORS) {
      const r = runCalculator(c.id, {});
      expect(r.ok, c.id).toBe(true);
      if (r.ok) expect(r.result.values.length).toBeGreaterThan(0);
    }
    expect(getCalculator('nope')).toBeUndefined();
  });
  it('reports bad params field by field', () => {
    const r = runCalculator('compound-bevel', { sides: 2, splay: 'steep', extra: 1 });
    expect(r).toMatchObject({ ok: false, fields: { sides: 'Sides must be at least 3', splay: 'Splay from vertical must be a number', extra: 'Unknown parameter "extra"' } });
  });
});

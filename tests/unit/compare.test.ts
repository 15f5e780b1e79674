import { describe, expect, it } from 'vitest';
import { compareRevisions, flatten } from '../../shared/compare';
import type { GeometrySummary } from '../../shared/schemas/geometry';

const summary = (w: number, h: number, pocket: [number, number]): GeometrySummary => ({
  units: 'mm',
  extents: { minX: 0, minY: 0, maxX: w, maxY: h, width: w, height: h },
  area: w * h,
  perimeter: 2 * (w + h),
  closedContours: 2,
  openContours: 0,
  layers: { outline: 4, pocket: 4 },
  features: { pocket: { width: pocket[0], height: pocket[1], depth: 9 } },
});

describe('revision compare', () => {
  it('flattens nested fit notes to dotted keys', () => {
    expect(flatten({ device: { width: 70, cased: true }, text: 'x' })).toEqual({ 'device.width': 70, 'device.cased': true, text: 'x' });
  });
  it('gives signed deltas B − A for parameters, fit notes and geometry (pocket 72 → 78.5 mm: +6.5)', () => {
    const a = { params: { deviceWidth: 70, pocketDepth: 9, cornerStyle: 'round' }, fitNotes: { device: { width: 70, cased: false } }, summary: summary(120, 200, [72, 150]) };
    const b = { params: { deviceWidth: 76.5, pocketDepth: 9, cornerStyle: 'round' }, fitNotes: { device: { width: 76.5, cased: true } }, summary: summary(120, 200, [78.5, 158]) };
    const rows = compareRevisions(a, b);
    const get = (section: string, key: string) => rows.find((r) => r.section === section && r.key === key)!;
    expect(get('parameters', 'deviceWidth')).toMatchObject({ delta: 6.5, unit: 'mm', changed: true });
    expect(get('parameters', 'pocketDepth')).toMatchObject({ delta: 0, changed: false });
    expect(get('parameters', 'cornerStyle')).toMatchObject({ delta: null, changed: false, unit: null });
    expect(get('fit notes', 'device.cased')).toMatchObject({ a: false, b: true, changed: true });
    expect(get('geometry', 'pocket.width')).toMatchObject({ a: 72, b: 78.5, delta: 6.5, unit: 'mm' });
    expect(get('geometry', 'pocket.height')).toMatchObject({ delta: 8 });
    expect(get('geometry', 'area')).toMatchObject({ delta: 0, unit: 'mm2' });
  });
  it('shows a parameter present on one side only', () => {
    const rows = compareRevisions({ params: { a: 1 }, fitNotes: {}, summary: summary(1, 1, [1, 1]) }, { params: { b: 2 }, fitNotes: {}, summary: summary(1, 1, [1, 1]) });
    expect(rows.filter((r) => r.section === 'parameters').map((r) => [r.key, r.a, r.b])).toEqual([['a', 1, null], ['b', null, 2]]);
  });
});

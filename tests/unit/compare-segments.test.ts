// The compare overlay's segment classification (components/compare/segments.ts). SVG path
// grammar (M, L, H, V, A, Z, absolute) from the W3C SVG 1.1 specification, section 8.3.
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { classifySegments, segmentsOf } from '../../components/compare/segments';
import { pathsInFrame, unionFrame } from '../../components/compare/frame';

describe('segmentsOf', () => {
  it('splits lines, closes a sub-path with Z and keys a line the same both ways round', () => {
    const square = segmentsOf('outline', 'M0 0 L10 0 L10 10 L0 10 Z');
    expect(square).toHaveLength(4);
    const back = segmentsOf('outline', 'M10 0 L0 0');
    expect(back[0].key).toBe(square[0].key);
    expect(segmentsOf('pocket', 'M0 0 L10 0')[0].key).not.toBe(square[0].key); // another layer
  });
  it('rounds to 0.01 mm: 0.004 apart is the same segment, 0.02 apart is not', () => {
    const a = segmentsOf('outline', 'M0 0 L10 0')[0].key;
    expect(segmentsOf('outline', 'M0.004 0 L10 0')[0].key).toBe(a);
    expect(segmentsOf('outline', 'M0.02 0 L10 0')[0].key).not.toBe(a);
  });
  it('reads arcs, H and V, and an arc drawn backwards with the sweep flipped is the same arc', () => {
    const arc = segmentsOf('recess', 'M 0 0 A 5 5 0 0 1 10 0');
    const reversed = segmentsOf('recess', 'M 10 0 A 5 5 0 0 0 0 0');
    expect(arc[0].key).toBe(reversed[0].key);
    expect(segmentsOf('recess', 'M 10 0 A 5 5 0 0 1 0 0')[0].key).not.toBe(arc[0].key); // the other half-circle
    expect(segmentsOf('x', 'M0 0 H5 V5').map((s) => s.key)).toEqual(['x|L|0.00,0.00|5.00,0.00', 'x|L|5.00,0.00|5.00,5.00']);
  });
});

describe('classifySegments', () => {
  it('sorts each segment into only A, only B or both, one path string per class', () => {
    const a = [{ layer: 'outline', d: 'M0 0 L10 0 L10 10 L0 10 Z' }];
    const b = [{ layer: 'outline', d: 'M0 0 L10 0 L10 12 L0 12 Z' }];
    const c = classifySegments(a, b);
    expect(c.counts).toEqual({ both: 1, onlyA: 3, onlyB: 3 });
    expect(c.d.both).toBe('M0 0L10 0');
    expect(c.d.onlyA.match(/M/g)).toHaveLength(3);
  });
  it('handles 5,000 segments a side quickly (a Map, not pairwise)', () => {
    const lines = (shift: number) => Array.from({ length: 5000 }, (_, i) => `M${i} 0L${i} ${10 + (i % 2 ? shift : 0)}`).join('');
    const t = performance.now();
    const c = classifySegments([{ layer: '0', d: lines(0) }], [{ layer: '0', d: lines(1) }]);
    expect(performance.now() - t).toBeLessThan(1000);
    expect(c.counts).toEqual({ both: 2500, onlyA: 2500, onlyB: 2500 });
  });
});

describe('pathsInFrame', () => {
  it('puts two models in one frame so a shared edge lands on the same coordinates', () => {
    const small: makerjs.IModel = { paths: { a: new makerjs.paths.Line([0, 0], [10, 0]), b: new makerjs.paths.Line([10, 0], [10, 10]) } };
    const big: makerjs.IModel = { paths: { a: new makerjs.paths.Line([0, 0], [10, 0]), b: new makerjs.paths.Line([10, 0], [10, 20]) } };
    const frame = unionFrame([small, big])!;
    expect([frame.width, frame.height]).toEqual([10, 20]);
    const c = classifySegments(pathsInFrame(small, frame), pathsInFrame(big, frame));
    expect(c.counts).toEqual({ both: 1, onlyA: 1, onlyB: 1 });
  });
});

import { panBy, zoomAbout, zoomOf } from '../../components/drawing/panzoom';

describe('pan and zoom arithmetic', () => {
  const home = { x: 0, y: 0, width: 200, height: 100 };
  it('zooms about the pointer: the point under it stays put', () => {
    const z = zoomAbout(home, home, 2, 0.25, 0.5);
    expect(z).toEqual({ x: 25, y: 25, width: 100, height: 50 });
    // the drawing point at 25% across was x = 50 before and is still 50 after
    expect(z.x + 0.25 * z.width).toBe(50);
    expect(zoomOf(z, home)).toBe(2);
  });
  it('keeps the zoom between its limits and ignores nonsense factors', () => {
    expect(zoomOf(zoomAbout(home, home, 1000), home)).toBe(40);
    expect(zoomOf(zoomAbout(home, home, 0.001), home)).toBe(0.5);
    expect(zoomAbout(home, home, Number.NaN)).toBe(home);
  });
  it('pans by screen pixels: 100 px right on a 400 px canvas of 200 mm shows 50 mm further left', () => {
    expect(panBy(home, 100, -40, 400)).toEqual({ x: -50, y: 20, width: 200, height: 100 });
  });
});

import { layerSubset, undersideModel } from '../../components/revision/underside';

describe('underside view', () => {
  // A 100 × 200 plate (longer in y) with a recess near the left edge and a top pocket.
  const plate = (): makerjs.IModel => ({
    models: {
      outline: { layer: 'outline', models: { r: new makerjs.models.Rectangle(100, 200) } },
      recess: { layer: 'recess', paths: { c: new makerjs.paths.Circle([20, 100], 10) } },
      pocket: { layer: 'pocket', models: { r: makerjs.model.move(new makerjs.models.Rectangle(40, 80), [30, 60]) } },
    },
  });
  it('keeps only the chosen layers, inherited from parent models', () => {
    const s = layerSubset(plate(), ['recess'])!;
    expect(Object.keys(s.models!)).toEqual(['recess']);
    expect(layerSubset(plate(), ['channel'])).toBeNull();
  });
  it('mirrors about the long axis: a recess 20 mm from the left edge is 20 mm from the right edge underneath', () => {
    const u = undersideModel(plate(), { width: 100, length: 200 })!;
    const recess = layerSubset(u, ['recess'])!;
    const e = makerjs.measure.modelExtents(recess)!;
    expect(e.low[0]).toBeCloseTo(70, 6);
    expect(e.high[0]).toBeCloseTo(90, 6);
    expect(e.low[1]).toBeCloseTo(90, 6); // along the long axis nothing moves
    expect(layerSubset(u, ['pocket'])).toBeNull(); // top-face pocket left out
    const all = makerjs.measure.modelExtents(u)!;
    expect([all.low[0], all.high[0]]).toEqual([0, 100]);
  });
});

import { changedFirst, formatDelta, formatValue } from '../../components/compare/diffFormat';

describe('difference table text', () => {
  it('signs deltas in the chosen units: 10 mm is +10.0 mm and +0.394 in (10 / 25.4 = 0.3937)', () => {
    expect(formatDelta({ delta: 10, unit: 'mm' }, 'mm')).toBe('+10.0 mm');
    expect(formatDelta({ delta: 10, unit: 'mm' }, 'in')).toBe('+0.394 in');
    expect(formatDelta({ delta: -2.8, unit: 'mm' }, 'mm')).toBe('−2.8 mm');
    expect(formatDelta({ delta: 0, unit: 'mm' }, 'mm')).toBe('±0.0 mm');
    expect(formatDelta({ delta: -0.04, unit: 'mm' }, 'mm')).toBe('−0.04 mm'); // a real change never reads ±0
    expect(formatDelta({ delta: 0.01, unit: 'mm' }, 'in')).toBe('+0.0004 in');
    expect(formatDelta({ delta: 645.16, unit: 'mm2' }, 'in')).toBe('+1.00 in²');
    expect(formatDelta({ delta: 2, unit: null }, 'mm')).toBe('+2');
    expect(formatDelta({ delta: null, unit: null }, 'mm')).toBeNull();
  });
  it('writes values and puts changed rows first', () => {
    expect(formatValue(25.4, 'mm', 'in')).toBe('1.000 in');
    expect(formatValue('walnut', null, 'mm')).toBe('walnut');
    const rows = [
      { section: 'parameters', key: 'a', a: 1, b: 1, delta: 0, unit: null, changed: false },
      { section: 'parameters', key: 'b', a: 1, b: 2, delta: 1, unit: null, changed: true },
    ] as const;
    expect(changedFirst([...rows]).map((r) => r.key)).toEqual(['b', 'a']);
  });
});

describe('pathsInFrame writes arcs and circles where makerjs would', () => {
  it('draws a quarter arc and a circle with the y axis flipped (checked against makerjs extents)', () => {
    // Quarter arc of radius 10 about (10, 0) from 0° to 90°: (20, 0) to (10, 10), counter-clockwise.
    const m: makerjs.IModel = { paths: { a: new makerjs.paths.Arc([10, 0], 10, 0, 90), c: new makerjs.paths.Circle([40, 5], 5), l: new makerjs.paths.Line([0, 0], [45, 0]) } };
    const frame = unionFrame([m])!;
    expect([frame.width, frame.height]).toEqual([45, 10]);
    const [p] = pathsInFrame(m, frame);
    expect(p.layer).toBe('0');
    expect(p.d).toContain('M20 10A10 10 0 0 0 10 0'); // y 0 → 10 (bottom), y 10 → 0 (top)
    expect(p.d).toContain('M45 5A5 5 0 0 0 35 5A5 5 0 0 0 45 5');
    expect(p.d).toContain('M0 10L45 10');
  });
});

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import DxfParserModule from 'dxf-parser';
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { modelToLayerPaths, mirrorForUnderside, previewFrame } from '../../shared/geometry/paths';
import { dogboneCentreOffset, dogboneOvercut, reliefCircles } from '../../shared/geometry/relief';
import { contoursByFindChains, partLayerOf, summarizeModel } from '../../shared/geometry/summary';
import { renderSvg } from '../../shared/geometry/svg';
import { GENERATORS, runGenerator } from '../../shared/generators';
import { GeometrySummary } from '../../shared/schemas/geometry';

const DxfParser = ((DxfParserModule as unknown as { default?: unknown }).default ?? DxfParserModule) as new () => { parseSync(text: string): any };

const onLayer = (layer: string, model: makerjs.IModel) => ({ ...model, layer });

describe('area of closed chains (pure geometry: closed forms from REFERENCES.md)', () => {
  it('rounded rectangle w × h, r: A = w·h − (4 − π)·r²; 80 × 160, r = 3.175 → 12791.3467 mm²', () => {
    const s = summarizeModel({ models: { o: onLayer('outline', new makerjs.models.RoundRectangle(80, 160, 3.175)) } });
    expect(80 * 160 - (4 - Math.PI) * 3.175 ** 2).toBeCloseTo(12791.3467, 4);
    expect(Math.abs(s.area - 12791.3467)).toBeLessThan(0.01);
    expect(s.perimeter).toBeCloseTo(2 * (80 + 160) - 8 * 3.175 + 2 * Math.PI * 3.175, 9);
  });

  it('Steiner: a convex shape offset by d has A + P·d + π·d²; 80 × 160 offset 0.5 → 13040.7854 mm² (makerjs outline)', () => {
    const offset = makerjs.model.outline(new makerjs.models.Rectangle(80, 160), 0.5);
    const s = summarizeModel(offset);
    expect(80 * 160 + 2 * (80 + 160) * 0.5 + Math.PI * 0.25).toBeCloseTo(13040.7854, 4);
    expect(Math.abs(s.area - 13040.7854)).toBeLessThan(0.01);
  });

  it('subtracts holes and adds islands inside holes (outermost minus holes)', () => {
    const model: makerjs.IModel = {
      models: {
        plate: onLayer('outline', new makerjs.models.Rectangle(200, 100)),
        hole: onLayer('outline', { paths: { c: new makerjs.paths.Circle([60, 50], 30) } }),
        island: onLayer('outline', { paths: { c: new makerjs.paths.Circle([60, 50], 10) } }),
        slot: onLayer('outline', new makerjs.models.RoundRectangle(40, 20, 10)),
        pocket: onLayer('pocket', new makerjs.models.Rectangle(10, 10)), // other layers do not count
      },
    };
    model.models!.slot.origin = [140, 40];
    const s = summarizeModel(model);
    const expected = 200 * 100 - Math.PI * 900 + Math.PI * 100 - (40 * 20 - (4 - Math.PI) * 100);
    expect(Math.abs(s.area - expected)).toBeLessThan(0.01);
    expect(s.closedContours).toBe(5);
    expect(s.layers).toEqual({ outline: 4 + 1 + 1 + 6, pocket: 4 }); // the fully rounded slot has no zero-length sides
  });

  it('gets the sign of arcs right whichever way the chain runs (half-disc, 0.01 mm²)', () => {
    // A D shape: diameter line plus a 180° arc, built so findChains walks the arc reversed.
    const d: makerjs.IModel = { paths: { line: new makerjs.paths.Line([-20, 0], [20, 0]), arc: new makerjs.paths.Arc([0, 0], 20, 0, 180) } };
    const bulgeDown: makerjs.IModel = { paths: { line: new makerjs.paths.Line([20, 0], [-20, 0]), arc: new makerjs.paths.Arc([0, 0], 20, 180, 360) } };
    expect(Math.abs(summarizeModel(d).area - (Math.PI * 400) / 2)).toBeLessThan(0.01);
    expect(Math.abs(summarizeModel(bulgeDown).area - (Math.PI * 400) / 2)).toBeLessThan(0.01);
  });

  it('counts open contours, loose paths and per-layer paths, and fits the GeometrySummary schema', () => {
    const model: makerjs.IModel = {
      models: {
        box: onLayer('outline', new makerjs.models.Rectangle(50, 30)),
        tick: onLayer('marks', { paths: { a: new makerjs.paths.Line([0, 0], [0, 5]), b: new makerjs.paths.Line([50, 0], [50, 5]) } }),
        zig: onLayer('guide', { paths: { a: new makerjs.paths.Line([0, 10], [10, 20]), b: new makerjs.paths.Line([10, 20], [20, 10]) } }),
      },
    };
    const s = summarizeModel(model, { box: { width: 50, height: 30 } });
    expect(s).toMatchObject({ closedContours: 1, openContours: 3, layers: { outline: 4, marks: 2, guide: 2 }, area: 1500 });
    expect(s.extents).toEqual({ minX: 0, minY: 0, maxX: 50, maxY: 30, width: 50, height: 30 });
    expect(GeometrySummary.parse(s)).toEqual(s);
  });
});

describe('our chain finder agrees with makerjs.model.findChains', () => {
  const check = (model: makerjs.IModel) => {
    const s = summarizeModel(model);
    const ref = contoursByFindChains(model, partLayerOf(s.layers));
    expect({ closed: s.closedContours, open: s.openContours }).toEqual({ closed: ref.closed, open: ref.open });
    expect(s.area).toBeCloseTo(ref.area, 6);
    return s;
  };

  it.each([
    ['charger-insert', {}],
    ['charger-insert', { cornerStyle: 'dogbone', padShape: 'rect', channelEdge: 'bottom' }],
    ['taper-jig', {}],
    ['splayed-box', { sides: 5 }],
    ['half-lap', { angle: 35 }],
  ])('on %s %j', (id, params) => {
    const r = runGenerator(id, params);
    expect(r.ok).toBe(true);
    if (r.ok) check(r.result.model);
  });

  it('on open runs, reversed paths and a branching joint (which goes to makerjs)', () => {
    const run: makerjs.IModel = { layer: 'guide', paths: { a: new makerjs.paths.Line([0, 0], [10, 0]), b: new makerjs.paths.Line([20, 5], [10, 0]), c: new makerjs.paths.Arc([25, 5], 5, 180, 0) } };
    expect(check({ models: { run } }).openContours).toBe(1);
    const tee: makerjs.IModel = { layer: 'outline', paths: { a: new makerjs.paths.Line([0, 0], [10, 0]), b: new makerjs.paths.Line([10, 0], [20, 0]), c: new makerjs.paths.Line([10, 0], [10, 10]) } };
    check({ models: { tee, box: onLayer('outline', new makerjs.models.Rectangle(30, 30)) } });
  });
});

describe('corner reliefs for a square inside corner (pure geometry, REFERENCES.md)', () => {
  it('dogbone centre sits r/√2 from each wall: 1/4 in bit 2.2451 mm, 6 mm bit 2.1213 mm', () => {
    expect(dogboneCentreOffset(6.35 / 2)).toBeCloseTo(2.2451, 4);
    expect(dogboneCentreOffset(3)).toBeCloseTo(2.1213, 4);
    expect(dogboneOvercut(1)).toBeCloseTo(0.2929, 4);
  });

  it('each dogbone circle passes through its corner and overcuts each wall by r(1 − 1/√2)', () => {
    const r = 3.175;
    const circles = reliefCircles(10, 20, 80, 160, r, 'dogbone');
    const corners = [[10, 20], [90, 20], [90, 180], [10, 180]];
    circles.forEach((k, i) => {
      expect(Math.hypot(k.c[0] - corners[i][0], k.c[1] - corners[i][1])).toBeCloseTo(r, 12);
      expect(Math.abs(k.c[0] - corners[i][0])).toBeCloseTo(2.2451, 4);
      expect(Math.abs(k.c[1] - corners[i][1])).toBeCloseTo(2.2451, 4);
      expect(k.r - Math.abs(k.c[0] - corners[i][0])).toBeCloseTo(r * (1 - 1 / Math.SQRT2), 12);
    });
  });

  it('T-bone: centre r from the corner on one wall, overcutting the other wall by r only', () => {
    const r = 3;
    const [k] = reliefCircles(0, 0, 50, 100, r, 'tbone', 'ends');
    expect(k.c).toEqual([3, 0]); // on the end wall y = 0
    expect(k.c[1] - k.r).toBe(-3); // r into the end wall
    expect(k.c[0] - k.r).toBe(0); // tangent to the side wall x = 0: no overcut there
  });
});

describe('paths for the client preview and the underside mirror', () => {
  it('gives SVG path data per layer, y flipped, top-left at (0, 0)', () => {
    const model: makerjs.IModel = {
      models: {
        outline: onLayer('outline', new makerjs.models.Rectangle(100, 50)),
        marks: onLayer('marks', { paths: { t: new makerjs.paths.Line([0, 0], [10, 10]) } }),
      },
    };
    const paths = modelToLayerPaths(model);
    expect(paths.map((p) => p.layer)).toEqual(['outline', 'marks']);
    expect(paths[1].d).toMatch(/^M 0 50 (L )?10 40$/); // (0,0) bottom-left → (0,50) on screen
    expect(previewFrame(model)).toEqual({ width: 100, height: 50, viewBox: '0 0 100 50' });
  });

  it('mirrors about the long axis: x → W − x for a part longer in y; points on the axis stay', () => {
    const part = { width: 100, length: 200 };
    const model: makerjs.IModel = { models: { dot: onLayer('recess', { paths: { c: new makerjs.paths.Circle([20, 30], 5) } }), mark: onLayer('marks', { paths: { m: new makerjs.paths.Line([50, 0], [50, 3]) } }) } };
    const m = mirrorForUnderside(model, part);
    const ext = makerjs.measure.modelExtents({ models: { x: { ...m } } });
    expect(ext).toBeTruthy();
    const found: Record<string, makerjs.IPoint[]> = {};
    makerjs.model.walk(m, {
      onPath(wp) {
        const o = makerjs.point.add(wp.pathContext.origin, wp.offset);
        (found[wp.layer] ??= []).push(o);
      },
    });
    expect(found.recess[0][0]).toBeCloseTo(80, 12);
    expect(found.recess[0][1]).toBeCloseTo(30, 12);
    expect(found.marks[0][0]).toBeCloseTo(50, 12);
  });

  it('renders a standalone SVG sized in mm with one styled element per layer', () => {
    const r = runGenerator('charger-insert', {});
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const svg = renderSvg(r.result.model, { title: 'Charger <insert>' });
    expect(svg).toMatch(/^<svg [^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toMatch(/width="119.2mm"/);
    expect(svg).toContain('<title>Charger &lt;insert&gt;</title>');
    for (const layer of Object.keys(r.result.summary.layers)) expect(svg).toContain(`id="${layer}"`);
    expect(svg).toContain('stroke-dasharray:6 3'); // the pocket layer's dash (layers.ts)
  });
});

// DXF: Autodesk DXF Reference — HEADER $INSUNITS (group 70) 4 = millimetres; LINE 10/20–11/21,
// ARC 10/20 centre, 40 radius, 50/51 degrees counter-clockwise; CIRCLE 10/20, 40.
function dxfExtents(entities: any[]) {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const add = (x: number, y: number) => {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  };
  for (const e of entities) {
    if (e.type === 'LINE') e.vertices.forEach((v: any) => add(v.x, v.y));
    else if (e.type === 'CIRCLE') {
      add(e.center.x - e.radius, e.center.y - e.radius);
      add(e.center.x + e.radius, e.center.y + e.radius);
    } else if (e.type === 'ARC') {
      // dxf-parser gives the angles in radians.
      const a0 = e.startAngle;
      let a1 = e.endAngle;
      while (a1 <= a0) a1 += 2 * Math.PI;
      const at = (a: number) => add(e.center.x + e.radius * Math.cos(a), e.center.y + e.radius * Math.sin(a));
      at(a0);
      at(a1);
      for (let q = Math.ceil(a0 / (Math.PI / 2)) * (Math.PI / 2); q < a1; q += Math.PI / 2) at(q);
    } else throw new Error(`unexpected entity ${e.type}`);
  }
  return { minX, minY, maxX, maxY };
}

function ezdxfAuditFile(text: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-gen-dxf-'));
  const file = path.join(dir, 'part.dxf');
  fs.writeFileSync(file, text);
  try {
    return execFileSync('/usr/bin/python3', ['-m', 'ezdxf', 'audit', file], { encoding: 'utf8' });
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

describe('generated DXF read back by independent readers (dxf-parser, ezdxf)', () => {
  const cases: [string, Record<string, unknown>][] = [
    ['charger-insert', {}],
    ['charger-insert', { padShape: 'rect', cornerStyle: 'dogbone', channelEdge: 'top' }],
    ['charger-insert', { cornerStyle: 'tbone', padShape: 'rect', channelEdge: 'left', fingerNotch: false }],
    ['taper-jig', { edges: 'two' }],
    ['splayed-box', { sides: 6, splay: 30 }],
    ['half-lap', { angle: 60, widthB: 70 }],
  ];
  it.each(cases)('%s %j: same extents, one entity per path, $INSUNITS 4, audit clean', (id, params) => {
    const r = runGenerator(id, params);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const dxf = makerjs.exporter.toDXF(r.result.model, { units: 'mm' });
    const parsed = new DxfParser().parseSync(dxf);
    expect(parsed.header.$INSUNITS).toBe(4);
    const pathCount = Object.values(r.result.summary.layers).reduce((a, b) => a + b, 0);
    expect(parsed.entities).toHaveLength(pathCount);
    const ext = dxfExtents(parsed.entities);
    const want = r.result.summary.extents;
    expect(ext.minX).toBeCloseTo(want.minX, 6);
    expect(ext.minY).toBeCloseTo(want.minY, 6);
    expect(ext.maxX).toBeCloseTo(want.maxX, 6);
    expect(ext.maxY).toBeCloseTo(want.maxY, 6);
    const layers = new Set(parsed.entities.map((e: any) => e.layer));
    expect([...layers].sort()).toEqual(Object.keys(r.result.summary.layers).sort());
    expect(ezdxfAuditFile(dxf)).toMatch(/No errors found/);
  });

  it('covers every generator', () => {
    expect(new Set(cases.map((c) => c[0]))).toEqual(new Set(GENERATORS.map((g) => g.id)));
  });
});

describe('layer paths for the screen', () => {
  it('puts the drawing’s top-left corner at (0, 0) for a part away from the origin (SVG y down, W3C SVG 1.1 §7.3)', async () => {
    const makerjs = (await import('makerjs')).default;
    const { modelToLayerPaths } = await import('../../shared/geometry/paths');
    const rect = makerjs.model.move(new makerjs.models.Rectangle(40, 20), [100, 50]);
    const [{ d }] = modelToLayerPaths({ models: { r: rect } });
    const nums = (d.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);
    const xs = nums.filter((_, i) => i % 2 === 0);
    const ys = nums.filter((_, i) => i % 2 === 1);
    expect([Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]).toEqual([0, 40, 0, 20]);
  });
});

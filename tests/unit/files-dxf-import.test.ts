// DXF import, against hand-written DXF text. Group codes and their meaning follow the Autodesk DXF
// Reference (HEADER and ENTITIES sections) as summarised in shared/REFERENCES.md; each check names
// what it relies on. The files have no handles or subclass markers, as R12 files do; LWPOLYLINE,
// ELLIPSE and SPLINE came with later releases (R13/R14, from memory) and are written the same way.
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { importDxf } from '../../files/dxf/import';
import { FileRejected, UnitsNeeded } from '../../files/errors';
import { summarizeModel } from '../../shared/geometry/summary';

type Group = string | number;

/** DXF text from entity group lists: optional $INSUNITS / $MEASUREMENT, optional BLOCKS. */
function dxf(entities: Group[][], opts: { insunits?: number | null; measurement?: number; blocks?: Group[][] } = {}): string {
  const g: Group[] = ['0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1009'];
  const insunits = opts.insunits === undefined ? 4 : opts.insunits;
  if (insunits !== null) g.push('9', '$INSUNITS', '70', insunits);
  if (opts.measurement !== undefined) g.push('9', '$MEASUREMENT', '70', opts.measurement);
  g.push('0', 'ENDSEC');
  if (opts.blocks) g.push('0', 'SECTION', '2', 'BLOCKS', ...opts.blocks.flat(), '0', 'ENDSEC');
  g.push('0', 'SECTION', '2', 'ENTITIES', ...entities.flat(), '0', 'ENDSEC', '0', 'EOF');
  return g.join('\n') + '\n';
}

const line = (x1: number, y1: number, x2: number, y2: number, layer = 'outline'): Group[] => [0, 'LINE', 8, layer, 10, x1, 20, y1, 30, 0, 11, x2, 21, y2, 31, 0];
const square = (w: number, h: number, layer = 'outline') => [line(0, 0, w, 0, layer), line(w, 0, w, h, layer), line(w, h, 0, h, layer), line(0, h, 0, 0, layer)];

function extents(model: makerjs.IModel) {
  const e = makerjs.measure.modelExtents(model);
  if (!e) throw new Error('model has no extents');
  return { minX: e.low[0], minY: e.low[1], maxX: e.high[0], maxY: e.high[1] };
}
const pathsOf = (model: makerjs.IModel) => Object.values(model.paths ?? {});

function distanceToLine(p: number[], a: makerjs.IPoint, b: makerjs.IPoint): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  return Math.abs((p[0] - a[0]) * dy - (p[1] - a[1]) * dx) / Math.hypot(dx, dy);
}

function rejection(fn: () => unknown): FileRejected {
  try {
    fn();
  } catch (e) {
    if (e instanceof FileRejected) return e;
    throw e;
  }
  throw new Error('expected a FileRejected error');
}

describe('DXF units ($INSUNITS, HEADER group 70; Autodesk DXF Reference)', () => {
  it('reads a LINE square in millimetres ($INSUNITS 4 = millimeters)', () => {
    const r = importDxf(dxf(square(100, 50)));
    expect(r.sourceUnits).toBe('mm');
    expect(r.unitsFrom).toBe('header');
    expect(r.entityCounts).toEqual({ LINE: 4 });
    expect(pathsOf(r.model)).toHaveLength(4);
    expect(extents(r.model)).toEqual({ minX: 0, minY: 0, maxX: 100, maxY: 50 });
    // LINE 10/20 start, 11/21 end: four lines meeting end to end close one contour of 100 × 50 (D)
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    expect(s.openContours).toBe(0);
    expect(s.area).toBeCloseTo(5000, 9);
    expect(r.model.units).toBe('mm');
  });

  it('converts inches ($INSUNITS 1) at 25.4 mm per inch exactly (16 CFR 500.19)', () => {
    const r = importDxf(dxf(square(4, 2), { insunits: 1 }));
    expect(r.sourceUnits).toBe('in');
    const e = extents(r.model);
    expect(e.maxX).toBeCloseTo(101.6, 12);
    expect(e.maxY).toBeCloseTo(50.8, 12);
  });

  it.each([
    [2, 'ft', 304.8], // 1 ft = 12 in = 304.8 mm (16 CFR 500.19)
    [5, 'cm', 10],
    [6, 'm', 1000],
  ])('converts $INSUNITS %i (%s) to millimetres', (code, units, mmPerUnit) => {
    const r = importDxf(dxf(square(2, 1), { insunits: code }));
    expect(r.sourceUnits).toBe(units);
    expect(extents(r.model).maxX).toBeCloseTo(2 * mmPerUnit, 9);
  });

  it('asks for units when $INSUNITS is missing, and tells the drawing size in file units', () => {
    let err: unknown;
    try {
      importDxf(dxf(square(120, 80), { insunits: null }));
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(UnitsNeeded);
    const u = err as UnitsNeeded;
    expect(u.code).toBe('units_needed');
    expect(u.name).toBe('UnitsNeeded');
    expect(u.message).toMatch(/does not say which units/);
    expect(u.extents).toEqual({ width: 120, height: 80 });
    expect(u.suggested).toBeUndefined();
  });

  it('asks for units when $INSUNITS is 0 (unitless), hinting from $MEASUREMENT 1 (metric; it does not scale geometry)', () => {
    expect(() => importDxf(dxf(square(1, 1), { insunits: 0, measurement: 1 }))).toThrow(UnitsNeeded);
    try {
      importDxf(dxf(square(1, 1), { insunits: 0, measurement: 1 }));
    } catch (e) {
      expect((e as UnitsNeeded).suggested).toBe('mm');
      expect((e as UnitsNeeded).message).toMatch(/unitless/);
    }
  });

  it("uses the user's units when the file has none", () => {
    const r = importDxf(dxf(square(4, 2), { insunits: null }), { units: 'in' });
    expect(r.unitsFrom).toBe('user');
    expect(r.sourceUnits).toBe('in');
    expect(extents(r.model).maxX).toBeCloseTo(101.6, 12);
  });

  it("keeps the header's units over a different user choice, and says so", () => {
    const r = importDxf(dxf(square(10, 10), { insunits: 4 }), { units: 'in' });
    expect(r.unitsFrom).toBe('header');
    expect(extents(r.model).maxX).toBe(10);
    expect(r.warnings.join(' ')).toMatch(/millimetres; that was used instead of the inches/);
  });

  it('refuses $INSUNITS codes it does not read (3 = miles, from memory)', () => {
    expect(rejection(() => importDxf(dxf(square(1, 1), { insunits: 3 }))).code).toBe('unsupported_units');
  });

  it('still reports other problems before asking for units', () => {
    expect(rejection(() => importDxf(dxf([[0, 'TEXT', 8, '0', 10, 0, 20, 0, 40, 2, 1, 'hi']], { insunits: null }))).code).toBe('no_geometry');
  });
});

describe('DXF entities (Autodesk DXF Reference, ENTITIES section)', () => {
  it('reads an ARC: centre 10/20, radius 40, angles 50/51 in degrees counter-clockwise', () => {
    const r = importDxf(dxf([[0, 'ARC', 8, 'outline', 10, 10, 20, 10, 30, 0, 40, 5, 50, 0, 51, 90]]));
    const [arc] = pathsOf(r.model) as makerjs.IPathArc[];
    expect(arc.type).toBe('arc');
    expect(arc.origin).toEqual([10, 10]);
    expect(arc.radius).toBe(5);
    expect(arc.startAngle).toBe(0);
    expect(arc.endAngle).toBe(90);
    const e = extents(r.model);
    expect(e.minX).toBeCloseTo(10, 12);
    expect(e.maxX).toBeCloseTo(15, 12);
    expect(e.maxY).toBeCloseTo(15, 12);
  });

  it('reads an ARC that runs through 0° (270 → 90 is a half turn counter-clockwise)', () => {
    const r = importDxf(dxf([[0, 'ARC', 8, 'outline', 10, 0, 20, 0, 40, 10, 50, 270, 51, 90]]));
    const [arc] = pathsOf(r.model) as makerjs.IPathArc[];
    expect(makerjs.angle.ofArcSpan(arc)).toBeCloseTo(180, 9);
    expect(extents(r.model).maxX).toBeCloseTo(10, 9); // passes through 0°, the +x side
    expect(extents(r.model).minX).toBeCloseTo(0, 9);
  });

  it('reads a CIRCLE: centre 10/20, radius 40 (from memory)', () => {
    const r = importDxf(dxf([[0, 'CIRCLE', 8, 'relief', 10, 30, 20, 40, 30, 0, 40, 12.7]]));
    const [c] = pathsOf(r.model) as makerjs.IPathCircle[];
    expect(c.type).toBe('circle');
    expect(c.origin).toEqual([30, 40]);
    expect(c.radius).toBe(12.7);
    expect(c.layer).toBe('relief');
  });

  it('mirrors OCS entities whose extrusion is (0, 0, −1): x is negated (DXF Reference, arbitrary axis algorithm)', () => {
    const r = importDxf(dxf([[0, 'ARC', 8, 'outline', 10, 10, 20, 0, 30, 0, 40, 5, 50, 0, 51, 90, 210, 0, 220, 0, 230, -1]]));
    const [arc] = pathsOf(r.model) as makerjs.IPathArc[];
    expect(arc.origin[0]).toBeCloseTo(-10, 12);
    // OCS 0°→90° maps to world 180°→90°: counter-clockwise from 90° to 180°
    expect(arc.startAngle).toBeCloseTo(90, 9);
    expect(arc.endAngle).toBeCloseTo(180, 9);
  });

  it('refuses entities not drawn in the XY plane', () => {
    const e = rejection(() => importDxf(dxf([[0, 'CIRCLE', 8, '0', 10, 0, 20, 0, 40, 5, 210, 1, 220, 0, 230, 0]])));
    expect(e.code).toBe('not_flat');
    expect(e.message).toMatch(/The CIRCLE at line \d+ is not drawn in the XY plane/);
  });

  it('reads an LWPOLYLINE whose bulge √2 − 1 makes a 90° corner arc (bulge = tan(θ/4))', () => {
    const b = Math.SQRT2 - 1; // tan(90°/4)
    const poly: Group[] = [0, 'LWPOLYLINE', 8, 'outline', 90, 5, 70, 1, 10, 0, 20, 0, 10, 90, 20, 0, 42, b, 10, 100, 20, 10, 10, 100, 20, 50, 10, 0, 20, 50];
    const r = importDxf(dxf([poly]));
    const paths = pathsOf(r.model);
    expect(paths).toHaveLength(5);
    const arc = paths.find((p) => p.type === 'arc') as makerjs.IPathArc;
    expect(arc.origin[0]).toBeCloseTo(90, 9);
    expect(arc.origin[1]).toBeCloseTo(10, 9);
    expect(arc.radius).toBeCloseTo(10, 9);
    expect(makerjs.angle.ofArcSpan(arc)).toBeCloseTo(90, 9);
    // rectangle 100 × 50 with one corner rounded r = 10: 5000 − (4 − π)·10²/4 (D)
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    expect(s.area).toBeCloseTo(5000 - ((4 - Math.PI) * 100) / 4, 6);
  });

  it('turns a negative bulge clockwise', () => {
    const b = -(Math.SQRT2 - 1);
    const r = importDxf(dxf([[0, 'LWPOLYLINE', 8, 'outline', 90, 2, 70, 0, 10, 0, 20, 0, 42, b, 10, 10, 20, 10]]));
    const [arc] = pathsOf(r.model) as makerjs.IPathArc[];
    // clockwise from (0,0) to (10,10) bends below the chord: centre (10, 0)
    expect(arc.origin[0]).toBeCloseTo(10, 9);
    expect(arc.origin[1]).toBeCloseTo(0, 9);
    expect(makerjs.angle.ofArcSpan(arc)).toBeCloseTo(90, 9);
  });

  it('reads a closed two-vertex LWPOLYLINE with bulges 1 as a full circle (two half arcs)', () => {
    const r = importDxf(dxf([[0, 'LWPOLYLINE', 8, 'outline', 90, 2, 70, 1, 10, -5, 20, 0, 42, 1, 10, 5, 20, 0, 42, 1]]));
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    expect(s.area).toBeCloseTo(Math.PI * 25, 6);
  });

  it('reads a POLYLINE with VERTEX entities closed by SEQEND', () => {
    const pl: Group[] = [0, 'POLYLINE', 8, 'pocket', 66, 1, 10, 0, 20, 0, 30, 0, 70, 1,
      0, 'VERTEX', 8, 'pocket', 10, 0, 20, 0, 30, 0,
      0, 'VERTEX', 8, 'pocket', 10, 40, 20, 0, 30, 0,
      0, 'VERTEX', 8, 'pocket', 10, 40, 20, 30, 30, 0,
      0, 'SEQEND', 8, 'pocket'];
    const r = importDxf(dxf([pl, line(100, 0, 110, 0)]));
    expect(r.entityCounts).toEqual({ POLYLINE: 1, LINE: 1 });
    const pocket = pathsOf(r.model).filter((p) => p.layer === 'pocket');
    expect(pocket).toHaveLength(3);
    expect(summarizeModel(r.model).area).toBe(0); // the outline layer holds only the open line
    const s = summarizeModel({ paths: Object.fromEntries(pocket.map((p, i) => [`q${i}`, { ...p, layer: 'outline' }])) });
    expect(s.area).toBeCloseTo(600, 9); // right triangle 40 × 30 / 2 (D)
  });

  it('expands an INSERT of a BLOCK: base point, scale, rotation; layer-0 entities take the insert layer', () => {
    const blocks: Group[][] = [[0, 'BLOCK', 8, '0', 2, 'PEG', 70, 0, 10, 5, 20, 5, 30, 0,
      0, 'CIRCLE', 8, '0', 10, 5, 20, 5, 30, 0, 40, 3,
      0, 'LINE', 8, 'marks', 10, 5, 20, 5, 30, 0, 11, 15, 21, 5, 31, 0,
      0, 'ENDBLK', 8, '0']];
    const insert: Group[] = [0, 'INSERT', 8, 'pocket', 2, 'PEG', 10, 100, 20, 50, 30, 0, 41, 2, 42, 2, 50, 90];
    const r = importDxf(dxf([insert], { blocks }));
    expect(r.entityCounts).toEqual({ INSERT: 1 });
    const circle = pathsOf(r.model).find((p) => p.type === 'circle') as makerjs.IPathCircle;
    expect(circle.origin[0]).toBeCloseTo(100, 9); // the base point lands on the insertion point
    expect(circle.origin[1]).toBeCloseTo(50, 9);
    expect(circle.radius).toBeCloseTo(6, 9);
    expect(circle.layer).toBe('pocket');
    const l = pathsOf(r.model).find((p) => p.type === 'line') as makerjs.IPathLine;
    expect(l.layer).toBe('marks');
    // (5,5)→(15,5) relative to the base: 10 along x, ×2, turned 90°: 20 up from the insertion point
    expect(l.end[0]).toBeCloseTo(100, 9);
    expect(l.end[1]).toBeCloseTo(70, 9);
  });

  it('draws a circle in a block inserted with unequal scales as an ellipse within 0.01 mm', () => {
    const blocks: Group[][] = [[0, 'BLOCK', 8, '0', 2, 'HOLE', 70, 0, 10, 0, 20, 0, 30, 0, 0, 'CIRCLE', 8, '0', 10, 0, 20, 0, 30, 0, 40, 10, 0, 'ENDBLK']];
    const r = importDxf(dxf([[0, 'INSERT', 8, 'outline', 2, 'HOLE', 10, 0, 20, 0, 41, 3, 42, 1]], { blocks }));
    const e = extents(r.model);
    expect(e.maxX).toBeCloseTo(30, 9);
    expect(e.maxY).toBeGreaterThan(10 - 0.01);
    expect(e.maxY).toBeLessThanOrEqual(10 + 1e-9);
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    // inscribed polygon: area below π·a·b by at most perimeter × tolerance (D)
    expect(s.area).toBeLessThanOrEqual(Math.PI * 30 * 10);
    expect(s.area).toBeGreaterThan(Math.PI * 30 * 10 - s.perimeter * 0.01);
    expect(r.warnings.join(' ')).toMatch(/straight segments within 0.01 mm/);
  });

  it('places MINSERT arrays: 70/71 columns and rows, 44/45 spacing', () => {
    const blocks: Group[][] = [[0, 'BLOCK', 8, '0', 2, 'DOT', 70, 0, 10, 0, 20, 0, 0, 'CIRCLE', 8, '0', 10, 0, 20, 0, 40, 1, 0, 'ENDBLK']];
    const r = importDxf(dxf([[0, 'INSERT', 8, 'outline', 2, 'DOT', 10, 0, 20, 0, 70, 3, 71, 2, 44, 10, 45, 20]], { blocks }));
    const centres = (pathsOf(r.model) as makerjs.IPathCircle[]).map((c) => `${c.origin[0]},${c.origin[1]}`).sort();
    expect(centres).toEqual(['0,0', '0,20', '10,0', '10,20', '20,0', '20,20']);
  });

  it('refuses blocks nested deeper than 8, blocks that insert themselves, and missing blocks', () => {
    const chain: Group[][] = [];
    for (let i = 0; i < 10; i++) {
      const inner: Group[] = i === 9 ? [0, 'LINE', 8, '0', 10, 0, 20, 0, 11, 1, 21, 0] : [0, 'INSERT', 8, '0', 2, `B${i + 1}`, 10, 0, 20, 0];
      chain.push([0, 'BLOCK', 8, '0', 2, `B${i}`, 70, 0, 10, 0, 20, 0, ...inner, 0, 'ENDBLK']);
    }
    const deep = rejection(() => importDxf(dxf([[0, 'INSERT', 8, '0', 2, 'B0', 10, 0, 20, 0]], { blocks: chain })));
    expect(deep.code).toBe('nesting_too_deep');
    expect(deep.message).toMatch(/more than 8 deep/);

    const self: Group[][] = [[0, 'BLOCK', 8, '0', 2, 'LOOP', 70, 0, 10, 0, 20, 0, 0, 'INSERT', 8, '0', 2, 'LOOP', 10, 1, 20, 0, 0, 'ENDBLK']];
    const loop = rejection(() => importDxf(dxf([[0, 'INSERT', 8, '0', 2, 'LOOP', 10, 0, 20, 0]], { blocks: self })));
    expect(loop.code).toBe('nesting_too_deep');
    expect(loop.message).toMatch(/contains itself/);

    expect(rejection(() => importDxf(dxf([[0, 'INSERT', 8, '0', 2, 'NOPE', 10, 0, 20, 0]]))).code).toBe('missing_block');
  });

  it('approximates an ELLIPSE (10/20 centre, 11/21 major axis, 40 ratio) within 0.01 mm', () => {
    const r = importDxf(dxf([[0, 'ELLIPSE', 8, 'outline', 10, 0, 20, 0, 30, 0, 11, 50, 21, 0, 31, 0, 40, 0.5, 41, 0, 42, 2 * Math.PI]]));
    const lines = pathsOf(r.model) as makerjs.IPathLine[];
    expect(lines.every((p) => p.type === 'line')).toBe(true);
    for (const l of lines) {
      // every vertex lies on x²/a² + y²/b² = 1 (D)
      expect((l.origin[0] / 50) ** 2 + (l.origin[1] / 25) ** 2).toBeCloseTo(1, 9);
      // and the ellipse between two vertices stays within 0.01 mm of their chord
      let t0 = Math.atan2(l.origin[1] / 25, l.origin[0] / 50);
      let t1 = Math.atan2(l.end[1] / 25, l.end[0] / 50);
      if (t1 - t0 > Math.PI) t0 += 2 * Math.PI;
      if (t0 - t1 > Math.PI) t1 += 2 * Math.PI;
      for (let k = 1; k < 20; k++) {
        const t = t0 + ((t1 - t0) * k) / 20;
        expect(distanceToLine([50 * Math.cos(t), 25 * Math.sin(t)], l.origin, l.end)).toBeLessThanOrEqual(0.01);
      }
    }
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    expect(s.area).toBeLessThanOrEqual(Math.PI * 50 * 25); // ellipse area πab (D)
    expect(s.area).toBeGreaterThan(Math.PI * 50 * 25 - s.perimeter * 0.01);
  });

  it('draws a half ELLIPSE (parameters 0 → π) as an open contour from the major axis end to its opposite', () => {
    const r = importDxf(dxf([[0, 'ELLIPSE', 8, 'outline', 10, 0, 20, 0, 11, 0, 21, 40, 40, 0.25, 41, 0, 42, Math.PI]]));
    const s = summarizeModel(r.model);
    expect(s.openContours).toBe(1);
    const e = extents(r.model);
    expect(e.maxY).toBeCloseTo(40, 9);
    expect(e.minY).toBeCloseTo(-40, 9);
    expect(e.minX).toBeCloseTo(-10, 3); // minor axis = ratio × (Z × major) points to −x
  });

  it('refuses a degenerate ELLIPSE with a clear message', () => {
    const e = rejection(() => importDxf(dxf([[0, 'ELLIPSE', 8, 'outline', 10, 0, 20, 0, 11, 0, 21, 0, 40, 0.5]])));
    expect(e.code).toBe('degenerate_entity');
    expect(e.message).toMatch(/The ELLIPSE at line \d+ cannot be drawn: its major axis has no length/);
    expect(rejection(() => importDxf(dxf([[0, 'ELLIPSE', 8, 'outline', 10, 0, 20, 0, 11, 5, 21, 0, 40, 0]]))).code).toBe('degenerate_entity');
  });

  it('samples a quadratic SPLINE on its curve (71 degree, 40 knots, 10/20 control points)', () => {
    // clamped degree 2 with three control points is the quadratic Bézier B(t) = (1−t)²P0 + 2t(1−t)P1 + t²P2 (D):
    // P0 (0,0), P1 (50,100), P2 (100,0) → y = 2x − x²/50, apex (50, 50)
    const sp: Group[] = [0, 'SPLINE', 8, 'outline', 70, 8, 71, 2, 72, 6, 73, 3, 74, 0, 40, 0, 40, 0, 40, 0, 40, 1, 40, 1, 40, 1, 10, 0, 20, 0, 30, 0, 10, 50, 20, 100, 30, 0, 10, 100, 20, 0, 30, 0];
    const r = importDxf(dxf([sp]));
    const lines = pathsOf(r.model) as makerjs.IPathLine[];
    for (const l of lines) expect(l.end[1]).toBeCloseTo(2 * l.end[0] - l.end[0] ** 2 / 50, 9);
    const e = extents(r.model);
    expect(e.minX).toBe(0);
    expect(e.maxX).toBeCloseTo(100, 12);
    expect(e.maxY).toBeGreaterThan(50 - 0.01);
    expect(e.maxY).toBeLessThanOrEqual(50 + 1e-9);
  });

  it('samples a rational SPLINE (41 weights): the quarter circle with middle weight √2/2 (The NURBS Book, from memory)', () => {
    const w = Math.SQRT1_2;
    const sp: Group[] = [0, 'SPLINE', 8, 'outline', 70, 12, 71, 2, 72, 6, 73, 3, 40, 0, 40, 0, 40, 0, 40, 1, 40, 1, 40, 1, 41, 1, 41, w, 41, 1, 10, 10, 20, 0, 30, 0, 10, 10, 20, 10, 30, 0, 10, 0, 20, 10, 30, 0];
    const r = importDxf(dxf([sp]));
    const lines = pathsOf(r.model) as makerjs.IPathLine[];
    expect(lines.length).toBeGreaterThan(8);
    for (const l of lines) expect(Math.hypot(l.end[0], l.end[1])).toBeCloseTo(10, 9);
  });

  it('refuses a SPLINE with a wrong knot count, or one given only by fit points', () => {
    const bad: Group[] = [0, 'SPLINE', 8, 'outline', 71, 2, 40, 0, 40, 0, 40, 1, 40, 1, 10, 0, 20, 0, 10, 5, 20, 5, 10, 10, 20, 0];
    const e = rejection(() => importDxf(dxf([bad])));
    expect(e.code).toBe('degenerate_entity');
    expect(e.message).toMatch(/4 knots where 3 control points of degree 2 need 6/);
    const fit: Group[] = [0, 'SPLINE', 8, 'outline', 71, 3, 74, 2, 11, 0, 21, 0, 11, 10, 21, 10];
    expect(rejection(() => importDxf(dxf([fit]))).code).toBe('unsupported_entity');
  });

  it('leaves TEXT, MTEXT, DIMENSION and HATCH out with a warning, and lists unknown entity types', () => {
    const r = importDxf(dxf([
      ...square(10, 10),
      [0, 'TEXT', 8, '0', 10, 0, 20, 0, 40, 2.5, 1, 'JIG A'],
      [0, 'MTEXT', 8, '0', 10, 0, 20, 0, 40, 2.5, 1, 'note'],
      [0, 'DIMENSION', 8, '0', 2, '*D1', 10, 0, 20, 0, 70, 0],
      [0, 'HATCH', 8, '0', 10, 0, 20, 0, 2, 'SOLID', 70, 1],
      [0, 'WIPEOUT', 8, '0', 10, 0, 20, 0],
    ]));
    expect(pathsOf(r.model)).toHaveLength(4);
    expect(r.entityCounts).toMatchObject({ LINE: 4, TEXT: 1, MTEXT: 1, DIMENSION: 1, HATCH: 1, WIPEOUT: 1 });
    const w = r.warnings.join('\n');
    expect(w).toMatch(/Text, dimensions and hatching .*TEXT ×1, MTEXT ×1, DIMENSION ×1, HATCH ×1/);
    expect(w).toMatch(/does not read were left out: WIPEOUT ×1/);
  });

  it('keeps layer names that match ours (any case) and puts the rest on outline with a warning', () => {
    const r = importDxf(dxf([line(0, 0, 1, 0, 'POCKET'), line(0, 1, 1, 1, 'Cut lines'), line(0, 2, 1, 2, '0')]));
    expect(pathsOf(r.model).map((p) => p.layer)).toEqual(['pocket', 'outline', 'outline']);
    expect(r.warnings.join(' ')).toMatch(/put on "outline": "Cut lines"\./);
  });

  it('leaves out paper-space entities (67 = 1)', () => {
    const r = importDxf(dxf([line(0, 0, 5, 0), [0, 'LINE', 8, '0', 67, 1, 10, 0, 20, 0, 11, 9, 21, 9]]));
    expect(pathsOf(r.model)).toHaveLength(1);
    expect(r.warnings.join(' ')).toMatch(/paper space/);
  });

  it('reads every decimal to the same double as Number() (the reader parses plain decimals itself)', () => {
    const values = ['0.1', '-0.2', '123.456789012345', '1.5E+03', '  42', '-1e-5', '.5', '5.', '+7.25', '0.30000000000000004', '900719.9254740993', '2.54000000000000000001'];
    let seed = 12345; // a fixed linear congruential sequence: decimals of 1 to 17 digits
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648);
    for (let i = 0; i < 300; i++) {
      const digits = String(next()) + String(next());
      const n = 1 + (next() % 17);
      const point = next() % Math.min(n + 1, 7); // at most 6 integer digits: inside ±1 000 000 mm
      const body = digits.slice(0, n);
      values.push(`${next() % 2 ? '-' : ''}${body.slice(0, point)}.${body.slice(point)}`.replace(/^(-?)\.$/, '$10'));
    }
    const r = importDxf(dxf(values.map((v) => [0, 'LINE', 8, 'outline', 10, 1e5, 20, 1e5, 11, v, 21, 0])));
    const ends = (Object.values(r.model.paths!) as makerjs.IPathLine[]).map((p) => p.end[0]);
    expect(ends).toEqual(values.map((v) => Number(v.trim())));
  });

  it('keeps open contours (the summary reports them) and drops zero-length paths with a count', () => {
    const r = importDxf(dxf([line(0, 0, 10, 0), line(3, 3, 3, 3)]));
    expect(summarizeModel(r.model).openContours).toBe(1);
    expect(r.warnings.join(' ')).toMatch(/1 zero-length path was dropped/);
  });
});

describe('DXF files that are refused, each with a clear message', () => {
  const good = dxf(square(10, 10));

  it('refuses a file cut off part way (no EOF)', () => {
    const e = rejection(() => importDxf(good.slice(0, Math.floor(good.length / 2))));
    expect(e.code).toBe('truncated');
    expect(e.message).toMatch(/incomplete/);
    expect(rejection(() => importDxf(good.replace(/0\nEOF\n$/, ''))).code).toBe('truncated');
  });

  it('refuses a group-code line that is not a number, naming the line', () => {
    const e = rejection(() => importDxf(good.replace('\n10\n0\n20\n0\n30', '\nten\n0\n20\n0\n30')));
    expect(e.code).toBe('damaged_dxf');
    expect(e.message).toMatch(/line \d+: expected a group code/);
  });

  it('refuses a LAYER table without ENDTAB (dxf-parser 1.1.2 loops forever on it)', () => {
    const tables = ['0', 'SECTION', '2', 'TABLES', '0', 'TABLE', '2', 'LAYER', '70', '1', '0', 'LAYER', '2', 'outline', '70', '0', '62', '7', '6', 'CONTINUOUS', '0', 'ENDSEC'].join('\n');
    const text = good.replace('0\nSECTION\n2\nENTITIES', `${tables}\n0\nSECTION\n2\nENTITIES`);
    const e = rejection(() => importDxf(text));
    expect(e.code).toBe('damaged_dxf');
    expect(e.message).toMatch(/table LAYER has no ENDTAB/);
  });

  it('refuses a POLYLINE that is not closed by SEQEND', () => {
    const pl: Group[] = [0, 'POLYLINE', 8, '0', 66, 1, 70, 0, 0, 'VERTEX', 8, '0', 10, 0, 20, 0, 0, 'VERTEX', 8, '0', 10, 5, 20, 0];
    const e = rejection(() => importDxf(dxf([pl, line(0, 0, 1, 1)])));
    expect(e.code).toBe('damaged_dxf');
    expect(e.message).toMatch(/POLYLINE is not closed by SEQEND/);
  });

  it('refuses a file with nothing to cut', () => {
    const e = rejection(() => importDxf(dxf([[0, 'TEXT', 8, '0', 10, 0, 20, 0, 40, 2, 1, 'only words']])));
    expect(e.code).toBe('no_geometry');
    expect(e.message).toMatch(/it has only TEXT ×1/);
  });

  it('refuses a file whose every path has zero length', () => {
    const e = rejection(() => importDxf(dxf([line(1, 1, 1, 1), [0, 'CIRCLE', 8, '0', 10, 0, 20, 0, 40, 0]])));
    expect(e.code).toBe('zero_length');
  });

  it.each([
    ['NaN', 'NaN', 'not a finite number'],
    ['1e308 in inches (overflows to Infinity in mm)', '1e308', 'not a finite number'],
    ['2 000 000 mm', '2000000', 'within ±1,000,000 mm'],
  ])('refuses a coordinate of %s', (_label, value, message) => {
    const units = value === '1e308' ? 1 : 4;
    const text = dxf([[0, 'LINE', 8, '0', 10, 0, 20, 0, 11, value, 21, 0]], { insunits: units });
    const e = rejection(() => importDxf(text));
    expect(e.code).toBe('bad_coordinate');
    expect(e.message).toContain(message);
    expect(e.message).toMatch(/The LINE at line 19 has a/); // 18 lines of HEADER and section start come before it
  });

  it('refuses more entities than the configured limit', () => {
    const many = Array.from({ length: 101 }, (_, i) => line(i, 0, i, 1));
    const e = rejection(() => importDxf(dxf(many), { maxEntities: 100 }));
    expect(e.code).toBe('too_many_entities');
    expect(e.message).toMatch(/more than 100 entities/);
    expect(importDxf(dxf(many.slice(0, 100)), { maxEntities: 100 }).entityCounts.LINE).toBe(100);
  });

  it('refuses more than the default 200 000 entities before parsing them', () => {
    const one = '0\nLINE\n8\n0\n10\n0\n20\n0\n11\n1\n21\n0\n';
    const text = `0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nSECTION\n2\nENTITIES\n${one.repeat(200_001)}0\nENDSEC\n0\nEOF\n`;
    const e = rejection(() => importDxf(text));
    expect(e.code).toBe('too_many_entities');
    expect(e.message).toMatch(/more than 200,000 entities/);
  });

  it('refuses a drawing that expands to more paths than the limit (block copies count)', () => {
    const blocks: Group[][] = [[0, 'BLOCK', 8, '0', 2, 'TEN', 70, 0, 10, 0, 20, 0, ...Array.from({ length: 10 }, (_, i) => line(i, 0, i, 1)).flat(), 0, 'ENDBLK']];
    const e = rejection(() => importDxf(dxf([[0, 'INSERT', 8, '0', 2, 'TEN', 10, 0, 20, 0, 70, 100, 71, 1, 44, 20]], { blocks }), { limits: { maxPaths: 500 } }));
    expect(e.code).toBe('too_complex');
  });
});

describe('DXF import at size', () => {
  it('reads 100 000 LINE entities (about 9 MB) in one linear pass', () => {
    const parts: string[] = ['0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nSECTION\n2\nENTITIES\n'];
    for (let i = 0; i < 100_000; i++) {
      const x = (i % 1000) * 1.5;
      const y = Math.floor(i / 1000) * 2.5;
      parts.push(`0\nLINE\n8\noutline\n10\n${x.toFixed(6)}\n20\n${y.toFixed(6)}\n30\n0.0\n11\n${(x + 1).toFixed(6)}\n21\n${(y + 1).toFixed(6)}\n31\n0.0\n`);
    }
    parts.push('0\nENDSEC\n0\nEOF\n');
    const text = parts.join('');
    expect(text.length).toBeGreaterThan(8_000_000);
    const r = importDxf(text);
    expect(Object.keys(r.model.paths ?? {})).toHaveLength(100_000);
    expect(extents(r.model)).toEqual({ minX: 0, minY: 0, maxX: 999 * 1.5 + 1, maxY: 99 * 2.5 + 1 });
  });
});

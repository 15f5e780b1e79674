import fc from 'fast-check';
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { GENERATORS, getGenerator, runGenerator, type GeneratorResult } from '../../shared/generators';
import { CHARGER_INSERT_PARAMS } from '../../shared/generators/chargerInsert';
import { DEVICE_NAME_MAX, EDITED_SUFFIX, deviceParamValues, fitNotesDeviceName } from '../../shared/generators/catalogDevice';
import { fitNotesFromParams } from '../../shared/generators/fitNotes';
import { FitNotes } from '../../shared/schemas/library';
import { DEMO_DEVICES } from '../../db/seed';
import { defaultParams, paramsSchema, type ParamValues } from '../../shared/params';
import { LAYERS } from '../../shared/schemas/geometry';
import { textInUnits } from '../../shared/units';
import { contoursByFindChains } from '../../shared/geometry/summary';

const gen = (id: string, params: Record<string, unknown> = {}): { params: ParamValues; result: GeneratorResult } => {
  const r = runGenerator(id, params);
  if (!r.ok) throw new Error(`${id}: ${r.message} ${JSON.stringify(r.fields)}`);
  return r;
};
const val = (res: GeneratorResult, key: string) => {
  const v = res.report.values.find((x) => x.key === key);
  if (!v) throw new Error(`no report value ${key}`);
  return v.value as number;
};
const codes = (res: GeneratorResult) => res.report.warnings.map((w) => w.code).sort();

/** Absolute circles on a layer: centre and radius. */
function circlesOn(model: makerjs.IModel, layer: string) {
  const out: { c: [number, number]; r: number }[] = [];
  makerjs.model.walk(model, {
    onPath(wp) {
      if (wp.layer !== layer || wp.pathContext.type !== 'circle') return;
      const c = makerjs.point.add(wp.pathContext.origin, wp.offset);
      out.push({ c: [c[0], c[1]], r: (wp.pathContext as makerjs.IPathCircle).radius });
    },
  });
  return out;
}

function chainsByLayer(model: makerjs.IModel) {
  const out: Record<string, { chains: makerjs.IChain[]; loose: number }> = {};
  makerjs.model.findChains(model, (chains, loose, layer) => (out[layer] = { chains, loose: loose.length }), { byLayers: true });
  return out;
}

/** Distance from a point to the edge of the rounded rectangle [0,W]×[0,L], corner radius R (negative outside). */
function plateDistance(x: number, y: number, W: number, L: number, R: number) {
  const qx = Math.min(x, W - x);
  const qy = Math.min(y, L - y);
  if (qx < R && qy < R) return R - Math.hypot(R - qx, R - qy);
  return Math.min(qx, qy);
}

/** Least distance from the features on `layers` to the plate edge, measured on the drawing itself. */
function wallFromDrawing(model: makerjs.IModel, layers: string[], W: number, L: number, R: number) {
  let least = Infinity;
  makerjs.model.walk(model, {
    onPath(wp) {
      if (!layers.includes(wp.layer)) return;
      const p = wp.pathContext;
      if (p.type === 'circle') {
        const c = makerjs.point.add(p.origin, wp.offset);
        least = Math.min(least, plateDistance(c[0], c[1], W, L, R) - (p as makerjs.IPathCircle).radius);
        return;
      }
      for (const k of makerjs.path.toKeyPoints(p, 0.05)) {
        const q = makerjs.point.add(k, wp.offset);
        least = Math.min(least, plateDistance(q[0], q[1], W, L, R));
      }
    },
  });
  return least;
}

describe('generator registry', () => {
  it('has the four generators, with valid declarations and runnable defaults', () => {
    expect(GENERATORS.map((g) => g.id)).toEqual(['charger-insert', 'taper-jig', 'splayed-box', 'half-lap']);
    for (const g of GENERATORS) {
      const names = g.params.map((p) => p.name);
      expect(new Set(names).size, g.id).toBe(names.length);
      for (const d of g.params) if (d.type === 'number') expect(d.default >= d.min && d.default <= d.max, `${g.id}.${d.name}`).toBe(true);
      expect(paramsSchema(g.params).parse({})).toEqual(defaultParams(g.params));
      const { result } = gen(g.id);
      const layers = Object.keys(result.summary.layers);
      for (const l of layers) expect(LAYERS as readonly string[], `${g.id} layer ${l}`).toContain(l);
      const outline = chainsByLayer(result.model).outline;
      expect(outline.loose, g.id).toBe(0);
      expect(outline.chains.every((c) => c.endless), g.id).toBe(true);
    }
    expect(getGenerator('nope')).toBeUndefined();
  });

  it('names the device parameters of the charger insert, all declared', () => {
    const g = getGenerator('charger-insert')!;
    expect(g.deviceParams).toEqual(['deviceWidth', 'deviceLength', 'deviceThickness', 'caseAllowance']);
    for (const k of g.deviceParams!) expect(g.params.map((p) => p.name)).toContain(k);
  });

  it('fills the device parameters from a catalog device, each from its own dimension', () => {
    // Invented demo device (db/seed.ts): 77.6 × 161.2 × 8.4 mm, case 1.6 mm per side.
    const d = DEMO_DEVICES[1];
    const size = { widthMm: d.width_mm, lengthMm: d.length_mm, thicknessMm: d.thickness_mm, caseAllowanceMm: d.case_allowance_mm };
    const g = getGenerator('charger-insert')!;
    expect(deviceParamValues(g.deviceParams!, size)).toEqual({ deviceWidth: d.width_mm, deviceLength: d.length_mm, deviceThickness: d.thickness_mm, caseAllowance: d.case_allowance_mm });
    // Names that are no dimension are left out rather than guessed.
    expect(deviceParamValues(['deviceColour', 'deviceWidth'], size)).toEqual({ deviceWidth: d.width_mm });
    // The filled values draw: pocket width = device width + 2 · (case allowance + pocket clearance), per the generator.
    const { result } = gen('charger-insert', deviceParamValues(g.deviceParams!, size));
    expect(val(result, 'pocketWidth')).toBeCloseTo(d.width_mm + 2 * (d.case_allowance_mm + (defaultParams(CHARGER_INSERT_PARAMS).pocketClearance as number)), 9);
  });

  it('the clearance the fit history suggests is the one fit notes record per side', () => {
    for (const g of GENERATORS.filter((x) => x.suggestedClearanceParam)) {
      const decl = g.params.find((p) => p.name === g.suggestedClearanceParam);
      expect(decl?.type, g.id).toBe('number');
      // A value away from the default, so a fit note read off another param cannot pass by chance.
      const p = gen(g.id, { [g.suggestedClearanceParam!]: 1.35 }).params;
      expect(fitNotesFromParams(g.id, p).clearancePerSide, g.id).toBe(1.35);
    }
    expect(getGenerator('charger-insert')!.suggestedClearanceParam).toBe('pocketClearance');
  });

  it('names a chosen device in fit notes, marked when its sizes were typed over, within the schema', () => {
    expect(fitNotesDeviceName({ name: 'Demo phone S', edited: false })).toBe('Demo phone S');
    expect(fitNotesDeviceName({ name: 'Demo phone S', edited: true })).toBe('Demo phone S (edited)');
    const long = 'x'.repeat(DEVICE_NAME_MAX);
    const named = fitNotesDeviceName({ name: long, edited: true });
    expect(named.length).toBe(DEVICE_NAME_MAX);
    expect(named.endsWith(EDITED_SUFFIX)).toBe(true);
    const notes = { device: { name: named, width: 70, length: 150, thickness: 8, cased: false } };
    expect(FitNotes.safeParse(notes).success).toBe(true);
    expect(FitNotes.safeParse({ device: { ...notes.device, name: long + EDITED_SUFFIX } }).success).toBe(false);
  });

  it('returns field-level messages for bad and inconsistent params', () => {
    expect(runGenerator('charger-insert', { openingWidth: 10, colour: 'red' })).toMatchObject({
      ok: false,
      fields: { openingWidth: 'Opening width must be at least 40 mm', colour: 'Unknown parameter "colour"' },
    });
    expect(runGenerator('charger-insert', { plateThickness: 6, pocketDepth: 3, skinThickness: 3 })).toMatchObject({ ok: false, fields: { skinThickness: expect.stringMatching(/no room for a recess/) } });
    expect(runGenerator('charger-insert', { openingWidth: 80, deviceWidth: 90 })).toMatchObject({ ok: false, fields: { deviceWidth: expect.stringMatching(/does not fit/) } });
    expect(runGenerator('charger-insert', { mcMin: 12, mcMax: 8 })).toMatchObject({ ok: false, fields: { mcMax: expect.any(String) } });
    expect(runGenerator('taper-jig', { wideEnd: 30, narrowEnd: 40 })).toMatchObject({ ok: false, fields: { narrowEnd: expect.any(String) } });
  });

  it('gives consistency messages with lengths as templates, so the form can show them in inches', () => {
    // 1 in = 25.4 mm exactly (NIST SP 811, appendix B.8). 6 mm = 0.236", 3 + 3 = 6 mm.
    const r = runGenerator('charger-insert', { plateThickness: 6, pocketDepth: 3, skinThickness: 3 });
    if (r.ok) throw new Error('expected a field message');
    expect(r.fields.skinThickness).toBe('Pocket depth + skin (6 mm) leaves no room for a recess in a 6 mm plate');
    expect(textInUnits(r.fieldTexts!.skinThickness, 'in')).toBe('Pocket depth + skin (0.236") leaves no room for a recess in a 0.236" plate');
    // Messages without lengths carry no template and read the same in either unit.
    const mc = runGenerator('charger-insert', { mcMin: 12, mcMax: 8 });
    if (mc.ok) throw new Error('expected a field message');
    expect(mc.fieldTexts?.mcMax).toBeUndefined();
    // The taper sled must carry the wide end and a cleat: the figure is rounded up in mm, then shown in inches.
    const t = runGenerator('taper-jig', { wideEnd: 100, narrowEnd: 40, sledWidth: 60 });
    if (t.ok) throw new Error('expected a field message');
    const mm = Number(/at least (\d+) mm/.exec(t.fields.sledWidth)?.[1]);
    expect(mm).toBeGreaterThan(100);
    expect(textInUnits(t.fieldTexts!.sledWidth, 'in')).toBe(`Sled width must be at least ${+(mm / 25.4).toFixed(3)}" to carry the leg and its cleat`);
  });
});

describe('charger insert', () => {
  it('derives plate, pocket, recess and skin from the params', () => {
    const p = { openingWidth: 120, openingLength: 200, fitClearance: 0.4, openingCornerRadius: 6.35, plateThickness: 18, deviceWidth: 76, deviceLength: 160, caseAllowance: 1.5, pocketClearance: 1, pocketDepth: 3, padShape: 'round', padDiameter: 70, padClearance: 0.5, skinThickness: 2 };
    const { result } = gen('charger-insert', p);
    expect(val(result, 'plateWidth')).toBeCloseTo(119.2, 9);
    expect(val(result, 'plateLength')).toBeCloseTo(199.2, 9);
    expect(val(result, 'plateCornerRadius')).toBeCloseTo(5.95, 9);
    expect(val(result, 'pocketWidth')).toBeCloseTo(76 + 2 * 2.5, 9);
    expect(val(result, 'pocketLength')).toBeCloseTo(160 + 2 * 2.5, 9);
    expect(val(result, 'recessWidth')).toBeCloseTo(71, 9);
    expect(val(result, 'recessDepth')).toBeCloseTo(18 - 3 - 2, 9);
    expect(val(result, 'skin')).toBeCloseTo(2, 9);
    // Rounded rectangle closed form A = w·h − (4 − π)·r² (pure geometry), to 0.01 mm².
    expect(Math.abs(result.summary.area - (119.2 * 199.2 - (4 - Math.PI) * 5.95 ** 2))).toBeLessThan(0.01);
    expect(result.summary.extents).toMatchObject({ minX: 0, minY: 0, width: 119.2, height: 199.2 });
    expect(result.summary.features?.recess).toEqual({ width: 71, height: 71, depth: 13 });
    expect(codes(result)).toEqual([]);
  });

  it('puts dogbone reliefs 2.2451 mm from each wall for a 1/4 in bit (REFERENCES.md, pure geometry)', () => {
    const { result } = gen('charger-insert', { cornerStyle: 'dogbone', bitDiameter: 6.35, padShape: 'rect' });
    const pw = val(result, 'pocketWidth');
    const pl = val(result, 'pocketLength');
    const W = val(result, 'plateWidth');
    const L = val(result, 'plateLength');
    const x0 = (W - pw) / 2;
    const y0 = (L - pl) / 2;
    const reliefs = circlesOn(result.model, 'relief');
    expect(reliefs).toHaveLength(8); // four at the pocket, four at the rectangular recess
    const pocketCorners = [[x0, y0], [x0 + pw, y0], [x0 + pw, y0 + pl], [x0, y0 + pl]];
    for (const [cx, cy] of pocketCorners) {
      const k = reliefs.find((q) => Math.hypot(q.c[0] - cx, q.c[1] - cy) < 3.2);
      expect(k).toBeDefined();
      expect(Math.abs(k!.c[0] - cx)).toBeCloseTo(2.2451, 4);
      expect(Math.abs(k!.c[1] - cy)).toBeCloseTo(2.2451, 4);
      expect(k!.r).toBeCloseTo(3.175, 12);
    }
    expect(val(result, 'reliefOffset')).toBeCloseTo(2.2451, 4);
  });

  it('puts T-bone reliefs on the end walls, r from each corner, and 6 mm bit dogbones at 2.1213 mm', () => {
    const t = gen('charger-insert', { cornerStyle: 'tbone', bitDiameter: 6 }).result;
    const y0 = (val(t, 'plateLength') - val(t, 'pocketLength')) / 2;
    const x0 = (val(t, 'plateWidth') - val(t, 'pocketWidth')) / 2;
    const pocket = circlesOn(t.model, 'relief');
    expect(pocket).toHaveLength(4);
    const bottomLeft = pocket.find((k) => k.c[0] < x0 + 4 && k.c[1] < y0 + 1)!;
    expect(bottomLeft.c[0] - x0).toBeCloseTo(3, 9);
    expect(bottomLeft.c[1]).toBeCloseTo(y0, 9);
    const d = gen('charger-insert', { cornerStyle: 'dogbone', bitDiameter: 6 }).result;
    expect(val(d, 'reliefOffset')).toBeCloseTo(2.1213, 4);
  });

  it('gives the underside mirrored about the long axis, with the marks on that axis unmoved', () => {
    const { result } = gen('charger-insert', { channelEdge: 'right' });
    const W = val(result, 'plateWidth');
    const top = chainsByLayer(result.model);
    const under = result.underside!;
    expect(under).toBeDefined();
    const extOf = (m: makerjs.IModel, layer: string) => {
      const pts: number[] = [];
      makerjs.model.walk(m, { onPath: (wp) => { if (wp.layer === layer) { const e = makerjs.measure.pathExtents(wp.pathContext); pts.push(e.low[0] + wp.offset[0], e.high[0] + wp.offset[0]); } } });
      return [Math.min(...pts), Math.max(...pts)];
    };
    const [tl, th] = extOf(result.model, 'channel');
    const [ul, uh] = extOf(under, 'channel');
    expect(ul).toBeCloseTo(W - th, 9);
    expect(uh).toBeCloseTo(W - tl, 9);
    expect(th).toBeCloseTo(W, 9); // runs to the right edge seen from the top…
    expect(ul).toBeCloseTo(0, 9); // …which is the left edge once turned over
    expect(extOf(under, 'marks')).toEqual(extOf(result.model, 'marks').map((x) => expect.closeTo(x, 9)));
    expect(top.marks.loose).toBe(2);
    expect(Object.keys(chainsByLayer(under)).sort()).toEqual(['channel', 'marks', 'outline', 'recess']);
  });

  it('warns when the skin is over 3 mm without a rated range, and only past the rated maximum with one', () => {
    expect(codes(gen('charger-insert', { skinThickness: 3.5 }).result)).toContain('skin_too_thick');
    expect(codes(gen('charger-insert', { skinThickness: 3.5, ratedRange: true, ratedMax: 5 }).result)).not.toContain('skin_too_thick');
    expect(codes(gen('charger-insert', { skinThickness: 6, ratedRange: true, ratedMax: 5 }).result)).toContain('skin_too_thick');
  });

  it('states a warning\'s lengths in inches when inches are chosen (1 in = 25.4 mm, 16 CFR 500.19)', () => {
    const w = gen('charger-insert', { skinThickness: 6, ratedRange: true, ratedMax: 5 }).result.report.warnings.find((x) => x.code === 'skin_too_thick')!;
    expect(w.message).toBe('The 6 mm skin is thicker than the charger’s rated 5 mm: it may not charge.');
    // 6 / 25.4 = 0.23622… → 0.236; 5 / 25.4 = 0.19685… → 0.197.
    expect(textInUnits(w, 'in')).toBe('The 0.236" skin is thicker than the charger’s rated 0.197": it may not charge.');
  });

  it('warns on corner radii tighter than the bit (common practice: a bit cannot cut inside its own radius)', () => {
    const r = gen('charger-insert', { pocketCornerRadius: 2, openingCornerRadius: 3, bitDiameter: 6.35 }).result;
    expect(codes(r)).toEqual(['opening_corner_below_bit', 'pocket_corner_below_bit']);
    expect(r.report.warnings.find((w) => w.code === 'pocket_corner_below_bit')!.fields).toContain('pocketCornerRadius');
  });

  it('warns on walls under 6 mm (common practice) and on a channel that breaks into the pocket', () => {
    expect(codes(gen('charger-insert', { openingWidth: 92, fingerNotch: false }).result)).toEqual(['thin_wall']); // 5.1 mm side walls
    const c = gen('charger-insert', { plateThickness: 18, pocketDepth: 3, channelDepth: 15 }).result;
    expect(codes(c)).toEqual(['channel_into_pocket']);
    expect(c.report.warnings[0].severity).toBe('danger');
  });

  it('allows for seasonal movement: flatsawn white oak across 119.2 mm, 6 → 11 % (Wood Handbook Eq. 13-2)', () => {
    const oak = gen('charger-insert', { stock: 'white-oak', cut: 'flatsawn', grain: 'length', mcMin: 6, mcMax: 11 }).result;
    expect(val(oak, 'movementAcross')).toBeCloseTo(119.2 * 0.00365 * 5, 3);
    expect(codes(oak)).toEqual(['movement_exceeds_clearance']);
    const ply = gen('charger-insert', { stock: 'plywood', mcMin: 6, mcMax: 11 }).result;
    expect(val(ply, 'movementAcross')).toBeCloseTo(119.2 * 1.5e-4 * 5, 3);
    expect(codes(ply)).toEqual([]);
    const along = gen('charger-insert', { stock: 'white-oak', cut: 'quartersawn', grain: 'width', mcMin: 6, mcMax: 7, fitClearance: 0.2 }).result;
    expect(val(along, 'movementAcross')).toBeCloseTo(199.6 * 0.0018, 3); // across the grain is now the length
  });
});

// Property tests over random valid parameters (fast-check).
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
const choices = (name: string) => {
  const d = CHARGER_INSERT_PARAMS.find((p) => p.name === name);
  if (d?.type !== 'choice') throw new Error(name);
  return d.choices.map((c) => c.value);
};
// Uniform in [min, max]: fast-check's own doubles crowd the bounds, which here mostly builds
// pockets exactly as wide as the plate.
const dbl = (min: number, max: number) => fc.noBias(fc.integer({ min: 0, max: 1_000_000 })).map((i) => min + ((max - min) * i) / 1_000_000);

const chargerParams = fc
  .record({
    deviceWidth: dbl(20, 150), deviceLength: dbl(40, 250), deviceThickness: dbl(3, 14), caseAllowance: dbl(0, 4), pocketClearance: dbl(0, 5),
    extraW: dbl(-1, 40), extraL: dbl(-1, 40), fitClearance: dbl(0, 3), cornerFrac: dbl(0, 0.5), plateThickness: dbl(6, 50),
    stock: fc.constantFrom(...choices('stock')), cut: fc.constantFrom(...choices('cut')), grain: fc.constantFrom(...choices('grain')),
    mc: fc.tuple(dbl(0, 30), dbl(0, 30)), pocketDepth: dbl(0.5, 15), pocketCornerRadius: dbl(0, 20), fingerNotch: fc.boolean(), notchDiameter: dbl(10, 60),
    padShape: fc.constantFrom(...choices('padShape')), padFrac: dbl(0.2, 1.02), padFrac2: dbl(0.2, 1.02), padClearance: dbl(0, 5), padThickness: dbl(2, 40),
    skinThickness: dbl(0.5, 8), ratedRange: fc.boolean(), rated: fc.tuple(dbl(0, 40), dbl(0.5, 40)),
    channelEdge: fc.constantFrom(...choices('channelEdge')), plugWidth: dbl(3, 40), channelClearance: dbl(0, 5), channelDepth: dbl(1, 25),
    bitDiameter: dbl(1, 25.4), cornerStyle: fc.constantFrom(...choices('cornerStyle')),
  })
  .map(({ extraW, extraL, cornerFrac, mc, padFrac, padFrac2, rated, ...a }) => {
    const pw = a.deviceWidth + 2 * (a.caseAllowance + a.pocketClearance);
    const pl = a.deviceLength + 2 * (a.caseAllowance + a.pocketClearance);
    const openingWidth = clamp(pw + 2 * a.fitClearance + 2 * extraW + (a.fingerNotch ? a.notchDiameter / 2 : 0), 40, 800);
    const openingLength = clamp(pl + 2 * a.fitClearance + 2 * extraL, 40, 800);
    const small = Math.min(openingWidth, openingLength);
    return {
      ...a,
      openingWidth, openingLength, openingCornerRadius: clamp(cornerFrac * small, 0, 100),
      mcMin: Math.min(...mc), mcMax: Math.max(...mc),
      ratedMin: Math.min(rated[0], rated[1]), ratedMax: clamp(Math.max(rated[0], rated[1]), 0.5, 40),
      padDiameter: clamp(padFrac * small, 20, 200), padWidth: clamp(padFrac * openingWidth, 20, 200), padLength: clamp(padFrac2 * openingLength, 20, 300),
    };
  });

// Table 13-5 (Wood Handbook FPL-GTR-190), copied here so the test does not read the code's table.
const TABLE_13_5: Record<string, [number, number]> = { 'white-oak': [0.0018, 0.00365], 'red-oak': [0.00158, 0.00369], 'hard-maple': [0.00165, 0.00353], 'black-cherry': [0.00126, 0.00248], 'black-walnut': [0.0019, 0.00274] };

describe('charger insert properties (fast-check over random valid params)', () => {
  it('closes every contour, keeps pockets and recesses inside the plate, and warns exactly when each condition holds', async () => {
    const { SPECIES } = await import('../../shared/wood/species');
    const names = new Set(CHARGER_INSERT_PARAMS.map((p) => p.name));
    let valid = 0;
    let invalid = 0;
    const seen: Record<string, [number, number]> = {}; // code → [times expected, times not]
    fc.assert(
      fc.property(chargerParams, (p) => {
        const r = runGenerator('charger-insert', p);
        if (!r.ok) {
          invalid++;
          for (const k of Object.keys(r.fields)) expect(names.has(k), k).toBe(true);
          expect(r.message.length).toBeGreaterThan(0);
          return;
        }
        valid++;
        const { model } = r.result;
        const W = p.openingWidth - 2 * p.fitClearance;
        const L = p.openingLength - 2 * p.fitClearance;
        const R = Math.max(p.openingCornerRadius - p.fitClearance, 0);

        // Every contour closed, except the alignment ticks.
        const byLayer = chainsByLayer(model);
        for (const [layer, { chains, loose }] of Object.entries(byLayer)) {
          if (layer === 'marks') continue;
          expect(loose, layer).toBe(0);
          expect(chains.every((c) => c.endless), layer).toBe(true);
        }
        expect(byLayer.outline.chains).toHaveLength(1);
        expect(Math.abs(r.result.summary.area - (W * L - (4 - Math.PI) * R * R))).toBeLessThan(0.01);
        const ref = contoursByFindChains(model, 'outline'); // makerjs's own chain finder agrees
        expect([r.result.summary.closedContours, r.result.summary.openContours]).toEqual([ref.closed, ref.open]);

        // Pockets, reliefs and recesses inside the plate; the channel inside its bounding box.
        const pocketWall = wallFromDrawing(model, ['pocket', 'relief'], W, L, R);
        const recessWall = wallFromDrawing(model, ['recess'], W, L, R);
        expect(pocketWall).toBeGreaterThan(-1e-9);
        expect(recessWall).toBeGreaterThan(-1e-9);
        const ch = makerjs.measure.modelExtents(model.models!.underside.models!.channel);
        expect(ch!.low[0]).toBeGreaterThan(-1e-9);
        expect(ch!.low[1]).toBeGreaterThan(-1e-9);
        expect(ch!.high[0]).toBeLessThan(W + 1e-9);
        expect(ch!.high[1]).toBeLessThan(L + 1e-9);

        // Each warning exactly when its condition holds.
        const T = p.plateThickness;
        const skinMax = p.ratedRange ? p.ratedMax : 3; // REFERENCES.md: about 3 mm without a stated range
        const minWall = Math.min(pocketWall, recessWall);
        const across = p.grain === 'length' ? W : L;
        const coeff = p.stock === 'plywood' ? 1.5e-4 : (TABLE_13_5[p.stock] ?? (() => { const s = SPECIES.find((x) => x.id === p.stock)!; return [s.cR, s.cT]; })())[p.cut === 'quartersawn' ? 0 : 1];
        const outside = (mc: number) => mc < 6 || mc > 14;
        const expected: Record<string, boolean> = {
          skin_too_thick: p.skinThickness > skinMax,
          skin_too_thin: p.ratedRange && p.skinThickness < p.ratedMin,
          pocket_corner_below_bit: p.cornerStyle === 'radius' && p.pocketCornerRadius < p.bitDiameter / 2,
          opening_corner_below_bit: p.openingCornerRadius < p.bitDiameter / 2,
          thin_wall: minWall < 6, // common practice
          channel_into_pocket: T - p.pocketDepth - p.channelDepth < 1,
          pad_proud: T - p.pocketDepth - p.skinThickness < p.padThickness,
          device_below_surface: p.pocketDepth > p.deviceThickness + p.caseAllowance && !p.fingerNotch,
          movement_exceeds_clearance: (across * coeff * (p.mcMax - p.mcMin)) / 2 > p.fitClearance,
          mc_outside_linear_range: p.stock !== 'plywood' && (outside(p.mcMin) || outside(p.mcMax)),
        };
        const got = new Set(r.result.report.warnings.map((w) => w.code));
        for (const code of got) expect(Object.keys(expected), `unexpected warning ${code}`).toContain(code);
        for (const [code, want] of Object.entries(expected)) {
          (seen[code] ??= [0, 0])[want ? 0 : 1]++;
          if (code === 'thin_wall' && Math.abs(minWall - 6) < 0.01) continue; // too close to call from the drawing
          expect(got.has(code), `${code} (min wall ${minWall.toFixed(3)})`).toBe(want);
        }
        for (const w of r.result.report.warnings) for (const f of w.fields) expect(names.has(f), f).toBe(true);
      }),
      { numRuns: 500 },
    );
    expect(valid).toBeGreaterThan(100);
    expect(invalid).toBeGreaterThan(0);
    // Not vacuous: every warning was both expected and not expected in some runs.
    for (const [code, [yes, no]] of Object.entries(seen)) {
      expect(yes, `${code} never expected`).toBeGreaterThan(0);
      expect(no, `${code} always expected`).toBeGreaterThan(0);
    }
  });
});

describe('taper jig, splayed box and half lap', () => {
  it('taper jig: 2 in → 1 in over 24 in gives 2.3859° and a cleat at that angle to the sled edge (pure geometry)', () => {
    const { result } = gen('taper-jig', { wideEnd: 50.8, narrowEnd: 25.4, taperLength: 609.6, edges: 'one' });
    expect(val(result, 'anglePerEdge')).toBeCloseTo(2.3859, 4);
    expect(val(result, 'offsetPerEdge')).toBeCloseTo(25.4, 6);
    const cleat = result.model.models!.cleat.paths!.cleat as makerjs.IPathLine;
    const slope = Math.atan2(cleat.end[1] - cleat.origin[1], cleat.end[0] - cleat.origin[0]);
    expect((-slope * 180) / Math.PI).toBeCloseTo(2.3859, 4);
    const two = gen('taper-jig', { wideEnd: 50.8, narrowEnd: 25.4, taperLength: 609.6, edges: 'two' }).result;
    expect(val(two, 'anglePerEdge')).toBeCloseTo(1.1935, 4);
  });

  it('splayed box: chart angles, and the panel’s edge angle equals the miter gauge (two derivations agree)', () => {
    const { result } = gen('splayed-box', { sides: 4, splay: 15, bottomWidth: 200, height: 100 });
    expect(val(result, 'bladeTilt')).toBeCloseTo(43.08, 2); // table-saw manual chart, N = 4, S = 15°
    expect(val(result, 'miterGauge')).toBeCloseTo(14.51, 2);
    const top = 200 + 2 * 100 * Math.tan((15 * Math.PI) / 180);
    const slant = 100 / Math.cos((15 * Math.PI) / 180);
    expect(val(result, 'slantHeight')).toBeCloseTo(slant, 3);
    expect(Math.abs(result.summary.area - ((top + 200) / 2) * slant)).toBeLessThan(0.01); // trapezoid area
    const edgeAngle = (Math.atan((top - 200) / 2 / slant) * 180) / Math.PI;
    expect(edgeAngle).toBeCloseTo(val(result, 'miterGauge'), 2);
  });

  it('half lap: each piece cut to half its thickness (common practice); windows w/sin α long', () => {
    const { result } = gen('half-lap', { widthA: 45, widthB: 70, thickness: 22, angle: 60, overrun: 10, margin: 40 });
    const s = Math.sin(Math.PI / 3);
    const c = Math.cos(Math.PI / 3);
    expect(val(result, 'lapDepth')).toBe(11);
    expect(val(result, 'notchA')).toBeCloseTo(70 / s, 3);
    expect(val(result, 'notchB')).toBeCloseTo(45 / s, 3);
    const plate = (along: number, band: number) => (along + ((band + 20) * c) / s + 80) * (band + 20 + 80);
    const expected = plate(70 / s, 45) - (70 / s) * 65 + plate(45 / s, 70) - (45 / s) * 90;
    expect(Math.abs(result.summary.area - expected)).toBeLessThan(0.01);
    expect(result.summary.closedContours).toBe(4);
  });
});

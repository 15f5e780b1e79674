// DXF export: what we write is read back by two independent readers, the npm package dxf-parser
// and Debian's python3-ezdxf (`python3 -m ezdxf audit`), as shared/REFERENCES.md suggests.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import DxfParserModule from 'dxf-parser';
import makerjs from 'makerjs';
import { afterAll, describe, expect, it } from 'vitest';
import { DXF_ACCURACY, finiteExtents, modelToDxf } from '../../files/dxf/export';
import { GENERATORS, runGenerator } from '../../shared/generators';
import { defaultParams } from '../../shared/params';
import { importDxf } from '../../files/dxf/import';
import { importSvg } from '../../files/svg/import';

const DxfParser = ((DxfParserModule as unknown as { default?: typeof DxfParserModule }).default ?? DxfParserModule) as typeof DxfParserModule;

interface ParsedEntity {
  type: string;
  layer: string;
  vertices?: { x: number; y: number }[];
  center?: { x: number; y: number };
  radius?: number;
  startAngle?: number;
  endAngle?: number;
}

function readBack(text: string) {
  const doc = new DxfParser().parseSync(text) as unknown as { header: Record<string, unknown>; entities: ParsedEntity[]; tables: { layer?: { layers: Record<string, unknown> } } };
  return doc;
}

/** Extents of dxf-parser's entities, computed by makerjs from the numbers it read (arcs by their sweep). */
function parsedExtents(entities: ParsedEntity[]) {
  const model: makerjs.IModel = { paths: {} };
  entities.forEach((e, i) => {
    const id = `e${i}`;
    if (e.type === 'LINE') model.paths![id] = new makerjs.paths.Line([e.vertices![0].x, e.vertices![0].y], [e.vertices![1].x, e.vertices![1].y]);
    else if (e.type === 'CIRCLE') model.paths![id] = new makerjs.paths.Circle([e.center!.x, e.center!.y], e.radius!);
    else if (e.type === 'ARC') {
      // dxf-parser converts ARC angles to radians
      model.paths![id] = new makerjs.paths.Arc([e.center!.x, e.center!.y], e.radius!, (e.startAngle! * 180) / Math.PI, (e.endAngle! * 180) / Math.PI);
    } else throw new Error(`unexpected ${e.type}`);
  });
  const x = makerjs.measure.modelExtents(model)!;
  return { minX: x.low[0], minY: x.low[1], maxX: x.high[0], maxY: x.high[1] };
}

function modelExtents(model: makerjs.IModel) {
  const x = makerjs.measure.modelExtents(model)!;
  return { minX: x.low[0], minY: x.low[1], maxX: x.high[0], maxY: x.high[1] };
}

/** A jig plate drawn by hand: 120 × 80 mm outline with a rounded corner, a pocket, a hole and a mark. */
function jigPlate(): makerjs.IModel {
  const b = Math.SQRT2 - 1; // 90° corner arc (Autodesk DXF Reference: bulge = tan(θ/4))
  const text = [
    '0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC',
    '0', 'SECTION', '2', 'ENTITIES',
    '0', 'LWPOLYLINE', '8', 'outline', '90', '5', '70', '1', '10', '0', '20', '0', '10', '110', '20', '0', '42', String(b), '10', '120', '20', '10', '10', '120', '20', '80', '10', '0', '20', '80',
    '0', 'LINE', '8', 'pocket', '10', '20', '20', '20', '11', '60', '21', '20',
    '0', 'LINE', '8', 'pocket', '10', '60', '20', '20', '11', '60', '21', '50',
    '0', 'LINE', '8', 'pocket', '10', '60', '20', '50', '11', '20', '21', '50',
    '0', 'LINE', '8', 'pocket', '10', '20', '20', '50', '11', '20', '21', '20',
    '0', 'CIRCLE', '8', 'relief', '10', '90', '20', '40', '40', '3.175',
    '0', 'ARC', '8', 'marks', '10', '90', '20', '65', '40', '5', '50', '30', '51', '150',
    '0', 'ENDSEC', '0', 'EOF', '',
  ].join('\n');
  return importDxf(text).model;
}

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-dxf-export-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

/** Debian's ezdxf auditor; its exit status is 0 and it prints "No errors found." for a clean file. */
function ezdxfAudit(text: string, name: string): string {
  const file = path.join(tmp, name);
  fs.writeFileSync(file, text);
  if (!fs.existsSync('/usr/bin/python3')) throw new Error('needs /usr/bin/python3 with python3-ezdxf (apt-get install python3-ezdxf)');
  return execFileSync('/usr/bin/python3', ['-m', 'ezdxf', 'audit', file], { encoding: 'utf8', timeout: 60_000 });
}

describe('modelToDxf', () => {
  it('writes R12 with $ACADVER AC1009 and $INSUNITS 4 for millimetres (Autodesk DXF Reference, HEADER)', () => {
    const doc = readBack(modelToDxf(jigPlate(), 'mm'));
    expect(doc.header.$ACADVER).toBe('AC1009');
    expect(doc.header.$INSUNITS).toBe(4);
    expect(doc.header.$MEASUREMENT).toBe(1); // metric
  });

  it('round-trips through dxf-parser in mm: same entity count, layers and extents', () => {
    const model = jigPlate();
    const paths = Object.values(model.paths!);
    const doc = readBack(modelToDxf(model, 'mm'));
    expect(doc.entities).toHaveLength(paths.length);
    expect(doc.entities.map((e) => e.layer).sort()).toEqual(paths.map((p) => p.layer).sort());
    expect(Object.keys(doc.tables.layer!.layers).sort()).toEqual(['marks', 'outline', 'pocket', 'relief']);
    const back = parsedExtents(doc.entities);
    const orig = modelExtents(model);
    for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(Math.abs(back[k] - orig[k])).toBeLessThanOrEqual(1e-6);
  });

  it('writes inches as millimetres ÷ 25.4 (16 CFR 500.19) with $INSUNITS 1 and $MEASUREMENT 0', () => {
    const model = jigPlate();
    const mm = readBack(modelToDxf(model, 'mm'));
    const inch = readBack(modelToDxf(model, 'in'));
    expect(inch.header.$INSUNITS).toBe(1);
    expect(inch.header.$MEASUREMENT).toBe(0);
    const a = parsedExtents(mm.entities);
    const b = parsedExtents(inch.entities);
    // numbers are written rounded to DXF_ACCURACY; an extent (centre + radius) adds two roundings
    for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(Math.abs(b[k] - a[k] / 25.4)).toBeLessThanOrEqual(2 * DXF_ACCURACY);
    expect(Math.abs(b.maxX - 120 / 25.4)).toBeLessThanOrEqual(DXF_ACCURACY / 2);
    const circle = inch.entities.find((e) => e.type === 'CIRCLE')!;
    expect(circle.radius).toBeCloseTo(0.125, 12); // a 1/4 in bit's relief: 3.175 mm = 0.125 in (D)
  });

  it('writes $EXTMIN/$EXTMAX matching the drawing', () => {
    const doc = readBack(modelToDxf(jigPlate(), 'mm'));
    expect(doc.header.$EXTMIN).toMatchObject({ x: 0, y: 0 });
    expect(doc.header.$EXTMAX).toMatchObject({ x: 120, y: 80 });
  });

  it('passes ezdxf audit in both units', () => {
    const model = jigPlate();
    expect(ezdxfAudit(modelToDxf(model, 'mm'), 'plate-mm.dxf')).toMatch(/No errors found/);
    expect(ezdxfAudit(modelToDxf(model, 'in'), 'plate-in.dxf')).toMatch(/No errors found/);
  });

  it('passes ezdxf audit for a model imported from SVG (curves become arcs)', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="60mm" height="40mm" viewBox="0 0 60 40"><path d="M5 35 C 5 5 55 5 55 35 Z"/><rect x="10" y="10" width="20" height="10" rx="2" data-layer="pocket"/></svg>';
    const { model } = importSvg(svg);
    expect(ezdxfAudit(modelToDxf(model, 'mm'), 'svg-mm.dxf')).toMatch(/No errors found/);
  });

  it('re-imports its own export with the same paths and extents', () => {
    const model = jigPlate();
    const again = importDxf(modelToDxf(model, 'in'));
    expect(again.sourceUnits).toBe('in');
    expect(Object.keys(again.model.paths!)).toHaveLength(Object.keys(model.paths!).length);
    const a = modelExtents(model);
    const b = modelExtents(again.model);
    for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(Math.abs(a[k] - b[k])).toBeLessThanOrEqual(25.4 * 2 * DXF_ACCURACY);
  });

  it('does not change the model it is given, in either unit', () => {
    const model = jigPlate();
    const before = JSON.stringify(model);
    modelToDxf(model, 'in');
    modelToDxf(model, 'mm');
    expect(JSON.stringify(model)).toBe(before);
  });

  // The header's extents come from our own one-pass measure; makerjs's measure.modelExtents (the
  // library's reference implementation) must agree on every generator's drawing and on nested origins.
  it('measures the same extents as makerjs.measure.modelExtents', () => {
    const nested: makerjs.IModel = {
      origin: [5, -3],
      models: { a: { origin: [10, 10], paths: { arc: new makerjs.paths.Arc([0, 0], 7, 20, 160) }, models: { b: { origin: [-40, 2], paths: { c: new makerjs.paths.Circle([1, 1], 2) } } } } },
      paths: { l: new makerjs.paths.Line([0, 0], [3, 4]) },
    };
    const models = [nested, jigPlate(), ...GENERATORS.map((g) => {
      const run = runGenerator(g.id, defaultParams(g.params));
      if (!run.ok) throw new Error(run.message);
      return run.result.model;
    })];
    for (const m of models) {
      const ours = finiteExtents(m)!;
      const theirs = makerjs.measure.modelExtents(m)!;
      for (const i of [0, 1]) {
        expect(ours.low[i]).toBeCloseTo(theirs.low[i], 9);
        expect(ours.high[i]).toBeCloseTo(theirs.high[i], 9);
      }
    }
    expect(finiteExtents({})).toBeNull();
  });

  it('refuses a model that is not in millimetres or holds a NaN', () => {
    expect(() => modelToDxf({ units: makerjs.unitType.Inch, paths: { a: new makerjs.paths.Line([0, 0], [1, 1]) } }, 'mm')).toThrow(/millimetres/);
    expect(() => modelToDxf({ paths: { a: new makerjs.paths.Line([0, 0], [NaN, 1]) } }, 'mm')).toThrow(/not a finite number/);
    expect(() => modelToDxf({ models: { m: { origin: [Infinity, 0], paths: { a: new makerjs.paths.Line([0, 0], [1, 1]) } } } }, 'in')).toThrow(/not a finite number/);
  });
});

// The internal geometry (makerjs, mm) → an R12 (AC1009) ASCII DXF in millimetres or inches.
// makerjs writes the tables and entities; we write the HEADER ourselves so it always states the
// version, the units the coordinates are really in, and the extents (Autodesk DXF Reference,
// HEADER section: $ACADVER, $INSUNITS group 70 (1 inches, 4 millimeters), $MEASUREMENT, $EXTMIN/$EXTMAX).
import makerjs from 'makerjs';
import { LAYERS, type LayerName } from '../../shared/schemas/geometry';
import { MM_PER_INCH, type LengthUnit } from '../../shared/units';

/**
 * DXF colour numbers (AutoCAD Color Index) per operation layer, chosen by us to echo the preview
 * palette in shared/geometry/layers.ts: 7 black/white, 3 green, 30 orange, 6 magenta, 1 red,
 * 8 and 9 greys.
 */
const LAYER_COLOR: Record<LayerName, number> = { outline: 7, pocket: 3, recess: 30, channel: 6, relief: 1, marks: 8, guide: 9 };

const INSUNITS: Record<LengthUnit, number> = { mm: 4, in: 1 };
/** Numbers are written rounded to this step of the file's unit (makerjs' default, 1e-7, is coarser than needed to keep mm ÷ 25.4 exact to the digits shown). */
export const DXF_ACCURACY = 1e-9;
const MEASUREMENT: Record<LengthUnit, number> = { mm: 1, in: 0 };

/** The model (millimetres) as DXF text with coordinates in `units`. */
export function modelToDxf(model: makerjs.IModel, units: LengthUnit): string {
  if (units !== 'mm' && units !== 'in') throw new Error(`modelToDxf: units must be 'mm' or 'in', not ${String(units)}`);
  if (model.units && model.units !== makerjs.unitType.Millimeter) {
    throw new Error(`modelToDxf expects a model in millimetres, not ${model.units}`);
  }
  // One pass over the paths: refuse non-finite numbers and measure the extents for the header.
  const mmExtents = finiteExtents(model);
  // toDXF only reads the model, so millimetres need no copy; inches are a scaled copy.
  let copy: makerjs.IModel;
  if (units === 'in') {
    copy = makerjs.cloneObject(model);
    makerjs.model.scale(copy, 1 / MM_PER_INCH, true);
    copy.units = makerjs.unitType.Inch;
  } else {
    copy = { ...model, units: makerjs.unitType.Millimeter };
  }
  const scale = units === 'in' ? 1 / MM_PER_INCH : 1;
  const ext = mmExtents && { low: [mmExtents.low[0] * scale, mmExtents.low[1] * scale], high: [mmExtents.high[0] * scale, mmExtents.high[1] * scale] };

  const layerOptions: Record<string, makerjs.exporter.IDXFLayerOptions> = {};
  for (const id of LAYERS) layerOptions[id] = { color: LAYER_COLOR[id] };
  const body = makerjs.exporter.toDXF(copy, { units: copy.units, layerOptions, accuracy: DXF_ACCURACY });

  const start = '0\nSECTION\n2\nHEADER\n';
  const end = body.indexOf('\n0\nENDSEC\n');
  if (!body.startsWith(start) || end < 0) throw new Error('makerjs toDXF output no longer starts with a HEADER section');
  return headerSection(ext, units) + body.slice(end + 1);
}

type Extents = { low: number[]; high: number[] };

function headerSection(ext: Extents | null, units: LengthUnit): string {
  const lines = ['0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1009', '9', '$INSUNITS', '70', String(INSUNITS[units]), '9', '$MEASUREMENT', '70', String(MEASUREMENT[units])];
  if (ext) {
    const r = (v: number) => String(makerjs.round(v, DXF_ACCURACY));
    lines.push('9', '$EXTMIN', '10', r(ext.low[0]), '20', r(ext.low[1]), '30', '0');
    lines.push('9', '$EXTMAX', '10', r(ext.high[0]), '20', r(ext.high[1]), '30', '0');
  }
  return lines.join('\n') + '\n';
}

/**
 * The model's extents (as makerjs.measure.modelExtents gives them), found in the same pass that
 * refuses NaN and infinities: a NaN would be written as the text "NaN", which no DXF reader accepts.
 * A plain recursion rather than makerjs.model.walk, which builds a route for every path.
 */
export function finiteExtents(model: makerjs.IModel): Extents | null {
  let low = [Infinity, Infinity];
  let high = [-Infinity, -Infinity];
  const visit = (m: makerjs.IModel, ox: number, oy: number, where: string) => {
    const x = ox + (m.origin?.[0] ?? 0);
    const y = oy + (m.origin?.[1] ?? 0);
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new Error(`modelToDxf: model "${where}" has an origin that is not a finite number`);
    for (const id in m.paths) {
      const p = m.paths[id] as makerjs.IPath & { end?: makerjs.IPoint; radius?: number };
      if (!p) continue;
      const nums = [p.origin[0], p.origin[1]];
      if (p.end) nums.push(p.end[0], p.end[1]);
      if (p.radius !== undefined) nums.push(p.radius);
      if (!nums.every(Number.isFinite)) throw new Error(`modelToDxf: path "${id}" has a coordinate that is not a finite number`);
      const e = makerjs.measure.pathExtents(p);
      if (!e) continue;
      low = [Math.min(low[0], e.low[0] + x), Math.min(low[1], e.low[1] + y)];
      high = [Math.max(high[0], e.high[0] + x), Math.max(high[1], e.high[1] + y)];
    }
    for (const id in m.models) {
      const child = m.models[id];
      if (child) visit(child, x, y, id);
    }
  };
  visit(model, 0, 0, 'root');
  return Number.isFinite(low[0]) ? { low, high } : null;
}

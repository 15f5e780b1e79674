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
  assertFinite(model);
  const copy = makerjs.cloneObject(model);
  if (units === 'in') makerjs.model.scale(copy, 1 / MM_PER_INCH, true);
  copy.units = units === 'in' ? makerjs.unitType.Inch : makerjs.unitType.Millimeter;

  const layerOptions: Record<string, makerjs.exporter.IDXFLayerOptions> = {};
  for (const id of LAYERS) layerOptions[id] = { color: LAYER_COLOR[id] };
  const body = makerjs.exporter.toDXF(copy, { units: copy.units, layerOptions, accuracy: DXF_ACCURACY });

  const start = '0\nSECTION\n2\nHEADER\n';
  const end = body.indexOf('\n0\nENDSEC\n');
  if (!body.startsWith(start) || end < 0) throw new Error('makerjs toDXF output no longer starts with a HEADER section');
  return headerSection(copy, units) + body.slice(end + 1);
}

function headerSection(model: makerjs.IModel, units: LengthUnit): string {
  const lines = ['0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1009', '9', '$INSUNITS', '70', String(INSUNITS[units]), '9', '$MEASUREMENT', '70', String(MEASUREMENT[units])];
  const ext = makerjs.measure.modelExtents(model);
  if (ext) {
    const r = (v: number) => String(makerjs.round(v, DXF_ACCURACY));
    lines.push('9', '$EXTMIN', '10', r(ext.low[0]), '20', r(ext.low[1]), '30', '0');
    lines.push('9', '$EXTMAX', '10', r(ext.high[0]), '20', r(ext.high[1]), '30', '0');
  }
  return lines.join('\n') + '\n';
}

/** A NaN in the model would be written as the text "NaN", which no DXF reader accepts. */
function assertFinite(model: makerjs.IModel): void {
  makerjs.model.walk(model, {
    onPath(wp) {
      const p = wp.pathContext as makerjs.IPath & { end?: makerjs.IPoint; radius?: number };
      const nums = [p.origin[0], p.origin[1], wp.offset[0], wp.offset[1]];
      if (p.end) nums.push(p.end[0], p.end[1]);
      if (p.radius !== undefined) nums.push(p.radius);
      if (!nums.every(Number.isFinite)) throw new Error(`modelToDxf: path "${wp.pathId}" has a coordinate that is not a finite number`);
    },
  });
}

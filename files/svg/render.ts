// The preview SVG of a model. It reuses the one renderer, shared/geometry/svg.ts (generators and
// previews draw the same way), and only adds the choice of physical units for width/height: the
// viewBox stays in millimetres either way, so the drawing prints at 1:1. It is always drawn from the
// model, never from an uploaded file's text.
import makerjs from 'makerjs';
import { renderSvg } from '../../shared/geometry/svg';
import { MM_PER_INCH, type LengthUnit } from '../../shared/units';

export interface SvgRenderOptions {
  title?: string;
  /** Units of the root width/height (default mm). */
  units?: LengthUnit;
}

const ROOT_SIZE = /^<svg width="([0-9.eE+-]+)mm" height="([0-9.eE+-]+)mm"/;

export function modelToSvg(model: makerjs.IModel, opts: SvgRenderOptions = {}): string {
  if (model.units && model.units !== makerjs.unitType.Millimeter) {
    throw new Error(`modelToSvg expects a model in millimetres, not ${model.units}`);
  }
  const svg = renderSvg(model, { title: opts.title });
  if ((opts.units ?? 'mm') === 'mm') return svg;
  const m = ROOT_SIZE.exec(svg);
  if (!m) throw new Error('shared/geometry/svg.ts no longer writes width/height in mm first');
  const inches = (mm: string) => String(makerjs.round(Number(mm) / MM_PER_INCH, 1e-6));
  return `<svg width="${inches(m[1])}in" height="${inches(m[2])}in"` + svg.slice(m[0].length);
}

// A standalone SVG of a model, with each operation layer drawn in its style (layers.ts). Sized in
// millimetres so it prints 1:1.
import makerjs from 'makerjs';
import { LAYERS } from '../schemas/geometry';
import { LAYER_STYLE } from './layers';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function layerOptions(): Record<string, makerjs.exporter.ISVGElementRenderOptions> {
  const out: Record<string, makerjs.exporter.ISVGElementRenderOptions> = {};
  for (const id of LAYERS) {
    const s = LAYER_STYLE[id];
    const style = [`stroke:${s.stroke}`, `stroke-width:${s.width}`, `fill:${s.fill ?? 'none'}`];
    if (s.dash) style.push(`stroke-dasharray:${s.dash}`);
    out[id] = { stroke: s.stroke, strokeWidth: String(s.width), fill: s.fill ?? 'none', cssStyle: style.join(';'), className: `layer-${id}` };
  }
  return out;
}
const LAYER_OPTIONS = layerOptions();

export function renderSvg(model: makerjs.IModel, opts: { title?: string } = {}): string {
  const withUnits: makerjs.IModel = model.units ? model : { ...model, units: makerjs.unitType.Millimeter };
  const svg = makerjs.exporter.toSVG(withUnits, {
    useSvgPathOnly: true,
    // nonzero: makerjs winds holes against their outlines, so overlapping pocket shapes (pocket +
    // finger notch) fill as one, where evenodd would leave their overlap blank.
    fillRule: 'nonzero',
    viewBox: true,
    fill: 'none',
    stroke: '#1F2421',
    strokeWidth: '1',
    layerOptions: LAYER_OPTIONS,
    svgAttrs: { role: 'img', 'aria-label': opts.title ?? 'Drawing' },
  });
  return opts.title ? svg.replace(/^(<svg[^>]*>)/, `$1<title>${esc(opts.title)}</title>`) : svg;
}

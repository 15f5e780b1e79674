// Routing templates for a half lap where two stretchers cross at an angle. Each piece is cut to
// half its thickness (common practice). On piece A the notch runs along B's direction and is
// w_B / sin α long along A; on B it is w_A / sin α along B. Each template has a parallelogram
// window (a through cut for a pattern bit with the bearing on the template) that runs past the
// stretcher's edges by the overrun, so the bit leaves the edges cleanly.
import makerjs from 'makerjs';
import { num, type ParamDecl, type ParamValues } from '../params';
import { summarizeModel } from '../geometry/summary';
import { onLayer, polygon, rad, rect, rv, warn } from './report';
import type { GeneratorDef, Warning } from './types';

export const HALF_LAP_PARAMS: ParamDecl[] = [
  { type: 'number', name: 'widthA', label: 'Stretcher A width', unit: 'mm', min: 10, max: 300, default: 45, step: 0.5, help: 'Face width of the first stretcher.' },
  { type: 'number', name: 'widthB', label: 'Stretcher B width', unit: 'mm', min: 10, max: 300, default: 45, step: 0.5, help: 'Face width of the second stretcher.' },
  { type: 'number', name: 'thickness', label: 'Stretcher thickness', unit: 'mm', min: 6, max: 150, default: 22, step: 0.5, help: 'Both stretchers; each lap is cut to half of it.' },
  { type: 'number', name: 'angle', label: 'Crossing angle', unit: 'deg', min: 15, max: 90, default: 90, step: 0.5, help: 'Angle between the stretchers (90° = square).' },
  { type: 'number', name: 'overrun', label: 'Window overrun', unit: 'mm', min: 0, max: 50, default: 10, step: 0.5, help: 'How far each window runs past the stretcher’s edges.' },
  { type: 'number', name: 'margin', label: 'Template margin', unit: 'mm', min: 15, max: 200, default: 40, step: 1, help: 'Template stock around the window.' },
];

const GAP = 20; // mm between the two templates

/** A template for cutting the notch in a stretcher of width `band` crossed by one of width `cross`. */
export function lapTemplate(band: number, cross: number, angleDeg: number, overrun: number, margin: number, slant: 1 | -1) {
  const a = rad(angleDeg);
  const along = cross / Math.sin(a); // notch length along this stretcher
  const k = (slant * Math.cos(a)) / Math.sin(a); // x shift per unit y of the crossing direction
  const y0 = -overrun;
  const y1 = band + overrun;
  const win: [number, number][] = [[k * y0, y0], [k * y0 + along, y0], [k * y1 + along, y1], [k * y1, y1]];
  const minX = Math.min(...win.map((q) => q[0]));
  const maxX = Math.max(...win.map((q) => q[0]));
  const dx = margin - minX;
  const dy = margin - y0;
  const window = win.map(([x, y]) => [x + dx, y + dy] as [number, number]);
  return {
    width: maxX - minX + 2 * margin,
    height: y1 - y0 + 2 * margin,
    window,
    windowArea: along * (y1 - y0),
    notchLength: along,
    edges: [dy, dy + band] as [number, number],
  };
}

function generate(p: ParamValues) {
  const wA = num(p, 'widthA');
  const wB = num(p, 'widthB');
  const T = num(p, 'thickness');
  const angle = num(p, 'angle');
  const o = num(p, 'overrun');
  const m = num(p, 'margin');
  const A = lapTemplate(wA, wB, angle, o, m, 1);
  const B = lapTemplate(wB, wA, angle, o, m, -1);
  const template = (t: typeof A, x: number): makerjs.IModel => {
    const guide: makerjs.IPathMap = {
      edge0: new makerjs.paths.Line([0, t.edges[0]], [t.width, t.edges[0]]),
      edge1: new makerjs.paths.Line([0, t.edges[1]], [t.width, t.edges[1]]),
    };
    return {
      origin: [x, 0],
      models: {
        plate: onLayer('outline', rect(0, 0, t.width, t.height)),
        window: onLayer('outline', polygon(t.window)),
        stretcher: onLayer('guide', { paths: guide }),
      },
    };
  };
  const model: makerjs.IModel = { units: makerjs.unitType.Millimeter, models: { a: template(A, 0), b: template(B, A.width + GAP) } };
  const warnings: Warning[] = [];
  if (angle < 30) warnings.push(warn('acute_crossing', 'caution', `At ${angle}° the acute corners of each lap leave short grain that breaks easily; consider a wider angle or reinforcing the joint.`, ['angle']));
  const values = [
    rv('lapDepth', 'Lap depth on each piece (half the thickness)', T / 2, 'mm'),
    rv('notchA', 'Notch length along stretcher A', A.notchLength, 'mm'),
    rv('notchB', 'Notch length along stretcher B', B.notchLength, 'mm'),
    rv('angle', 'Crossing angle', angle, 'deg'),
    rv('templateA', 'Template A', `${A.width.toFixed(1)} × ${A.height.toFixed(1)} mm`),
    rv('templateB', 'Template B', `${B.width.toFixed(1)} × ${B.height.toFixed(1)} mm`),
  ];
  const summary = summarizeModel(model, {
    lapA: { width: A.notchLength, height: wA, depth: T / 2 },
    lapB: { width: B.notchLength, height: wB, depth: T / 2 },
  });
  return { model, summary, report: { values, warnings } };
}

export const halfLap: GeneratorDef = {
  id: 'half-lap',
  title: 'Half-lap templates for crossing stretchers',
  kind: 'template',
  description: 'Two routing templates for a half lap where stretchers cross at an angle; each piece is cut to half its thickness.',
  params: HALF_LAP_PARAMS,
  generate,
};

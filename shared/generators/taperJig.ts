// Taper sled template for a leg taper. The blade runs along the sled's bottom edge (y = 0); the
// leg lies on the sled against a cleat along its untapered back edge, overhanging the sled edge
// by the amount the cut removes: nothing at the wide end, the full offset at the narrow end.
// Angle: θ = atan((W_wide − W_narrow) / L) on one edge, atan(((W_wide − W_narrow)/2) / L) on
// each of two edges (pure geometry; 2 in → 1 in over 24 in: 2.3859°, 1.1935°).
import makerjs from 'makerjs';
import { num, str, type ParamDecl, type ParamValues } from '../params';
import { summarizeModel } from '../geometry/summary';
import { len, lengthText } from '../units';
import { deg, onLayer, polygon, rect, rv, warn } from './report';
import type { FieldMessage, GeneratorDef, Warning } from './types';

export const TAPER_PARAMS: ParamDecl[] = [
  { type: 'number', name: 'wideEnd', label: 'Wide end', unit: 'mm', min: 10, max: 300, default: 50.8, step: 0.1, group: 'Leg', help: 'Leg width where the taper starts (usually just below the apron).' },
  { type: 'number', name: 'narrowEnd', label: 'Narrow end', unit: 'mm', min: 5, max: 300, default: 25.4, step: 0.1, group: 'Leg', help: 'Leg width at the foot.' },
  { type: 'number', name: 'taperLength', label: 'Taper length', unit: 'mm', min: 50, max: 1500, default: 609.6, step: 0.5, group: 'Leg', help: 'Length of the tapered part of the leg.' },
  { type: 'choice', name: 'edges', label: 'Tapered edges', choices: [{ value: 'one', label: 'One edge' }, { value: 'two', label: 'Two edges (split)' }], default: 'one', group: 'Leg', help: 'Split the taper over two edges to halve the angle per cut.' },
  { type: 'number', name: 'sledWidth', label: 'Sled width', unit: 'mm', min: 60, max: 600, default: 200, step: 1, group: 'Sled', help: 'Width of the sled base.' },
  { type: 'number', name: 'sledMargin', label: 'Sled overhang each end', unit: 'mm', min: 0, max: 300, default: 75, step: 1, group: 'Sled', help: 'Extra sled length beyond each end of the taper.' },
];

export function taperAngles(wide: number, narrow: number, length: number, edges: 'one' | 'two') {
  const total = wide - narrow;
  const offset = edges === 'two' ? total / 2 : total;
  return { total, offset, angleRad: Math.atan(offset / length), angle: deg(Math.atan(offset / length)) };
}

const CLEAT_ROOM = 25; // mm of sled beside the leg for the cleat

function layout(p: ParamValues) {
  const W = num(p, 'wideEnd');
  const N = num(p, 'narrowEnd');
  const Lt = num(p, 'taperLength');
  const edges = str(p, 'edges') as 'one' | 'two';
  const a = taperAngles(W, N, Lt, edges);
  const m = num(p, 'sledMargin');
  return { W, N, Lt, edges, ...a, m, sledLength: Math.hypot(Lt, a.offset) + 2 * m, sledWidth: num(p, 'sledWidth') };
}

function check(p: ParamValues): FieldMessage[] {
  const out: FieldMessage[] = [];
  const k = layout(p);
  if (k.N >= k.W) out.push({ field: 'narrowEnd', message: 'Narrow end must be narrower than the wide end' });
  else if (k.sledWidth < k.W * Math.cos(k.angleRad) + CLEAT_ROOM) out.push({ field: 'sledWidth', ...lengthText`Sled width must be at least ${len(Math.ceil(k.W * Math.cos(k.angleRad) + CLEAT_ROOM))} to carry the leg and its cleat` });
  return out;
}

function generate(p: ParamValues) {
  const k = layout(p);
  const c = Math.cos(k.angleRad);
  const s = Math.sin(k.angleRad);
  // Leg frame: back edge along y' = W, the cut from (0, 0) to (Lt, offset). Rotate by −θ so the
  // cut lies on the sled edge, then move the wide end to x = margin.
  const toSled = (x: number, y: number): [number, number] => [k.m + x * c + y * s, -x * s + y * c];
  const legCorners = [toSled(0, 0), toSled(k.Lt, 0), toSled(k.Lt, k.W), toSled(0, k.W)];
  const cleatStart = toSled(-k.m * 0.8, k.W);
  const cleatEnd = toSled(k.Lt, k.W);
  const stopA = toSled(k.Lt, k.W);
  const stopB = toSled(k.Lt, k.W + CLEAT_ROOM * 0.8);
  const model: makerjs.IModel = {
    units: makerjs.unitType.Millimeter,
    models: {
      sled: onLayer('outline', rect(0, 0, k.sledLength, k.sledWidth)),
      leg: onLayer('guide', polygon(legCorners)),
      cut: onLayer('guide', { paths: { cut: new makerjs.paths.Line(toSled(0, 0), toSled(k.Lt, k.offset)) } }),
      cleat: onLayer('marks', { paths: { cleat: new makerjs.paths.Line(cleatStart, cleatEnd), stop: new makerjs.paths.Line(stopA, stopB) } }),
    },
  };
  const warnings: Warning[] = [];
  if (k.angle > 5) warnings.push(warn('steep_taper', 'info', `A ${k.angle.toFixed(2)}° taper per edge is steep for a leg; check the look on a mock-up.`, ['narrowEnd', 'taperLength', 'edges']));
  const values = [
    rv('anglePerEdge', 'Taper angle per edge', k.angle, 'deg', 4),
    rv('offsetPerEdge', 'Offset at the narrow end, per edge', k.offset, 'mm'),
    rv('totalTaper', 'Total reduction in width', k.total, 'mm'),
    rv('edges', 'Edges tapered', k.edges === 'two' ? 2 : 1, 'count'),
    rv('sledLength', 'Sled length', k.sledLength, 'mm'),
    rv('sledWidth', 'Sled width', k.sledWidth, 'mm'),
  ];
  if (k.edges === 'two') {
    values.push(rv('secondCut', 'Second edge', 'Adjacent face: same setting. Opposite edge with the first cut against the cleat: twice the angle.'));
  }
  const summary = summarizeModel(model, { sled: { width: k.sledLength, height: k.sledWidth } });
  return { model, summary, report: { values, warnings } };
}

export const taperJig: GeneratorDef = {
  id: 'taper-jig',
  title: 'Taper sled for legs',
  kind: 'jig',
  description: 'A table-saw sled template for tapering legs on one or two edges: the leg rides against a cleat at the taper angle, and the report gives the angle and the offset at the narrow end.',
  params: TAPER_PARAMS,
  check,
  generate,
};

// Splayed (mitered, sloped-sided) box with N sides, each leaning S from vertical.
// Blade tilt = asin(cos S · sin(180°/N)), miter gauge = atan(sin S · tan(180°/N)): the
// compound-angle charts in table-saw manuals (REFERENCES.md). The side panel is a trapezoid:
// bottom edge b, top edge b + 2·H·tan S·tan(180°/N), slant height H / cos S. The angle its side
// edges make with the panel's centre line is atan(sin S · tan(180°/N)) — the miter gauge angle.
import makerjs from 'makerjs';
import { num, type ParamDecl, type ParamValues } from '../params';
import { summarizeModel } from '../geometry/summary';
import { deg, onLayer, polygon, rad, rv, warn } from './report';
import type { GeneratorDef, Warning } from './types';

export const SPLAYED_BOX_PARAMS: ParamDecl[] = [
  { type: 'number', name: 'sides', label: 'Sides', unit: 'count', min: 3, max: 12, default: 4, step: 1, help: 'Number of sides of the box.' },
  { type: 'number', name: 'splay', label: 'Splay from vertical', unit: 'deg', min: 0, max: 60, default: 15, step: 0.5, help: 'How far each side leans out from vertical.' },
  { type: 'number', name: 'bottomWidth', label: 'Bottom width of a side', unit: 'mm', min: 20, max: 2000, default: 200, step: 0.5, help: 'Length of each side panel’s bottom edge, on the outside face.' },
  { type: 'number', name: 'height', label: 'Box height', unit: 'mm', min: 10, max: 1000, default: 100, step: 0.5, help: 'Vertical height of the box (the panels are longer: the slant height).' },
];

export function compoundAngles(sides: number, splayDeg: number) {
  const S = rad(splayDeg);
  const half = Math.PI / sides;
  return { bladeTilt: deg(Math.asin(Math.cos(S) * Math.sin(half))), miterGauge: deg(Math.atan(Math.sin(S) * Math.tan(half))) };
}

export function splayedPanel(sides: number, splayDeg: number, bottomWidth: number, height: number) {
  const S = rad(splayDeg);
  const top = bottomWidth + 2 * height * Math.tan(S) * Math.tan(Math.PI / sides);
  const slant = height / Math.cos(S);
  return { top, bottom: bottomWidth, slant, area: ((top + bottomWidth) / 2) * slant };
}

function generate(p: ParamValues) {
  const n = num(p, 'sides');
  const S = num(p, 'splay');
  const panel = splayedPanel(n, S, num(p, 'bottomWidth'), num(p, 'height'));
  const angles = compoundAngles(n, S);
  const d = (panel.top - panel.bottom) / 2;
  const model: makerjs.IModel = {
    units: makerjs.unitType.Millimeter,
    models: {
      panel: onLayer('outline', polygon([[d, 0], [d + panel.bottom, 0], [panel.top, panel.slant], [0, panel.slant]])),
      centre: onLayer('guide', { paths: { centre: new makerjs.paths.Line([panel.top / 2, 0], [panel.top / 2, panel.slant]) } }),
    },
  };
  const warnings: Warning[] = [];
  if (S > 45) warnings.push(warn('steep_splay', 'caution', `At ${S}° of splay the bevels get acute; cut test pieces and support the stock well (follow the saw maker’s instructions).`, ['splay']));
  const values = [
    rv('bladeTilt', 'Blade tilt (from vertical)', angles.bladeTilt, 'deg'),
    rv('miterGauge', 'Miter gauge (from square)', angles.miterGauge, 'deg'),
    rv('edgeBevel', 'Top and bottom edge bevel (to sit flat)', S, 'deg'),
    rv('topWidth', 'Top width of a side', panel.top, 'mm'),
    rv('bottomWidth', 'Bottom width of a side', panel.bottom, 'mm'),
    rv('slantHeight', 'Slant height of a side', panel.slant, 'mm'),
    rv('panelArea', 'Area of one side', panel.area, 'mm2'),
    rv('sides', 'Sides', n, 'count'),
  ];
  const summary = summarizeModel(model, { panel: { width: panel.top, height: panel.slant } });
  return { model, summary, report: { values, warnings } };
}

export const splayedBox: GeneratorDef = {
  id: 'splayed-box',
  title: 'Splayed box side',
  kind: 'template',
  description: 'The side panel of a box with N sloping sides, with the blade tilt and miter gauge settings for the compound miters.',
  params: SPLAYED_BOX_PARAMS,
  generate,
};

import { num, type ParamValues } from '../params';
import { rv, warn } from '../generators/report';
import { compoundAngles } from '../generators/splayedBox';
import type { CalculatorDef } from './types';

/**
 * Mitered box with N sides splayed S from vertical: blade tilt = asin(cos S · sin(180°/N)),
 * miter gauge = atan(sin S · tan(180°/N)) — matches the compound-angle charts in table-saw manuals.
 */
export const compoundBevelCalculator: CalculatorDef = {
  id: 'compound-bevel',
  title: 'Compound miter for a splayed box',
  description: 'Blade tilt and miter gauge angle for a box whose N sides lean out from vertical.',
  params: [
    { type: 'number', name: 'sides', label: 'Sides', unit: 'count', min: 3, max: 24, default: 4, step: 1, help: 'Number of sides.' },
    { type: 'number', name: 'splay', label: 'Splay from vertical', unit: 'deg', min: 0, max: 89, default: 15, step: 0.5, help: 'How far each side leans out.' },
  ],
  compute(p: ParamValues) {
    const a = compoundAngles(num(p, 'sides'), num(p, 'splay'));
    const warnings = num(p, 'splay') > 45 ? [warn('steep_splay', 'caution', 'Splays over 45° give acute bevels: cut test pieces first and follow the saw maker’s instructions.', ['splay'])] : [];
    return {
      values: [
        rv('bladeTilt', 'Blade tilt (from vertical)', a.bladeTilt, 'deg'),
        rv('miterGauge', 'Miter gauge (from square)', a.miterGauge, 'deg'),
        rv('edgeBevel', 'Top and bottom edge bevel', num(p, 'splay'), 'deg'),
      ],
      warnings,
    };
  },
};

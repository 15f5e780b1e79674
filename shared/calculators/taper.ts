import { num, str, type ParamValues } from '../params';
import { rv } from '../generators/report';
import { taperAngles } from '../generators/taperJig';
import type { CalculatorDef } from './types';

/** θ = atan((W_wide − W_narrow) / L) for one edge; half the offset per edge for two (pure geometry). */
export const taperCalculator: CalculatorDef = {
  id: 'taper',
  title: 'Leg taper',
  description: 'Angle and offset per edge for tapering a leg on one or two edges.',
  params: [
    { type: 'number', name: 'wide', label: 'Wide end', unit: 'mm', min: 1, max: 1000, default: 50.8, step: 0.1, help: 'Width where the taper starts.' },
    { type: 'number', name: 'narrow', label: 'Narrow end', unit: 'mm', min: 0, max: 1000, default: 25.4, step: 0.1, help: 'Width at the end of the taper.' },
    { type: 'number', name: 'length', label: 'Taper length', unit: 'mm', min: 1, max: 5000, default: 609.6, step: 0.5, help: 'Length of the taper.' },
    { type: 'choice', name: 'edges', label: 'Tapered edges', choices: [{ value: 'one', label: 'One edge' }, { value: 'two', label: 'Two edges' }], default: 'one', help: 'Split the taper over two edges.' },
  ],
  check(p) {
    return num(p, 'narrow') > num(p, 'wide') ? [{ field: 'narrow', message: 'Narrow end must not be wider than the wide end' }] : [];
  },
  compute(p: ParamValues) {
    const a = taperAngles(num(p, 'wide'), num(p, 'narrow'), num(p, 'length'), str(p, 'edges') as 'one' | 'two');
    return {
      values: [
        rv('anglePerEdge', 'Angle per edge', a.angle, 'deg', 4),
        rv('offsetPerEdge', 'Offset at the narrow end, per edge', a.offset, 'mm'),
        rv('totalTaper', 'Total reduction in width', a.total, 'mm'),
      ],
      warnings: [],
    };
  },
};

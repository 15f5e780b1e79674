// Seasonal movement across a board's width: Wood Handbook FPL-GTR-190 Eq. 13-2 with the Table 13-5
// coefficients; moisture contents either given or found from relative humidity by the
// Hailwood–Horrobin EMC fit (FPL-RN-0268).
import { num, str, type ParamValues } from '../params';
import { rv, warn } from '../generators/report';
import type { Warning } from '../generators/types';
import { emc, woodMovement, type Cut } from '../wood/movement';
import { getSpecies, SPECIES_CHOICES } from '../wood/species';
import type { CalculatorDef } from './types';

export const woodMovementCalculator: CalculatorDef = {
  id: 'wood-movement',
  title: 'Wood movement',
  description: 'How much a board’s width changes between two moisture contents (or two relative humidities), from the Wood Handbook (FPL-GTR-190) coefficients.',
  params: [
    { type: 'choice', name: 'species', label: 'Species', choices: SPECIES_CHOICES, default: 'white-oak', help: 'Coefficients from Wood Handbook Table 13-5 (species marked approx. are from memory).' },
    { type: 'choice', name: 'cut', label: 'Cut', choices: [{ value: 'flatsawn', label: 'Flatsawn' }, { value: 'quartersawn', label: 'Quartersawn' }, { value: 'plywood', label: 'Plywood' }], default: 'flatsawn', help: 'Flatsawn uses the tangential coefficient, quartersawn the radial one; plywood about 1.5 × 10⁻⁴ per % whatever the species.' },
    { type: 'number', name: 'width', label: 'Width', unit: 'mm', min: 1, max: 5000, default: 200, step: 1, help: 'Width across the grain.' },
    { type: 'choice', name: 'mode', label: 'From', choices: [{ value: 'mc', label: 'Moisture content' }, { value: 'rh', label: 'Relative humidity' }], default: 'mc', help: 'Give moisture contents directly, or the air’s relative humidity (converted to equilibrium moisture content).' },
    { type: 'number', name: 'mcFrom', label: 'Moisture content from', unit: 'percent', min: 0, max: 30, default: 6, step: 0.1, help: 'Starting moisture content.' },
    { type: 'number', name: 'mcTo', label: 'Moisture content to', unit: 'percent', min: 0, max: 30, default: 12, step: 0.1, help: 'Final moisture content.' },
    { type: 'number', name: 'rhFrom', label: 'Relative humidity from', unit: 'percent', min: 0, max: 98, default: 30, step: 1, help: 'Starting relative humidity.' },
    { type: 'number', name: 'rhTo', label: 'Relative humidity to', unit: 'percent', min: 0, max: 98, default: 65, step: 1, help: 'Final relative humidity.' },
    { type: 'number', name: 'temperature', label: 'Temperature', unit: 'deg', min: -10, max: 60, default: 21.1, step: 0.1, help: 'Air temperature in °C for the humidity conversion.' },
  ],
  compute(p: ParamValues) {
    const cut = str(p, 'cut') as Cut;
    const byRh = str(p, 'mode') === 'rh';
    const T = num(p, 'temperature');
    const mcFrom = byRh ? emc(num(p, 'rhFrom'), T) : num(p, 'mcFrom');
    const mcTo = byRh ? emc(num(p, 'rhTo'), T) : num(p, 'mcTo');
    const r = woodMovement({ species: str(p, 'species'), cut, width: num(p, 'width'), mcFrom, mcTo });
    const warnings: Warning[] = [];
    const mcFields = byRh ? ['rhFrom', 'rhTo'] : ['mcFrom', 'mcTo'];
    if (cut !== 'plywood' && r.outsideLinearRange) {
      warnings.push(warn('mc_outside_linear_range', 'info', 'Eq. 13-2 is linear only between 6 % and 14 % moisture content (Wood Handbook); outside it the figure is rough.', mcFields));
    }
    const species = getSpecies(str(p, 'species'));
    if (cut !== 'plywood' && species?.source.startsWith('from memory')) {
      warnings.push(warn('coefficient_from_memory', 'info', `The ${species.name} coefficients were not checked against the published table: treat the figure as approximate.`, ['species']));
    }
    return {
      values: [
        rv('change', r.change >= 0 ? 'Swelling' : 'Shrinkage', Math.abs(r.change), 'mm', 4),
        rv('signedChange', 'Change in width (+ swells, − shrinks)', r.change, 'mm', 4),
        rv('coefficient', cut === 'plywood' ? 'Coefficient (plywood, per 1 % MC)' : `Coefficient (${cut === 'quartersawn' ? 'C_R' : 'C_T'}, per 1 % MC)`, r.coefficient, undefined, 6),
        rv('mcFrom', byRh ? 'Moisture content from (EMC)' : 'Moisture content from', mcFrom, 'percent', 2),
        rv('mcTo', byRh ? 'Moisture content to (EMC)' : 'Moisture content to', mcTo, 'percent', 2),
        rv('finalWidth', 'Final width', num(p, 'width') + r.change, 'mm', 3),
      ],
      warnings,
    };
  },
};

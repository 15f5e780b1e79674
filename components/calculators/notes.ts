import type { Caution } from '../../shared/safety';

/** Where each calculator's numbers come from, shown under its results. */
export const CALCULATOR_SOURCES: Record<string, string> = {
  'wood-movement':
    'Coefficients: USDA Wood Handbook FPL-GTR-190 (2010), Table 13-5; change = width × coefficient × change in moisture content (Eq. 13-2). Humidity to moisture content: Hailwood–Horrobin fit, USDA FPL Research Note FPL-RN-0268.',
  taper: 'Geometry: angle per edge = atan(offset per edge / taper length).',
  'compound-bevel':
    'Formulas: blade tilt = asin(cos S · sin(180°/N)), miter gauge = atan(sin S · tan(180°/N)), for N sides splayed S from vertical. Check them against the compound-angle chart in your saw’s manual.',
  'frame-miter': 'Geometry: each of the two pieces meeting at a corner is cut at half the corner angle.',
};

/** Calculators whose numbers go straight to a saw carry the saw cautions; wood movement is arithmetic only. */
const CAUTIONS: Record<string, Caution['id'][]> = {
  taper: ['saw'],
  'compound-bevel': ['saw'],
  'frame-miter': ['saw'],
};

export function cautionsForCalculator(id: string): Caution['id'][] {
  return CAUTIONS[id] ?? [];
}

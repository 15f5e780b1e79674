import { num, str, type ParamValues } from '../params';
import { rv, warn } from '../generators/report';
import type { CalculatorDef } from './types';

/**
 * Flat frame: two pieces meeting at a corner angle α are each cut at α/2, measured between the cut
 * and the piece's edge (85° → 42.5°, 95° → 47.5°). A miter saw set from square reads 90° − α/2.
 * Common practice: cutting with the stock on edge instead gives the complement. A regular frame of
 * N pieces has corners of 180° − 360°/N.
 */
export const frameMiterCalculator: CalculatorDef = {
  id: 'frame-miter',
  title: 'Frame miter',
  description: 'Cut angle per piece for a flat frame, from the corner angle or the number of pieces in a regular frame.',
  params: [
    { type: 'choice', name: 'mode', label: 'From', choices: [{ value: 'corner', label: 'Corner angle' }, { value: 'pieces', label: 'Number of pieces (regular frame)' }], default: 'corner', help: 'Give the corner angle, or the number of equal pieces.' },
    { type: 'number', name: 'cornerAngle', label: 'Corner angle', unit: 'deg', min: 1, max: 179, default: 90, step: 0.5, help: 'Inside angle where two pieces meet.' },
    { type: 'number', name: 'pieces', label: 'Pieces', unit: 'count', min: 3, max: 36, default: 4, step: 1, help: 'Number of equal pieces in a regular frame.' },
  ],
  compute(p: ParamValues) {
    const byPieces = str(p, 'mode') === 'pieces';
    const alpha = byPieces ? 180 - 360 / num(p, 'pieces') : num(p, 'cornerAngle');
    const cut = alpha / 2;
    const warnings = cut < 15 ? [warn('acute_miter', 'caution', `A ${cut.toFixed(1)}° cut leaves a long, fragile point; support it with a sled or a sacrificial fence.`, [byPieces ? 'pieces' : 'cornerAngle'])] : [];
    return {
      values: [
        rv('cornerAngle', 'Corner angle', alpha, 'deg'),
        rv('cutAngle', 'Cut angle per piece (between cut and edge)', cut, 'deg'),
        rv('sawSetting', 'Miter saw setting (from square)', 90 - cut, 'deg'),
        rv('cutsPerPiece', 'Cuts per piece', 2, 'count'),
      ],
      warnings,
    };
  },
};

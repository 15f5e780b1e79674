// What a generated revision fits, read off its parameters, so a saved insert carries its fit
// notes without the maker typing them twice.
import { getSpecies } from '../wood/species';
import type { FitNotes } from '../schemas/library';
import type { ParamValues } from '../params';

const n = (p: ParamValues, k: string) => (typeof p[k] === 'number' ? (p[k] as number) : undefined);

export function fitNotesFromParams(generatorId: string, p: ParamValues): FitNotes {
  if (generatorId !== 'charger-insert') return {};
  const round = p.padShape === 'round';
  const stock = String(p.stock ?? 'plywood');
  return {
    device: { width: n(p, 'deviceWidth')!, length: n(p, 'deviceLength')!, thickness: n(p, 'deviceThickness')!, cased: (n(p, 'caseAllowance') ?? 0) > 0 },
    clearancePerSide: n(p, 'pocketClearance'),
    charger: {
      shape: round ? 'round' : 'rect',
      width: (round ? n(p, 'padDiameter') : n(p, 'padWidth'))!,
      length: (round ? n(p, 'padDiameter') : n(p, 'padLength'))!,
      thickness: n(p, 'padThickness')!,
      ...(p.ratedRange ? { rangeMin: n(p, 'ratedMin'), rangeMax: n(p, 'ratedMax') } : {}),
    },
    stock: { material: stock === 'plywood' ? 'plywood' : (getSpecies(stock)?.name ?? stock).toLowerCase(), thickness: n(p, 'plateThickness')! },
    bitDiameter: n(p, 'bitDiameter'),
    grain: stock === 'plywood' ? 'none' : p.grain === 'width' ? 'along-width' : 'along-length',
  };
}

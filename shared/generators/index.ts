import { validateParams } from '../params';
import { chargerInsert } from './chargerInsert';
import { halfLap } from './halfLap';
import { splayedBox } from './splayedBox';
import { taperJig } from './taperJig';
import type { GeneratorDef, GeneratorResult } from './types';
import type { FieldText, ParamValues } from '../params';

export type { FieldMessage, FitReport, GeneratorDef, GeneratorResult, ReportValue, Warning } from './types';

export const GENERATORS: GeneratorDef[] = [chargerInsert, taperJig, splayedBox, halfLap];

export function getGenerator(id: string): GeneratorDef | undefined {
  return GENERATORS.find((g) => g.id === id);
}

/** `fields` are in millimetres; `fieldTexts` hold those with lengths in them as templates (`textInUnits`). */
export type RunGeneratorResult = { ok: true; params: ParamValues; result: GeneratorResult } | { ok: false; fields: Record<string, string>; message: string; fieldTexts?: Record<string, FieldText> };

/** Validate, check combinations, generate. An unknown id comes back as a field error on `generatorId`. */
export function runGenerator(id: string, raw: unknown): RunGeneratorResult {
  const gen = getGenerator(id);
  if (!gen) {
    const message = `There is no generator "${id}"`;
    return { ok: false, fields: { generatorId: message }, message };
  }
  const v = validateParams(gen.params, raw, gen.check);
  return v.ok ? { ok: true, params: v.params, result: gen.generate(v.params) } : v;
}

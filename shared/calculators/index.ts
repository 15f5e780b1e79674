import { validateParams, type ParamValues } from '../params';
import { compoundBevelCalculator } from './compoundBevel';
import { frameMiterCalculator } from './frameMiter';
import { taperCalculator } from './taper';
import type { CalculatorDef, CalculatorResult } from './types';
import { woodMovementCalculator } from './woodMovement';

export type { CalculatorDef, CalculatorResult } from './types';

export const CALCULATORS: CalculatorDef[] = [woodMovementCalculator, taperCalculator, compoundBevelCalculator, frameMiterCalculator];

export function getCalculator(id: string): CalculatorDef | undefined {
  return CALCULATORS.find((c) => c.id === id);
}

export type RunCalculatorResult = { ok: true; params: ParamValues; result: CalculatorResult } | { ok: false; fields: Record<string, string>; message: string };

/** Validate, check combinations, compute. An unknown id comes back as a field error on `calculatorId`. */
export function runCalculator(id: string, raw: unknown): RunCalculatorResult {
  const calc = getCalculator(id);
  if (!calc) {
    const message = `There is no calculator "${id}"`;
    return { ok: false, fields: { calculatorId: message }, message };
  }
  const v = validateParams(calc.params, raw, calc.check);
  return v.ok ? { ok: true, params: v.params, result: calc.compute(v.params) } : v;
}

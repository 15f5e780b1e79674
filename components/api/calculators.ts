// Server endpoints for the shop calculators.
//
// The calculator screens compute with the shared code (shared/calculators) directly: the same
// functions the server runs, so the numbers agree and typing needs no round trip. These hooks are
// for callers that want the server's answer (other clients, checks against a deployed version).
import { useQuery } from '@tanstack/react-query';
import type { CalculatorResult } from '../../shared/calculators/types';
import type { ParamDecl, ParamValues } from '../../shared/params';
import { ApiError, api } from './client';

/** One entry of GET /api/calculators. */
export interface CalculatorListing {
  id: string;
  title: string;
  description: string;
  params: ParamDecl[];
  docs: string;
}

/** POST /api/calculators/:id answers with the values and warnings, and the params as validated. */
export type CalculatorAnswer = CalculatorResult & { params: ParamValues };

export const calculatorKeys = {
  all: ['calculators'] as const,
  list: () => [...calculatorKeys.all, 'list'] as const,
  results: () => [...calculatorKeys.all, 'result'] as const,
  result: (id: string, params: Partial<ParamValues>) => [...calculatorKeys.results(), id, params] as const,
};

export function fetchCalculatorList(signal?: AbortSignal): Promise<CalculatorListing[]> {
  return api<{ calculators: CalculatorListing[] }>('/calculators', { signal }).then((r) => r.calculators);
}

/** A 400 carries `fields` (param name → message) for the form. */
export function fetchCalculatorResult(id: string, params: Partial<ParamValues>, signal?: AbortSignal): Promise<CalculatorAnswer> {
  return api<CalculatorAnswer>(`/calculators/${encodeURIComponent(id)}`, { method: 'POST', json: { params }, signal });
}

export function useCalculatorList() {
  return useQuery({ queryKey: calculatorKeys.list(), queryFn: ({ signal }) => fetchCalculatorList(signal), staleTime: Infinity });
}

/** The server's result for `params`; pass null to wait. */
export function useCalculatorResult(id: string, params: Partial<ParamValues> | null) {
  return useQuery({
    queryKey: calculatorKeys.result(id, params ?? {}),
    enabled: params !== null,
    queryFn: ({ signal }) => fetchCalculatorResult(id, params ?? {}, signal),
    placeholderData: (prev) => prev,
    staleTime: Infinity,
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 1,
  });
}

// Two revisions side by side: the server's table of differences (shared/compare.ts).
import { useQuery } from '@tanstack/react-query';
import type { DiffRow } from '../../shared/compare';
import { api } from './client';
import type { RevisionWithTitle } from './revisions';

export const compareKeys = {
  all: ['compare'] as const,
  pair: (a: string, b: string) => [...compareKeys.all, a, b] as const,
};

export interface Comparison {
  a: RevisionWithTitle;
  b: RevisionWithTitle;
  rows: DiffRow[];
}

export function useComparison(a: string | undefined, b: string | undefined) {
  return useQuery({
    queryKey: compareKeys.pair(a ?? '-', b ?? '-'),
    enabled: !!a && !!b,
    // Saved revisions never change (only their status), so the table holds.
    staleTime: 5 * 60_000,
    queryFn: ({ signal }) => api<Comparison>(`/revisions/${a}/compare/${b}`, { signal }),
  });
}

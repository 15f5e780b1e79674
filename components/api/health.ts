import { useQuery } from '@tanstack/react-query';
import { api } from './client';

export interface Health {
  ok: boolean;
  db: boolean;
  objects: boolean;
  mail: boolean;
  /** Refused or failed. */
  down?: string[];
  /** No answer within `limitMs`: overloaded or hung. */
  slow?: string[];
  limitMs?: number;
}

export const healthKeys = { all: ['health'] as const };

export function useHealth() {
  return useQuery({
    queryKey: healthKeys.all,
    // 503 still carries which service is down: show it rather than a bare error.
    queryFn: () => api<Health>('/health', { acceptStatus: [503] }),
    refetchInterval: 30000,
  });
}

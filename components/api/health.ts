import { useQuery } from '@tanstack/react-query';
import { api } from './client';

export interface Health {
  ok: boolean;
  db: boolean;
  objects: boolean;
  mail: boolean;
  down?: string[];
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

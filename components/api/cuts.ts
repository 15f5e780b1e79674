// Cut log: what was cut from a revision and how it fitted, and a shop's fit history per device
// and material with the clearance to try next.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ClearanceSuggestion } from '../../shared/fit/clearance';
import type { CutLogEntry, CutLogInput } from '../../shared/schemas/cuts';
import { CSRF_HEADER } from '../../shared/schemas/auth';
import { api, ApiError, reach } from './client';
import { apiUrl } from './upload';

export const cutKeys = {
  all: ['cuts'] as const,
  ofRevision: (revisionId: string) => [...cutKeys.all, 'revision', revisionId] as const,
  fitHistories: () => [...cutKeys.all, 'fit-history'] as const,
  fitHistory: (shopId: string, device: string, material: string) => [...cutKeys.fitHistories(), shopId, device, material] as const,
};

export const cutPhotoUrl = (cutId: string) => apiUrl(`/cuts/${cutId}/photo`);

export function useCuts(revisionId: string | undefined) {
  return useQuery({
    queryKey: cutKeys.ofRevision(revisionId ?? '-'),
    enabled: !!revisionId,
    queryFn: ({ signal }) => api<{ items: CutLogEntry[] }>(`/revisions/${revisionId}/cuts`, { signal }).then((r) => r.items),
  });
}

export interface FitHistory {
  device: string;
  material: string;
  cuts: CutLogEntry[];
  suggestion: ClearanceSuggestion | null;
}

export function useFitHistory(shopId: string | undefined, device: string | null | undefined, material: string | undefined) {
  const m = material?.trim() ?? '';
  return useQuery({
    queryKey: cutKeys.fitHistory(shopId ?? '-', device ?? '-', m),
    enabled: !!shopId && !!device && m.length > 0,
    queryFn: ({ signal }) => api<FitHistory>(`/shops/${shopId}/fit-history?${new URLSearchParams({ device: device!, material: m })}`, { signal }),
  });
}

/** Records a cut; with a photo it goes as multipart (field `photo`), numbers as text. */
export function useLogCut(revisionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ input, photo }: { input: CutLogInput; photo?: File | null }) => {
      if (!photo) return api<{ id: string; clearanceMm: number | null }>(`/revisions/${revisionId}/cuts`, { method: 'POST', json: input });
      const form = new FormData();
      for (const [k, v] of Object.entries(input)) if (v !== undefined && v !== null) form.append(k, String(v));
      form.append('photo', photo, photo.name);
      const res = await reach(apiUrl(`/revisions/${revisionId}/cuts`), { method: 'POST', credentials: 'include', body: form, headers: { Accept: 'application/json', [CSRF_HEADER]: '1' } });
      const data = await res.json().catch(() => null);
      if (!res.ok) {
        const err = data?.error;
        throw new ApiError(res.status, err?.code ?? 'http_error', err?.message ?? (res.status === 413 ? 'The photo is larger than 8 MB' : `Saving the cut failed (${res.status})`), err?.fields);
      }
      return data as { id: string; clearanceMm: number | null };
    },
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: cutKeys.ofRevision(revisionId) });
      qc.invalidateQueries({ queryKey: cutKeys.fitHistories() });
    },
  });
}

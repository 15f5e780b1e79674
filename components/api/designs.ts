// Designs in a shop's library: the list (keyset pages), one design, and the changes to them.
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type {
  CreateDesign,
  CreateGeneratedRevision,
  DesignDetail,
  DesignKind,
  DesignPage,
  ForkDesign,
  RevisionStatus,
  UpdateDesign,
} from '../../shared/schemas/library';
import { api } from './client';

/** What the library list is filtered and sorted by; empty values mean "any". */
export interface LibraryFilters {
  q?: string;
  kind?: DesignKind;
  status?: RevisionStatus;
  material?: string;
  tag?: string;
  sort?: 'updated' | 'title' | 'created';
  dir?: 'asc' | 'desc';
}

export const designKeys = {
  all: ['designs'] as const,
  lists: () => [...designKeys.all, 'list'] as const,
  shopLists: (shopId: string) => [...designKeys.lists(), shopId] as const,
  list: (shopId: string, filters: LibraryFilters) => [...designKeys.shopLists(shopId), cleanFilters(filters)] as const,
  details: () => [...designKeys.all, 'detail'] as const,
  detail: (designId: string) => [...designKeys.details(), designId] as const,
};

/** Drops empty filter values so "" and undefined share one cache entry and one URL. */
export function cleanFilters(f: LibraryFilters): LibraryFilters {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(f)) if (typeof v === 'string' && v.trim() !== '') out[k] = v.trim();
  return out as LibraryFilters;
}

export const LIBRARY_PAGE_SIZE = 24;

/** `pageSize`: rows per page (the library's 24 unless told; home asks for a few). */
export function useDesignList(shopId: string | null | undefined, filters: LibraryFilters, pageSize = LIBRARY_PAGE_SIZE) {
  const clean = cleanFilters(filters);
  return useInfiniteQuery({
    queryKey: [...designKeys.list(shopId ?? '-', clean), pageSize],
    enabled: !!shopId,
    initialPageParam: null as string | null,
    queryFn: ({ pageParam, signal }) => {
      const params = new URLSearchParams({ ...(clean as Record<string, string>), limit: String(pageSize) });
      if (pageParam) params.set('cursor', pageParam);
      return api<DesignPage>(`/shops/${shopId}/designs?${params}`, { signal });
    },
    getNextPageParam: (last) => last.nextCursor,
    // Keep the old rows on screen while a new search in the same shop runs, instead of flashing
    // an empty list; another shop's rows are never shown in their place.
    placeholderData: (prev, prevQuery) => (prevQuery?.queryKey[2] === (shopId ?? '-') ? prev : undefined),
  });
}

export function useDesign(designId: string | undefined) {
  return useQuery({
    queryKey: designKeys.detail(designId ?? '-'),
    enabled: !!designId,
    queryFn: ({ signal }) => api<DesignDetail>(`/designs/${designId}`, { signal }),
  });
}

export function useCreateDesign(shopId: string | null | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof CreateDesign>) => api<DesignDetail>(`/shops/${shopId}/designs`, { method: 'POST', json: body }),
    onSuccess: (design) => {
      qc.setQueryData(designKeys.detail(design.id), design);
      qc.invalidateQueries({ queryKey: designKeys.shopLists(design.shopId) });
    },
  });
}

export function useUpdateDesign(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (patch: z.input<typeof UpdateDesign>) => api<DesignDetail>(`/designs/${designId}`, { method: 'PATCH', json: patch }),
    onSuccess: (design) => {
      qc.setQueryData(designKeys.detail(design.id), design);
      qc.invalidateQueries({ queryKey: designKeys.shopLists(design.shopId) });
    },
  });
}

export interface SavedRevision {
  id: string;
  designId: string;
  number: number;
}

/** A revision made by a generator: the server runs the generator again from these parameters. */
export function useSaveGeneratedRevision(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof CreateGeneratedRevision>) => api<SavedRevision>(`/designs/${designId}/revisions`, { method: 'POST', json: body }),
    onSuccess: () => invalidateDesign(qc, designId),
  });
}

/** The fork's new design and its r1. */
export type ForkResult = SavedRevision;

export function useForkDesign(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof ForkDesign>) => api<ForkResult>(`/designs/${designId}/forks`, { method: 'POST', json: body }),
    onSuccess: (_r, body) => {
      // The source shows the new fork in its lineage; the target shop's library has a new row.
      qc.invalidateQueries({ queryKey: designKeys.detail(designId) });
      qc.invalidateQueries({ queryKey: designKeys.shopLists(body.targetShopId) });
    },
  });
}

/** After a new revision or a status change: the design page and every list that shows it. */
export function invalidateDesign(qc: ReturnType<typeof useQueryClient>, designId: string) {
  qc.invalidateQueries({ queryKey: designKeys.detail(designId) });
  qc.invalidateQueries({ queryKey: designKeys.lists() });
}

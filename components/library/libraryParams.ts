import { router, useLocalSearchParams } from 'expo-router';
import { useCallback, useMemo } from 'react';
import { DESIGN_KINDS, LIBRARY_SORTS, REVISION_STATUSES } from '../../shared/schemas/library';
import type { LibraryFilters } from '../api/designs';

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
const oneOf = <T extends string>(list: readonly T[], v: string | undefined): T | undefined => (list.includes(v as T) ? (v as T) : undefined);

/**
 * The library's search, filters and sort live in the address, so a reload, the back button or a
 * shared link shows the same list. Unknown values in the address are ignored, not obeyed.
 */
export function useLibraryParams(): [LibraryFilters, (patch: Partial<LibraryFilters>) => void] {
  const raw = useLocalSearchParams<Record<string, string | string[]>>();
  const q = one(raw.q);
  const kind = one(raw.kind);
  const status = one(raw.status);
  const material = one(raw.material);
  const tag = one(raw.tag);
  const sort = one(raw.sort);
  const dir = one(raw.dir);
  const filters = useMemo<LibraryFilters>(
    () => ({
      q,
      kind: oneOf(DESIGN_KINDS, kind),
      status: oneOf(REVISION_STATUSES, status),
      material,
      tag,
      sort: oneOf(LIBRARY_SORTS, sort),
      dir: oneOf(['asc', 'desc'] as const, dir),
    }),
    [q, kind, status, material, tag, sort, dir],
  );
  const update = useCallback((patch: Partial<LibraryFilters>) => {
    // An empty value removes the parameter from the address.
    const next: Record<string, string | undefined> = {};
    for (const [k, v] of Object.entries(patch)) next[k] = v === undefined || v === '' ? undefined : String(v);
    router.setParams(next);
  }, []);
  return [filters, update];
}

export const SORT_LABEL: Record<(typeof LIBRARY_SORTS)[number], string> = {
  updated: 'Last changed',
  title: 'Title',
  created: 'Date added',
};

/** The direction a sort starts in: titles A→Z, dates newest first (as the server defaults). */
export const defaultDir = (sort: (typeof LIBRARY_SORTS)[number]) => (sort === 'title' ? 'asc' : 'desc');

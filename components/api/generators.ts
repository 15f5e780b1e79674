// Server endpoints for generators.
//
// Which source when: the generator screens list and preview from the shared registry
// (shared/generators) directly. It is the same code the server runs, it ships in the bundle, and a
// local preview answers every keystroke without a round trip. These hooks are for where the
// server's answer is the one that counts: the SVG it renders (the file a saved revision keeps), its
// validation before a save, and any client that must not trust its own bundle's version.
import { useQuery } from '@tanstack/react-query';
import type { FitReport, GeneratorDef } from '../../shared/generators/types';
import type { ParamDecl, ParamValues } from '../../shared/params';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import { ApiError, api } from './client';

/** One entry of GET /api/generators. */
export interface GeneratorListing {
  id: string;
  title: string;
  kind: GeneratorDef['kind'];
  description: string;
  params: ParamDecl[];
  deviceParams: string[];
  /** The parameter table as markdown. */
  docs: string;
}

/** POST /api/generators/:id/preview answers with the server's drawing and fit report. */
export interface GeneratorPreview {
  svg: string;
  /** Underside work, mirrored for cutting after the part is turned over (generators that have it). */
  undersideSvg?: string;
  report: FitReport;
  summary: GeometrySummary;
  /** The params as validated, defaults filled in. */
  params: ParamValues;
}

export const generatorKeys = {
  all: ['generators'] as const,
  list: () => [...generatorKeys.all, 'list'] as const,
  previews: () => [...generatorKeys.all, 'preview'] as const,
  preview: (id: string, params: Partial<ParamValues>) => [...generatorKeys.previews(), id, params] as const,
};

export function fetchGeneratorList(signal?: AbortSignal): Promise<GeneratorListing[]> {
  return api<{ generators: GeneratorListing[] }>('/generators', { signal }).then((r) => r.generators);
}

/** A 400 carries `fields` (param name → message): show them in the form with ParamForm's `externalErrors`. */
export function fetchGeneratorPreview(id: string, params: Partial<ParamValues>, signal?: AbortSignal): Promise<GeneratorPreview> {
  return api<GeneratorPreview>(`/generators/${encodeURIComponent(id)}/preview`, { method: 'POST', json: { params }, signal });
}

export function useGeneratorList() {
  return useQuery({
    queryKey: generatorKeys.list(),
    queryFn: ({ signal }) => fetchGeneratorList(signal),
    // The declarations change only with a new server build.
    staleTime: Infinity,
  });
}

/** The server's preview for `params`; pass null to wait (e.g. while the form is invalid). */
export function useGeneratorPreview(id: string, params: Partial<ParamValues> | null) {
  return useQuery({
    queryKey: generatorKeys.preview(id, params ?? {}),
    enabled: params !== null,
    queryFn: ({ signal }) => fetchGeneratorPreview(id, params ?? {}, signal),
    // Keep the last drawing while the next one is on its way.
    placeholderData: (prev) => prev,
    staleTime: Infinity,
    // Refused params stay refused: retrying a 400 or 404 cannot help.
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 1,
  });
}

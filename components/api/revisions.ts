// Revisions: checking an upload before it is saved, saving it, moving a revision's status, and
// the files each revision keeps (preview, model, downloads).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { FitNotes, RevisionInfo, RevisionStatus } from '../../shared/schemas/library';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import { api } from './client';
import { invalidateDesign, type SavedRevision } from './designs';
import { apiUrl, uploadFile, type UploadProgress } from './upload';

export const revisionKeys = {
  all: ['revisions'] as const,
  detail: (revisionId: string) => [...revisionKeys.all, 'detail', revisionId] as const,
  model: (revisionId: string) => [...revisionKeys.all, 'model', revisionId] as const,
};

export type DownloadFormat = 'dxf' | 'svg';
export type LengthUnits = 'mm' | 'in';

/** The generated preview of a revision (our own SVG, served with a sandbox CSP). */
export const previewSvgUrl = (revisionId: string) => apiUrl(`/revisions/${revisionId}/preview.svg`);

/** A direct download: the browser saves it as `<title>-r<N>.<ext>`. */
export const downloadUrl = (revisionId: string, format: DownloadFormat, units: LengthUnits = 'mm') =>
  apiUrl(`/revisions/${revisionId}/download?format=${format}&units=${units}`);

export type RevisionWithTitle = RevisionInfo & { designTitle: string };

export function useRevision(revisionId: string | undefined) {
  return useQuery({
    queryKey: revisionKeys.detail(revisionId ?? '-'),
    enabled: !!revisionId,
    queryFn: ({ signal }) => api<RevisionWithTitle>(`/revisions/${revisionId}`, { signal }),
  });
}

/** The stored geometry (a makerjs model, mm). A saved revision's geometry never changes. */
export function useRevisionModel(revisionId: string | undefined) {
  return useQuery({
    queryKey: revisionKeys.model(revisionId ?? '-'),
    enabled: !!revisionId,
    staleTime: Infinity,
    gcTime: 10 * 60_000,
    queryFn: ({ signal }) => api<Record<string, unknown>>(`/revisions/${revisionId}/model`, { signal }),
  });
}

/** What the server read from a file, before anything is saved. */
export interface InspectResult {
  format: 'dxf' | 'svg';
  sourceUnits: string;
  unitsFrom: string;
  entityCounts: Record<string, number>;
  warnings: string[];
  summary: GeometrySummary;
  svg: string;
}

export interface InspectInput {
  file: File;
  units?: LengthUnits;
  onProgress?: (p: UploadProgress) => void;
  signal?: AbortSignal;
}

export function useInspectUpload(designId: string) {
  return useMutation({
    mutationFn: ({ file, units, onProgress, signal }: InspectInput) =>
      uploadFile<InspectResult>(`/designs/${designId}/uploads/inspect`, file, { units }, { onProgress, signal }),
  });
}

export interface SaveUploadInput {
  file: File;
  message: string;
  status: RevisionStatus;
  fitNotes: FitNotes;
  units?: LengthUnits;
  onProgress?: (p: UploadProgress) => void;
  signal?: AbortSignal;
}

export type SavedUpload = SavedRevision & { warnings: string[]; summary: GeometrySummary };

export function useSaveUpload(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, message, status, fitNotes, units, onProgress, signal }: SaveUploadInput) =>
      uploadFile<SavedUpload>(
        `/designs/${designId}/revisions/upload`,
        file,
        { message, status, fitNotes: JSON.stringify(fitNotes), units },
        { onProgress, signal },
      ),
    onSuccess: () => invalidateDesign(qc, designId),
  });
}

export function useChangeStatus(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revisionId, status }: { revisionId: string; status: RevisionStatus }) =>
      api<{ id: string; status: RevisionStatus; previous: RevisionStatus }>(`/revisions/${revisionId}/status`, { method: 'PATCH', json: { status } }),
    onSuccess: (r) => {
      invalidateDesign(qc, designId);
      qc.invalidateQueries({ queryKey: revisionKeys.detail(r.id) });
    },
  });
}

export interface DownloadLink {
  url: string;
  name: string;
  expiresInSeconds: number;
}

/** A short-lived link (five minutes) to hand to a shop computer that is not signed in. */
export function useDownloadLink() {
  return useMutation({
    mutationFn: ({ revisionId, format, units }: { revisionId: string; format: DownloadFormat; units: LengthUnits }) =>
      api<DownloadLink>(`/revisions/${revisionId}/download?format=${format}&units=${units}&link=1`),
  });
}

/** A new revision from a generated one, with only the device parameters changed. */
export function useRegenerate(designId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revisionId, deviceId, message }: { revisionId: string; deviceId: string; message?: string }) =>
      api<SavedRevision & { fromRevisionId: string }>(`/revisions/${revisionId}/regenerate`, { method: 'POST', json: { deviceId, message } }),
    onSuccess: () => invalidateDesign(qc, designId),
  });
}

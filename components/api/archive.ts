// Shop archives: the whole library as one .tar.gz to download, and importing one into a shop.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ArchiveImportResult } from '../../shared/schemas/archive';
import { catalogKeys } from './catalog';
import { designKeys } from './designs';
import { apiUrl, uploadFile, type UploadProgress } from './upload';

export { ALREADY_IMPORTED } from '../../shared/schemas/archive';
export type { ArchiveImportResult } from '../../shared/schemas/archive';

/** The download address; the browser sends the session cookie, so a plain link works. */
export const archiveDownloadUrl = (shopId: string) => apiUrl(`/shops/${shopId}/archive`);

export interface ImportArchiveInput {
  file: File;
  /** Import it even though this shop already has it: its designs come in as a further copy. */
  again?: boolean;
  onProgress?: (p: UploadProgress) => void;
  signal?: AbortSignal;
}

export function useImportArchive(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, again, onProgress, signal }: ImportArchiveInput) =>
      uploadFile<ArchiveImportResult>(`/shops/${shopId}/archive${again ? '?again=true' : ''}`, file, {}, { fieldName: 'archive', onProgress, signal }),
    onSuccess: () =>
      Promise.all([qc.invalidateQueries({ queryKey: designKeys.shopLists(shopId) }), qc.invalidateQueries({ queryKey: catalogKeys.shop(shopId) })]),
  });
}

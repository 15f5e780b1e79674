// Importing a shop archive (POST /api/shops/:shopId/archive): the query it takes and what it answers.
import { z } from 'zod';

/** `again=true`: import an archive this shop already imported once more, as a further copy. */
export const ArchiveImportQuery = z.strictObject({
  again: z.enum(['true', 'false'], { error: 'again must be "true" or "false"' }).optional(),
});
export type ArchiveImportQuery = z.infer<typeof ArchiveImportQuery>;

/** The 201 answer. */
export interface ArchiveImportResult {
  /** The record of this import (table archive_imports). */
  importId: string;
  /** null for the first import of this archive into the shop; the first import's id for a further copy. */
  copyOf: string | null;
  designs: number;
  revisions: number;
  files: number;
  cutLogs: number;
  photos: number;
  devices: { added: number; skipped: number };
  chargers: { added: number; skipped: number };
  activity: number;
  /** Old design id (in the archive) → new design id (in this shop). */
  designIds: Record<string, string>;
  revisionIds: Record<string, string>;
}

/** `error.details` of the 409 `already_imported` answer: the first import of the same archive. */
export interface AlreadyImportedDetails {
  importId: string;
  importedAt: string;
  /** null when the account that imported it is gone. */
  importedBy: { id: string; name: string } | null;
  designs: number;
  sourceShop: { id: string; name: string };
  exportedAt: string;
  /** How many further copies were imported since, on purpose. */
  copies: number;
}

export const ALREADY_IMPORTED = 'already_imported';

// Saving a revision: objects first, then the rows in one transaction; when anything fails, the
// objects written so far are removed. Revision numbers come from a counter on the design row,
// taken under its row lock, so concurrent saves get r1, r2, … with no gap or duplicate.
import { createHash, randomUUID } from 'node:crypto';
import type makerjs from 'makerjs';
import { sql, type Transaction } from 'kysely';
import type { Database } from '../../db/schema';
import type { FitNotes, RevisionStatus } from '../../shared/schemas/library';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import type { Deps } from '../deps';
import { HttpError } from '../http/errors';
import { logActivity } from '../designs/repository';
import { renderRevisionFiles, type RenderedFile } from './geometry';

export interface RevisionDraft {
  authorId: string | null;
  source: 'generated' | 'uploaded';
  generatorId?: string | null;
  params?: Record<string, number | string | boolean> | null;
  message: string;
  status: RevisionStatus;
  fitNotes: FitNotes;
  model: makerjs.IModel;
  summary: GeometrySummary;
  title: string;
  original?: { body: Buffer; contentType: string; ext: string };
  activity: { action: string; detail?: Record<string, unknown> };
}

export interface SavedRevision {
  id: string;
  designId: string;
  number: number;
}

/**
 * `designId` is either an existing design, or a function that creates the design inside the
 * same transaction (a fork: the new design and its r1 appear together or not at all).
 */
export async function saveRevision(
  deps: Deps,
  designId: string | ((tx: Transaction<Database>) => Promise<string>),
  draft: RevisionDraft,
  hooks: { afterObjects?: () => Promise<void> } = {},
): Promise<SavedRevision> {
  const revisionId = randomUUID();
  const files: RenderedFile[] = renderRevisionFiles(draft.model, draft.title);
  if (draft.original) files.push({ role: 'original', ...draft.original });
  const written = files.map((f) => `revisions/${revisionId}/${f.role}.${f.ext}`);
  // The files go up side by side. Every write is waited for, failed or not, before anything is
  // removed: a write still in flight could otherwise land after the clean-up and stay behind.
  const puts = await Promise.allSettled(files.map((f, i) => deps.objects.put(written[i], f.body, f.contentType)));
  const failed = puts.find((p): p is PromiseRejectedResult => p.status === 'rejected');
  if (failed) {
    await removeQuietly(deps, written);
    deps.log.error({ err: failed.reason }, 'object store write failed');
    throw new HttpError(503, 'storage_unavailable', 'The file store is not answering; nothing was saved. Try again in a moment.');
  }
  try {
    await hooks.afterObjects?.();
    return await deps.db.transaction().execute(async (tx) => {
      const id = typeof designId === 'string' ? designId : await designId(tx);
      const bumped = await tx
        .updateTable('designs')
        .set({ latest_revision_number: sql`latest_revision_number + 1`, latest_status: draft.status, updated_at: sql`now()` })
        .where('id', '=', id)
        .returning(['latest_revision_number', 'shop_id'])
        .executeTakeFirst();
      if (!bumped) throw new HttpError(404, 'not_found', 'That design no longer exists');
      const number = bumped.latest_revision_number;
      await tx
        .insertInto('revisions')
        .values({
          id: revisionId,
          design_id: id,
          number,
          message: draft.message,
          author_id: draft.authorId,
          source: draft.source,
          generator_id: draft.generatorId ?? null,
          params: draft.params ? JSON.stringify(draft.params) : null,
          status: draft.status,
          fit_notes: JSON.stringify(draft.fitNotes ?? {}),
          summary: JSON.stringify(draft.summary),
        })
        .execute();
      await tx
        .insertInto('revision_files')
        .values(
          files.map((f, i) => ({
            revision_id: revisionId,
            role: f.role,
            object_key: written[i],
            content_type: f.contentType,
            bytes: f.body.length,
            sha256: createHash('sha256').update(f.body).digest('hex'),
          })),
        )
        .execute();
      await logActivity(tx, {
        shopId: bumped.shop_id,
        designId: id,
        revisionId,
        actorId: draft.authorId,
        action: draft.activity.action,
        detail: { number, ...draft.activity.detail },
      });
      return { id: revisionId, designId: id, number };
    });
  } catch (e) {
    await removeQuietly(deps, written);
    throw e;
  }
}

async function removeQuietly(deps: Deps, keys: string[]) {
  try {
    await deps.objects.remove(keys);
  } catch (err) {
    // The sweep removes them later: no row refers to them.
    deps.log.warn({ err, keys }, 'could not remove objects after a failed save');
  }
}

import type { Kysely } from 'kysely';
import type { Database, FileRole } from '../../db/schema';
import type { FitNotes, RevisionStatus } from '../../shared/schemas/library';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import type { Deps } from '../deps';
import { toRevisionInfo } from '../designs/repository';

export async function getRevision(db: Kysely<Database>, revisionId: string) {
  const r = await db
    .selectFrom('revisions as r')
    .innerJoin('designs as d', 'd.id', 'r.design_id')
    .leftJoin('users as u', 'u.id', 'r.author_id')
    .select(['r.id', 'r.design_id', 'r.number', 'r.message', 'r.author_id', 'u.name as author_name', 'r.created_at', 'r.source', 'r.generator_id', 'r.params', 'r.status', 'r.fit_notes', 'r.summary', 'd.title', 'd.shop_id'])
    .where('r.id', '=', revisionId)
    .executeTakeFirst();
  if (!r) return null;
  const files = await db.selectFrom('revision_files').select(['role', 'bytes', 'sha256', 'object_key', 'content_type']).where('revision_id', '=', revisionId).execute();
  return { info: toRevisionInfo(r, files), title: r.title, shopId: r.shop_id, files };
}

export async function fileOf(db: Kysely<Database>, revisionId: string, role: FileRole) {
  return db.selectFrom('revision_files').select(['object_key', 'content_type', 'bytes']).where('revision_id', '=', revisionId).where('role', '=', role).executeTakeFirst();
}

/** Everything needed to copy a revision elsewhere (a fork) or regenerate it. */
export async function loadRevisionForCopy(deps: Deps, revisionId: string) {
  const r = await getRevision(deps.db, revisionId);
  if (!r) return null;
  const modelFile = r.files.find((f) => f.role === 'model');
  if (!modelFile) throw new Error(`revision ${revisionId} has no stored model`);
  const model = JSON.parse((await deps.objects.get(modelFile.object_key)).toString('utf8'));
  const originalFile = r.files.find((f) => f.role === 'original');
  const original = originalFile
    ? { body: await deps.objects.get(originalFile.object_key), contentType: originalFile.content_type, ext: originalFile.object_key.split('.').pop() ?? 'bin' }
    : undefined;
  return {
    id: r.info.id,
    designId: r.info.designId,
    number: r.info.number as number,
    source: r.info.source as 'generated' | 'uploaded',
    generatorId: r.info.generatorId as string | null,
    params: r.info.params as Record<string, number | string | boolean> | null,
    fitNotes: r.info.fitNotes as FitNotes,
    summary: r.info.summary as GeometrySummary,
    status: r.info.status as RevisionStatus,
    model,
    original,
    title: r.title,
  };
}

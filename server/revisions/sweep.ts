import type { Deps } from '../deps';

/**
 * Removes stored objects that no row refers to (left by a crash between the object writes and
 * the row's commit). Objects younger than `graceSeconds` are left alone: a save may be in flight.
 */
export async function sweepOrphans(deps: Pick<Deps, 'db' | 'objects'>, { graceSeconds = 600, dryRun = false } = {}) {
  const referenced = new Set<string>();
  for (const r of await deps.db.selectFrom('revision_files').select('object_key').execute()) referenced.add(r.object_key);
  for (const r of await deps.db.selectFrom('cut_logs').select('photo_key').where('photo_key', 'is not', null).execute()) referenced.add(r.photo_key!);
  const cutoff = Date.now() - graceSeconds * 1000;
  const orphans: string[] = [];
  for (const prefix of ['revisions/', 'photos/']) {
    for (const o of await deps.objects.listWithDates(prefix)) {
      if (!referenced.has(o.key) && o.lastModified.getTime() <= cutoff) orphans.push(o.key);
    }
  }
  if (!dryRun) await deps.objects.remove(orphans);
  return { checked: referenced.size, removed: orphans };
}

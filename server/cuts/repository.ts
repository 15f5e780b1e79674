import type { Kysely } from 'kysely';
import type { Database } from '../../db/schema';
import type { CutLogEntry, CutLogInput } from '../../shared/schemas/cuts';

/** The device a revision fits, as one key for the fit history: its name, else W×L×T. */
export function deviceKeyOf(fitNotes: { device?: { name?: string; width: number; length: number; thickness: number } } | null): string | null {
  const d = fitNotes?.device;
  if (!d) return null;
  return d.name?.trim() || `${d.width}×${d.length}×${d.thickness} mm`;
}

export async function insertCut(
  db: Kysely<Database>,
  c: CutLogInput & { revisionId: string; shopId: string; authorId: string; deviceKey: string | null; photoKey: string | null },
) {
  return db
    .insertInto('cut_logs')
    .values({
      revision_id: c.revisionId,
      shop_id: c.shopId,
      author_id: c.authorId,
      cut_on: c.cutOn,
      material: c.material,
      bit_mm: c.bitMm,
      machine_note: c.machineNote,
      device_key: c.deviceKey,
      clearance_mm: c.clearanceMm ?? null,
      measured_width_mm: c.measuredWidthMm ?? null,
      measured_length_mm: c.measuredLengthMm ?? null,
      result: c.result,
      photo_key: c.photoKey,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

function baseQuery(db: Kysely<Database>) {
  return db
    .selectFrom('cut_logs as c')
    .innerJoin('revisions as r', 'r.id', 'c.revision_id')
    .leftJoin('users as u', 'u.id', 'c.author_id')
    .select(['c.id', 'c.revision_id', 'r.number', 'c.cut_on', 'c.material', 'c.bit_mm', 'c.machine_note', 'c.device_key', 'c.clearance_mm', 'c.measured_width_mm', 'c.measured_length_mm', 'c.result', 'c.photo_key', 'u.name as author'])
    .orderBy('c.cut_on', 'desc')
    .orderBy('c.created_at', 'desc');
}

function toEntry(r: any): CutLogEntry {
  return {
    id: r.id,
    revisionId: r.revision_id,
    revisionNumber: r.number,
    cutOn: r.cut_on instanceof Date ? r.cut_on.toISOString().slice(0, 10) : String(r.cut_on),
    material: r.material,
    bitMm: r.bit_mm,
    machineNote: r.machine_note,
    deviceKey: r.device_key,
    clearanceMm: r.clearance_mm ?? undefined,
    measuredWidthMm: r.measured_width_mm ?? undefined,
    measuredLengthMm: r.measured_length_mm ?? undefined,
    result: r.result,
    author: r.author ?? null,
    hasPhoto: Boolean(r.photo_key),
  };
}

export async function cutsOfRevision(db: Kysely<Database>, revisionId: string) {
  return (await baseQuery(db).where('c.revision_id', '=', revisionId).execute()).map(toEntry);
}

export async function fitHistory(db: Kysely<Database>, shopId: string, deviceKey: string, material: string) {
  const rows = await baseQuery(db)
    .where('c.shop_id', '=', shopId)
    .where('c.device_key', '=', deviceKey)
    .where((eb) => eb(eb.fn('lower', ['c.material']), '=', material.toLowerCase()))
    .execute();
  return rows.map(toEntry);
}

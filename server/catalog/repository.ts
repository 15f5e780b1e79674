import type { Kysely } from 'kysely';
import type { Database } from '../../db/schema';
import type { Charger, ChargerInput, Device, DeviceInput } from '../../shared/schemas/catalog';

export async function listDevices(db: Kysely<Database>, shopId: string): Promise<Device[]> {
  const rows = await db.selectFrom('devices').selectAll().where('shop_id', '=', shopId).orderBy('name').execute();
  return rows.map((r) => ({ id: r.id, name: r.name, widthMm: r.width_mm, lengthMm: r.length_mm, thicknessMm: r.thickness_mm, caseAllowanceMm: r.case_allowance_mm }));
}

export async function insertDevice(db: Kysely<Database>, shopId: string, d: DeviceInput) {
  return db
    .insertInto('devices')
    .values({ shop_id: shopId, name: d.name, width_mm: d.widthMm, length_mm: d.lengthMm, thickness_mm: d.thicknessMm, case_allowance_mm: d.caseAllowanceMm })
    .returning('id')
    .executeTakeFirstOrThrow();
}

export async function listChargers(db: Kysely<Database>, shopId: string): Promise<Charger[]> {
  const rows = await db.selectFrom('chargers').selectAll().where('shop_id', '=', shopId).orderBy('name').execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    shape: r.shape,
    widthMm: r.width_mm,
    lengthMm: r.length_mm,
    thicknessMm: r.thickness_mm,
    rangeMinMm: r.range_min_mm,
    rangeMaxMm: r.range_max_mm,
  }));
}

export async function insertCharger(db: Kysely<Database>, shopId: string, c: ChargerInput) {
  return db
    .insertInto('chargers')
    .values({
      shop_id: shopId,
      name: c.name,
      shape: c.shape,
      width_mm: c.widthMm,
      length_mm: c.shape === 'round' ? c.widthMm : (c.lengthMm ?? c.widthMm),
      thickness_mm: c.thicknessMm,
      range_min_mm: c.rangeMinMm ?? null,
      range_max_mm: c.rangeMaxMm ?? null,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

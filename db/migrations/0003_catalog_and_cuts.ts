import { Kysely, sql } from 'kysely';

// A shop's catalog of devices and charger pads, and the log of test and production cuts.
// Every length is stored in millimetres.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('devices')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('width_mm', 'float8', (c) => c.notNull().check(sql`width_mm > 0`))
    .addColumn('length_mm', 'float8', (c) => c.notNull().check(sql`length_mm > 0`))
    .addColumn('thickness_mm', 'float8', (c) => c.notNull().check(sql`thickness_mm > 0`))
    .addColumn('case_allowance_mm', 'float8', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('devices_shop_name_uq', ['shop_id', 'name'])
    .execute();

  await db.schema
    .createTable('chargers')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('shape', 'text', (c) => c.notNull().check(sql`shape in ('round', 'rect')`))
    .addColumn('width_mm', 'float8', (c) => c.notNull().check(sql`width_mm > 0`))
    .addColumn('length_mm', 'float8', (c) => c.notNull().check(sql`length_mm > 0`))
    .addColumn('thickness_mm', 'float8', (c) => c.notNull().check(sql`thickness_mm > 0`))
    .addColumn('range_min_mm', 'float8')
    .addColumn('range_max_mm', 'float8')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('chargers_shop_name_uq', ['shop_id', 'name'])
    .execute();

  await db.schema
    .createTable('cut_logs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('revision_id', 'uuid', (c) => c.notNull().references('revisions.id').onDelete('cascade'))
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('cut_on', 'date', (c) => c.notNull())
    .addColumn('material', 'text', (c) => c.notNull())
    .addColumn('bit_mm', 'float8', (c) => c.notNull())
    .addColumn('machine_note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('device_key', 'text')
    .addColumn('clearance_mm', 'float8')
    .addColumn('measured_width_mm', 'float8')
    .addColumn('measured_length_mm', 'float8')
    .addColumn('result', 'text', (c) => c.notNull().check(sql`result in ('tight', 'good', 'loose')`))
    .addColumn('photo_key', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`CREATE INDEX cut_logs_revision_idx ON cut_logs (revision_id)`.execute(db);
  await sql`CREATE INDEX cut_logs_fit_idx ON cut_logs (shop_id, device_key, material)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['cut_logs', 'chargers', 'devices']) await db.schema.dropTable(t).ifExists().execute();
}

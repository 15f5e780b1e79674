import { Kysely, sql } from 'kysely';

// Every completed shop-archive import (server/archive/import.ts), written in the same transaction as
// the imported rows: a failed import leaves none. An archive is known by the sha256 of its
// manifest.json bytes (the manifest lists every file with its own sha256, so it stands for the whole).
// - copy_of: null for the first import of an archive into a shop; the id of that first import when
//   the owner chose to import it again as a further copy.
// - The partial unique index lets only one first import per (shop, manifest): a second one, even
//   one running at the same moment, hits it and is refused whole.
// - source_shop_id has no foreign key: the archive may come from another Jigwright.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('archive_imports')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('imported_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('imported_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('source_shop_id', 'uuid', (c) => c.notNull())
    .addColumn('source_shop_name', 'text', (c) => c.notNull())
    .addColumn('exported_at', 'timestamptz', (c) => c.notNull())
    .addColumn('manifest_sha256', 'text', (c) => c.notNull().check(sql`manifest_sha256 ~ '^[0-9a-f]{64}$'`))
    .addColumn('copy_of', 'uuid', (c) => c.references('archive_imports.id').onDelete('cascade'))
    .addColumn('designs', 'integer', (c) => c.notNull().check(sql`designs >= 0`))
    .addColumn('revisions', 'integer', (c) => c.notNull().check(sql`revisions >= 0`))
    .addColumn('files', 'integer', (c) => c.notNull().check(sql`files >= 0`))
    .addColumn('cut_logs', 'integer', (c) => c.notNull().check(sql`cut_logs >= 0`))
    .addColumn('photos', 'integer', (c) => c.notNull().check(sql`photos >= 0`))
    .addColumn('devices_added', 'integer', (c) => c.notNull().check(sql`devices_added >= 0`))
    .addColumn('devices_skipped', 'integer', (c) => c.notNull().check(sql`devices_skipped >= 0`))
    .addColumn('chargers_added', 'integer', (c) => c.notNull().check(sql`chargers_added >= 0`))
    .addColumn('chargers_skipped', 'integer', (c) => c.notNull().check(sql`chargers_skipped >= 0`))
    .addColumn('activity', 'integer', (c) => c.notNull().check(sql`activity >= 0`))
    .execute();
  await sql`CREATE UNIQUE INDEX archive_imports_first_uq ON archive_imports (shop_id, manifest_sha256) WHERE copy_of IS NULL`.execute(db);
  await sql`CREATE INDEX archive_imports_copy_of_idx ON archive_imports (copy_of)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('archive_imports').ifExists().execute();
}

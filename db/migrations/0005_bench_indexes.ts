import { Kysely, sql } from 'kysely';

// The library search, from EXPLAIN (ANALYZE) on the bench library (bench/results.md, row 3):
// with only the GIN index on `search`, a search inside one shop with a kind filter fetched every
// design matching the words in any shop and kind, then threw most away ("Rows Removed by Filter").
// One GIN index over shop, kind and the search vector lets PostgreSQL intersect all three before
// it reads a row; it also serves searches without a kind filter, so the old index is dropped.
// btree_gin (a contrib extension shipped with PostgreSQL, marked trusted since 13) supplies GIN
// operator classes for the uuid and text columns. fastupdate is off: every revision save updates
// its design row (a new index entry each time), and with a pending list every search pays for a
// linear read of the entries not merged yet (measured: 1 500 pending entries made the bench search
// 0.9 → 1.4 ms), while merging at once costs a save about 0.2 ms.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`CREATE EXTENSION IF NOT EXISTS btree_gin`.execute(db);
  await sql`CREATE INDEX designs_shop_kind_search_idx ON designs USING gin (shop_id, kind, search) WITH (fastupdate = off)`.execute(db);
  await sql`DROP INDEX IF EXISTS designs_search_idx`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`CREATE INDEX IF NOT EXISTS designs_search_idx ON designs USING gin (search)`.execute(db);
  await sql`DROP INDEX IF EXISTS designs_shop_kind_search_idx`.execute(db);
}

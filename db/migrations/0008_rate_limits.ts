import { Kysely, sql } from 'kysely';

// Counters for the sign-in, sign-up and reset limits (server/auth/limits.ts), kept in PostgreSQL so
// that several API processes behind one load balancer count together, and a restart does not wipe
// them. One row per limiter and client key; a row whose window has ended is reused or removed.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('rate_limits')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('hits', 'integer', (c) => c.notNull().check(sql`hits >= 0`))
    .addColumn('reset_at', 'timestamptz', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('rate_limits_reset_idx').on('rate_limits').column('reset_at').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('rate_limits').ifExists().execute();
}

import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './schema';

export type DB = Kysely<Database>;

/** A Kysely instance over a pg pool. Pool errors (a restarted server) are logged, not fatal. */
export function createDb(connectionString: string, opts: { max?: number } = {}): DB {
  const pool = new pg.Pool({
    connectionString,
    max: opts.max ?? 10,
    connectionTimeoutMillis: 5000,
    idleTimeoutMillis: 30000,
  });
  pool.on('error', () => {
    /* an idle client lost its server; the pool replaces it on next use */
  });
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

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
  // A client in use (inside a transaction, between two statements) that loses its server emits
  // 'error' too, and pg-pool listens only to idle ones: unheard, it would end the process. Its
  // statement fails on its own, and the pool drops a client that is no longer queryable.
  pool.on('connect', (client) => {
    client.on('error', () => undefined);
  });
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

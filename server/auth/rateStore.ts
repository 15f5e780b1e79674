// express-rate-limit's Store over the `rate_limits` table (migration 0008): counters shared by every
// API process on the same database, and kept across a restart. Each limiter has its own prefix.
// Increment is one statement (INSERT … ON CONFLICT), so two processes counting the same client at
// the same moment cannot lose a hit; a row whose window has ended starts again at 1.
import { sql } from 'kysely';
import type { Options, Store, IncrementResponse, ClientRateLimitInfo } from 'express-rate-limit';
import type { DB } from '../../db/connect';

export class PostgresRateStore implements Store {
  windowMs = 60_000;
  readonly localKeys = false;

  constructor(
    private readonly db: DB,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string) {
    return `${this.prefix}:${key}`;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.db.selectFrom('rate_limits').select(['hits', 'reset_at']).where('key', '=', this.key(key)).where('reset_at', '>', sql<Date>`now()`).executeTakeFirst();
    return row ? { totalHits: row.hits, resetTime: row.reset_at } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const windowSql = sql`${this.windowMs} * interval '1 millisecond'`;
    const r = await sql<{ hits: number; reset_at: Date }>`
      INSERT INTO rate_limits (key, hits, reset_at) VALUES (${this.key(key)}, 1, now() + ${windowSql})
      ON CONFLICT (key) DO UPDATE SET
        hits = CASE WHEN rate_limits.reset_at <= now() THEN 1 ELSE rate_limits.hits + 1 END,
        reset_at = CASE WHEN rate_limits.reset_at <= now() THEN now() + ${windowSql} ELSE rate_limits.reset_at END
      RETURNING hits, reset_at`.execute(this.db);
    return { totalHits: r.rows[0].hits, resetTime: r.rows[0].reset_at };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .updateTable('rate_limits')
      .set({ hits: sql`greatest(hits - 1, 0)` })
      .where('key', '=', this.key(key))
      .where('reset_at', '>', sql<Date>`now()`)
      .execute();
  }

  async resetKey(key: string): Promise<void> {
    await this.db.deleteFrom('rate_limits').where('key', '=', this.key(key)).execute();
  }
}

/** Rows whose window ended: housekeeping removes them (a later hit would only start them again). */
export async function removeEndedRateWindows(db: DB): Promise<number> {
  const r = await db.deleteFrom('rate_limits').where('reset_at', '<', sql<Date>`now()`).executeTakeFirst();
  return Number(r.numDeletedRows);
}

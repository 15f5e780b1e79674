// Work the running server does by itself now and then: spent sign-in rows and ended rate-limit
// windows go (server/auth/cleanup, server/auth/rateStore),
// and stored objects no revision refers to are swept after their grace time, as `npm run sweep`
// does by hand (server/revisions/sweep). A failure is logged and tried again next time; it never
// stops the server. The timer does not keep the process alive.
import { sql } from 'kysely';
import type { Deps } from './deps';
import { removeSpentAuthRows } from './auth/cleanup';
import { removeEndedRateWindows } from './auth/rateStore';
import { sweepOrphans } from './revisions/sweep';

/** The advisory lock key of a housekeeping round (any bigint the app uses for nothing else). */
export const HOUSEKEEPING_LOCK = 4_172_031_001;

export interface HousekeepingOptions {
  /** First round after start-up (not at once: start-up already has enough to do). */
  firstAfterMs?: number;
  everyMs?: number;
  /**
   * Objects younger than this are left alone: a save or an archive import may still be writing its
   * rows. A day, not the hand-run sweep's 10 minutes: a large archive import writes every file
   * before its one transaction, and it must never lose one to a sweep that ran in between.
   */
  graceSeconds?: number;
}

export function startHousekeeping(deps: Pick<Deps, 'db' | 'objects' | 'log'>, { firstAfterMs = 60_000, everyMs = 3_600_000, graceSeconds = 86_400 }: HousekeepingOptions = {}) {
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<void> | undefined;
  let stopped = false;
  let rounds = 0;
  let skipped = 0;
  const round = async () => {
    rounds++;
    try {
      // With several API processes on one database, one of them does the round: the others find the
      // lock taken and skip it. A transaction-level lock, so it goes with the connection if this dies.
      await deps.db.transaction().execute(async (tx) => {
        const lock = await sql<{ got: boolean }>`select pg_try_advisory_xact_lock(${HOUSEKEEPING_LOCK}) as got`.execute(tx);
        if (!lock.rows[0]?.got) {
          skipped++;
          return;
        }
        const spent = await removeSpentAuthRows(deps.db);
        const rateWindows = await removeEndedRateWindows(deps.db);
        const swept = await sweepOrphans(deps, { graceSeconds });
        if (spent.sessions || spent.resets || rateWindows || swept.removed.length) deps.log.info({ ...spent, rateWindows, orphanObjects: swept.removed.length }, 'housekeeping');
      });
    } catch (err) {
      deps.log.warn({ err }, 'housekeeping failed; it runs again later');
    }
  };
  const schedule = (ms: number) => {
    if (stopped) return;
    timer = setTimeout(() => {
      running = round().finally(() => {
        running = undefined;
        schedule(everyMs);
      });
    }, ms);
    timer.unref();
  };
  schedule(firstAfterMs);
  return {
    /** Rounds started so far. */
    get rounds() {
      return rounds;
    },
    /** Rounds left to another process that held the lock. */
    get skipped() {
      return skipped;
    },
    /** Stops the timer and waits for a round in progress. */
    async stop() {
      stopped = true;
      clearTimeout(timer);
      await running;
    },
  };
}

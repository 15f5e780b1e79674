// Housekeeping: spent sessions and reset links are removed after a day, live ones stay, and a token
// for a removed session is refused as a revoked one is. The timer sweeps orphan objects past their
// grace time and keeps going when a round fails.
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { removeSpentAuthRows } from '../../server/auth/cleanup';
import { startHousekeeping } from '../../server/housekeeping';
import { bearer, signUpVia } from '../support/accounts';
import { createTestContext, type TestContext } from '../support/context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const HOUR = 3600 * 1000;
const ago = (h: number) => new Date(Date.now() - h * HOUR);

describe('spent sign-in rows', () => {
  it('removes sessions expired or ended over a day ago and used or expired reset links; keeps the rest', async () => {
    const p = await signUpVia(ctx);
    const ids = await ctx.db
      .insertInto('sessions')
      .values([
        { user_id: p.id, expires_at: ago(48) }, // expired two days ago: goes
        { user_id: p.id, expires_at: ago(-24 * 20), revoked_at: ago(30) }, // ended 30 h ago: goes
        { user_id: p.id, expires_at: ago(-24 * 20), revoked_at: ago(2) }, // ended 2 h ago: kept for the day
        { user_id: p.id, expires_at: ago(2) }, // expired 2 h ago: kept for the day
      ])
      .returning('id')
      .execute();
    await ctx.db
      .insertInto('password_resets')
      .values([
        { user_id: p.id, token_hash: `h-${p.id}-1`, expires_at: ago(30) },
        { user_id: p.id, token_hash: `h-${p.id}-2`, expires_at: ago(-1), used_at: ago(26) },
        { user_id: p.id, token_hash: `h-${p.id}-3`, expires_at: ago(-1) },
      ])
      .execute();
    const removed = await removeSpentAuthRows(ctx.db);
    expect(removed.sessions).toBeGreaterThanOrEqual(2);
    expect(removed.resets).toBeGreaterThanOrEqual(2);
    const left = await ctx.db.selectFrom('sessions').select('id').where('user_id', '=', p.id).execute();
    expect(left.map((r) => r.id).sort()).toEqual([ids[2].id, ids[3].id, ...(await liveSessionIds(p.id))].sort());
    const resets = await ctx.db.selectFrom('password_resets').select('token_hash').where('user_id', '=', p.id).execute();
    expect(resets.map((r) => r.token_hash)).toEqual([`h-${p.id}-3`]);
    // The sign-up's own session is live and still works.
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(200);
  });

  it('a token whose session row was removed is refused, with the same answer as a revoked one', async () => {
    const p = await signUpVia(ctx);
    await ctx.db.updateTable('sessions').set({ revoked_at: ago(25) }).where('user_id', '=', p.id).execute();
    const revoked = await ctx.http.get('/api/me').set(bearer(p.token));
    await removeSpentAuthRows(ctx.db);
    expect(await ctx.db.selectFrom('sessions').select('id').where('user_id', '=', p.id).execute()).toEqual([]);
    const removed = await ctx.http.get('/api/me').set(bearer(p.token));
    expect(revoked.status).toBe(401);
    expect(removed.status).toBe(401);
    expect(removed.body).toEqual(revoked.body);
  });
});

describe('ended rate-limit windows', () => {
  it('are removed; a window still running is kept', async () => {
    const { removeEndedRateWindows } = await import('../../server/auth/rateStore');
    await ctx.db
      .insertInto('rate_limits')
      .values([
        { key: 'sign-up:198.51.100.7', hits: 4, reset_at: ago(1) }, // ended an hour ago (RFC 5737 documentation address)
        { key: 'sign-up:198.51.100.8', hits: 2, reset_at: ago(-0.25) }, // ends in 15 minutes
      ])
      .execute();
    expect(await removeEndedRateWindows(ctx.db)).toBe(1);
    expect((await ctx.db.selectFrom('rate_limits').select('key').execute()).map((r) => r.key)).toEqual(['sign-up:198.51.100.8']);
  });
});

describe('housekeeping with several API processes', () => {
  it('one round at a time: while another process holds the lock, a round is skipped; the next one runs', async () => {
    const { HOUSEKEEPING_LOCK } = await import('../../server/housekeeping');
    const { sql } = await import('kysely');
    const key = 'revisions/00000000-0000-4000-8000-00000000beef/top.dxf';
    await ctx.deps.objects.put(key, Buffer.from('0\nEOF\n'), 'application/dxf');
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let locked!: () => void;
    const isLocked = new Promise<void>((r) => (locked = r));
    // "Another process": a transaction holding the same advisory lock.
    const other = ctx.db.transaction().execute(async (tx) => {
      await sql`select pg_advisory_xact_lock(${HOUSEKEEPING_LOCK})`.execute(tx);
      locked();
      await held;
    });
    await isLocked;
    const h = startHousekeeping(ctx.deps, { firstAfterMs: 0, everyMs: 50, graceSeconds: 0 });
    try {
      await expect.poll(() => h.skipped, { timeout: 5000 }).toBeGreaterThanOrEqual(1);
      expect(await ctx.deps.objects.list(key)).toHaveLength(1);
      release();
      await other;
      await expect.poll(async () => (await ctx.deps.objects.list(key)).length, { timeout: 5000 }).toBe(0);
    } finally {
      release();
      await h.stop();
    }
  });
});

async function liveSessionIds(userId: string) {
  return (await ctx.db.selectFrom('sessions').select('id').where('user_id', '=', userId).where('revoked_at', 'is', null).where('expires_at', '>', new Date()).execute()).map((r) => r.id);
}

describe('the housekeeping timer', () => {
  it('sweeps orphan objects past their grace time, leaves younger ones, and keeps going after a failed round', async () => {
    await ctx.deps.objects.put('revisions/00000000-0000-4000-8000-00000000feed/top.dxf', Buffer.from('0\nEOF\n'), 'application/dxf');
    const warnings: string[] = [];
    const log = pino({ level: 'info' }, { write: (line: string) => warnings.push(line) });
    // Grace of a day: the object just written stays.
    const careful = startHousekeeping({ ...ctx.deps, log }, { firstAfterMs: 0, everyMs: 60_000 });
    await expect.poll(() => careful.rounds).toBe(1);
    await careful.stop();
    expect(await ctx.deps.objects.list('revisions/00000000-0000-4000-8000-00000000feed/')).toHaveLength(1);
    // A round that fails (the store refuses the listing) is logged, and the next round runs.
    let calls = 0;
    const objects = Object.create(ctx.deps.objects) as typeof ctx.deps.objects;
    objects.listWithDates = async (prefix?: string) => {
      if (++calls === 1) throw new Error('the store refused the listing');
      return ctx.deps.objects.listWithDates(prefix);
    };
    const brave = startHousekeeping({ db: ctx.db, objects, log }, { firstAfterMs: 0, everyMs: 50, graceSeconds: 0 });
    await expect.poll(async () => (await ctx.deps.objects.list('revisions/00000000-0000-4000-8000-00000000feed/')).length, { timeout: 5000 }).toBe(0);
    await brave.stop();
    expect(warnings.some((l) => l.includes('housekeeping failed'))).toBe(true);
  });
});

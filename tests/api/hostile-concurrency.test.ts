// Concurrency: 100 simultaneous saves on one design get r1..r100 with no gap or duplicate; forks,
// status changes and saves fired together keep the library's invariants: every fork has exactly
// r1, every design's latest_status is its newest revision's status, every revision is whole, and
// no request fails (no deadlock, no 500).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../db/seed';
import { REVISION_STATUSES } from '../../shared/schemas/library';
import { createTestContext, type TestContext } from '../support/context';
import { dxfFile, rectLines } from '../support/dxf';
import { orphans, revisionProblems } from '../support/ledger';

let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
let token: string;
const auth = () => ({ Authorization: `Bearer ${token}` });
const file = Buffer.from(dxfFile(rectLines(64, 48)));
const tally = { tried: 0, failures: 0 };

const upload = (designId: string, i: number) => ctx.http.post(`/api/designs/${designId}/revisions/upload`).set(auth()).field('message', `Concurrent save ${i}`).attach('file', file, 'part.dxf');
const newDesign = async (title: string) => (await ctx.http.post(`/api/shops/${seed.shopId}/designs`).set(auth()).send({ kind: 'insert', title })).body.id as string;

/** A fixed pseudo-random sequence (xorshift32), so a failing run can be repeated exactly. */
function rng(seedValue = 0x9e3779b9) {
  let x = seedValue;
  return (n: number) => {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    return (x >>> 0) % n;
  };
}

beforeAll(async () => {
  ctx = await createTestContext();
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  // The demo editor belongs to both shops, so it can fork into either.
  token = (await ctx.http.post('/api/auth/sign-in').send({ email: 'editor@larchmere.example', password: 'larchmere-editor' })).body.token;
}, 60_000);
afterAll(async () => ctx?.close());

describe('concurrency', () => {
  it('100 simultaneous saves on one design give r1..r100', async () => {
    const designId = await newDesign('Hundred saves');
    const results = await Promise.all(Array.from({ length: 100 }, (_, i) => upload(designId, i)));
    tally.tried += results.length;
    const bad = results.filter((r) => r.status !== 201);
    tally.failures += bad.length;
    expect(bad.map((r) => `${r.status} ${JSON.stringify(r.body)}`)).toEqual([]);
    const numbers = results.map((r) => r.body.number as number).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 100 }, (_, i) => i + 1));
    const rows = await ctx.db.selectFrom('revisions').select('number').where('design_id', '=', designId).orderBy('number').execute();
    expect(rows.map((r) => r.number)).toEqual(numbers);
    const d = await ctx.db.selectFrom('designs').select('latest_revision_number').where('id', '=', designId).executeTakeFirstOrThrow();
    expect(d.latest_revision_number).toBe(100);
  }, 120_000);

  it('simultaneous forks, status changes and saves keep every invariant', async () => {
    const designId = await newDesign('Busy source');
    const revs: string[] = [];
    for (let i = 0; i < 6; i++) revs.push((await upload(designId, i)).body.id);
    const pick = rng();
    const ops: (() => Promise<{ status: number; body: any; kind: string }>)[] = [];
    const tag = (kind: string) => (r: { status: number; body: any }) => ({ status: r.status, body: r.body, kind });
    for (let i = 0; i < 30; i++) {
      const target = i % 2 ? seed.shopId : seed.secondShopId;
      ops.push(() => ctx.http.post(`/api/designs/${designId}/forks`).set(auth()).send({ revisionId: revs[pick(revs.length)], targetShopId: target, title: `Fork ${i}` }).then(tag('fork')));
    }
    for (let i = 0; i < 60; i++) {
      // Half of them on whatever is the newest revision at the time: that one moves latest_status.
      ops.push(async () => {
        const newest = i % 2 ? await ctx.db.selectFrom('revisions').select('id').where('design_id', '=', designId).orderBy('number', 'desc').limit(1).executeTakeFirstOrThrow() : { id: revs[pick(revs.length)] };
        return ctx.http.patch(`/api/revisions/${newest.id}/status`).set(auth()).send({ status: REVISION_STATUSES[pick(REVISION_STATUSES.length)] }).then(tag('status'));
      });
    }
    for (let i = 0; i < 20; i++) ops.push(() => upload(designId, 100 + i).then(tag('save')));
    // Shuffle, then fire all at once.
    for (let i = ops.length - 1; i > 0; i--) {
      const j = pick(i + 1);
      [ops[i], ops[j]] = [ops[j], ops[i]];
    }
    const results = await Promise.all(ops.map((op) => op()));
    tally.tried += results.length;
    const bad = results.filter((r) => r.status >= 300);
    tally.failures += bad.length;
    expect(bad.map((r) => `${r.kind}: ${r.status} ${JSON.stringify(r.body)}`)).toEqual([]);

    // Each fork has exactly r1, and points at the source.
    const forks = await ctx.db.selectFrom('designs').select(['id', 'latest_revision_number', 'forked_from_design_id']).where('forked_from_design_id', '=', designId).execute();
    expect(forks).toHaveLength(30);
    for (const f of forks) {
      const fr = await ctx.db.selectFrom('revisions').select('number').where('design_id', '=', f.id).execute();
      expect(fr.map((r) => r.number), f.id).toEqual([1]);
      expect(f.latest_revision_number).toBe(1);
    }
    // The source kept numbering without gaps: r1..r26.
    const numbers = (await ctx.db.selectFrom('revisions').select('number').where('design_id', '=', designId).orderBy('number').execute()).map((r) => r.number);
    expect(numbers).toEqual(Array.from({ length: 26 }, (_, i) => i + 1));
    // latest_status equals the newest revision's status, for every design (checked by revisionProblems too).
    const mismatched = await ctx.db
      .selectFrom('designs as d')
      .innerJoin('revisions as r', (j) => j.onRef('r.design_id', '=', 'd.id').onRef('r.number', '=', 'd.latest_revision_number'))
      .select(['d.id', 'd.latest_status', 'r.status'])
      .whereRef('d.latest_status', '!=', 'r.status')
      .execute();
    expect(mismatched).toEqual([]);
    const problems = await revisionProblems(ctx.deps, { content: true });
    const left = await orphans(ctx.deps);
    console.log(`[hostile-concurrency] cases tried: ${tally.tried} concurrent requests, failures: ${tally.failures + problems.length + mismatched.length}, orphans found: ${left.length}`);
    expect(problems).toEqual([]);
    expect(left).toEqual([]);
  }, 120_000);
});

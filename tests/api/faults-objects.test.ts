// The object store fails: down before a save, killed in the middle of one (after some of the
// revision's objects were written), and during an archive import and a cut photo. Each request gets
// a 503 with a JSON error, no row is written, and what the store kept from the interrupted save is
// exactly what the sweep then finds and removes. When the store is back, the same API (not
// restarted) saves again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../db/seed';
import { sweepOrphans } from '../../server/revisions/sweep';
import { createTestContext, type TestContext } from '../support/context';
import { dxfFile, rectLines } from '../support/dxf';
import { diffSnapshots, errorAnswerProblems, orphans, revisionProblems, snapshot, type Snapshot } from '../support/ledger';
import { privateObjects, type PrivateObjects } from '../support/private';

let store: PrivateObjects;
let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
let token: string;
let designId: string;
const auth = () => ({ Authorization: `Bearer ${token}` });
const file = Buffer.from(dxfFile(rectLines(90, 60)));
const tally = { tried: 0, failures: 0, orphans: 0 };

const upload = () => ctx.http.post(`/api/designs/${designId}/revisions/upload`).set(auth()).field('message', 'Saved while the store falls over').attach('file', file, 'part.dxf');

/** Rows only: the bucket cannot be listed while the store is down. */
const rowsOf = (s: Snapshot) => ({ ...s, objects: [] });

beforeAll(async () => {
  store = await privateObjects('faults-objects');
  ctx = await createTestContext({ S3_PORT: String(store.port), S3_BUCKET: 'jigwright' });
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  token = (await ctx.http.post('/api/auth/sign-in').send({ email: 'editor@larchmere.example', password: 'larchmere-editor' })).body.token;
  designId = (await ctx.http.post(`/api/shops/${seed.shopId}/designs`).set(auth()).send({ kind: 'jig', title: 'Store fault jig' })).body.id;
  const first = await upload();
  expect(first.status, JSON.stringify(first.body)).toBe(201);
}, 60_000);
afterAll(async () => {
  await ctx?.close();
  await store?.destroy();
});

describe('object store faults', () => {
  it('store down before the save: 503 JSON, nothing stored; health says which service is down', async () => {
    tally.tried++;
    const before = await snapshot(ctx.db, ctx.deps.objects);
    await store.kill();
    try {
      const r = await upload();
      expect(errorAnswerProblems(r, 503)).toEqual([]);
      expect(r.body.error.code).toBe('storage_unavailable');
      const health = await ctx.http.get('/api/health');
      expect(health.status).toBe(503);
      expect(health.body).toMatchObject({ ok: false, objects: false, db: true });
      // Reading a file while the store is down is a 5xx JSON answer, never a hang or a crash.
      const rev = await ctx.db.selectFrom('revisions').select('id').where('design_id', '=', designId).executeTakeFirstOrThrow();
      for (const p of ['preview.svg', 'model', 'download?format=dxf', 'template.pdf']) {
        const dl = await ctx.http.get(`/api/revisions/${rev.id}/${p}`).set(auth());
        expect(errorAnswerProblems(dl, 503), p).toEqual([]);
        expect(dl.body.error.code, p).toBe('storage_unavailable');
        // A failed read must not be cached as the file (the preview is otherwise immutable for a year).
        expect(dl.headers['cache-control'], p).toBe('no-store');
      }
      expect(diffSnapshots(rowsOf(before), rowsOf(await snapshot(ctx.db, { list: async () => [] } as never)))).toEqual([]);
    } finally {
      await store.start();
    }
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });

  it('store killed after two of the revision’s objects were written: 503, no row, and the sweep removes exactly those two', async () => {
    tally.tried++;
    const before = await snapshot(ctx.db, ctx.deps.objects);
    const objects = ctx.deps.objects;
    const realPut = objects.put.bind(objects);
    const written: string[] = [];
    // The save may send its writes one after another or side by side: either way the first two land,
    // then the store dies, and only then do the later writes reach it.
    let killed!: () => void;
    const storeDead = new Promise<void>((resolve) => (killed = resolve));
    let calls = 0;
    objects.put = async (key, body, type) => {
      if (++calls > 2) {
        await storeDead;
        return realPut(key, body, type);
      }
      await realPut(key, body, type);
      written.push(key);
      if (written.length === 2) {
        await store.kill();
        killed();
      }
    };
    let r;
    try {
      r = await upload();
    } finally {
      objects.put = realPut;
      await store.start();
    }
    expect(errorAnswerProblems(r, 503)).toEqual([]);
    expect(r.body.error.code).toBe('storage_unavailable');
    const after = await snapshot(ctx.db, ctx.deps.objects);
    expect(diffSnapshots(rowsOf(before), rowsOf(after))).toEqual([]);
    // The failed save could not remove its objects (the store was gone): they are orphans now.
    const found = await orphans(ctx.deps);
    tally.orphans += found.length;
    expect(found.sort()).toEqual([...written].sort());
    const swept = await sweepOrphans(ctx.deps, { graceSeconds: 0 });
    expect(swept.removed.sort()).toEqual([...written].sort());
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });

  it('store killed during an archive import: 503, no row; the sweep removes what was written', async () => {
    tally.tried++;
    const owner = (await ctx.http.post('/api/auth/sign-in').send({ email: 'owner@larchmere.example', password: 'larchmere-owner' })).body.token;
    const archive = await ctx.http
      .get(`/api/shops/${seed.shopId}/archive`)
      .set({ Authorization: `Bearer ${owner}` })
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(archive.status).toBe(200);
    const before = await snapshot(ctx.db, ctx.deps.objects);
    const objects = ctx.deps.objects;
    const realPut = objects.put.bind(objects);
    let n = 0;
    objects.put = async (key, body, type) => {
      await realPut(key, body, type);
      if (++n === 3) await store.kill();
    };
    let r;
    try {
      r = await ctx.http.post(`/api/shops/${seed.shopId}/archive`).set({ Authorization: `Bearer ${owner}` }).attach('archive', archive.body as Buffer, 'library.tar.gz');
    } finally {
      objects.put = realPut;
      await store.start();
    }
    expect(errorAnswerProblems(r, 503)).toEqual([]);
    expect(diffSnapshots(rowsOf(before), rowsOf(await snapshot(ctx.db, ctx.deps.objects)))).toEqual([]);
    const found = await orphans(ctx.deps);
    tally.orphans += found.length;
    expect(found).toHaveLength(3);
    await sweepOrphans(ctx.deps, { graceSeconds: 0 });
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });

  it('store down while a cut is logged with a photo: 503, no cut row', async () => {
    tally.tried++;
    const rev = await ctx.db.selectFrom('revisions').select('id').where('design_id', '=', designId).executeTakeFirstOrThrow();
    const before = await snapshot(ctx.db, ctx.deps.objects);
    await store.kill();
    let r;
    try {
      r = await ctx.http
        .post(`/api/revisions/${rev.id}/cuts`)
        .set(auth())
        .field('cutOn', '2026-11-21')
        .field('material', 'MDF')
        .field('bitMm', '6')
        .field('result', 'loose')
        .attach('photo', Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(64)]), 'cut.jpg');
    } finally {
      await store.start();
    }
    expect(errorAnswerProblems(r, 503)).toEqual([]);
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });

  it('store fails in the middle of a download: that download is cut off and the API stays up', async () => {
    tally.tried++;
    const rev = await ctx.db.selectFrom('revisions').select('id').where('design_id', '=', designId).executeTakeFirstOrThrow();
    const objects = ctx.deps.objects;
    const realStream = objects.stream.bind(objects);
    const { PassThrough } = await import('node:stream');
    objects.stream = async () => {
      const s = new PassThrough();
      s.write('0\nSECTION\n');
      setTimeout(() => s.destroy(Object.assign(new Error('read ECONNRESET'), { code: 'ECONNRESET' })), 20);
      return s;
    };
    try {
      const r = await ctx.http.get(`/api/revisions/${rev.id}/download?format=dxf`).set(auth()).then(
        (res) => ({ ok: true, res }),
        (err) => ({ ok: false, err }),
      );
      // Content-Length was promised; a cut-off body must not look complete.
      expect(r.ok).toBe(false);
    } finally {
      objects.stream = realStream;
    }
    expect((await ctx.http.get('/api/health')).status).toBe(200);
  });

  it('the sweep sees past the first 1000 objects (the fake pages ListObjectsV2 wrongly; v1 paging works)', async () => {
    tally.tried++;
    const keys = Array.from({ length: 1010 }, (_, i) => `revisions/00000000-0000-4000-8000-${String(i).padStart(12, '0')}/dxf.dxf`);
    for (let i = 0; i < keys.length; i += 100) await Promise.all(keys.slice(i, i + 100).map((k) => ctx.deps.objects.put(k, Buffer.from('stray'), 'application/dxf')));
    const found = await orphans(ctx.deps);
    expect(found.length).toBe(1010);
    const swept = await sweepOrphans(ctx.deps, { graceSeconds: 0 });
    expect(swept.removed.length).toBe(1010);
    expect(await orphans(ctx.deps)).toEqual([]);
  }, 60_000);

  it('with the store back, the same API saves again and everything is whole', async () => {
    const r = await upload();
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.number).toBe(2);
    expect((await ctx.http.get('/api/health')).status).toBe(200);
    const left = await orphans(ctx.deps);
    const broken = await revisionProblems(ctx.deps, { content: true });
    console.log(`[faults-objects] cases tried: ${tally.tried}, failures: ${broken.length + left.length}, orphans found: ${tally.orphans} (all removed by the sweep; ${left.length} left)`);
    expect(left).toEqual([]);
    expect(broken).toEqual([]);
  });
});

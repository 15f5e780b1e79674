// The library's core guarantees: uploads round-trip, units convert exactly, revisions are
// immutable and numbered without gaps, forks keep lineage, and failures leave nothing behind.
import DxfParserModule from 'dxf-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../db/seed';
import { saveRevision } from '../../server/revisions/store';
import { createTestContext, type TestContext } from '../support/context';
import { arc, dxfFile, ezdxfAudit, line, rectLines } from '../support/dxf';

const DxfParser = ((DxfParserModule as any).default ?? DxfParserModule) as new () => { parseSync(t: string): any };
const MM_PER_INCH = 25.4; // exact: 16 CFR 500.19, the 1959 international yard and pound agreement

let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
const tokens: Record<string, string> = {};
const auth = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });

async function signIn(email: string, password: string) {
  const r = await ctx.http.post('/api/auth/sign-in').send({ email, password });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body.token as string;
}

async function counts() {
  const revisions = await ctx.db.selectFrom('revisions').select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
  const objects = await ctx.deps.objects.list('revisions/');
  return { revisions: Number(revisions.n), objects: objects.length };
}

async function newDesign(who = 'editor', body: Record<string, unknown> = {}) {
  const r = await ctx.http
    .post(`/api/shops/${seed.shopId}/designs`)
    .set(auth(who))
    .send({ kind: 'template', title: 'Grommet template', tags: ['cord'], material: 'MDF', ...body });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.id as string;
}

function upload(designId: string, text: string | Buffer, fields: Record<string, string> = {}, filename = 'part.dxf') {
  const req = ctx.http.post(`/api/designs/${designId}/revisions/upload`).set(auth('editor'));
  req.field('message', fields.message ?? 'First cut file');
  for (const [k, v] of Object.entries(fields)) if (k !== 'message') req.field(k, v);
  return req.attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), filename);
}

function extentsOf(parsed: any) {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const e of parsed.entities) {
    if (e.type === 'LINE') for (const v of e.vertices) { xs.push(v.x); ys.push(v.y); }
    if (e.type === 'ARC' || e.type === 'CIRCLE') {
      // Extents of a full circle bound the arc; our test arcs are quarter arcs placed to agree.
      xs.push(e.center.x - e.radius, e.center.x + e.radius);
      ys.push(e.center.y - e.radius, e.center.y + e.radius);
    }
  }
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

beforeAll(async () => {
  ctx = await createTestContext();
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  tokens.owner = await signIn('owner@larchmere.example', 'larchmere-owner');
  tokens.editor = await signIn('editor@larchmere.example', 'larchmere-editor');
  tokens.viewer = await signIn('viewer@larchmere.example', 'larchmere-viewer');
  tokens.other = await signIn('lead@otterbrook.example', 'otterbrook-lead');
});
afterAll(async () => ctx?.close());

describe('upload and download', () => {
  // 120 × 80 mm rectangle, drawn as four LINEs (DXF Reference, LINE: 10/20 start, 11/21 end).
  const rectangle = dxfFile(rectLines(120, 80), 4);

  it('round-trips an uploaded DXF: the download reads back with the same extents, and ezdxf audits it clean', async () => {
    const designId = await newDesign();
    const up = await upload(designId, rectangle);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect(up.body.number).toBe(1);
    expect(up.body.summary.extents).toMatchObject({ width: 120, height: 80 });
    expect(up.body.summary.closedContours).toBe(1);
    expect(up.body.summary.area).toBeCloseTo(9600, 6);

    const dl = await ctx.http.get(`/api/revisions/${up.body.id}/download?format=dxf&units=mm`).set(auth('viewer')).buffer(true).parse((res, cb) => {
      let data = '';
      res.on('data', (c: Buffer) => (data += c.toString()));
      res.on('end', () => cb(null, data));
    });
    expect(dl.status).toBe(200);
    expect(dl.headers['content-disposition']).toBe('attachment; filename="grommet-template-r1.dxf"');
    const parsed = new DxfParser().parseSync(dl.body as string);
    // DXF Reference, HEADER: $INSUNITS 4 = millimeters.
    expect(parsed.header.$INSUNITS).toBe(4);
    expect(parsed.entities.filter((e: any) => e.type === 'LINE')).toHaveLength(4);
    expect(extentsOf(parsed)).toEqual({ minX: 0, minY: 0, maxX: 120, maxY: 80 });
    expect(ezdxfAudit(dl.body as string)).toMatch(/No errors found/);
  });

  it('converts to inches exactly (1 in = 25.4 mm) and sets $INSUNITS 1', async () => {
    const designId = await newDesign();
    const up = await upload(designId, dxfFile([...rectLines(254, 127), arc(127, 63.5, 25.4, 0, 90)], 4));
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const get = (units: string) =>
      ctx.http.get(`/api/revisions/${up.body.id}/download?format=dxf&units=${units}`).set(auth('viewer')).buffer(true).parse((res, cb) => {
        let d = '';
        res.on('data', (c: Buffer) => (d += c.toString()));
        res.on('end', () => cb(null, d));
      });
    const mm = new DxfParser().parseSync((await get('mm')).body);
    const inch = new DxfParser().parseSync((await get('in')).body);
    expect(inch.header.$INSUNITS).toBe(1); // DXF Reference: 1 = inches
    const a = extentsOf(mm);
    const b = extentsOf(inch);
    expect(b.maxX * MM_PER_INCH).toBeCloseTo(a.maxX, 9);
    expect(b.maxY * MM_PER_INCH).toBeCloseTo(a.maxY, 9);
    expect(b.maxX).toBeCloseTo(10, 12);
    expect(b.maxY).toBeCloseTo(5, 12);
    const inchArc = inch.entities.find((e: any) => e.type === 'ARC');
    expect(inchArc.radius).toBeCloseTo(1, 12);
  });

  it('asks for units when the DXF header has none, and stores nothing until told', async () => {
    const designId = await newDesign();
    const before = await counts();
    const noUnits = dxfFile(rectLines(4, 2), null);
    const r = await upload(designId, noUnits);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('units_needed');
    expect(await counts()).toEqual(before);
    const r2 = await upload(designId, noUnits, { units: 'in' });
    expect(r2.status, JSON.stringify(r2.body)).toBe(201);
    expect(r2.body.summary.extents.width).toBeCloseTo(4 * MM_PER_INCH, 9);
  });

  it('offers a short-lived link (five minutes) and names the file', async () => {
    const designId = await newDesign('editor', { title: 'Link test' });
    const up = await upload(designId, rectangle);
    const r = await ctx.http.get(`/api/revisions/${up.body.id}/download?format=svg&link=1`).set(auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.name).toBe('link-test-r1.svg');
    expect(r.body.expiresInSeconds).toBeLessThanOrEqual(300);
    expect(new URL(r.body.url).searchParams.get('X-Amz-Expires')).toBe('300');
  });

  it('refuses downloads to members of another shop without revealing the revision', async () => {
    const designId = await newDesign();
    const up = await upload(designId, rectangle);
    const r = await ctx.http.get(`/api/revisions/${up.body.id}/download`).set(auth('other'));
    expect(r.status).toBe(404);
  });
});

describe('bad files get a clear 4xx and store nothing', () => {
  const cases: [string, Buffer | string][] = [
    ['empty', Buffer.alloc(0)],
    ['truncated DXF', dxfFile(rectLines(10, 10)).slice(0, 120)],
    ['binary DXF', Buffer.concat([Buffer.from('AutoCAD Binary DXF\r\n\x1a\x00'), Buffer.alloc(64, 7)])],
    ['PNG image', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13])],
    ['JSON sent as .dxf', '{"entities": []}'],
    ['huge coordinate', dxfFile([line(0, 0, 1e308, 0), line(1e308, 0, 0, 10)])],
    ['NaN coordinate', dxfFile([line(0, 0, NaN, 0)])],
  ];
  for (const [label, body] of cases) {
    it(label, async () => {
      const designId = await newDesign();
      const before = await counts();
      const r = await upload(designId, body as any);
      expect(r.status, `${label}: ${JSON.stringify(r.body)}`).toBeGreaterThanOrEqual(400);
      expect(r.status).toBeLessThan(500);
      expect(typeof r.body.error.message).toBe('string');
      expect(r.body.error.message.length).toBeGreaterThan(8);
      expect(await counts()).toEqual(before);
    });
  }

  it('refuses a file over the upload limit with 413', async () => {
    const small = await createTestContext({ UPLOAD_MAX_BYTES: '2048' });
    try {
      await seedDemo(small.db, { bcryptCost: 4 });
      const t = (await small.http.post('/api/auth/sign-in').send({ email: 'editor@larchmere.example', password: 'larchmere-editor' })).body.token;
      const shop = await small.db.selectFrom('shops').select('id').where('slug', '=', 'larchmere').executeTakeFirstOrThrow();
      const d = await small.http.post(`/api/shops/${shop.id}/designs`).set({ Authorization: `Bearer ${t}` }).send({ kind: 'jig', title: 'Big' });
      const big = dxfFile(Array.from({ length: 200 }, (_, i) => line(i, 0, i, 10)));
      const r = await small.http.post(`/api/designs/${d.body.id}/revisions/upload`).set({ Authorization: `Bearer ${t}` }).field('message', 'x').attach('file', Buffer.from(big), 'big.dxf');
      expect(r.status).toBe(413);
      expect(r.body.error.code).toBe('file_too_large');
    } finally {
      await small.close();
    }
  });
});

describe('revisions', () => {
  it('50 concurrent saves on one design give r1..r50 with no gap or duplicate', async () => {
    const designId = await newDesign();
    const file = dxfFile(rectLines(30, 20));
    const results = await Promise.all(Array.from({ length: 50 }, (_, i) => upload(designId, file, { message: `save ${i}` })));
    for (const r of results) expect(r.status, JSON.stringify(r.body)).toBe(201);
    const numbers = results.map((r) => r.body.number).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 50 }, (_, i) => i + 1));
    const rows = await ctx.db.selectFrom('revisions').select('number').where('design_id', '=', designId).orderBy('number').execute();
    expect(rows.map((r) => r.number)).toEqual(numbers);
  }, 60000);

  it('a saved revision cannot be edited, only its status moves', async () => {
    const designId = await newDesign();
    const up = await upload(designId, dxfFile(rectLines(30, 20)));
    await expect(ctx.db.updateTable('revisions').set({ message: 'rewritten' }).where('id', '=', up.body.id).execute()).rejects.toThrow(/immutable/);
    const st = await ctx.http.patch(`/api/revisions/${up.body.id}/status`).set(auth('editor')).send({ status: 'trial' });
    expect(st.status).toBe(200);
    expect(st.body).toMatchObject({ status: 'trial', previous: 'draft' });
    const bad = await ctx.http.patch(`/api/revisions/${up.body.id}/status`).set(auth('editor')).send({ status: 'finished' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.status).toBeTruthy();
    const viewer = await ctx.http.patch(`/api/revisions/${up.body.id}/status`).set(auth('viewer')).send({ status: 'proven' });
    expect(viewer.status).toBe(403);
  });

  it('a failed object write leaves no row (503, nothing stored)', async () => {
    const designId = await newDesign();
    const before = await counts();
    const { ObjectStore } = await import('../../files/objectStore');
    const broken = { ...ctx.deps, objects: new ObjectStore({ ...ctx.config.objects, port: 1 }) };
    const file = dxfFile(rectLines(30, 20));
    const { importUpload } = await import('../../server/revisions/geometry');
    const imported = importUpload(Buffer.from(file));
    const draft = { authorId: null, source: 'uploaded' as const, message: 'x', status: 'draft' as const, fitNotes: {}, model: imported.model, summary: imported.summary, title: 't', activity: { action: 'test' } };
    await expect(saveRevision(broken, designId, draft)).rejects.toMatchObject({ status: 503 });
    expect(await counts()).toEqual(before);
  });

  it('a failed row leaves no object (the written objects are removed)', async () => {
    const before = await counts();
    const { importUpload } = await import('../../server/revisions/geometry');
    const imported = importUpload(Buffer.from(dxfFile(rectLines(30, 20))));
    const draft = { authorId: null, source: 'uploaded' as const, message: 'x', status: 'draft' as const, fitNotes: {}, model: imported.model, summary: imported.summary, title: 't', activity: { action: 'test' } };
    // A design that does not exist: the transaction fails after every object was written.
    await expect(saveRevision(ctx.deps, '00000000-0000-4000-8000-000000000000', draft)).rejects.toMatchObject({ status: 404 });
    expect(await counts()).toEqual(before);
  });

  it('the sweep removes objects no row refers to, and only those', async () => {
    const designId = await newDesign();
    await upload(designId, dxfFile(rectLines(30, 20)));
    await ctx.deps.objects.put('revisions/00000000-dead-4000-8000-000000000000/dxf.dxf', Buffer.from('stray'), 'application/dxf');
    const { sweepOrphans } = await import('../../server/revisions/sweep');
    const out = await sweepOrphans(ctx.deps, { graceSeconds: 0 });
    expect(out.removed).toEqual(['revisions/00000000-dead-4000-8000-000000000000/dxf.dxf']);
    const again = await sweepOrphans(ctx.deps, { graceSeconds: 0 });
    expect(again.removed).toEqual([]);
  });
});

describe('forks', () => {
  it('forks a chosen revision into another shop as r1, with lineage on both sides', async () => {
    const designId = await newDesign('editor', { kind: 'jig', title: 'Taper sled' });
    await upload(designId, dxfFile(rectLines(600, 150)));
    const r2 = await upload(designId, dxfFile(rectLines(610, 150)), { message: 'Longer fence' });
    // The demo editor is also an editor in the second shop.
    const f = await ctx.http.post(`/api/designs/${designId}/forks`).set(auth('editor')).send({ revisionId: r2.body.id, targetShopId: seed.secondShopId });
    expect(f.status, JSON.stringify(f.body)).toBe(201);
    expect(f.body.number).toBe(1);
    const fork = await ctx.http.get(`/api/designs/${f.body.designId}`).set(auth('other'));
    expect(fork.status).toBe(200);
    expect(fork.body.forkedFrom).toMatchObject({ designId, designTitle: 'Taper sled', revisionNumber: 2, shopName: 'Larchmere Workshop' });
    expect(fork.body.revisions[0].summary.extents.width).toBe(610);
    const source = await ctx.http.get(`/api/designs/${designId}`).set(auth('viewer'));
    expect(source.body.forks).toEqual([{ designId: f.body.designId, title: 'Taper sled', shopName: 'Otterbrook Makerspace', fromRevisionNumber: 2 }]);
    expect(source.body.activity.map((a: any) => a.action)).toContain('design.forked');
  });

  it('refuses a fork into a shop where the caller is only a viewer or not a member', async () => {
    const designId = await newDesign();
    const up = await upload(designId, dxfFile(rectLines(30, 20)));
    const viewer = await ctx.http.post(`/api/designs/${designId}/forks`).set(auth('viewer')).send({ revisionId: up.body.id, targetShopId: seed.shopId });
    expect(viewer.status).toBe(403);
    const notMember = await ctx.http.post(`/api/designs/${designId}/forks`).set(auth('viewer')).send({ revisionId: up.body.id, targetShopId: seed.secondShopId });
    expect(notMember.status).toBe(404);
  });
});

describe('library listing', () => {
  it('searches title, tags and description; filters by kind, status, material and tag; pages by cursor', async () => {
    const ids: string[] = [];
    for (let i = 0; i < 7; i++) {
      ids.push(await newDesign('editor', { kind: i % 2 ? 'jig' : 'insert', title: `Walnut plate ${i}`, tags: i < 3 ? ['bedside'] : ['desk'], material: i < 4 ? 'walnut' : 'birch ply', description: i === 6 ? 'mirror-image of the left one' : '' }));
    }
    const list = (qs: string) => ctx.http.get(`/api/shops/${seed.shopId}/designs?${qs}`).set(auth('viewer'));
    expect((await list('q=walnut%20pla')).body.items.length).toBeGreaterThanOrEqual(7);
    expect((await list('q=mirror')).body.items.map((d: any) => d.id)).toEqual([ids[6]]);
    expect((await list('tag=bedside&q=walnut')).body.items).toHaveLength(3);
    expect((await list('material=Birch%20Ply&q=walnut')).body.items).toHaveLength(3);
    expect((await list('kind=jig&q=walnut')).body.items).toHaveLength(3);
    const page1 = await list('q=walnut&sort=title&limit=4');
    expect(page1.body.items.map((d: any) => d.title)).toEqual(['Walnut plate 0', 'Walnut plate 1', 'Walnut plate 2', 'Walnut plate 3']);
    const page2 = await list(`q=walnut&sort=title&limit=4&cursor=${page1.body.nextCursor}`);
    expect(page2.body.items.map((d: any) => d.title)).toEqual(['Walnut plate 4', 'Walnut plate 5', 'Walnut plate 6']);
    expect(page2.body.nextCursor).toBeNull();
    const bad = await list('cursor=garbage');
    expect(bad.status).toBe(400);
    const unknown = await list('colour=red');
    expect(unknown.status).toBe(400);
  });
});

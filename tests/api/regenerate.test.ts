// Story: regenerate a charger insert for a new phone size, compare, and learn clearances from cuts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_DEVICES, seedDemo } from '../../db/seed';
import { createTestContext, type TestContext } from '../support/context';

let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
const tokens: Record<string, string> = {};
const auth = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });

const baseParams = { openingWidth: 130, openingLength: 210, plateThickness: 12, deviceWidth: 68.4, deviceLength: 142, deviceThickness: 7.9, caseAllowance: 1.2, padDiameter: 56, padThickness: 5.8, skinThickness: 2.5 };
const notes = { device: { name: 'Demo phone S', width: 68.4, length: 142, thickness: 7.9, cased: true }, clearancePerSide: 0.4, stock: { material: 'birch plywood', thickness: 12 } };

beforeAll(async () => {
  ctx = await createTestContext();
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  for (const [who, email, pw] of [['editor', 'editor@larchmere.example', 'larchmere-editor'], ['viewer', 'viewer@larchmere.example', 'larchmere-viewer'], ['other', 'lead@otterbrook.example', 'otterbrook-lead']]) {
    tokens[who] = (await ctx.http.post('/api/auth/sign-in').send({ email, password: pw })).body.token;
  }
});
afterAll(async () => ctx?.close());

async function generatedInsert() {
  const d = await ctx.http.post(`/api/shops/${seed.shopId}/designs`).set(auth('editor')).send({ kind: 'insert', title: 'Side table plate', material: 'birch plywood' });
  const r = await ctx.http.post(`/api/designs/${d.body.id}/revisions`).set(auth('editor')).send({ generatorId: 'charger-insert', params: baseParams, message: 'Plywood test', fitNotes: notes });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return { designId: d.body.id as string, revisionId: r.body.id as string };
}

describe('regenerate for another device', () => {
  it('saves a new revision changing only the device parameters; the old one stays; compare shows the pocket delta', async () => {
    const { designId, revisionId } = await generatedInsert();
    const devices = await ctx.http.get(`/api/shops/${seed.shopId}/devices`).set(auth('viewer'));
    const large = devices.body.items.find((d: any) => d.name === 'Demo phone L');
    const re = await ctx.http.post(`/api/revisions/${revisionId}/regenerate`).set(auth('editor')).send({ deviceId: large.id });
    expect(re.status, JSON.stringify(re.body)).toBe(201);
    expect(re.body.number).toBe(2);
    const design = await ctx.http.get(`/api/designs/${designId}`).set(auth('viewer'));
    const [r2, r1] = design.body.revisions;
    expect(r1.id).toBe(revisionId);
    const changed = Object.keys(r2.params).filter((k) => r2.params[k] !== r1.params[k]).sort();
    expect(changed).toEqual(['caseAllowance', 'deviceLength', 'deviceThickness', 'deviceWidth']);
    expect(r2.fitNotes.device).toMatchObject({ name: 'Demo phone L', width: 77.6, length: 161.2 });

    const cmp = await ctx.http.get(`/api/revisions/${r1.id}/compare/${r2.id}`).set(auth('viewer'));
    expect(cmp.status).toBe(200);
    const width = cmp.body.rows.find((r: any) => r.section === 'parameters' && r.key === 'deviceWidth');
    expect(width.delta).toBeCloseTo(77.6 - 68.4, 9);
    // Pocket = device + 2 × (case allowance + clearance): its width grows by
    // (77.6 − 68.4) + 2 × (1.6 − 1.2) = 10.0 mm (pure arithmetic on the generator's definition).
    const pocket = cmp.body.rows.find((r: any) => r.section === 'geometry' && /pocket/i.test(r.key) && /width/.test(r.key));
    expect(pocket?.delta).toBeCloseTo(10, 6);
  });

  it('refuses non-device parameters and other shops’ devices', async () => {
    const { revisionId } = await generatedInsert();
    const bad = await ctx.http.post(`/api/revisions/${revisionId}/regenerate`).set(auth('editor')).send({ device: { plateThickness: 30 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/plateThickness/);
    const viewer = await ctx.http.post(`/api/revisions/${revisionId}/regenerate`).set(auth('viewer')).send({ device: { deviceWidth: 70 } });
    expect(viewer.status).toBe(403);
    const other = await ctx.http.get(`/api/revisions/${revisionId}`).set(auth('other'));
    expect(other.status).toBe(404);
  });

  it('gives field-level messages for out-of-range generator parameters and saves nothing', async () => {
    const { designId } = await generatedInsert();
    const r = await ctx.http.post(`/api/designs/${designId}/revisions`).set(auth('editor')).send({ generatorId: 'charger-insert', params: { ...baseParams, plateThickness: -3 }, message: 'x' });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.plateThickness).toBeTruthy();
    const revs = await ctx.db.selectFrom('revisions').select('id').where('design_id', '=', designId).execute();
    expect(revs).toHaveLength(1);
  });
});

describe('cut log and clearance suggestion', () => {
  it('records cuts and suggests the next clearance from the fit history (tight at 0.4, loose at 1.0 → 0.7 mm)', async () => {
    const { revisionId } = await generatedInsert();
    const log = (body: object) => ctx.http.post(`/api/revisions/${revisionId}/cuts`).set(auth('editor')).send({ cutOn: '2026-11-20', material: 'Birch plywood', bitMm: 6.35, ...body });
    expect((await log({ result: 'tight' })).status).toBe(201); // takes the revision's 0.4 mm
    expect((await log({ result: 'loose', clearanceMm: 1.0 })).status).toBe(201);
    const bad = await log({ result: 'snug' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.result).toBeTruthy();
    const hist = await ctx.http.get(`/api/shops/${seed.shopId}/fit-history?device=${encodeURIComponent('Demo phone S')}&material=birch%20plywood`).set(auth('viewer'));
    expect(hist.status).toBe(200);
    expect(hist.body.cuts).toHaveLength(2);
    expect(hist.body.suggestion.clearanceMm).toBeCloseTo(0.7, 9);
  });

  it('keeps a photo only when the row is written, and refuses a photo that is not an image', async () => {
    const { revisionId } = await generatedInsert();
    const before = (await ctx.deps.objects.list('photos/')).length;
    const notImage = await ctx.http.post(`/api/revisions/${revisionId}/cuts`).set(auth('editor'))
      .field('cutOn', '2026-11-21').field('material', 'oak').field('bitMm', '6').field('result', 'good')
      .attach('photo', Buffer.from('<svg onload="x()"/>'), 'photo.png');
    expect(notImage.status).toBe(400);
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8ffff3f0005fe02fea7d6a6e00000000049454e44ae426082', 'hex');
    const ok = await ctx.http.post(`/api/revisions/${revisionId}/cuts`).set(auth('editor'))
      .field('cutOn', '2026-11-21').field('material', 'oak').field('bitMm', '6').field('result', 'good')
      .attach('photo', png, 'photo.png');
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect((await ctx.deps.objects.list('photos/')).length).toBe(before + 1);
    const photo = await ctx.http.get(`/api/cuts/${ok.body.id}/photo`).set(auth('viewer'));
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/png');
  });
});

describe('catalog', () => {
  it('lists the invented demo devices, adds one, refuses duplicates and bad sizes', async () => {
    const list = await ctx.http.get(`/api/shops/${seed.shopId}/devices`).set(auth('viewer'));
    expect(list.body.items.map((d: any) => d.name).sort()).toEqual(DEMO_DEVICES.map((d) => d.name).sort());
    const add = await ctx.http.post(`/api/shops/${seed.shopId}/devices`).set(auth('editor')).send({ name: 'Shop tablet', widthMm: 110, lengthMm: 180, thicknessMm: 7 });
    expect(add.status).toBe(201);
    const dup = await ctx.http.post(`/api/shops/${seed.shopId}/devices`).set(auth('editor')).send({ name: 'Shop tablet', widthMm: 110, lengthMm: 180, thicknessMm: 7 });
    expect(dup.status).toBe(409);
    const zero = await ctx.http.post(`/api/shops/${seed.shopId}/devices`).set(auth('editor')).send({ name: 'Flat', widthMm: 0, lengthMm: 180, thicknessMm: 7 });
    expect(zero.status).toBe(400);
    expect(zero.body.error.fields.widthMm).toMatch(/more than 0/);
    const viewer = await ctx.http.post(`/api/shops/${seed.shopId}/devices`).set(auth('viewer')).send({ name: 'X', widthMm: 1, lengthMm: 1, thicknessMm: 1 });
    expect(viewer.status).toBe(403);
  });
});

// Shop archives: an owner downloads the whole library and imports it into another shop with
// nothing lost (counts, sha256 of every file, metadata, lineage), and every damaged or hostile
// archive is refused whole (4xx, no row, no object). The export is read with GNU tar and checked
// with GNU coreutils' `sha256sum -c`, independent of the code that wrote it; the format is POSIX
// pax/ustar (IEEE Std 1003.1, pax) inside gzip (RFC 1952).
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../db/seed';
import { seedDemoLibrary } from '../../server/library/demoLibrary';
import { createTestContext, type TestContext } from '../support/context';
import { dxfFile, rectLines } from '../support/dxf';
import { manifestOf, pack, unpack, withManifest, type TarEntry } from '../support/archive';
import { diffSnapshots, errorAnswerProblems, orphans, revisionProblems, snapshot } from '../support/ledger';

let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
const tokens: Record<string, string> = {};
const auth = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from('JFIF invented test photo'), Buffer.alloc(200, 7)]);
const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(120, 3)]);

async function download(shopId: string, who = 'owner'): Promise<Buffer> {
  const r = await ctx.http
    .get(`/api/shops/${shopId}/archive`)
    .set(auth(who))
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  expect(r.status, String(r.body).slice(0, 200)).toBe(200);
  expect(r.headers['content-type']).toBe('application/gzip');
  expect(r.headers['content-disposition']).toMatch(/^attachment; filename="[a-z0-9-]+-library-\d{4}-\d{2}-\d{2}\.tar\.gz"$/);
  return r.body as Buffer;
}

const importInto = (shopId: string, archive: Buffer, who = 'owner', http = ctx.http, query = '') =>
  http.post(`/api/shops/${shopId}/archive${query}`).set(auth(who)).attach('archive', archive, 'library.tar.gz');
const newShop = async (name: string) => {
  const r = await ctx.http.post('/api/shops').set(auth('owner')).send({ name });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.shop.id as string;
};
const designCount = async (shopId: string) => Number((await sql<{ n: string }>`SELECT count(*) AS n FROM designs WHERE shop_id = ${shopId}`.execute(ctx.db)).rows[0].n);

let exported: Buffer;
let entries: TarEntry[];
let targetShopId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  await seedDemoLibrary(ctx.deps, seed);
  const signIn = async (email: string, password: string) => (await ctx.http.post('/api/auth/sign-in').send({ email, password })).body.token as string;
  tokens.owner = await signIn('owner@larchmere.example', 'larchmere-owner');
  tokens.editor = await signIn('editor@larchmere.example', 'larchmere-editor');
  tokens.other = await signIn('lead@otterbrook.example', 'otterbrook-lead');

  // More than the demo has: an upload (keeps its original), cut logs with photos, a fork inside
  // the shop, and a fork from the other shop into this one (lineage that leaves the archive).
  const d = await ctx.http.post(`/api/shops/${seed.shopId}/designs`).set(auth('editor')).send({ kind: 'template', title: 'Router base plate — Ø 150', tags: ['router'], material: 'acrylic' });
  const up = await ctx.http.post(`/api/designs/${d.body.id}/revisions/upload`).set(auth('editor')).field('message', 'Drawn by hand').field('status', 'trial').attach('file', Buffer.from(dxfFile(rectLines(150, 150))), 'plate.dxf');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  for (const [photo, name] of [[JPEG, 'a.jpg'], [PNG, 'b.png']] as const) {
    const c = await ctx.http.post(`/api/revisions/${up.body.id}/cuts`).set(auth('editor')).field('cutOn', '2026-11-02').field('material', 'acrylic').field('bitMm', '3.175').field('result', 'tight').field('clearanceMm', '0.3').attach('photo', photo, name);
    expect(c.status, JSON.stringify(c.body)).toBe(201);
  }
  const inside = await ctx.http.post(`/api/designs/${d.body.id}/forks`).set(auth('editor')).send({ revisionId: up.body.id, targetShopId: seed.shopId, title: 'Router base plate, offset' });
  expect(inside.status, JSON.stringify(inside.body)).toBe(201);
  const od = await ctx.http.post(`/api/shops/${seed.secondShopId}/designs`).set(auth('other')).send({ kind: 'jig', title: 'Makerspace dowel jig' });
  const orev = await ctx.http.post(`/api/designs/${od.body.id}/revisions/upload`).set(auth('other')).field('message', 'v1').attach('file', Buffer.from(dxfFile(rectLines(40, 20))), 'dowel.dxf');
  const outside = await ctx.http.post(`/api/designs/${od.body.id}/forks`).set(auth('editor')).send({ revisionId: orev.body.id, targetShopId: seed.shopId });
  expect(outside.status, JSON.stringify(outside.body)).toBe(201);

  const created = await ctx.http.post('/api/shops').set(auth('owner')).send({ name: 'Larchmere Annex' });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  targetShopId = created.body.shop.id;
  exported = await download(seed.shopId);
  entries = await unpack(exported);
}, 90_000);
afterAll(async () => ctx?.close());

describe('export', () => {
  it('starts with manifest.json and SHA256SUMS, holds every revision file and photo, and GNU tar + sha256sum agree', async () => {
    expect(entries[0].header.name).toBe('manifest.json');
    expect(entries[1].header.name).toBe('SHA256SUMS');
    const m = manifestOf(entries);
    expect(m).toMatchObject({ format: 'jigwright.shop-archive', schemaVersion: 1, shop: { id: seed.shopId, name: 'Larchmere Workshop' } });

    // Counts against the database, not against the manifest itself.
    const q = async (query: ReturnType<typeof sql<{ n: string }>>) => Number((await query.execute(ctx.db)).rows[0].n);
    const shop = seed.shopId;
    const designs = await q(sql`SELECT count(*) AS n FROM designs WHERE shop_id = ${shop}`);
    const revisions = await q(sql`SELECT count(*) AS n FROM revisions r JOIN designs d ON d.id = r.design_id WHERE d.shop_id = ${shop}`);
    const files = await q(sql`SELECT count(*) AS n FROM revision_files f JOIN revisions r ON r.id = f.revision_id JOIN designs d ON d.id = r.design_id WHERE d.shop_id = ${shop}`);
    const cuts = await q(sql`SELECT count(*) AS n FROM cut_logs c JOIN revisions r ON r.id = c.revision_id JOIN designs d ON d.id = r.design_id WHERE d.shop_id = ${shop}`);
    expect(m.counts).toMatchObject({ designs, revisions, files, cutLogs: cuts, photos: 2 });
    expect(m.designs).toHaveLength(designs);
    expect(designs).toBeGreaterThanOrEqual(8);

    // Every file row of the shop is in the archive with its recorded sha256 and bytes.
    const rows = await ctx.db
      .selectFrom('revision_files as f')
      .innerJoin('revisions as r', 'r.id', 'f.revision_id')
      .innerJoin('designs as d', 'd.id', 'r.design_id')
      .select(['f.revision_id', 'f.role', 'f.sha256', 'f.bytes'])
      .where('d.shop_id', '=', seed.shopId)
      .execute();
    const listed = new Map<string, { sha256: string; bytes: number; path: string }>();
    for (const r of m.revisions) for (const f of r.files) listed.set(`${r.id}/${f.role}`, f);
    for (const r of rows) expect(listed.get(`${r.revision_id}/${r.role}`), `${r.revision_id} ${r.role}`).toMatchObject({ sha256: r.sha256, bytes: r.bytes });

    // GNU tar unpacks it and GNU coreutils checks every file against SHA256SUMS.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-archive-'));
    try {
      const file = path.join(dir, 'library.tar.gz');
      fs.writeFileSync(file, exported);
      const listing = execFileSync('tar', ['-tzf', file], { encoding: 'utf8' }).trim().split('\n');
      expect(listing.length).toBe(2 + files + 2);
      execFileSync('tar', ['-xzf', file, '-C', dir]);
      const check = execFileSync('sha256sum', ['-c', '--strict', 'SHA256SUMS'], { cwd: dir, encoding: 'utf8' });
      expect(check.trim().split('\n')).toHaveLength(files + 2);
      expect(check).not.toMatch(/FAILED/);
      for (const r of m.revisions) for (const f of r.files) expect(sha(fs.readFileSync(path.join(dir, f.path)))).toBe(f.sha256);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('records lineage inside the archive by id and outside it in words', () => {
    const m = manifestOf(entries);
    const offset = m.designs.find((d: any) => d.title === 'Router base plate, offset');
    const source = m.designs.find((d: any) => d.title === 'Router base plate — Ø 150');
    expect(offset.forkedFrom).toMatchObject({ inArchive: true, designId: source.id, revisionNumber: 1 });
    const dowel = m.designs.find((d: any) => d.title === 'Makerspace dowel jig');
    expect(dowel.forkedFrom).toMatchObject({ inArchive: false, title: 'Makerspace dowel jig', shopName: 'Otterbrook Makerspace' });
    expect(dowel.forkedFrom.text).toBe('Makerspace dowel jig r1 (Otterbrook Makerspace)');
    // The other shop's own designs are not in this shop's archive.
    expect(m.designs.every((d: any) => d.title !== 'Makerspace dowel jig' || d.forkedFrom)).toBe(true);
    expect(m.revisions.map((r: any) => r.designId).every((id: string) => m.designs.some((d: any) => d.id === id))).toBe(true);
  });

  it('only owners may download it; other shops do not learn it exists', async () => {
    expect((await ctx.http.get(`/api/shops/${seed.shopId}/archive`).set(auth('editor'))).status).toBe(403);
    expect((await ctx.http.get(`/api/shops/${seed.shopId}/archive`).set(auth('other'))).status).toBe(404);
    expect((await ctx.http.get(`/api/shops/${seed.shopId}/archive`)).status).toBe(401);
  });
});

describe('import', () => {
  it('brings every design, revision, file, cut log and photo into another shop with nothing lost', async () => {
    const before = await snapshot(ctx.db, ctx.deps.objects);
    const r = await importInto(targetShopId, exported);
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const m = manifestOf(entries);
    expect(r.body).toMatchObject({ designs: m.counts.designs, revisions: m.counts.revisions, files: m.counts.files, cutLogs: m.counts.cutLogs, photos: 2 });
    const designIds: Record<string, string> = r.body.designIds;
    const revisionIds: Record<string, string> = r.body.revisionIds;

    // Rows, compared field by field with the source shop's.
    for (const d of m.designs) {
      const got = await ctx.db.selectFrom('designs').selectAll().where('id', '=', designIds[d.id]).executeTakeFirstOrThrow();
      const src = await ctx.db.selectFrom('designs').selectAll().where('id', '=', d.id).executeTakeFirstOrThrow();
      expect(got.shop_id).toBe(targetShopId);
      for (const k of ['kind', 'title', 'description', 'tags', 'material', 'latest_revision_number', 'latest_status', 'created_at', 'updated_at'] as const) expect(got[k], `${d.title} ${k}`).toEqual(src[k]);
      if (d.forkedFrom?.inArchive) {
        expect(got.forked_from_design_id).toBe(designIds[d.forkedFrom.designId]);
        expect(got.forked_from_revision_id).toBe(revisionIds[d.forkedFrom.revisionId]);
      } else if (d.forkedFrom) {
        expect(got.forked_from_design_id).toBeNull();
        expect(got.forked_from_text).toBe(d.forkedFrom.text);
      } else expect(got.forked_from_design_id).toBeNull();
    }
    for (const rv of m.revisions) {
      const got = await ctx.db.selectFrom('revisions').selectAll().where('id', '=', revisionIds[rv.id]).executeTakeFirstOrThrow();
      const src = await ctx.db.selectFrom('revisions').selectAll().where('id', '=', rv.id).executeTakeFirstOrThrow();
      expect(got.design_id).toBe(designIds[rv.designId]);
      for (const k of ['number', 'message', 'source', 'generator_id', 'params', 'status', 'fit_notes', 'summary', 'units', 'created_at'] as const) expect(got[k], `${k}`).toEqual(src[k]);
      // Authors who are not members of the new shop keep their name.
      const srcAuthor = src.author_id ? (await ctx.db.selectFrom('users').select('name').where('id', '=', src.author_id).executeTakeFirstOrThrow()).name : null;
      expect(got.author_id === src.author_id || got.author_name === srcAuthor).toBe(true);
      // Every file: same role, same bytes and sha256 in the row and in the new object itself.
      const newFiles = await ctx.db.selectFrom('revision_files').selectAll().where('revision_id', '=', got.id).orderBy('role').execute();
      const oldFiles = await ctx.db.selectFrom('revision_files').selectAll().where('revision_id', '=', rv.id).orderBy('role').execute();
      expect(newFiles.map((f) => [f.role, f.sha256, f.bytes])).toEqual(oldFiles.map((f) => [f.role, f.sha256, f.bytes]));
      for (const f of newFiles) {
        expect(f.object_key.startsWith(`revisions/${got.id}/`)).toBe(true);
        expect(sha(await ctx.deps.objects.get(f.object_key))).toBe(f.sha256);
      }
    }
    const newCuts = await ctx.db.selectFrom('cut_logs').selectAll().where('shop_id', '=', targetShopId).orderBy('created_at').execute();
    expect(newCuts).toHaveLength(m.counts.cutLogs);
    for (const c of m.cutLogs) {
      const got = newCuts.find((x) => x.revision_id === revisionIds[c.revisionId] && x.created_at.toISOString() === c.createdAt)!;
      expect(got, c.id).toBeTruthy();
      expect({ material: got.material, bit: got.bit_mm, result: got.result, clearance: got.clearance_mm, device: got.device_key }).toEqual({ material: c.material, bit: c.bitMm, result: c.result, clearance: c.clearanceMm, device: c.deviceKey });
      if (c.photo) expect(sha(await ctx.deps.objects.get(got.photo_key!))).toBe(c.photo.sha256);
    }
    // The photos are readable through the API in the new shop.
    const photoCut = newCuts.find((c) => c.photo_key)!;
    const photo = await ctx.http.get(`/api/cuts/${photoCut.id}/photo`).set(auth('owner'));
    expect(photo.status).toBe(200);

    // Nothing else moved: the source shop is untouched and nothing is orphaned or broken.
    const after = await snapshot(ctx.db, ctx.deps.objects);
    expect(after.objects.length - before.objects.length).toBe(m.counts.files + m.counts.photos);
    expect(await orphans(ctx.deps)).toEqual([]);
    expect(await revisionProblems(ctx.deps)).toEqual([]);

    // Round trip: the new shop's own archive says the same, apart from ids and the export time.
    const again = manifestOf(await unpack(await download(targetShopId)));
    const idMap = new Map<string, string>([...Object.entries(designIds), ...Object.entries(revisionIds)].map(([a, b]) => [b, a]));
    const normalize = (x: any) =>
      JSON.parse(JSON.stringify(x, (k, v) => (typeof v === 'string' && idMap.has(v) ? idMap.get(v) : k === 'path' ? v.replace(/--[0-9a-f-]{36}/, '--ID') : v)));
    const strip = (mf: any) => ({
      designs: mf.designs.map((d: any) => ({ ...d, author: d.author?.name ?? null, forkedFrom: d.forkedFrom && { ...d.forkedFrom, designId: d.forkedFrom.inArchive ? d.forkedFrom.designId : null, revisionId: d.forkedFrom.inArchive ? d.forkedFrom.revisionId : null } })),
      revisions: mf.revisions.map((x: any) => ({ ...x, author: x.author?.name ?? null })),
      // Cut logs saved in one statement share created_at; their order then follows ids, which differ.
      cutLogs: mf.cutLogs.map((c: any) => ({ ...c, id: undefined, author: c.author?.name ?? null, photo: c.photo && { ...c.photo, path: undefined } })).sort((x: any, y: any) => JSON.stringify(x).localeCompare(JSON.stringify(y))),
    });
    const a = strip(normalize(m));
    const b = strip(normalize(again));
    // The external fork's source loses its ids (kept as text), so compare it by its words.
    // A fork inside the archive now names the new shop as its source's shop.
    for (const x of [...a.designs, ...b.designs]) {
      if (x.forkedFrom && !x.forkedFrom.inArchive) x.forkedFrom = { inArchive: false, text: x.forkedFrom.text };
      else if (x.forkedFrom) x.forkedFrom = { ...x.forkedFrom, shopName: undefined, text: undefined };
    }
    expect(again.designs.find((d: any) => d.forkedFrom?.inArchive).forkedFrom.shopName).toBe('Larchmere Annex');
    expect(b.designs).toEqual(a.designs);
    expect(b.revisions).toEqual(a.revisions);
    expect(b.cutLogs).toEqual(a.cutLogs);
  }, 60_000);

  it('only an owner of the target shop may import', async () => {
    const before = await snapshot(ctx.db, ctx.deps.objects);
    expect((await importInto(seed.shopId, exported, 'editor')).status).toBe(403);
    expect((await importInto(targetShopId, exported, 'other')).status).toBe(404);
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });
});

describe('importing the same archive again', () => {
  let m: any;
  let ownerName: string;
  beforeAll(async () => {
    m = manifestOf(entries);
    ownerName = (await ctx.db.selectFrom('users').select('name').where('id', '=', seed.users['owner@larchmere.example']).executeTakeFirstOrThrow()).name;
  });

  it('a second import into the same shop is 409 already_imported, says when, by whom and how much, and adds nothing', async () => {
    const shopId = await newShop('Larchmere Second Bench');
    const first = await importInto(shopId, exported);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body.copyOf).toBeNull();

    // The record: the manifest's own bytes hashed here with node:crypto (FIPS 180-4 SHA-256), and
    // its source and counts read back from the manifest, not from the import's answer.
    const record = await ctx.db.selectFrom('archive_imports').selectAll().where('shop_id', '=', shopId).execute();
    expect(record).toHaveLength(1);
    expect(record[0]).toMatchObject({
      id: first.body.importId,
      imported_by: seed.users['owner@larchmere.example'],
      source_shop_id: seed.shopId,
      source_shop_name: 'Larchmere Workshop',
      manifest_sha256: sha(entries[0].body),
      copy_of: null,
      designs: m.counts.designs,
      revisions: m.counts.revisions,
      files: m.counts.files,
      cut_logs: m.counts.cutLogs,
      photos: m.counts.photos,
      activity: m.counts.activity,
    });
    expect(record[0].exported_at.toISOString()).toBe(new Date(m.exportedAt).toISOString());
    expect(record[0].devices_added + record[0].devices_skipped).toBe(m.devices.length);

    const before = await snapshot(ctx.db, ctx.deps.objects);
    const second = await importInto(shopId, exported);
    expect(errorAnswerProblems(second, 409), JSON.stringify(second.body)).toEqual([]);
    expect(second.body.error.code).toBe('already_imported');
    const msg: string = second.body.error.message;
    const importedAt = record[0].imported_at;
    const day = importedAt.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
    expect(msg).toContain(`on ${day} at ${importedAt.toISOString().slice(11, 16)} UTC`);
    expect(msg).toContain(`by ${ownerName}`);
    expect(msg).toContain(`${m.counts.designs} designs`);
    expect(msg).toContain('Larchmere Workshop');
    expect(msg).toContain('Nothing was added');
    expect(second.body.error.details).toMatchObject({
      importId: first.body.importId,
      importedBy: { id: seed.users['owner@larchmere.example'], name: ownerName },
      designs: m.counts.designs,
      sourceShop: { id: seed.shopId, name: 'Larchmere Workshop' },
      copies: 0,
    });
    // Nothing written: no row in any table, no object, nothing for the sweep.
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
    expect(await designCount(shopId)).toBe(m.counts.designs);
    expect(await orphans(ctx.deps)).toEqual([]);

    // A damaged copy of the same archive (same manifest, a file missing) is told the same: the
    // manifest is enough to know, so no file of it is read or written.
    const damaged = await importInto(shopId, await pack(entries.slice(0, -1)));
    expect(errorAnswerProblems(damaged, 409)).toEqual([]);
    expect(damaged.body.error.code).toBe('already_imported');
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);

    // again=true: the owner means it; a further copy comes in and its record says whose copy it is.
    const again = await importInto(shopId, exported, 'owner', ctx.http, '?again=true');
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(again.body.copyOf).toBe(first.body.importId);
    expect(again.body.designs).toBe(m.counts.designs);
    expect(await designCount(shopId)).toBe(2 * m.counts.designs);
    const firstIds = new Set(Object.values(first.body.designIds));
    expect(Object.values(again.body.designIds).some((id) => firstIds.has(id as string))).toBe(false);
    const copy = await ctx.db.selectFrom('archive_imports').selectAll().where('id', '=', again.body.importId).executeTakeFirstOrThrow();
    expect(copy).toMatchObject({ shop_id: shopId, copy_of: first.body.importId, manifest_sha256: sha(entries[0].body), designs: m.counts.designs });
    const logged = await ctx.db.selectFrom('activity').select('detail').where('shop_id', '=', shopId).where('action', '=', 'shop.archive-imported').orderBy('created_at').execute();
    expect(logged.map((a) => (a.detail as { copyOf: string | null }).copyOf)).toEqual([null, first.body.importId]);
    const after = await snapshot(ctx.db, ctx.deps.objects);
    expect(after.objects.length - before.objects.length).toBe(m.counts.files + m.counts.photos);
    expect(await orphans(ctx.deps)).toEqual([]);
    expect(await revisionProblems(ctx.deps)).toEqual([]);

    // Without the flag it is refused again, and the answer counts the copy.
    const third = await importInto(shopId, exported);
    expect(third.status).toBe(409);
    expect(third.body.error.details.copies).toBe(1);
    expect(third.body.error.message).toContain('Since then it has been imported again as copies once.');
    expect(third.body.error.message).toContain('only if you want another set of its designs');
    expect(await designCount(shopId)).toBe(2 * m.counts.designs);
  }, 90_000);

  it('again must be "true" or "false"; anything else is refused before the archive is read', async () => {
    const before = await snapshot(ctx.db, ctx.deps.objects);
    for (const query of ['?again=yes', '?again=true&again=true', '?again[x]=1', '?copies=2']) {
      const r = await importInto(targetShopId, exported, 'owner', ctx.http, query);
      expect(errorAnswerProblems(r, 400), query).toEqual([]);
      expect(r.body.error.code, query).toBe('invalid_input');
    }
    expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
  });

  it('another shop can import an archive this one already has', async () => {
    const a = await newShop('Larchmere Fourth Bench');
    const b = await newShop('Larchmere Fifth Bench');
    expect((await importInto(a, exported)).status).toBe(201);
    const r = await importInto(b, exported);
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.copyOf).toBeNull();
    expect(await designCount(b)).toBe(m.counts.designs);
    expect(await designCount(a)).toBe(m.counts.designs);
  }, 60_000);

  it('two imports of the same archive at the same moment: exactly one succeeds, the other is 409 and leaves nothing', async () => {
    const shopId = await newShop('Larchmere Sixth Bench');
    const before = await snapshot(ctx.db, ctx.deps.objects);
    // Each import's object writes wait until both imports are writing, so both have passed the
    // early check and both reach the transaction: only the unique index can tell them apart.
    const objects = ctx.deps.objects;
    const realPut = objects.put.bind(objects);
    let putting = 0;
    let release!: () => void;
    const bothWriting = new Promise<void>((resolve) => (release = resolve));
    const timer = setTimeout(release, 20_000); // never hang the suite if one import fails early
    objects.put = async (key, body, type) => {
      if (++putting === 2) release();
      await bothWriting;
      return realPut(key, body, type);
    };
    let answers;
    try {
      answers = await Promise.all([importInto(shopId, exported), importInto(shopId, exported)]);
    } finally {
      objects.put = realPut;
      clearTimeout(timer);
    }
    expect(answers.map((a) => a.status).sort(), JSON.stringify(answers.map((a) => a.body.error ?? a.body.importId))).toEqual([201, 409]);
    const lost = answers.find((a) => a.status === 409)!;
    expect(errorAnswerProblems(lost, 409)).toEqual([]);
    expect(lost.body.error.code).toBe('already_imported');
    const won = answers.find((a) => a.status === 201)!;
    expect(lost.body.error.details.importId).toBe(won.body.importId);
    // Exactly one set: its rows, its record, its objects; the loser's objects are gone.
    expect(await designCount(shopId)).toBe(m.counts.designs);
    expect(await ctx.db.selectFrom('archive_imports').select('id').where('shop_id', '=', shopId).execute()).toEqual([{ id: won.body.importId }]);
    const after = await snapshot(ctx.db, ctx.deps.objects);
    expect(after.objects.length - before.objects.length).toBe(m.counts.files + m.counts.photos);
    expect(await orphans(ctx.deps)).toEqual([]);
    expect(await revisionProblems(ctx.deps)).toEqual([]);
  }, 90_000);
});

describe('hostile archives are refused whole', () => {
  let small: TestContext;
  let smallShop: string;
  let smallToken: string;
  // A shop that never imported this archive: the cases keep its manifest and must each fail on
  // their own fault, not on already_imported.
  let hostileShopId: string;
  beforeAll(async () => {
    hostileShopId = await newShop('Larchmere Proving Bench');
    // Small limits, so the oversize and decompression-bomb cases stay small.
    small = await createTestContext({ ARCHIVE_MAX_BYTES: String(4 * 1024 * 1024), ARCHIVE_MAX_UNPACKED_BYTES: String(8 * 1024 * 1024) });
    const s = await seedDemo(small.db, { bcryptCost: 4 });
    smallShop = s.shopId;
    smallToken = (await small.http.post('/api/auth/sign-in').send({ email: 'owner@larchmere.example', password: 'larchmere-owner' })).body.token;
  });
  afterAll(async () => small?.close());

  const files = () => entries.filter((e) => e.header.name !== 'manifest.json' && e.header.name !== 'SHA256SUMS');
  const firstFile = (m: any) => m.revisions[0].files[0];
  const cases: [string, () => Promise<Buffer> | Buffer, number, string | RegExp][] = [
    ['a DXF instead of an archive', () => Buffer.from(dxfFile(rectLines(10, 10))), 400, 'not_archive'],
    ['an empty file', () => Buffer.alloc(0), 400, /not_archive|bad_request/],
    ['gzip of random bytes, not a tar', () => gzipSync(Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 7919) % 251))), 400, 'damaged_archive'],
    ['a gzip stream cut off half way', () => exported.subarray(0, Math.floor(exported.length / 2)), 400, /damaged_archive|missing_files/],
    ['the files without a manifest', () => pack(files()), 400, 'no_manifest'],
    ['the manifest after the files', () => pack([...files(), entries[0]]), 400, 'no_manifest'],
    ['a manifest that is not JSON', () => pack([{ header: entries[0].header, body: Buffer.from('{"format": ') }, ...entries.slice(1)]), 400, 'bad_manifest'],
    ['a manifest of another format', () => pack(withManifest(entries, (m) => ({ ...m, format: 'zip-of-stuff' }))), 400, 'bad_manifest'],
    ['schema version 2 (a newer Jigwright)', () => pack(withManifest(entries, (m) => ({ ...m, schemaVersion: 2 }))), 400, 'unsupported_version'],
    ['an unknown field in the manifest', () => pack(withManifest(entries, (m) => ({ ...m, secretField: 1 }))), 400, 'bad_manifest'],
    ['a revision of a design not in the archive', () => pack(withManifest(entries, (m) => { m.revisions[0].designId = '00000000-0000-4000-8000-000000000000'; return m; })), 400, 'bad_manifest'],
    ['revision numbers with a gap', () => pack(withManifest(entries, (m) => { const r = m.revisions.find((x: any) => x.number === 1 && m.revisions.some((y: any) => y.designId === x.designId && y.number === 2)); r.number = 9; return m; })), 400, 'bad_manifest'],
    ['a fork whose source is not in the archive but claims to be', () => pack(withManifest(entries, (m) => { const d = m.designs.find((x: any) => x.forkedFrom?.inArchive); d.forkedFrom.designId = '00000000-0000-4000-8000-000000000000'; return m; })), 400, 'bad_manifest'],
    ['a file path that climbs out (../../etc/passwd)', () => pack(withManifest(entries, (m) => { firstFile(m).path = '../../etc/passwd'; return m; })), 400, 'bad_manifest'],
    ['counts that do not match the lists', () => pack(withManifest(entries, (m) => ({ ...m, counts: { ...m.counts, designs: m.counts.designs + 1 } }))), 400, 'bad_manifest'],
    ['negative dimensions in a device', () => pack(withManifest(entries, (m) => { m.devices[0].widthMm = -5; return m; })), 400, 'bad_manifest'],
    ['fit notes with a zero device width', () => pack(withManifest(entries, (m) => { m.revisions.find((r: any) => r.fitNotes.device).fitNotes.device.width = 0; return m; })), 400, 'bad_manifest'],
    ['a tar entry named ../escape', () => pack([...entries, { header: { name: '../escape.txt', type: 'file' }, body: Buffer.from('x') }]), 400, 'unsafe_entry'],
    ['a symlink entry', () => pack([...entries.slice(0, 2), { header: { name: 'designs/link', type: 'symlink', linkname: '/etc/passwd' }, body: Buffer.alloc(0) }, ...entries.slice(2)]), 400, 'unsafe_entry'],
    ['one file changed by a byte (sha256 differs)', () => pack(entries.map((e, i) => (i === entries.length - 1 ? { header: e.header, body: Buffer.from(e.body.map((b, j) => (j === 0 ? b ^ 1 : b))) } : e))), 400, 'checksum_mismatch'],
    ['one listed file missing', () => pack(entries.slice(0, -1)), 400, 'missing_files'],
    ['a file the manifest does not list', () => pack([...entries, { header: { name: 'designs/extra.dxf', type: 'file' }, body: Buffer.from('0\nEOF\n') }]), 400, 'unexpected_file'],
    ['a file twice', () => pack([...entries, entries[entries.length - 1]]), 400, 'unexpected_file'],
    ['a preview SVG with a script (checksums fixed to match)', () => tamper(() => ({ role: 'svg', body: Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>') })), 400, 'bad_file'],
    ['a photo that is not an image (checksums fixed to match)', () => tamper(() => ({ photo: true, body: Buffer.from('<html>not a photo</html>') })), 400, 'bad_file'],
    ['a device name with a NUL: refused by the database after every object was written', () => pack(withManifest(entries, (m) => { m.devices[0].name = 'Demo\u0000phone'; return m; })), 400, 'invalid_text'],
  ];

  /** Replaces one file's bytes and fixes its size and sha256 in the manifest, so only the content check can catch it. */
  async function tamper(pick: () => { role?: string; photo?: boolean; body: Buffer }): Promise<Buffer> {
    const m = manifestOf(entries);
    const choice = pick();
    const target = choice.photo ? m.cutLogs.find((c: any) => c.photo).photo : m.revisions[0].files.find((f: any) => f.role === choice.role);
    target.bytes = choice.body.length;
    target.sha256 = sha(choice.body);
    const list = entries.map((e) => (e.header.name === 'manifest.json' ? { header: e.header, body: Buffer.from(JSON.stringify(m)) } : e.header.name === target.path ? { header: e.header, body: choice.body } : e));
    return pack(list);
  }

  const tally = { tried: 0, failed: 0 };
  for (const [label, make, status, code] of cases) {
    it(label, async () => {
      tally.tried++;
      tally.failed++; // undone at the end when every check passed
      const before = await snapshot(ctx.db, ctx.deps.objects);
      const r = await importInto(hostileShopId, await make());
      const problems = errorAnswerProblems(r, status);
      expect(problems, JSON.stringify(r.body)).toEqual([]);
      if (typeof code === 'string') expect(r.body.error.code).toBe(code);
      else expect(r.body.error.code).toMatch(code);
      expect(diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects))).toEqual([]);
      tally.failed--;
    });
  }

  it('an archive over the upload limit is refused with 413', async () => {
    const before = await snapshot(small.db, small.deps.objects);
    const r = await small.http.post(`/api/shops/${smallShop}/archive`).set({ Authorization: `Bearer ${smallToken}` }).attach('archive', Buffer.alloc(4 * 1024 * 1024 + 1, 1), 'big.tar.gz');
    expect(errorAnswerProblems(r, 413)).toEqual([]);
    expect(r.body.error.code).toBe('file_too_large');
    expect(diffSnapshots(before, await snapshot(small.db, small.deps.objects))).toEqual([]);
  });

  it('a decompression bomb (12 MB of zeros in 12 kB) stops at the unpacked limit with 413', async () => {
    const bomb = await pack(withManifest(entries, (m) => ({ ...m, padding: ' '.repeat(12 * 1024 * 1024) })));
    expect(bomb.length).toBeLessThan(200 * 1024);
    const before = await snapshot(small.db, small.deps.objects);
    const r = await small.http.post(`/api/shops/${smallShop}/archive`).set({ Authorization: `Bearer ${smallToken}` }).attach('archive', bomb, 'bomb.tar.gz');
    expect(errorAnswerProblems(r, 413), JSON.stringify(r.body)).toEqual([]);
    expect(r.body.error.code).toBe('archive_too_large');
    expect(diffSnapshots(before, await snapshot(small.db, small.deps.objects))).toEqual([]);
  });

  it('no archive in the request, or under another field name', async () => {
    for (const req of [
      ctx.http.post(`/api/shops/${targetShopId}/archive`).set(auth('owner')).field('note', 'x'),
      ctx.http.post(`/api/shops/${targetShopId}/archive`).set(auth('owner')).attach('file', exported, 'library.tar.gz'),
    ]) {
      const r = await req;
      expect(errorAnswerProblems(r, 400)).toEqual([]);
    }
  });

  it('after all of them: no orphan object, every revision whole', async () => {
    const found = await orphans(ctx.deps);
    const smallOrphans = await orphans(small.deps);
    console.log(`[hostile-archive] cases tried: ${tally.tried}, failures: ${tally.failed}, orphans found: ${found.length + smallOrphans.length}`);
    expect(smallOrphans).toEqual([]);
    expect(found).toEqual([]);
    expect(await revisionProblems(ctx.deps, { content: true })).toEqual([]);
    expect((await ctx.http.get('/api/health')).status).toBe(200);
  });
});

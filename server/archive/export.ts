// Export: a shop's whole library as one gzip-compressed tar (POSIX pax/ustar, written by
// tar-stream): manifest.json first, then SHA256SUMS (GNU coreutils `sha256sum -c` format), then
// every revision's files and every cut photo. Each object is hashed while it streams and compared
// with its row; a mismatch or a failed read aborts the archive (the download fails rather than
// delivering a quietly wrong copy).
import { createHash } from 'node:crypto';
import type { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import tar from 'tar-stream';
import { readFileSync } from 'node:fs';
import type { Deps } from '../deps';
import { ARCHIVE_FORMAT, ARCHIVE_SCHEMA_VERSION, type ArchiveManifest, CHECKSUMS_NAME, FILE_NAME, MANIFEST_NAME, slugOf } from './manifest';

/** One stored object to copy into the archive. */
interface Source {
  path: string;
  key: string;
  bytes: number;
  sha256: string;
  mtime: Date;
}

const APP_VERSION = String(JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')).version);
const iso = (d: Date) => d.toISOString();
const person = (id: string | null, joined: string | null, recorded: string | null) =>
  id && joined !== null ? { id, name: joined } : recorded ? { id: null, name: recorded } : null;
const extOf = (key: string) => (/\.([a-z0-9]{1,8})$/i.exec(key)?.[1] ?? 'bin').toLowerCase();

export async function buildManifest(deps: Pick<Deps, 'db' | 'objects'>, shopId: string): Promise<{ manifest: ArchiveManifest; sources: Source[] }> {
  const { db, objects } = deps;
  const shop = await db.selectFrom('shops').select(['id', 'name', 'slug']).where('id', '=', shopId).executeTakeFirstOrThrow();
  const designs = await db
    .selectFrom('designs as d')
    .leftJoin('users as u', 'u.id', 'd.author_id')
    .leftJoin('designs as p', 'p.id', 'd.forked_from_design_id')
    .leftJoin('shops as ps', 'ps.id', 'p.shop_id')
    .leftJoin('revisions as pr', 'pr.id', 'd.forked_from_revision_id')
    .select([
      'd.id', 'd.kind', 'd.title', 'd.description', 'd.tags', 'd.material', 'd.author_id', 'u.name as author_joined', 'd.author_name', 'd.created_at', 'd.updated_at',
      'd.latest_revision_number', 'd.latest_status', 'd.forked_from_design_id', 'd.forked_from_revision_id', 'd.forked_from_text',
      'p.shop_id as parent_shop_id', 'p.title as parent_title', 'ps.name as parent_shop', 'pr.number as parent_number',
    ])
    .where('d.shop_id', '=', shopId)
    .orderBy('d.created_at')
    .orderBy('d.id')
    .execute();
  const revisions = await db
    .selectFrom('revisions as r')
    .innerJoin('designs as d', 'd.id', 'r.design_id')
    .leftJoin('users as u', 'u.id', 'r.author_id')
    .select(['r.id', 'r.design_id', 'r.number', 'r.message', 'r.author_id', 'u.name as author_joined', 'r.author_name', 'r.created_at', 'r.source', 'r.generator_id', 'r.params', 'r.status', 'r.fit_notes', 'r.summary', 'r.units'])
    .where('d.shop_id', '=', shopId)
    .orderBy('d.created_at')
    .orderBy('d.id')
    .orderBy('r.number')
    .execute();
  const files = await db
    .selectFrom('revision_files as f')
    .innerJoin('revisions as r', 'r.id', 'f.revision_id')
    .innerJoin('designs as d', 'd.id', 'r.design_id')
    .select(['f.revision_id', 'f.role', 'f.object_key', 'f.content_type', 'f.bytes', 'f.sha256'])
    .where('d.shop_id', '=', shopId)
    .orderBy('f.revision_id')
    .orderBy('f.role')
    .execute();
  const cuts = await db
    .selectFrom('cut_logs as c')
    .innerJoin('revisions as r', 'r.id', 'c.revision_id')
    .innerJoin('designs as d', 'd.id', 'r.design_id')
    .leftJoin('users as u', 'u.id', 'c.author_id')
    .select(['c.id', 'c.revision_id', 'c.cut_on', 'c.material', 'c.bit_mm', 'c.machine_note', 'c.device_key', 'c.clearance_mm', 'c.measured_width_mm', 'c.measured_length_mm', 'c.result', 'c.author_id', 'u.name as author_joined', 'c.author_name', 'c.created_at', 'c.photo_key'])
    .where('d.shop_id', '=', shopId)
    .orderBy('c.created_at')
    .orderBy('c.id')
    .execute();
  const devices = await db.selectFrom('devices').selectAll().where('shop_id', '=', shopId).orderBy('name').execute();
  const chargers = await db.selectFrom('chargers').selectAll().where('shop_id', '=', shopId).orderBy('name').execute();
  const activity = await db
    .selectFrom('activity as a')
    .innerJoin('designs as d', 'd.id', 'a.design_id')
    .leftJoin('users as u', 'u.id', 'a.actor_id')
    .select(['a.design_id', 'a.revision_id', 'a.action', 'a.detail', 'u.name as actor_joined', 'a.actor_name', 'a.created_at'])
    .where('d.shop_id', '=', shopId)
    .orderBy('a.id')
    .execute();

  const sources: Source[] = [];
  const dirOf = new Map<string, { dir: string; slug: string }>();
  for (const d of designs) {
    const slug = slugOf(d.title);
    dirOf.set(d.id, { dir: `designs/${slug}--${d.id}`, slug });
  }
  const revDir = new Map<string, { dir: string; base: string; created: Date }>();
  for (const r of revisions) {
    const d = dirOf.get(r.design_id)!;
    revDir.set(r.id, { dir: `${d.dir}/r${String(r.number).padStart(3, '0')}`, base: `${d.slug}-r${r.number}`, created: r.created_at });
  }
  const filesOf = new Map<string, ArchiveManifest['revisions'][number]['files']>();
  for (const f of files) {
    const rd = revDir.get(f.revision_id)!;
    const path = `${rd.dir}/${FILE_NAME[f.role](rd.base, extOf(f.object_key))}`;
    filesOf.set(f.revision_id, [...(filesOf.get(f.revision_id) ?? []), { role: f.role, path, contentType: f.content_type, bytes: f.bytes, sha256: f.sha256 }]);
    sources.push({ path, key: f.object_key, bytes: f.bytes, sha256: f.sha256, mtime: rd.created });
  }

  const cutLogs: ArchiveManifest['cutLogs'] = [];
  for (const c of cuts) {
    const cutOn = c.cut_on instanceof Date ? c.cut_on.toISOString().slice(0, 10) : String(c.cut_on);
    let photo: ArchiveManifest['cutLogs'][number]['photo'] = null;
    if (c.photo_key) {
      // Photos have no stored checksum: read each once to take it (they are at most 8 MB).
      const body = await objects.get(c.photo_key);
      const ext = extOf(c.photo_key);
      const path = `${revDir.get(c.revision_id)!.dir}/cuts/${cutOn}--${c.id}.${ext}`;
      photo = { path, contentType: ext === 'png' ? 'image/png' : 'image/jpeg', bytes: body.length, sha256: createHash('sha256').update(body).digest('hex') };
      sources.push({ path, key: c.photo_key, bytes: body.length, sha256: photo.sha256, mtime: c.created_at });
    }
    cutLogs.push({
      id: c.id,
      revisionId: c.revision_id,
      cutOn,
      material: c.material,
      bitMm: c.bit_mm,
      machineNote: c.machine_note,
      deviceKey: c.device_key,
      clearanceMm: c.clearance_mm,
      measuredWidthMm: c.measured_width_mm,
      measuredLengthMm: c.measured_length_mm,
      result: c.result,
      author: person(c.author_id, c.author_joined, c.author_name),
      createdAt: iso(c.created_at),
      photo,
    });
  }

  const manifest: ArchiveManifest = {
    format: ARCHIVE_FORMAT,
    schemaVersion: ARCHIVE_SCHEMA_VERSION,
    exportedAt: new Date().toISOString(),
    app: { name: 'jigwright', version: APP_VERSION },
    shop: { id: shop.id, name: shop.name, slug: shop.slug },
    counts: {
      designs: designs.length,
      revisions: revisions.length,
      files: files.length,
      cutLogs: cutLogs.length,
      photos: cutLogs.filter((c) => c.photo).length,
      devices: devices.length,
      chargers: chargers.length,
      activity: activity.length,
    },
    designs: designs.map((d) => {
      let forkedFrom: ArchiveManifest['designs'][number]['forkedFrom'] = null;
      if (d.forked_from_design_id) {
        const text = `${d.parent_title ?? 'a design'}${d.parent_number ? ` r${d.parent_number}` : ''} (${d.parent_shop ?? 'another shop'})`;
        forkedFrom = {
          inArchive: d.parent_shop_id === shopId,
          designId: d.forked_from_design_id,
          revisionId: d.forked_from_revision_id,
          revisionNumber: d.parent_number ?? null,
          title: d.parent_title ?? null,
          shopName: d.parent_shop ?? null,
          text,
        };
      } else if (d.forked_from_text) {
        forkedFrom = { inArchive: false, designId: null, revisionId: null, revisionNumber: null, title: null, shopName: null, text: d.forked_from_text };
      }
      return {
        id: d.id,
        kind: d.kind,
        title: d.title,
        description: d.description,
        tags: d.tags,
        material: d.material,
        author: person(d.author_id, d.author_joined, d.author_name),
        createdAt: iso(d.created_at),
        updatedAt: iso(d.updated_at),
        latestRevisionNumber: d.latest_revision_number,
        latestStatus: d.latest_status as ArchiveManifest['designs'][number]['latestStatus'],
        forkedFrom,
      };
    }),
    revisions: revisions.map((r) => ({
      id: r.id,
      designId: r.design_id,
      number: r.number,
      message: r.message,
      author: person(r.author_id, r.author_joined, r.author_name),
      createdAt: iso(r.created_at),
      source: r.source,
      generatorId: r.generator_id,
      params: (r.params ?? null) as ArchiveManifest['revisions'][number]['params'],
      status: r.status,
      fitNotes: (r.fit_notes ?? {}) as Record<string, unknown>,
      summary: r.summary as Record<string, unknown>,
      units: r.units,
      files: filesOf.get(r.id) ?? [],
    })),
    cutLogs,
    devices: devices.map((d) => ({ name: d.name, widthMm: d.width_mm, lengthMm: d.length_mm, thicknessMm: d.thickness_mm, caseAllowanceMm: d.case_allowance_mm })),
    chargers: chargers.map((c) => ({ name: c.name, shape: c.shape, widthMm: c.width_mm, lengthMm: c.length_mm, thicknessMm: c.thickness_mm, rangeMinMm: c.range_min_mm, rangeMaxMm: c.range_max_mm })),
    activity: activity.map((a) => ({
      designId: a.design_id,
      revisionId: a.revision_id,
      action: a.action,
      actor: a.actor_joined ?? a.actor_name ?? null,
      detail: (a.detail ?? {}) as Record<string, unknown>,
      createdAt: iso(a.created_at),
    })),
  };
  return { manifest, sources };
}

/** `<slug>-library-YYYY-MM-DD.tar.gz` */
export function archiveName(slug: string, at = new Date()): string {
  return `${slugOf(slug)}-library-${at.toISOString().slice(0, 10)}.tar.gz`;
}

/**
 * Streams the archive into `out`. Resolves when it is complete; rejects (after destroying the
 * pack) if an object cannot be read or does not match its recorded size and checksum.
 */
export async function writeArchive(deps: Pick<Deps, 'objects'>, built: { manifest: ArchiveManifest; sources: Source[] }, out: Writable): Promise<void> {
  const pack = tar.pack();
  const done = pipeline(pack, createGzip(), out);
  let failure: unknown;
  done.catch((e) => {
    failure ??= e;
  });
  try {
    const exportedAt = new Date(built.manifest.exportedAt);
    await addBuffer(pack, { name: MANIFEST_NAME, mtime: exportedAt }, Buffer.from(JSON.stringify(built.manifest, null, 2) + '\n'));
    const sums = built.sources.map((s) => `${s.sha256}  ${s.path}\n`).join('');
    await addBuffer(pack, { name: CHECKSUMS_NAME, mtime: exportedAt }, Buffer.from(sums));
    for (const s of built.sources) {
      if (failure) throw failure;
      await addObject(deps, pack, s);
    }
    pack.finalize();
  } catch (e) {
    pack.destroy(e as Error);
    await done.catch(() => undefined);
    throw e;
  }
  await done;
}

function addBuffer(pack: tar.Pack, header: { name: string; mtime: Date }, body: Buffer): Promise<void> {
  return new Promise((resolve, reject) => {
    pack.entry({ ...header, size: body.length, mode: 0o644 }, body, (err) => (err ? reject(err) : resolve()));
  });
}

async function addObject(deps: Pick<Deps, 'objects'>, pack: tar.Pack, s: Source): Promise<void> {
  const source = await deps.objects.stream(s.key);
  const hash = createHash('sha256');
  let seen = 0;
  await new Promise<void>((resolve, reject) => {
    const entry = pack.entry({ name: s.path, size: s.bytes, mtime: s.mtime, mode: 0o644 }, (err) => (err ? reject(err) : resolve()));
    source.on('data', (c: Buffer) => {
      seen += c.length;
      hash.update(c);
    });
    source.on('error', (e) => {
      entry.destroy(e);
      reject(e);
    });
    source.pipe(entry as unknown as Writable);
  });
  const sha = hash.digest('hex');
  if (seen !== s.bytes || sha !== s.sha256) {
    throw new Error(`stored object ${s.key} does not match its record (${seen} bytes, sha256 ${sha.slice(0, 12)}…; expected ${s.bytes} bytes, ${s.sha256.slice(0, 12)}…)`);
  }
}


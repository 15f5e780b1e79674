// Import: a shop archive (server/archive/export.ts) into a shop, all or nothing. The manifest comes
// first and is checked whole; each following file must be one it lists, with its size and sha256;
// every file is written to the object store under new keys; then every row goes in one
// transaction. When anything fails, the objects written so far are removed (the sweep catches any
// that could not be). Limits against hostile archives (OWASP File Upload Cheat Sheet: archives,
// decompression bombs): entry count, unpacked size, size per entry, and only regular files.
// An archive is known by the sha256 of its manifest bytes: a shop that already imported it is told
// so (409 already_imported) before any object is written, unless the owner asked for it `again`;
// the record of each import (archive_imports, migration 0007) goes in the same transaction as the
// rows, and its unique index turns a second import running at the same moment into the same 409.
import { counted, timesInWords } from '../../shared/words';
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import { Transform, type Readable } from 'node:stream';
import { createGunzip } from 'node:zlib';
import tar from 'tar-stream';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/schema';
import type { Deps } from '../deps';
import { HttpError } from '../http/errors';
import { logActivity } from '../designs/repository';
import { sniffUpload } from '../../files/sniff';
import { ALREADY_IMPORTED, type AlreadyImportedDetails, type ArchiveImportResult } from '../../shared/schemas/archive';
import {
  ARCHIVE_FORMAT,
  ARCHIVE_SCHEMA_VERSION,
  ArchiveManifest,
  ArchivePath,
  type ArchiveFile,
  CHECKSUMS_NAME,
  MANIFEST_NAME,
  manifestProblems,
} from './manifest';

export interface ImportLimits {
  /** Most bytes the archive may unpack to. */
  maxUnpackedBytes: number;
  /** Largest single file inside. */
  maxEntryBytes: number;
  maxEntries: number;
  maxManifestBytes: number;
}

export const DEFAULT_IMPORT_LIMITS: ImportLimits = {
  maxUnpackedBytes: 8 * 1024 ** 3,
  maxEntryBytes: 512 * 1024 ** 2,
  maxEntries: 2_000_000,
  maxManifestBytes: 256 * 1024 ** 2,
};

export type ImportResult = ArchiveImportResult;

export interface ImportTarget {
  shopId: string;
  userId: string;
  /** Import even when this shop already imported the same archive: its designs come in as a further copy. */
  again?: boolean;
}

const bad = (code: string, message: string) => new HttpError(400, code, message);
const EXT = /\.([a-z0-9]{1,8})$/i;

/** What the archive must hold for one listed file, and where it goes. */
interface Expected extends ArchiveFile {
  key: string;
  kind: 'dxf' | 'svg' | 'model' | 'original' | 'photo';
  seen: boolean;
}

export async function importArchive(deps: Deps, target: ImportTarget, file: string, limits: ImportLimits = DEFAULT_IMPORT_LIMITS): Promise<ImportResult> {
  const head = Buffer.alloc(512);
  const fd = await fs.promises.open(file, 'r');
  let headLength: number;
  try {
    headLength = (await fd.read(head, 0, 512, 0)).bytesRead;
  } finally {
    await fd.close();
  }
  const gzip = head[0] === 0x1f && head[1] === 0x8b; // RFC 1952 §2.3.1 member header
  const plainTar = headLength === 512 && head.subarray(257, 262).toString('latin1') === 'ustar'; // POSIX.1 ustar magic
  if (!gzip && !plainTar) throw bad('not_archive', 'The file is not a Jigwright shop archive (a .tar.gz from "Download the whole library").');

  const written: string[] = [];
  const source = fs.createReadStream(file);
  let unpacked = 0;
  const meter = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      unpacked += chunk.length;
      if (unpacked > limits.maxUnpackedBytes) cb(new HttpError(413, 'archive_too_large', `The archive unpacks to more than ${formatBytes(limits.maxUnpackedBytes)}, more than one import takes.`));
      else cb(null, chunk);
    },
  });
  const extract = tar.extract();
  const fail = (e: unknown) => extract.destroy(e as Error);
  let stream: Readable = source;
  source.on('error', fail);
  if (gzip) {
    const gunzip = createGunzip();
    gunzip.on('error', (e) => fail(bad('damaged_archive', `The archive is damaged: it does not unpack (${e.message}). Download it again.`)));
    stream = source.pipe(gunzip);
  }
  meter.on('error', fail);
  stream.pipe(meter).pipe(extract as never);

  try {
    let manifest: ArchiveManifest | undefined;
    let manifestSha256 = '';
    let plan: Plan | undefined;
    let entries = 0;
    try {
      for await (const entry of extract) {
        if (++entries > limits.maxEntries) throw bad('too_many_entries', `The archive has more than ${limits.maxEntries.toLocaleString('en-US')} entries.`);
        const h = entry.header;
        const name = String(h.name ?? '').replace(/^\.\//, '');
        if (h.type === 'directory') {
          entry.resume();
          continue;
        }
        if (h.type !== 'file' && h.type !== 'contiguous-file') {
          throw bad('unsafe_entry', `The archive holds "${name.slice(0, 80)}", which is a ${h.type} rather than a plain file; Jigwright archives hold only files.`);
        }
        if (!ArchivePath.safeParse(name).success) throw bad('unsafe_entry', `The archive holds a file with an unsafe name ("${name.slice(0, 80)}").`);
        if (!manifest) {
          if (name !== MANIFEST_NAME) throw bad('no_manifest', `The archive does not start with ${MANIFEST_NAME}, so it is not a Jigwright shop archive (or it was repacked).`);
          const body = await readEntry(entry, limits.maxManifestBytes, MANIFEST_NAME);
          manifest = parseManifest(body);
          manifestSha256 = createHash('sha256').update(body).digest('hex');
          // Before any object is written: a shop that has this archive already is told so at once.
          if (!target.again) {
            const prior = await firstImportOf(deps.db, target.shopId, manifestSha256);
            if (prior) throw await alreadyImported(deps.db, prior);
          }
          plan = planKeys(manifest);
          continue;
        }
        if (name === CHECKSUMS_NAME) {
          entry.resume(); // the manifest carries the same checksums
          continue;
        }
        const want = plan!.files.get(name);
        if (!want) throw bad('unexpected_file', `The archive holds "${name.slice(0, 120)}", which its manifest does not list.`);
        if (want.seen) throw bad('unexpected_file', `The archive holds "${name.slice(0, 120)}" twice.`);
        if (h.size !== want.bytes) throw bad('checksum_mismatch', `"${name.slice(0, 120)}" is ${h.size} bytes in the archive but ${want.bytes} in its manifest: the archive is damaged.`);
        const body = await readEntry(entry, Math.min(limits.maxEntryBytes, want.bytes), name);
        if (createHash('sha256').update(body).digest('hex') !== want.sha256) {
          throw bad('checksum_mismatch', `"${name.slice(0, 120)}" does not match its sha256 in the manifest: the archive is damaged.`);
        }
        checkContent(want, body, name);
        want.seen = true;
        try {
          await deps.objects.put(want.key, body, want.contentType);
        } catch (e) {
          deps.log.error({ err: e }, 'object store write failed during an archive import');
          throw new HttpError(503, 'storage_unavailable', 'The file store is not answering; nothing was imported. Try again in a moment.');
        }
        written.push(want.key);
      }
    } catch (e) {
      throw asImportError(e);
    }
    if (!manifest || !plan) throw bad('no_manifest', `The archive is empty: it has no ${MANIFEST_NAME}.`);
    const missing = [...plan.files.entries()].filter(([, f]) => !f.seen).map(([p]) => p);
    if (missing.length) throw bad('missing_files', `The archive is missing ${counted(missing.length, 'file')} its manifest lists (the first is "${missing[0].slice(0, 120)}"). Nothing was imported.`);
    return await insertRows(deps, target, manifest, manifestSha256, plan);
  } catch (e) {
    source.destroy();
    if (written.length) {
      try {
        await deps.objects.remove(written);
      } catch (err) {
        deps.log.warn({ err, count: written.length }, 'could not remove objects after a failed archive import; the sweep will');
      }
    }
    throw e;
  }
}

function parseManifest(body: Buffer): ArchiveManifest {
  let raw: unknown;
  try {
    raw = JSON.parse(body.toString('utf8'));
  } catch {
    throw bad('bad_manifest', `The archive's ${MANIFEST_NAME} is not valid JSON.`);
  }
  const head = raw as { format?: unknown; schemaVersion?: unknown };
  if (head?.format !== ARCHIVE_FORMAT) throw bad('bad_manifest', `This is not a Jigwright shop archive (its manifest's format is not "${ARCHIVE_FORMAT}").`);
  if (head.schemaVersion !== ARCHIVE_SCHEMA_VERSION) {
    throw bad('unsupported_version', `The archive's manifest is schema version ${String(head.schemaVersion).slice(0, 20)}; this Jigwright reads version ${ARCHIVE_SCHEMA_VERSION}.${typeof head.schemaVersion === 'number' && head.schemaVersion > ARCHIVE_SCHEMA_VERSION ? ' It was made by a newer Jigwright.' : ''}`);
  }
  const parsed = ArchiveManifest.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const more = parsed.error.issues.length > 1 ? ` (and ${parsed.error.issues.length - 1} more)` : '';
    throw bad('bad_manifest', `The archive's manifest is not valid at ${issue.path.join('.') || 'its top'}: ${issue.message}${more}.`);
  }
  const problems = manifestProblems(parsed.data);
  if (problems.length) throw bad('bad_manifest', `The archive's manifest does not hold together: ${problems[0]}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}.`);
  return parsed.data;
}

interface Plan {
  /** Archive path → what it must be and its new object key. */
  files: Map<string, Expected>;
  /** Revision id in the archive → its new id. */
  revIds: Map<string, string>;
}

/** New ids and object keys for everything the manifest lists. */
function planKeys(m: ArchiveManifest): Plan {
  const out = new Map<string, Expected>();
  const revIds = new Map(m.revisions.map((r) => [r.id, randomUUID()]));
  for (const r of m.revisions) {
    for (const f of r.files) {
      const ext = (EXT.exec(f.path)?.[1] ?? 'bin').toLowerCase();
      const kind = f.role === 'dxf' || f.role === 'dxf_in' ? 'dxf' : f.role === 'svg' ? 'svg' : f.role;
      out.set(f.path, { ...f, key: `revisions/${revIds.get(r.id)}/${f.role}.${ext}`, kind, seen: false });
    }
  }
  for (const c of m.cutLogs) {
    if (!c.photo) continue;
    const ext = c.photo.contentType === 'image/png' ? 'png' : 'jpg';
    out.set(c.photo.path, { ...c.photo, key: `photos/${randomUUID()}.${ext}`, kind: 'photo', seen: false });
  }
  return { files: out, revIds };
}

const ACTIVE_SVG = /<script|<foreignObject|<iframe|<embed|<object|\son[a-z]+\s*=|javascript:|<!DOCTYPE|<!ENTITY/i;

/** Each file must be what its role says (OWASP File Upload Cheat Sheet: check the content, not the name). */
function checkContent(f: Expected, body: Buffer, name: string): void {
  const refuse = (what: string) => {
    throw bad('bad_file', `"${name.slice(0, 120)}" is not ${what}; the archive is damaged or was altered.`);
  };
  switch (f.kind) {
    case 'model': {
      let v: unknown;
      try {
        v = JSON.parse(body.toString('utf8'));
      } catch {
        refuse('a drawing model (JSON)');
      }
      if (!v || typeof v !== 'object' || Array.isArray(v)) refuse('a drawing model (JSON)');
      break;
    }
    case 'svg':
      if (!/^\s*(<\?xml[^>]*>\s*)?<svg[\s>]/.test(body.subarray(0, 4096).toString('utf8')) || ACTIVE_SVG.test(body.toString('utf8'))) refuse('a plain SVG preview');
      break;
    case 'dxf':
      if (!/^\s*(0|999)\r?\n/.test(body.subarray(0, 64).toString('latin1'))) refuse('a DXF file');
      break;
    case 'original':
      try {
        sniffUpload(body);
      } catch {
        refuse('a DXF or SVG drawing');
      }
      break;
    case 'photo': {
      const jpeg = body.length > 3 && body[0] === 0xff && body[1] === 0xd8 && body[2] === 0xff;
      const png = body.length > 8 && body.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
      if (!(f.contentType === 'image/png' ? png : jpeg)) refuse(f.contentType === 'image/png' ? 'a PNG image' : 'a JPEG image');
      break;
    }
  }
}

async function readEntry(entry: tar.Entry, max: number, name: string): Promise<Buffer> {
  if ((entry.header.size ?? 0) > max) throw new HttpError(413, 'entry_too_large', `"${name.slice(0, 120)}" in the archive is larger than ${formatBytes(max)}.`);
  const chunks: Buffer[] = [];
  let n = 0;
  for await (const c of entry) {
    n += c.length;
    if (n > max) throw new HttpError(413, 'entry_too_large', `"${name.slice(0, 120)}" in the archive is larger than ${formatBytes(max)}.`);
    chunks.push(c);
  }
  return Buffer.concat(chunks);
}

/** tar-stream and zlib errors are about the sender's file; ours pass through. */
function asImportError(e: unknown): unknown {
  if (e instanceof HttpError) return e;
  const msg = String((e as Error)?.message ?? e);
  return bad('damaged_archive', `The archive is damaged and cannot be read (${msg.slice(0, 120)}). Download it again.`);
}

function formatBytes(n: number): string {
  return n >= 1024 ** 3 ? `${(n / 1024 ** 3).toFixed(1)} GiB` : n >= 1024 ** 2 ? `${Math.round(n / 1024 ** 2)} MiB` : `${Math.round(n / 1024)} KiB`;
}

const chunks = <T>(list: T[], size = 500): T[][] => {
  const out: T[][] = [];
  for (let i = 0; i < list.length; i += size) out.push(list.slice(i, i + size));
  return out;
};

type ImportRecord = { id: string; imported_at: Date; imported_by: string | null; designs: number; source_shop_id: string; source_shop_name: string; exported_at: Date };

/** The first import of the archive with this manifest into the shop, if there was one. */
async function firstImportOf(db: Kysely<Database>, shopId: string, manifestSha256: string): Promise<ImportRecord | undefined> {
  return db
    .selectFrom('archive_imports')
    .select(['id', 'imported_at', 'imported_by', 'designs', 'source_shop_id', 'source_shop_name', 'exported_at'])
    .where('shop_id', '=', shopId)
    .where('manifest_sha256', '=', manifestSha256)
    .where('copy_of', 'is', null)
    .executeTakeFirst();
}

const inWords = (d: Date) => `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' })} at ${d.toISOString().slice(11, 16)} UTC`;

/** 409: the shop has this archive already; when, by whom, how much, and that nothing was added. */
async function alreadyImported(db: Kysely<Database>, prior: ImportRecord): Promise<HttpError> {
  const by = prior.imported_by ? await db.selectFrom('users').select('name').where('id', '=', prior.imported_by).executeTakeFirst() : undefined;
  const copies = Number((await db.selectFrom('archive_imports').select((eb) => eb.fn.countAll<string>().as('n')).where('copy_of', '=', prior.id).executeTakeFirstOrThrow()).n);
  const details: AlreadyImportedDetails = {
    importId: prior.id,
    importedAt: prior.imported_at.toISOString(),
    importedBy: by && prior.imported_by ? { id: prior.imported_by, name: by.name } : null,
    designs: prior.designs,
    sourceShop: { id: prior.source_shop_id, name: prior.source_shop_name },
    exportedAt: prior.exported_at.toISOString(),
    copies,
  };
  const who = by ? by.name : 'someone who no longer has an account';
  const since = copies ? ` Since then it has been imported again as copies ${timesInWords(copies)}.` : '';
  return new HttpError(
    409,
    ALREADY_IMPORTED,
    `This archive of ${prior.source_shop_name} (exported ${inWords(prior.exported_at)}) was already imported into this shop on ${inWords(prior.imported_at)} by ${who}, with ${counted(prior.designs, 'design')}.${since} Nothing was added this time. Import it again as copies only if you want ${copies ? 'another' : 'a second'} set of its designs.`,
    details,
  );
}

async function insertRows(deps: Deps, target: ImportTarget, m: ArchiveManifest, manifestSha256: string, plan: Plan): Promise<ImportResult> {
  const { revIds } = plan;
  const designIds = new Map(m.designs.map((d) => [d.id, randomUUID()]));
  const keyOf = (path: string) => plan.files.get(path)!.key;
  // Authors keep their account only when they are members of the importing shop; otherwise their name.
  const authorIds = [...new Set([...m.designs, ...m.revisions, ...m.cutLogs].map((x) => x.author?.id).filter((x): x is string => !!x))];
  const members = new Set(
    authorIds.length
      ? (await deps.db.selectFrom('memberships').select('user_id').where('shop_id', '=', target.shopId).where('user_id', 'in', authorIds).execute()).map((r) => r.user_id)
      : [],
  );
  const who = (a: { id: string | null; name: string } | null) =>
    a?.id && members.has(a.id) ? { id: a.id as string | null, name: null as string | null } : { id: null, name: a?.name ?? null };
  const newestOf = new Map<string, { number: number; status: string }>();
  for (const r of m.revisions) if ((newestOf.get(r.designId)?.number ?? 0) < r.number) newestOf.set(r.designId, { number: r.number, status: r.status });

  return deps.db.transaction().execute(async (tx) => {
    // The record first: a second first-import of the same archive waits here on the unique index
    // until this transaction ends, then finds the row and is refused (409) before it writes anything.
    const record = {
      shop_id: target.shopId,
      imported_by: target.userId,
      source_shop_id: m.shop.id,
      source_shop_name: m.shop.name,
      exported_at: m.exportedAt,
      manifest_sha256: manifestSha256,
      designs: m.designs.length,
      revisions: m.revisions.length,
      files: m.revisions.reduce((n, r) => n + r.files.length, 0),
      cut_logs: m.cutLogs.length,
      photos: m.cutLogs.filter((c) => c.photo).length,
      devices_added: 0,
      devices_skipped: 0,
      chargers_added: 0,
      chargers_skipped: 0,
      activity: m.activity.length,
    };
    let first = await firstImportOf(tx, target.shopId, manifestSha256);
    let importId: string | undefined;
    if (!first) {
      importId = (
        await tx
          .insertInto('archive_imports')
          .values({ ...record, copy_of: null })
          .onConflict((oc) => oc.columns(['shop_id', 'manifest_sha256']).where('copy_of', 'is', null).doNothing())
          .returning('id')
          .executeTakeFirst()
      )?.id;
      if (!importId) {
        // Another import of the same archive into this shop committed while this one was running.
        first = await firstImportOf(tx, target.shopId, manifestSha256);
        if (!first) throw new Error('archive_imports: a conflicting import vanished');
        if (!target.again) throw await alreadyImported(tx, first);
      }
    } else if (!target.again) throw await alreadyImported(tx, first);
    if (!importId) importId = (await tx.insertInto('archive_imports').values({ ...record, copy_of: first!.id }).returning('id').executeTakeFirstOrThrow()).id;
    const copyOf = first?.id ?? null;

    for (const part of chunks(m.designs)) {
      await tx
        .insertInto('designs')
        .values(
          part.map((d) => {
            const a = who(d.author);
            const external = d.forkedFrom && !d.forkedFrom.inArchive ? d.forkedFrom.text : null;
            const newest = newestOf.get(d.id);
            return {
              id: designIds.get(d.id)!,
              shop_id: target.shopId,
              kind: d.kind,
              title: d.title,
              description: d.description,
              tags: d.tags,
              material: d.material,
              author_id: a.id,
              author_name: a.name,
              forked_from_text: external,
              latest_revision_number: newest?.number ?? 0,
              latest_status: newest?.status ?? 'draft',
              created_at: d.createdAt,
              updated_at: d.updatedAt,
            };
          }),
        )
        .execute();
    }
    for (const part of chunks(m.revisions)) {
      await tx
        .insertInto('revisions')
        .values(
          part.map((r) => {
            const a = who(r.author);
            return {
              id: revIds.get(r.id)!,
              design_id: designIds.get(r.designId)!,
              number: r.number,
              message: r.message,
              author_id: a.id,
              author_name: a.name,
              source: r.source,
              generator_id: r.generatorId,
              params: r.params === null ? null : JSON.stringify(r.params),
              status: r.status,
              fit_notes: JSON.stringify(r.fitNotes),
              summary: JSON.stringify(r.summary),
              units: r.units,
              created_at: r.createdAt,
            };
          }),
        )
        .execute();
    }
    const fileRows = m.revisions.flatMap((r) => r.files.map((f) => ({ revision_id: revIds.get(r.id)!, role: f.role, object_key: keyOf(f.path), content_type: f.contentType, bytes: f.bytes, sha256: f.sha256 })));
    for (const part of chunks(fileRows)) await tx.insertInto('revision_files').values(part).execute();
    // Lineage inside the archive points at the new rows; outside it, it was kept as text above.
    for (const d of m.designs) {
      const f = d.forkedFrom;
      if (!f?.inArchive || !f.designId) continue;
      await tx
        .updateTable('designs')
        .set({ forked_from_design_id: designIds.get(f.designId)!, forked_from_revision_id: f.revisionId ? revIds.get(f.revisionId)! : null })
        .where('id', '=', designIds.get(d.id)!)
        .execute();
    }
    for (const part of chunks(m.cutLogs)) {
      await tx
        .insertInto('cut_logs')
        .values(
          part.map((c) => {
            const a = who(c.author);
            return {
              revision_id: revIds.get(c.revisionId)!,
              shop_id: target.shopId,
              author_id: a.id,
              author_name: a.name,
              cut_on: c.cutOn,
              material: c.material,
              bit_mm: c.bitMm,
              machine_note: c.machineNote,
              device_key: c.deviceKey,
              clearance_mm: c.clearanceMm,
              measured_width_mm: c.measuredWidthMm,
              measured_length_mm: c.measuredLengthMm,
              result: c.result,
              photo_key: c.photo ? keyOf(c.photo.path) : null,
              created_at: c.createdAt,
            };
          }),
        )
        .execute();
    }
    let devicesAdded = 0;
    for (const part of chunks(m.devices)) {
      const r = await tx
        .insertInto('devices')
        .values(part.map((d) => ({ shop_id: target.shopId, name: d.name, width_mm: d.widthMm, length_mm: d.lengthMm, thickness_mm: d.thicknessMm, case_allowance_mm: d.caseAllowanceMm })))
        .onConflict((oc) => oc.columns(['shop_id', 'name']).doNothing())
        .returning('id')
        .execute();
      devicesAdded += r.length;
    }
    let chargersAdded = 0;
    for (const part of chunks(m.chargers)) {
      const r = await tx
        .insertInto('chargers')
        .values(part.map((c) => ({ shop_id: target.shopId, name: c.name, shape: c.shape, width_mm: c.widthMm, length_mm: c.lengthMm, thickness_mm: c.thicknessMm, range_min_mm: c.rangeMinMm, range_max_mm: c.rangeMaxMm })))
        .onConflict((oc) => oc.columns(['shop_id', 'name']).doNothing())
        .returning('id')
        .execute();
      chargersAdded += r.length;
    }
    for (const part of chunks(m.activity)) {
      await tx
        .insertInto('activity')
        .values(
          part.map((a) => ({
            shop_id: target.shopId,
            design_id: a.designId ? designIds.get(a.designId)! : null,
            revision_id: a.revisionId ? revIds.get(a.revisionId)! : null,
            actor_id: null,
            actor_name: a.actor,
            action: a.action,
            detail: JSON.stringify(a.detail),
            created_at: a.createdAt,
          })),
        )
        .execute();
    }
    const result: ImportResult = {
      importId,
      copyOf,
      designs: m.designs.length,
      revisions: m.revisions.length,
      files: fileRows.length,
      cutLogs: m.cutLogs.length,
      photos: m.cutLogs.filter((c) => c.photo).length,
      devices: { added: devicesAdded, skipped: m.devices.length - devicesAdded },
      chargers: { added: chargersAdded, skipped: m.chargers.length - chargersAdded },
      activity: m.activity.length,
      designIds: Object.fromEntries(designIds),
      revisionIds: Object.fromEntries(revIds),
    };
    await logActivity(tx, {
      shopId: target.shopId,
      actorId: target.userId,
      action: 'shop.archive-imported',
      detail: { fromShop: m.shop.name, exportedAt: m.exportedAt, designs: result.designs, revisions: result.revisions, files: result.files, cutLogs: result.cutLogs, copyOf },
    });
    await tx
      .updateTable('archive_imports')
      .set({ devices_added: devicesAdded, devices_skipped: result.devices.skipped, chargers_added: chargersAdded, chargers_skipped: result.chargers.skipped })
      .where('id', '=', importId)
      .execute();
    return result;
  });
}

// What the hardening suites check after every refused request or fault: nothing in the database
// or the bucket changed, no stored object lacks a row (the sweep, in dry-run mode, finds none), and
// every revision is whole (all its file rows, each object present with the recorded bytes and hash).
import { createHash } from 'node:crypto';
import { sql } from 'kysely';
import type { DB } from '../../db/connect';
import type { ObjectStore } from '../../files/objectStore';
import { sweepOrphans } from '../../server/revisions/sweep';

export interface Snapshot {
  /** Per table: row count and a digest of every row, so an UPDATE shows as well as an INSERT. */
  tables: Record<string, { rows: number; digest: string }>;
  /** Every key in the bucket, sorted. */
  objects: string[];
}

/** The application's tables (every base table in `public` except Kysely's own bookkeeping). */
export async function appTables(db: DB): Promise<string[]> {
  const r = await sql<{ table_name: string }>`
    SELECT table_name FROM information_schema.tables
    WHERE table_schema = 'public' AND table_type = 'BASE TABLE' AND table_name NOT LIKE 'kysely_%'
    ORDER BY table_name`.execute(db);
  return r.rows.map((x) => x.table_name);
}

export async function snapshot(db: DB, objects: ObjectStore): Promise<Snapshot> {
  const tables: Snapshot['tables'] = {};
  const names = await appTables(db);
  // One round trip: count and md5 of the rows in a fixed order, per table.
  const parts = names.map((t) => sql`SELECT ${t}::text AS name, count(*)::int AS rows, md5(coalesce(string_agg(x::text, E'\n' ORDER BY x::text), '')) AS digest FROM ${sql.table(t)} x`);
  const r = await sql<{ name: string; rows: number; digest: string }>`${sql.join(parts, sql` UNION ALL `)}`.execute(db);
  for (const row of r.rows) tables[row.name] = { rows: row.rows, digest: row.digest };
  const keys = (await objects.list('')).sort();
  return { tables, objects: keys };
}

/** Human-readable differences between two snapshots; empty when nothing changed. */
export function diffSnapshots(before: Snapshot, after: Snapshot): string[] {
  const out: string[] = [];
  for (const t of new Set([...Object.keys(before.tables), ...Object.keys(after.tables)])) {
    const a = before.tables[t];
    const b = after.tables[t];
    if (!a || !b) out.push(`table ${t} ${a ? 'disappeared' : 'appeared'}`);
    else if (a.rows !== b.rows) out.push(`${t}: ${a.rows} → ${b.rows} rows`);
    else if (a.digest !== b.digest) out.push(`${t}: a row changed`);
  }
  const was = new Set(before.objects);
  const now = new Set(after.objects);
  const added = after.objects.filter((k) => !was.has(k));
  const removed = before.objects.filter((k) => !now.has(k));
  if (added.length) out.push(`objects added: ${added.slice(0, 5).join(', ')}${added.length > 5 ? ` (+${added.length - 5})` : ''}`);
  if (removed.length) out.push(`objects removed: ${removed.slice(0, 5).join(', ')}${removed.length > 5 ? ` (+${removed.length - 5})` : ''}`);
  return out;
}

/** Stored objects no row refers to, as the sweep sees them (dry run: nothing is removed). */
export async function orphans(deps: { db: DB; objects: ObjectStore }): Promise<string[]> {
  return (await sweepOrphans(deps, { graceSeconds: 0, dryRun: true })).removed;
}

/** The files every revision keeps (server/revisions/geometry.ts renderRevisionFiles), plus the upload's original. */
export const DERIVED_ROLES = ['dxf', 'dxf_in', 'svg', 'model'] as const;

/**
 * Problems with saved revisions: a missing file row, an object that is not in the bucket, or (with
 * `content`) an object whose bytes or sha256 differ from its row. Also checks that each design's
 * revisions are numbered 1..n and that latest_revision_number and latest_status match the newest.
 */
export async function revisionProblems(deps: { db: DB; objects: ObjectStore }, { content = false } = {}): Promise<string[]> {
  const problems: string[] = [];
  const revs = await deps.db.selectFrom('revisions').select(['id', 'design_id', 'number', 'source', 'status']).execute();
  const files = await deps.db.selectFrom('revision_files').select(['revision_id', 'role', 'object_key', 'bytes', 'sha256']).execute();
  const inBucket = new Set(await deps.objects.list('revisions/'));
  const byRev = new Map<string, typeof files>();
  for (const f of files) byRev.set(f.revision_id, [...(byRev.get(f.revision_id) ?? []), f]);
  for (const r of revs) {
    const mine = byRev.get(r.id) ?? [];
    const roles = new Set(mine.map((f) => f.role));
    const need: string[] = [...DERIVED_ROLES, ...(r.source === 'uploaded' ? ['original'] : [])];
    for (const role of need) if (!roles.has(role as never)) problems.push(`revision ${r.id} (r${r.number}) has no ${role} file row`);
    for (const f of mine) {
      if (!inBucket.has(f.object_key)) {
        problems.push(`revision ${r.id} ${f.role}: object ${f.object_key} is missing`);
        continue;
      }
      if (content) {
        const body = await deps.objects.get(f.object_key);
        if (body.length !== f.bytes) problems.push(`${f.object_key}: ${body.length} bytes, row says ${f.bytes}`);
        if (createHash('sha256').update(body).digest('hex') !== f.sha256) problems.push(`${f.object_key}: sha256 differs from its row`);
      }
    }
  }
  const designs = await deps.db.selectFrom('designs').select(['id', 'latest_revision_number', 'latest_status']).execute();
  const revsOf = new Map<string, typeof revs>();
  for (const r of revs) revsOf.set(r.design_id, [...(revsOf.get(r.design_id) ?? []), r]);
  for (const d of designs) {
    const mine = (revsOf.get(d.id) ?? []).sort((a, b) => a.number - b.number);
    const numbers = mine.map((r) => r.number);
    if (numbers.some((n, i) => n !== i + 1)) problems.push(`design ${d.id}: revisions numbered ${numbers.join(',')}, not 1..${numbers.length}`);
    if (d.latest_revision_number !== mine.length) problems.push(`design ${d.id}: latest_revision_number ${d.latest_revision_number} but ${mine.length} revisions`);
    const newest = mine[mine.length - 1];
    if (newest && d.latest_status !== newest.status) problems.push(`design ${d.id}: latest_status ${d.latest_status} but r${newest.number} is ${newest.status}`);
  }
  return problems;
}

/** Things wrong with an error answer: not 4xx (or not `status`), no code or message, or a stack trace. */
export function errorAnswerProblems(res: { status: number; body: unknown; text?: string; headers: Record<string, unknown> }, want?: number | number[]): string[] {
  const p: string[] = [];
  const wanted = want === undefined ? null : Array.isArray(want) ? want : [want];
  if (wanted ? !wanted.includes(res.status) : res.status < 400 || res.status >= 500) p.push(`status ${res.status}${wanted ? `, wanted ${wanted.join('/')}` : ', wanted 4xx'}`);
  if (!String(res.headers['content-type'] ?? '').startsWith('application/json')) p.push(`content-type ${String(res.headers['content-type'])}`);
  const err = (res.body as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
  if (!err || typeof err.code !== 'string' || !err.code) p.push('no error.code');
  if (!err || typeof err.message !== 'string' || err.message.trim().length < 8) p.push('no clear error.message');
  const text = res.text ?? JSON.stringify(res.body ?? '');
  if (STACK_TRACE.test(text)) p.push('the answer contains a stack trace or source path');
  return p;
}

/** V8 stack frames ("    at fn (file.ts:12:3)"), source paths and module folders. */
export const STACK_TRACE = /\bat [\w.<>$]+ \(|\bat (?:file|node):|\.(?:ts|js|mjs):\d+:\d+|node_modules|\/work\/|[A-Z]:\\\\/;

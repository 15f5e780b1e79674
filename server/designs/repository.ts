import { sql, type Kysely, type Transaction } from 'kysely';
import type { Database } from '../../db/schema';
import type { CreateDesign, DesignDetail, DesignListItem, DesignPage, LibraryQuery } from '../../shared/schemas/library';
import { badRequest } from '../http/errors';

type Q = Kysely<Database> | Transaction<Database>;

export async function insertDesign(db: Q, shopId: string, authorId: string, d: CreateDesign, lineage?: { designId: string; revisionId: string }) {
  return db
    .insertInto('designs')
    .values({
      shop_id: shopId,
      kind: d.kind,
      title: d.title,
      description: d.description,
      tags: d.tags,
      material: d.material,
      author_id: authorId,
      forked_from_design_id: lineage?.designId ?? null,
      forked_from_revision_id: lineage?.revisionId ?? null,
    })
    .returning(['id', 'shop_id'])
    .executeTakeFirstOrThrow();
}

export async function updateDesign(db: Q, designId: string, patch: Partial<Omit<CreateDesign, 'kind'>>) {
  if (Object.keys(patch).length === 0) return;
  await db.updateTable('designs').set({ ...patch, updated_at: sql`now()` }).where('id', '=', designId).execute();
}

export async function logActivity(
  db: Q,
  a: { shopId: string; designId?: string | null; revisionId?: string | null; actorId: string | null; action: string; detail?: Record<string, unknown> },
) {
  await db
    .insertInto('activity')
    .values({
      shop_id: a.shopId,
      design_id: a.designId ?? null,
      revision_id: a.revisionId ?? null,
      actor_id: a.actorId,
      action: a.action,
      detail: JSON.stringify(a.detail ?? {}),
    })
    .execute();
}

// Keyset pagination: the cursor is the last row's sort value and id.
function encodeCursor(v: string, id: string) {
  return Buffer.from(JSON.stringify([v, id])).toString('base64url');
}
const CURSOR_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const CURSOR_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
/** The cursor's parts are cast in SQL (::uuid, ::timestamptz), so both are checked here first. */
function decodeCursor(c: string, sort: LibraryQuery['sort']): [string, string] {
  try {
    const parsed = JSON.parse(Buffer.from(c, 'base64url').toString('utf8'));
    if (Array.isArray(parsed) && parsed.length === 2 && parsed.every((x) => typeof x === 'string') && CURSOR_ID.test(parsed[1])) {
      if (sort === 'title' ? !parsed[0].includes('\u0000') : CURSOR_TIME.test(parsed[0]) && Number.isFinite(Date.parse(parsed[0]))) return parsed as [string, string];
    }
  } catch {
    /* fall through */
  }
  throw badRequest('The page cursor is not valid; start again from the first page');
}

/** Prefix search over title, tags and description: every word must match the start of a word. */
export function toPrefixQuery(q: string): string | null {
  const words = q
    .split(/\s+/)
    .map((w) => w.toLowerCase().replace(/[^\p{L}\p{N}]/gu, ''))
    .filter(Boolean)
    .slice(0, 8);
  return words.length ? words.map((w) => `${w}:*`).join(' & ') : null;
}

export async function listDesigns(db: Q, shopId: string, q: LibraryQuery): Promise<DesignPage> {
  const dir = q.dir ?? (q.sort === 'title' ? 'asc' : 'desc');
  const sortExpr =
    q.sort === 'title' ? sql<string>`lower(d.title)` : q.sort === 'created' ? sql<string>`d.created_at` : sql<string>`d.updated_at`;
  const cmp = dir === 'asc' ? sql`>` : sql`<`;
  const order = dir === 'asc' ? sql`ASC` : sql`DESC`;
  const conds = [sql`d.shop_id = ${shopId}`];
  if (q.kind) conds.push(sql`d.kind = ${q.kind}`);
  if (q.status) conds.push(sql`d.latest_status = ${q.status}`);
  if (q.material) conds.push(sql`lower(d.material) = lower(${q.material})`);
  if (q.tag) conds.push(sql`d.tags @> ARRAY[${q.tag}]::text[]`);
  if (q.q) {
    const tsq = toPrefixQuery(q.q);
    if (tsq) conds.push(sql`d.search @@ to_tsquery('simple', ${tsq})`);
  }
  if (q.cursor) {
    const [v, id] = decodeCursor(q.cursor, q.sort);
    const value = q.sort === 'title' ? sql`${v}` : sql`${v}::timestamptz`;
    conds.push(sql`(${sortExpr}, d.id) ${cmp} (${value}, ${id}::uuid)`);
  }
  const where = sql.join(conds, sql` AND `);
  // The page is chosen first (filter, sort, limit on designs alone), then only its rows are joined
  // to their latest revision and fork parent: joining before the LIMIT looked up every matching
  // design's revision and parent (EXPLAIN in bench/results.md, row 3).
  const rows = await sql<{
    id: string;
    kind: DesignListItem['kind'];
    title: string;
    description: string;
    tags: string[];
    material: string;
    latest_revision_number: number;
    latest_status: DesignListItem['latestStatus'];
    latest_revision_id: string | null;
    updated_at: Date;
    created_at: Date;
    sort_value: string | Date;
    parent_id: string | null;
    parent_title: string | null;
  }>`
    SELECT d.id, d.kind, d.title, d.description, d.tags, d.material, d.latest_revision_number, d.latest_status,
           d.updated_at, d.created_at, d.sort_value,
           r.id AS latest_revision_id, p.id AS parent_id, p.title AS parent_title
    FROM (
      SELECT d.id, d.kind, d.title, d.description, d.tags, d.material, d.latest_revision_number, d.latest_status,
             d.updated_at, d.created_at, d.forked_from_design_id, ${sortExpr} AS sort_value
      FROM designs d
      WHERE ${where}
      ORDER BY ${sortExpr} ${order}, d.id ${order}
      LIMIT ${q.limit + 1}
    ) d
    LEFT JOIN revisions r ON r.design_id = d.id AND r.number = d.latest_revision_number
    LEFT JOIN designs p ON p.id = d.forked_from_design_id
    ORDER BY d.sort_value ${order}, d.id ${order}
  `.execute(db);
  const list = rows.rows.slice(0, q.limit);
  const last = list[list.length - 1];
  const nextCursor =
    rows.rows.length > q.limit && last
      ? encodeCursor(last.sort_value instanceof Date ? last.sort_value.toISOString() : String(last.sort_value), last.id)
      : null;
  return {
    items: list.map((r) => ({
      id: r.id,
      kind: r.kind,
      title: r.title,
      description: r.description,
      tags: r.tags,
      material: r.material,
      latestRevision: r.latest_revision_number,
      latestStatus: r.latest_status,
      latestRevisionId: r.latest_revision_id,
      updatedAt: r.updated_at.toISOString(),
      forkedFrom: r.parent_id ? { designId: r.parent_id, title: r.parent_title ?? '' } : null,
    })),
    nextCursor,
  };
}

export async function getDesignDetail(db: Q, designId: string): Promise<DesignDetail | null> {
  const d = await db
    .selectFrom('designs as d')
    .innerJoin('shops as s', 's.id', 'd.shop_id')
    .leftJoin('users as u', 'u.id', 'd.author_id')
    .select(['d.id', 'd.shop_id', 's.name as shop_name', 'd.kind', 'd.title', 'd.description', 'd.tags', 'd.material', 'd.created_at', 'd.updated_at', 'd.author_id', 'u.name as author_name', 'd.forked_from_design_id', 'd.forked_from_revision_id', 'd.forked_from_text'])
    .where('d.id', '=', designId)
    .executeTakeFirst();
  if (!d) return null;
  const [revisions, parent, forks, activity] = await Promise.all([
    listRevisions(db, designId),
    d.forked_from_design_id
      ? db
          .selectFrom('designs as p')
          .innerJoin('shops as s', 's.id', 'p.shop_id')
          .leftJoin('revisions as r', (j) => j.on('r.id', '=', d.forked_from_revision_id ?? '00000000-0000-0000-0000-000000000000'))
          .select(['p.id', 'p.title', 's.name as shop_name', 'r.id as rev_id', 'r.number as rev_number'])
          .where('p.id', '=', d.forked_from_design_id)
          .executeTakeFirst()
      : Promise.resolve(undefined),
    db
      .selectFrom('designs as f')
      .innerJoin('shops as s', 's.id', 'f.shop_id')
      .leftJoin('revisions as r', 'r.id', 'f.forked_from_revision_id')
      .select(['f.id', 'f.title', 's.name as shop_name', 'r.number as rev_number'])
      .where('f.forked_from_design_id', '=', designId)
      .orderBy('f.created_at')
      .execute(),
    db
      .selectFrom('activity as a')
      .leftJoin('users as u', 'u.id', 'a.actor_id')
      .select(['a.id', 'a.action', 'a.detail', 'a.created_at', 'u.name as actor'])
      .where('a.design_id', '=', designId)
      .orderBy('a.id', 'desc')
      .limit(50)
      .execute(),
  ]);
  return {
    id: d.id,
    shopId: d.shop_id,
    shopName: d.shop_name,
    kind: d.kind,
    title: d.title,
    description: d.description,
    tags: d.tags,
    material: d.material,
    author: d.author_id ? { id: d.author_id, name: d.author_name ?? '' } : null,
    createdAt: d.created_at.toISOString(),
    updatedAt: d.updated_at.toISOString(),
    forkedFrom: parent
      ? { designId: parent.id, designTitle: parent.title, shopName: parent.shop_name, revisionId: parent.rev_id ?? null, revisionNumber: parent.rev_number ?? null }
      : null,
    forkedFromText: d.forked_from_text ?? null,
    forks: forks.map((f) => ({ designId: f.id, title: f.title, shopName: f.shop_name, fromRevisionNumber: f.rev_number ?? null })),
    revisions,
    activity: activity.map((a) => ({ id: String(a.id), action: a.action, actor: a.actor ?? null, detail: a.detail as Record<string, unknown>, createdAt: a.created_at.toISOString() })),
  };
}

export async function listRevisions(db: Q, designId: string) {
  const rows = await db
    .selectFrom('revisions as r')
    .leftJoin('users as u', 'u.id', 'r.author_id')
    .select(['r.id', 'r.design_id', 'r.number', 'r.message', 'r.author_id', 'u.name as author_name', 'r.created_at', 'r.source', 'r.generator_id', 'r.params', 'r.status', 'r.fit_notes', 'r.summary'])
    .where('r.design_id', '=', designId)
    .orderBy('r.number', 'desc')
    .execute();
  const files = rows.length
    ? await db.selectFrom('revision_files').select(['revision_id', 'role', 'bytes', 'sha256']).where('revision_id', 'in', rows.map((r) => r.id)).execute()
    : [];
  return rows.map((r) => toRevisionInfo(r, files.filter((f) => f.revision_id === r.id)));
}

export function toRevisionInfo(r: any, files: { role: string; bytes: number; sha256: string }[]) {
  return {
    id: r.id,
    designId: r.design_id,
    number: r.number,
    message: r.message,
    author: r.author_id ? { id: r.author_id, name: r.author_name ?? '' } : null,
    createdAt: (r.created_at as Date).toISOString(),
    source: r.source,
    generatorId: r.generator_id,
    params: r.params,
    status: r.status,
    fitNotes: r.fit_notes,
    summary: r.summary,
    files: files.map((f) => ({ role: f.role, bytes: f.bytes, sha256: f.sha256 })),
  };
}

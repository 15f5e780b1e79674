// Rows 3 and 4: the API under load on 127.0.0.1.
// 3: the library page (GET /api/shops/:shopId/designs?limit=50 with a kind filter and a search
//    term) over 10 000 designs / 100 000 revisions, 50 concurrent; baseline: the exact SQL that
//    listDesigns sends, captured from Kysely and run through pg at the same concurrency and count,
//    over a pool as large as the server's (DATABASE_POOL_MAX).
// 4: regenerate-and-save (POST /api/revisions/:id/regenerate with a catalog device), 20 concurrent;
//    baseline: the route's work called in this process without HTTP, auth or JSON (load the source
//    revision and its model object, generate, save objects and rows).
import { Kysely, PostgresDialect, type CompiledQuery } from 'kysely';
import pg from 'pg';
import type { Database } from '../db/schema';
import { listDesigns } from '../server/designs/repository';
import { loadRevisionForCopy } from '../server/revisions/repository';
import { renderRevisionFiles } from '../server/revisions/geometry';
import { saveRevision } from '../server/revisions/store';
import { runGenerator } from '../shared/generators';
import { LibraryQuery } from '../shared/schemas/library';
import { BENCH_PARAMS } from './generate';
import { cannon, closedLoop, statusText, type LoadResult } from './lib/load';
import { judge, type Row } from './lib/report';
import { loadText, ms, percentile, ratio } from './lib/stats';
import { BENCH_DESIGNS, REVISIONS_PER_DESIGN, seedBenchLibrary } from './seed';
import type { BenchStack } from './stack';

export const LIBRARY_QUERY = { limit: '50', kind: 'insert', q: 'walnut' };
const LIST_AMOUNT = 5000;
const LIST_CONNECTIONS = 50;
const REGEN_AMOUNT = 600;
const REGEN_CONNECTIONS = 20;
const REGEN_DESIGNS = 40;
const REGEN_FLOOR_AMOUNT = 300;

export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${baseUrl}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (r.status !== 200) throw new Error(`sign-in as ${email} answered ${r.status}: ${await r.text()}`);
  return ((await r.json()) as { token: string }).token;
}

export async function apiJson<T>(baseUrl: string, token: string, method: string, path: string, body?: unknown, expect = 200): Promise<T> {
  const r = await fetch(`${baseUrl}/api${path}`, {
    method,
    headers: { authorization: `Bearer ${token}`, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await r.text();
  if (r.status !== expect) throw new Error(`${method} ${path} answered ${r.status} (expected ${expect}): ${text.slice(0, 300)}`);
  return (text ? JSON.parse(text) : undefined) as T;
}

/** The SQL (and parameters) listDesigns sends for a query, captured from Kysely's log. */
async function captureListQuery(url: string, shopId: string): Promise<CompiledQuery> {
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  let captured: CompiledQuery | undefined;
  const db = new Kysely<Database>({
    dialect: new PostgresDialect({ pool }),
    log: (e) => {
      if (e.level === 'query' && /FROM designs d/.test(e.query.sql)) captured = e.query;
    },
  });
  try {
    await listDesigns(db, shopId, LibraryQuery.parse(LIBRARY_QUERY));
  } finally {
    await db.destroy();
  }
  if (!captured) throw new Error('could not capture the library query from Kysely');
  return captured;
}

export interface PlanSummary {
  text: string;
  summary: string;
}

export async function explain(url: string, q: CompiledQuery): Promise<PlanSummary> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    // twice, so the second plan reads a warm cache like the load test does
    await client.query(`EXPLAIN (ANALYZE, BUFFERS) ${q.sql}`, q.parameters as unknown[]);
    const r = await client.query(`EXPLAIN (ANALYZE, BUFFERS) ${q.sql}`, q.parameters as unknown[]);
    const text = r.rows.map((x: Record<string, string>) => x['QUERY PLAN']).join('\n');
    // plan nodes: the first line and every line that starts with "->", without their cost figures
    const nodes = text
      .split('\n')
      .filter((l, i) => i === 0 || /^\s*->/.test(l))
      .map((l) => l.replace(/^\s*->\s*/, '').replace(/\s+\(cost=.*$/, '').trim());
    const exec = /Execution Time: ([\d.]+) ms/.exec(text)?.[1];
    const plan = /Planning Time: ([\d.]+) ms/.exec(text)?.[1];
    const seq = nodes.filter((n) => n.startsWith('Seq Scan'));
    return {
      text,
      summary: `${nodes.join(' → ')}. Planning ${plan ?? '?'} ms, execution ${exec ?? '?'} ms${seq.length ? `; sequential scans: ${seq.join(', ')}` : '; no sequential scans'}.`,
    };
  } finally {
    await client.end();
  }
}

function requireAll(r: LoadResult, expected: number, amount: number, what: string) {
  const good = r.statusCounts[String(expected)] ?? r.statusCounts.ok ?? 0;
  if (good !== amount || r.errors) throw new Error(`${what}: ${statusText(r, expected)} of ${amount} requests`);
}

export async function benchLibrary(stack: BenchStack, baseUrl: string): Promise<{ rows: Row[]; notes: string[]; plan: PlanSummary; sql: CompiledQuery }> {
  const { db, seed } = stack;
  const editorId = seed.users['editor@larchmere.example'];
  const t0 = performance.now();
  const seeded = await seedBenchLibrary(db, seed.shopId, editorId);
  const seedSeconds = (performance.now() - t0) / 1000;
  const token = await signIn(baseUrl, 'viewer@larchmere.example', 'larchmere-viewer');
  const qs = new URLSearchParams(LIBRARY_QUERY).toString();
  const path = `/api/shops/${seed.shopId}/designs?${qs}`;

  // The page must really be a full page of matches, and the same rows the direct SQL returns.
  const page = await apiJson<{ items: { id: string }[]; nextCursor: string | null }>(baseUrl, token, 'GET', path.slice(4));
  const compiled = await captureListQuery(stack.url, seed.shopId);
  const pool = new pg.Pool({ connectionString: stack.url, max: stack.deps().config.databasePoolMax });
  try {
    const direct = await pool.query(compiled.sql, compiled.parameters as unknown[]);
    const same = direct.rows.slice(0, 50).map((r: { id: string }) => r.id).join() === page.items.map((i) => i.id).join();
    if (page.items.length !== 50 || !page.nextCursor || !same) throw new Error(`the library page is not what the bench expects: ${page.items.length} items, next cursor ${page.nextCursor ? 'set' : 'missing'}, same rows as the direct SQL: ${same}`);
    const matching = await pool.query(
      `SELECT count(*)::int AS n FROM designs WHERE shop_id = $1 AND kind = 'insert' AND search @@ to_tsquery('simple', 'walnut:*')`,
      [seed.shopId],
    );
    const plan = await explain(stack.url, compiled);

    // warm both paths up, then measure
    const headers = { authorization: `Bearer ${token}` };
    await cannon({ url: baseUrl + path, connections: LIST_CONNECTIONS, amount: 500, maxSeconds: 60, headers });
    const loadBefore = loadText();
    const api = await cannon({ url: baseUrl + path, connections: LIST_CONNECTIONS, amount: LIST_AMOUNT, maxSeconds: 120, headers });
    requireAll(api, 200, LIST_AMOUNT, 'library page');
    await closedLoop(LIST_CONNECTIONS, 500, 60, async () => void (await pool.query(compiled.sql, compiled.parameters as unknown[])));
    const base = await closedLoop(LIST_CONNECTIONS, LIST_AMOUNT, 120, async () => void (await pool.query(compiled.sql, compiled.parameters as unknown[])));
    requireAll(base, 0, LIST_AMOUNT, 'direct query');
    // The floor of any signed-in request at this concurrency: GET /api/me (session check + the
    // caller's shops), no library query.
    const me = await cannon({ url: `${baseUrl}/api/me`, connections: LIST_CONNECTIONS, amount: LIST_AMOUNT, maxSeconds: 120, headers });
    requireAll(me, 200, LIST_AMOUNT, 'GET /api/me');
    const loadAfter = loadText();

    const a95 = percentile(api.latencies, 95);
    const b95 = percentile(base.latencies, 95);
    const j = judge([
      { ok: a95 <= 25, label: `p95 ${ms(a95)} > 25 ms` },
      { ok: a95 <= 4 * b95, label: `p95 ${ratio(a95, b95)} the direct query > 4×` },
    ]);
    return {
      rows: [
        {
          id: '3',
          what: `Library page (limit 50, kind filter + search) over ${BENCH_DESIGNS.toLocaleString('en-US')} designs / ${(BENCH_DESIGNS * REVISIONS_PER_DESIGN).toLocaleString('en-US')} revisions, ${LIST_CONNECTIONS} concurrent, ${LIST_AMOUNT} requests`,
          measured: `p95 ${ms(a95)} (p50 ${ms(percentile(api.latencies, 50))}, ${Math.round(api.rate)} req/s)`,
          baseline: `p95 ${ms(b95)} (p50 ${ms(percentile(base.latencies, 50))}, ${Math.round(base.rate)} q/s), same SQL through pg`,
          ratio: `p95 ${ratio(a95, b95)}`,
          target: 'p95 ≤ 25 ms and ≤ 4× direct query',
          ...j,
        },
      ],
      notes: [
        `Row 3: seeded ${seeded.designs.toLocaleString('en-US')} designs and ${seeded.revisions.toLocaleString('en-US')} revisions in ${seedSeconds.toFixed(1)} s, all in one invented shop; the query \`${qs}\` matches ${matching.rows[0].n} designs (sorted by last change, newest first). The API request signs in with a Bearer token (session check + membership check + the list query: 3 queries). Baseline pool: ${stack.deps().config.databasePoolMax} connections, the server's DATABASE_POOL_MAX, with ${LIST_CONNECTIONS} callers. For scale, GET /api/me at the same concurrency and count (a signed-in request without the library query): p50 ${ms(percentile(me.latencies, 50))}, p95 ${ms(percentile(me.latencies, 95))}, ${Math.round(me.rate)} req/s. Load average before / after: ${loadBefore} → ${loadAfter}. API: ${statusText(api, 200)}.`,
      ],
      plan,
      sql: compiled,
    };
  } finally {
    await pool.end();
  }
}

export async function benchRegenerate(stack: BenchStack, baseUrl: string): Promise<{ rows: Row[]; notes: string[] }> {
  const { db, seed } = stack;
  const token = await signIn(baseUrl, 'editor@larchmere.example', 'larchmere-editor');
  const devices = await db.selectFrom('devices').select(['id', 'name']).where('shop_id', '=', seed.shopId).where('name', 'like', 'Demo phone%').orderBy('name').execute();
  if (devices.length === 0) throw new Error('the demo catalog has no phones to regenerate for');
  const sources: string[] = [];
  for (let i = 0; i < REGEN_DESIGNS; i++) {
    const d = await apiJson<{ id: string }>(baseUrl, token, 'POST', `/shops/${seed.shopId}/designs`, { kind: 'insert', title: `Bench regenerate plate ${i + 1}`, tags: ['charger'], material: 'Birch ply' }, 201);
    const r = await apiJson<{ id: string }>(baseUrl, token, 'POST', `/designs/${d.id}/revisions`, { generatorId: 'charger-insert', params: BENCH_PARAMS, message: 'Bench source revision' }, 201);
    sources.push(r.id);
  }
  // One regenerate must succeed as the load will do it, and write its objects.
  const first = await apiJson<{ id: string }>(baseUrl, token, 'POST', `/revisions/${sources[0]}/regenerate`, { deviceId: devices[0].id }, 201);
  const stored = await db.selectFrom('revision_files').select(['role', 'object_key']).where('revision_id', '=', first.id).execute();
  if (stored.length < 4 || !(await stack.deps().objects.exists(stored[0].object_key))) throw new Error('a regenerated revision did not store its files');

  let n = 0;
  const nextRequest = () => {
    const i = n++;
    return { path: `/api/revisions/${sources[i % sources.length]}/regenerate`, body: JSON.stringify({ deviceId: devices[i % devices.length].id }) };
  };
  const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
  const url = `${baseUrl}/api/revisions/${sources[0]}/regenerate`; // the path rotates per request
  await cannon({ url, connections: REGEN_CONNECTIONS, amount: 60, maxSeconds: 60, method: 'POST', headers, next: nextRequest });
  const loadBefore = loadText();
  const api = await cannon({ url, connections: REGEN_CONNECTIONS, amount: REGEN_AMOUNT, maxSeconds: 180, method: 'POST', headers, next: nextRequest });
  requireAll(api, 201, REGEN_AMOUNT, 'regenerate');

  // Baseline: the same work in process.
  const deps = stack.deps();
  const device = await db.selectFrom('devices').selectAll().where('shop_id', '=', seed.shopId).where('name', 'like', 'Demo phone%').orderBy('name').execute();
  const work = async (i: number) => {
    const rev = await loadRevisionForCopy(deps, sources[i % sources.length]);
    if (!rev || !rev.params || !rev.generatorId) throw new Error('source revision missing');
    const d = device[i % device.length];
    const run = runGenerator(rev.generatorId, { ...rev.params, deviceWidth: d.width_mm, deviceLength: d.length_mm, deviceThickness: d.thickness_mm, caseAllowance: d.case_allowance_mm });
    if (!run.ok) throw new Error(run.message);
    await saveRevision(deps, rev.designId, {
      authorId: seed.users['editor@larchmere.example'],
      source: 'generated',
      generatorId: rev.generatorId,
      params: run.params,
      message: `Regenerated from r${rev.number} (bench baseline)`,
      status: 'draft',
      fitNotes: rev.fitNotes,
      model: run.result.model,
      summary: run.result.summary,
      title: rev.title,
      activity: { action: 'revision.regenerated', detail: { fromNumber: rev.number } },
    });
  };
  await closedLoop(REGEN_CONNECTIONS, 60, 60, work);
  const base = await closedLoop(REGEN_CONNECTIONS, REGEN_AMOUNT, 180, work);
  requireAll(base, 0, REGEN_AMOUNT, 'in-process regenerate');
  // The floor under both: only the four object writes a save makes (one after another, as
  // saveRevision does), at the same concurrency, to the same object-store fake.
  const sample = runGenerator('charger-insert', BENCH_PARAMS);
  if (!sample.ok) throw new Error(sample.message);
  const files = renderRevisionFiles(sample.result.model, 'Bench');
  const puts = await closedLoop(REGEN_CONNECTIONS, REGEN_FLOOR_AMOUNT, 120, async (i) => {
    for (const f of files) await deps.objects.put(`bench-floor/${i}/${f.role}.${f.ext}`, f.body, f.contentType);
  });
  requireAll(puts, 0, REGEN_FLOOR_AMOUNT, 'object writes');
  const loadAfter = loadText();
  const a95 = percentile(api.latencies, 95);
  const b95 = percentile(base.latencies, 95);
  const j = judge([{ ok: a95 <= 60, label: `p95 ${ms(a95)} > 60 ms` }]);
  return {
    rows: [
      {
        id: '4',
        what: `Regenerate-and-save for a catalog device (4 objects + rows each), ${REGEN_CONNECTIONS} concurrent, ${REGEN_AMOUNT} requests`,
        measured: `p95 ${ms(a95)} (p50 ${ms(percentile(api.latencies, 50))}, ${Math.round(api.rate)} req/s)`,
        baseline: `p95 ${ms(b95)} (p50 ${ms(percentile(base.latencies, 50))}), same work in process, no HTTP`,
        ratio: `p95 ${ratio(a95, b95)}`,
        target: 'p95 ≤ 60 ms',
        ...j,
      },
    ],
    notes: [
      `Row 4: ${REGEN_DESIGNS} generated source revisions (one per design, so concurrent saves rarely queue on one design's row lock), rotated with ${devices.length} catalog phones; every request answered 201 (${statusText(api, 201)}). Each save writes the DXF in mm and inches, the SVG preview and the model JSON to the object-store fake (one after another), then the revision, file and activity rows in one transaction. Those four object writes alone, at ${REGEN_CONNECTIONS} concurrent (${REGEN_FLOOR_AMOUNT} sets): p50 ${ms(percentile(puts.latencies, 50))}, p95 ${ms(percentile(puts.latencies, 95))}. Load average before / after: ${loadBefore} → ${loadAfter}.`,
    ],
  };
}

// `npm run bench`: every benchmark in one run, one table, written to bench/results.md.
// Starts its own services (as the tests do), its own database and server, sends load only to
// 127.0.0.1 with bounded request counts, and stops everything at the end, also on failure.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { postgresBinDir, repoRoot } from '../scripts/lib/services.mjs';
import { ensureWebExport } from '../scripts/lib/web.mjs';
import { benchLibrary, benchRegenerate, type PlanSummary } from './api';
import { benchGenerate } from './generate';
import { benchImport } from './importDxf';
import { errorRow, markdownTable, type Row } from './lib/report';
import { loadText } from './lib/stats';
import { startBenchStack, type BenchStack } from './stack';
import { benchWeb } from './web';

// `npm run bench -- 3 4` runs only those rows' benchmarks (for working on one); no argument runs all.
const only = process.argv.slice(2).filter((a) => /^[1-5]$/.test(a));
const want = (n: string) => only.length === 0 || only.includes(n);
const started = Date.now();
const rows: Row[] = [];
const notes: string[] = [];
let plan: PlanSummary | undefined;
let planSql = '';
let stack: BenchStack | undefined;
const workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-bench-work-'));

const say = (m: string) => process.stdout.write(`[bench] ${m}\n`);

async function cleanUp() {
  const s = stack;
  stack = undefined;
  if (s) await s.stop();
  fs.rmSync(workDir, { recursive: true, force: true });
}

let stopping = false;
for (const sig of ['SIGINT', 'SIGTERM'] as const) {
  process.on(sig, () => {
    if (stopping) return;
    stopping = true;
    say(`${sig}: stopping the bench services…`);
    cleanUp().finally(() => process.exit(130));
  });
}

async function section<T extends { rows: Row[]; notes: string[] }>(name: string, fallback: Row[], fn: () => Promise<T>): Promise<T | undefined> {
  say(`${name}… (load average ${loadText()})`);
  const t0 = Date.now();
  try {
    const r = await fn();
    rows.push(...r.rows);
    notes.push(...r.notes);
    say(`${name}: done in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    return r;
  } catch (e) {
    console.error(`[bench] ${name} failed:`, e);
    rows.push(...fallback.map((f) => errorRow(f.id, f.what, f.target, e)));
    return undefined;
  }
}

const stub = (id: string, what: string, target: string) => ({ id, what, target }) as Row;

/** The SQL as written in the repository, without its template's leading indentation. */
function dedent(text: string): string {
  const lines = text.replace(/^\n+|\s+$/g, '').split('\n');
  const indents = lines.filter((l) => l.trim()).map((l) => /^ */.exec(l)![0].length);
  const cut = Math.min(...indents);
  return lines.map((l) => l.slice(cut)).join('\n');
}

function machine(): string {
  const memGiB = os.totalmem() / 1024 ** 3;
  let pgVersion = 'unknown';
  const bin = postgresBinDir();
  if (bin) {
    try {
      pgVersion = execFileSync(path.join(bin, 'postgres'), ['--version'], { encoding: 'utf8' }).trim().replace(/^postgres \(PostgreSQL\) /, '');
    } catch {
      /* keep unknown */
    }
  }
  return `${os.cpus().length} cores (${os.cpus()[0]?.model.trim() ?? 'unknown CPU'}), ${memGiB.toFixed(1)} GiB RAM, Node ${process.version}, PostgreSQL ${pgVersion}, ${os.type()} ${os.release()}`;
}

async function main() {
  const loadAtStart = loadText();
  say(`machine: ${machine()}; load average ${loadAtStart}`);

  let webReady = want('5');
  if (webReady) {
    try {
      ensureWebExport(); // rebuilds dist/ only when its inputs changed, as npm start and npm test do
    } catch (e) {
      webReady = false;
      console.error('[bench] web export failed:', e);
    }
  }

  if (want('1')) await section('1 generate + DXF export', [stub('1', 'Charger insert: generate + DXF export, in process', 'p50 ≤ 5 ms and ≤ 2× baseline')], benchGenerate);
  if (want('2')) await section('2 import a 10 MB DXF', [stub('2a', 'Import a 10 MB DXF: wall time', '≤ 1.3× baseline'), stub('2b', 'Import a 10 MB DXF: peak RSS', '≤ 300 MB')], () => benchImport(workDir));

  const apiRows = [stub('3', 'Library page under load, 50 concurrent', 'p95 ≤ 25 ms and ≤ 4× direct query'), stub('4', 'Regenerate-and-save, 20 concurrent', 'p95 ≤ 60 ms')];
  const webRows = [stub('5a', 'Web: initial JavaScript, gzipped', '≤ 1.5 MB gzipped'), stub('5b', 'Web: first contentful paint', '≤ 1.5 s'), stub('5c', 'Web: compare view, two 5,000-segment drawings', '≤ 300 ms')];
  let baseUrl = '';
  const needStack = want('3') || want('4') || want('5');
  if (needStack) {
    try {
      say('starting services, database and server…');
      stack = await startBenchStack();
      baseUrl = (await stack.startServer()).baseUrl;
    } catch (e) {
      console.error('[bench] could not start the services:', e);
      const wanted = [...apiRows, ...webRows].filter((f) => want(f.id.slice(0, 1)));
      rows.push(...wanted.map((f) => errorRow(f.id, f.what, f.target, e)));
    }
  }
  if (stack && baseUrl) {
    const s = stack;
    const lib = want('3') ? await section('3 library page under load', [apiRows[0]], () => benchLibrary(s, baseUrl)) : undefined;
    if (lib) {
      plan = lib.plan;
      planSql = lib.sql.sql;
    }
    if (want('4')) await section('4 regenerate under load', [apiRows[1]], () => benchRegenerate(s, baseUrl));
    if (webReady) await section('5 web', webRows, () => benchWeb(s, baseUrl));
    else if (want('5')) rows.push(...webRows.map((f) => errorRow(f.id, f.what, f.target, new Error('the web export could not be built'))));
  }

  const seconds = (Date.now() - started) / 1000;
  const table = markdownTable(rows);
  const passed = rows.filter((r) => r.verdict === 'PASS').length;
  const md = [
    '# Benchmark results',
    '',
    `Written by \`npm run bench\` on ${new Date().toISOString()} in ${seconds.toFixed(0)} s.`,
    '',
    `Machine: ${machine()}. Load average (1 / 5 / 15 min) at the start: ${loadAtStart}; at the end: ${loadText()}. Other processes may have been running: see the load figures in the notes.`,
    '',
    table,
    '',
    `${passed} of ${rows.length} rows meet their targets. Percentiles are nearest-rank over every request or run; MB = 10^6 bytes.`,
    '',
    '## Notes',
    '',
    ...notes.map((n) => `- ${n}`),
    '',
    '## Library query plan (row 3)',
    '',
    plan ? `Summary: ${plan.summary}` : 'No plan: row 3 did not run.',
    '',
    ...(plan
      ? ['The query listDesigns sends (captured from Kysely):', '', '```sql', dedent(planSql), '```', '', '`EXPLAIN (ANALYZE, BUFFERS)`, second run:', '', '```', plan.text, '```', '']
      : []),
  ].join('\n');
  // A partial run (`npm run bench -- 3`) writes to the temporary folder, not over the full results.
  const out = only.length ? path.join(os.tmpdir(), 'jigwright-bench-results.partial.md') : path.join(repoRoot, 'bench', 'results.md');
  fs.writeFileSync(out, md);
  console.log(`\n${table}\n\n${passed} of ${rows.length} rows meet their targets (${seconds.toFixed(0)} s). Written to ${out.startsWith(repoRoot) ? path.relative(repoRoot, out) : out}.`);
  return rows.every((r) => r.verdict === 'PASS');
}

let ok = false;
try {
  ok = await main();
} catch (e) {
  console.error('[bench] failed:', e);
} finally {
  await cleanUp();
}
process.exit(ok ? 0 : 1);

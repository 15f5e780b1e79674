// `npm run soak [-- --seconds 600 --rate 200 --warmup 60]`: a bounded soak on loopback. Starts its
// own PostgreSQL cluster, object-store and mail fakes and the API (`node --import tsx
// server/main.ts`, one process, plus the soak's memory probe) in a temporary folder, seeds the invented demo shop, then sends a
// fixed rate of mixed reads and writes with autocannon to 127.0.0.1 only, for a fixed time, and
// stops everything. Passes when every answer is 2xx (none is expected to be anything else), no
// request errors or times out, at least 75 % of the target rate was answered, and the server's
// resident memory after a full collection (process.memoryUsage().rss, read by
// scripts/lib/memory-probe.mjs every 3 s) grows by at most 10 % from the end of the warm-up to the
// end of the run (taken from a line fitted through every reading, see below), and so does the JS
// heap kept after that collection (heapUsed).
// Also imported by tests/soak/soak.test.ts for the one-minute version (`npm test -- soak`).
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { freePort, repoRoot, startFake, startPostgres, stopChild, waitForPort } from './lib/services.mjs';

const MAX_GROWTH = 0.1;
/** The share of the target rate that must be answered (a saturated machine answers fewer, later). */
const MIN_THROUGHPUT = 0.75;

function tsxProcess(script, env, stdio = ['ignore', 'ignore', 'pipe'], args = [], nodeArgs = []) {
  return spawn(process.execPath, [...nodeArgs, '--import', 'tsx', script, ...args], { cwd: repoRoot, env: { ...process.env, ...env }, stdio });
}

/** How often the server is asked for its memory after a full collection (scripts/lib/memory-probe.mjs). */
const PROBE_EVERY_MS = 3000;

/** Asks the server (started with the memory probe) for process.memoryUsage() after a full GC. */
function probeMemory(server, id) {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      server.off('message', onMessage);
      reject(new Error('the memory probe did not answer within 10 s'));
    }, 10_000);
    function onMessage(m) {
      if (m?.probe !== 'memory' || m.id !== id) return;
      clearTimeout(timer);
      server.off('message', onMessage);
      resolve(m);
    }
    server.on('message', onMessage);
    server.send({ probe: 'memory', id });
  });
}

function rssKb(pid) {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1] ?? NaN);
}

/** The least-squares line through points [x, y]. */
function leastSquares(points) {
  const n = points.length;
  const mx = points.reduce((a, p) => a + p[0], 0) / n;
  const my = points.reduce((a, p) => a + p[1], 0) / n;
  const sxx = points.reduce((a, p) => a + (p[0] - mx) ** 2, 0);
  const sxy = points.reduce((a, p) => a + (p[0] - mx) * (p[1] - my), 0);
  const slope = sxx > 0 ? sxy / sxx : 0;
  return { slope, at: (x) => my + slope * (x - mx) };
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor(s.length / 2)] : NaN;
};

/** A multipart/form-data body (RFC 7578) with one text field and one file. */
function multipart(boundary, message, fileName, file) {
  return Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="message"\r\n\r\n${message}\r\n`),
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\nContent-Type: application/dxf\r\n\r\n`),
    file,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
}

/** 120 × 80 mm plate with a 30 mm hole, written by hand (Autodesk DXF Reference: LINE, CIRCLE, $INSUNITS 4 = mm). */
function plateDxf() {
  const line = (x1, y1, x2, y2) => `0\nLINE\n8\noutline\n10\n${x1}\n20\n${y1}\n11\n${x2}\n21\n${y2}\n`;
  const ents = [line(0, 0, 120, 0), line(120, 0, 120, 80), line(120, 80, 0, 80), line(0, 80, 0, 0), '0\nCIRCLE\n8\noutline\n10\n60\n20\n40\n40\n15\n'];
  return Buffer.from(`0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nSECTION\n2\nENTITIES\n${ents.join('')}0\nENDSEC\n0\nEOF\n`);
}

async function json(url, init = {}) {
  const r = await fetch(url, { ...init, signal: AbortSignal.timeout(30_000) });
  const body = await r.json().catch(() => null);
  if (!r.ok) throw new Error(`${init.method ?? 'GET'} ${url}: ${r.status} ${JSON.stringify(body)}`);
  return body;
}

/**
 * Runs one soak. Returns the counts and memory figures; `ok` says whether it passed.
 * @param {{ seconds?: number, rate?: number, warmup?: number, connections?: number, every?: number, log?: (s: string) => void }} opts
 */
export async function runSoak({ seconds = 600, rate = 200, warmup = Math.min(120, Math.round(seconds / 5)), connections = 16, every = 60, log = (s) => process.stdout.write(`[soak] ${s}\n`) } = {}) {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-soak-'));
  fs.chmodSync(root, 0o755);
  const stops = [];
  // Stopped by hand (Ctrl-C, kill): stop the server, fakes and cluster too, rather than leave them running.
  const onSignal = async (signal) => {
    log(`${signal}: stopping the soak's services`);
    for (const stop of stops) await stop().catch(() => undefined);
    fs.rmSync(root, { recursive: true, force: true });
    process.exit(130);
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const pgPort = await freePort();
    const pg = await startPostgres({ dataDir: path.join(root, 'pg'), port: pgPort, fast: true });
    stops.push(() => pg.stop());
    const s3Port = await freePort();
    const objects = await startFake('objects', { port: s3Port, dir: path.join(root, 'objects'), extraEnv: { FAKE_BUCKET: 'jigwright' } });
    stops.push(() => objects.stop());
    const smtpPort = await freePort();
    const mail = await startFake('mail', { port: smtpPort, dir: path.join(root, 'mail') });
    stops.push(() => mail.stop());
    const port = await freePort();
    const env = {
      DATABASE_URL: `postgres://postgres@127.0.0.1:${pgPort}/soak`,
      S3_ENDPOINT: '127.0.0.1',
      S3_PORT: String(s3Port),
      S3_BUCKET: 'jigwright',
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      SESSION_SECRET: 'soak-secret-that-is-long-enough-0123456789',
      BCRYPT_COST: '4',
      LOG_LEVEL: 'warn',
      RATE_LIMIT_DISABLED: 'true',
      PORT: String(port),
      HOST: '127.0.0.1',
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      WEB_DIST: path.join(root, 'no-web'),
      NODE_ENV: 'production',
    };
    const prep = tsxProcess('server/cli/prepare.ts', env);
    let prepErr = '';
    prep.stderr.on('data', (c) => (prepErr += c));
    const prepCode = await new Promise((r) => prep.once('exit', r));
    if (prepCode !== 0) throw new Error(`prepare failed: ${prepErr}`);

    // The memory probe lives outside product code; it only adds an IPC handler (see the file).
    const server = tsxProcess('server/main.ts', env, ['ignore', 'ignore', 'pipe', 'ipc'], [], ['--expose-gc', '--import', './scripts/lib/memory-probe.mjs']);
    let serverErr = '';
    server.stderr.on('data', (c) => (serverErr = (serverErr + c).slice(-4000)));
    stops.unshift(() => stopChild(server));
    await waitForPort(port, 60_000);
    const base = `http://127.0.0.1:${port}`;

    // The world the traffic runs in: the demo shop, its designs and revisions, and some of our own.
    const { token } = await json(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'editor@larchmere.example', password: 'larchmere-editor' }) });
    const auth = { authorization: `Bearer ${token}` };
    const me = await json(`${base}/api/me`, { headers: auth });
    const shopId = me.shops.find((s) => s.role !== 'viewer').id;
    // The load is kept stationary, so memory can be judged: revisions are added to designs whose
    // details are never read (their revision lists grow), and details are read of designs that
    // never change size.
    const designs = [];
    const writeOnly = [];
    for (let i = 0; i < 24; i++) {
      const d = await json(`${base}/api/shops/${shopId}/designs`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify({ kind: 'insert', title: `Soak plate ${i}`, tags: ['soak'] }) });
      (i % 2 ? writeOnly : designs).push(d.id);
    }
    const page = await json(`${base}/api/shops/${shopId}/designs?limit=100`, { headers: auth });
    const revisions = page.items.map((d) => d.latestRevisionId).filter(Boolean);
    if (revisions.length < 3) throw new Error('the demo library has too few revisions to read');
    const devices = await json(`${base}/api/shops/${shopId}/devices`, { headers: auth });

    const boundary = 'soakboundary7c1e';
    const uploadBody = multipart(boundary, 'Soak upload', 'plate.dxf', plateDxf());
    const jsonHeaders = { ...auth, 'content-type': 'application/json' };
    let n = 0;
    const rotate = (list) => list[n++ % list.length];
    const statuses = ['draft', 'trial', 'proven', 'retired'];
    const get = (p) => ({ method: 'GET', headers: auth, setupRequest: (req) => ({ ...req, path: typeof p === 'function' ? p() : p }) });
    // One cycle: 50 requests, 7 of them writes.
    const mix = [
      ...Array(10).fill(get(`/api/shops/${shopId}/designs?limit=20`)),
      ...Array(3).fill(get(() => `/api/shops/${shopId}/designs?q=${encodeURIComponent(rotate(['charger', 'sled', 'soak plate', 'oak']))}`)),
      ...Array(8).fill(get(() => `/api/designs/${rotate([...designs, ...page.items.map((d) => d.id)])}`)),
      ...Array(6).fill(get(() => `/api/revisions/${rotate(revisions)}`)),
      ...Array(6).fill(get(() => `/api/revisions/${rotate(revisions)}/preview.svg`)),
      ...Array(4).fill(get(() => `/api/revisions/${rotate(revisions)}/download?format=dxf&units=${rotate(['mm', 'in'])}`)),
      ...Array(2).fill(get(`/api/shops/${shopId}/devices`)),
      ...Array(2).fill(get('/api/me')),
      get(`/api/shops/${shopId}/chargers`),
      { method: 'POST', path: '/api/generators/charger-insert/preview', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ params: {} }) },
      ...Array(2).fill({ method: 'PATCH', headers: jsonHeaders, setupRequest: (req) => ({ ...req, path: `/api/revisions/${rotate(revisions)}/status`, body: JSON.stringify({ status: rotate(statuses) }) }) }),
      { method: 'POST', headers: jsonHeaders, setupRequest: (req) => ({ ...req, path: `/api/revisions/${rotate(revisions)}/cuts`, body: JSON.stringify({ cutOn: '2026-11-30', material: 'birch ply', bitMm: 6.35, result: rotate(['tight', 'good', 'loose']), clearanceMm: 0.4 }) }) },
      { method: 'POST', path: `/api/shops/${shopId}/designs`, headers: jsonHeaders, body: JSON.stringify({ kind: 'jig', title: 'Soak jig', tags: ['soak'] }) },
      { method: 'PATCH', headers: jsonHeaders, setupRequest: (req) => ({ ...req, path: `/api/designs/${rotate(designs)}`, body: JSON.stringify({ description: `Touched at ${Date.now()}` }) }) },
      { method: 'POST', headers: { ...auth, 'content-type': `multipart/form-data; boundary=${boundary}` }, body: uploadBody, setupRequest: (req) => ({ ...req, path: `/api/designs/${rotate(writeOnly)}/revisions/upload` }) },
      get(`/api/shops/${shopId}/fit-history?device=${encodeURIComponent(devices.items[0]?.name ?? 'Demo phone S')}&material=white%20oak`),
    ];
    const unexpected = [];
    for (const r of mix) {
      r.onResponse = (status, body) => {
        if ((status < 200 || status >= 300) && unexpected.length < 10) unexpected.push(`${status} ${String(body).slice(0, 200)}`);
      };
    }

    const samples = [];
    const collected = [];
    const started = Date.now();
    const sampler = setInterval(() => {
      try {
        samples.push({ t: (Date.now() - started) / 1000, kb: rssKb(server.pid) });
      } catch {
        /* the process is gone: the run fails below */
      }
    }, 1000);
    let probeId = 0;
    let probeFailure = null;
    let probing = false;
    const prober = setInterval(() => {
      if (probing) return;
      probing = true;
      const t = (Date.now() - started) / 1000;
      probeMemory(server, ++probeId)
        .then((m) => {
          if (!m.gc) probeFailure = 'the server was started without --expose-gc';
          collected.push({ t, kb: Math.round(m.rss / 1024), heapUsedKb: Math.round(m.heapUsed / 1024), heapTotalKb: Math.round(m.heapTotal / 1024) });
        })
        .catch((e) => (probeFailure = e.message))
        .finally(() => (probing = false));
    }, PROBE_EVERY_MS);
    const statusCounts = {};
    log(`${seconds} s at ${rate} requests/s (warm-up ${warmup} s) against ${base}, server pid ${server.pid}`);
    const instance = autocannon({ url: base, connections, overallRate: rate, duration: seconds, requests: mix, timeout: 20 });
    instance.on('response', (_client, status) => {
      statusCounts[status] = (statusCounts[status] ?? 0) + 1;
    });
    let lastLog = Date.now();
    instance.on('tick', () => {
      if (Date.now() - lastLog >= every * 1000) {
        lastLog = Date.now();
        const s = samples[samples.length - 1];
        log(`${Math.round((Date.now() - started) / 1000)} s: ${Object.values(statusCounts).reduce((a, b) => a + b, 0)} answers, RSS ${s ? Math.round(s.kb / 1024) : '?'} MiB`);
      }
    });
    const result = await instance;
    clearInterval(sampler);
    clearInterval(prober);
    const alive = server.exitCode === null && server.signalCode === null;
    // Objects no row refers to, as `npm run sweep -- --dry-run --grace 0` sees them after the run.
    const sweep = tsxProcess('server/cli/sweep.ts', env, ['ignore', 'pipe', 'pipe'], ['--dry-run', '--grace', '0']);
    let sweepOut = '';
    sweep.stdout.on('data', (c) => (sweepOut += c));
    sweep.stderr.on('data', (c) => (sweepOut += c));
    await new Promise((r) => sweep.once('exit', r));
    const orphans = Number(/would remove (\d+) orphan/.exec(sweepOut)?.[1] ?? NaN);
    if (!Number.isFinite(orphans)) log(`the sweep did not report: ${sweepOut.slice(-3000)}`);

    // RSS rises and falls by tens of MiB with each garbage collection, and V8 grows its heap under
    // load for minutes before it settles, so single readings say little. Every 3 s the memory probe
    // runs a full collection in the server and reads RSS straight after it: what the process keeps.
    // Growth is taken from a least-squares line through those readings after the warm-up: its value
    // at the end against its value at the end of the warm-up. A leak is a rising line.
    const kept = collected.filter((c) => c.t >= warmup).map((c) => [c.t, c.kb]);
    const fit = leastSquares(kept);
    const rssWarmKb = Math.round(fit.at(warmup));
    const rssEndKb = Math.round(fit.at(seconds));
    const growth = kept.length >= 5 && !probeFailure ? (rssEndKb - rssWarmKb) / rssWarmKb : NaN;
    if (probeFailure) log(`memory probe: ${probeFailure}`);
    // The same for the JS heap the collector keeps: much less noisy than RSS (no allocator pages),
    // so a leak of objects shows here long before it moves RSS by 10 %.
    const heapFit = leastSquares(collected.filter((c) => c.t >= warmup).map((c) => [c.t, c.heapUsedKb]));
    const heapWarmKb = Math.round(heapFit.at(warmup));
    const heapEndKb = Math.round(heapFit.at(seconds));
    const heapGrowth = kept.length >= 5 && !probeFailure ? (heapEndKb - heapWarmKb) / heapWarmKb : NaN;
    const warm = samples.filter((s) => s.t > warmup - 10 && s.t <= warmup).map((s) => s.kb);
    const end = samples.filter((s) => s.t > seconds - 10).map((s) => s.kb);
    const summary = {
      seconds,
      rate,
      requests: result.requests.total,
      perSecond: Math.round(result.requests.average),
      non2xx: result.non2xx,
      errors: result.errors,
      timeouts: result.timeouts,
      statusCounts,
      latencyP99Ms: result.latency.p99,
      rssWarmKb,
      rssEndKb,
      rssMedianWarmKb: median(warm),
      rssMedianEndKb: median(end),
      rssMaxKb: Math.max(...samples.map((x) => x.kb)),
      rssGrowthPct: Math.round(growth * 1000) / 10,
      probes: kept.length,
      heapWarmKb,
      heapEndKb,
      heapGrowthPct: Math.round(heapGrowth * 1000) / 10,
      alive,
      orphans,
      unexpected,
      ok: false,
    };
    summary.ok = alive && orphans === 0 && result.non2xx === 0 && result.errors === 0 && result.timeouts === 0 && Number.isFinite(growth) && growth <= MAX_GROWTH && Number.isFinite(heapGrowth) && heapGrowth <= MAX_GROWTH && result.requests.total >= rate * seconds * MIN_THROUGHPUT;
    if (!alive) summary.serverStderr = serverErr;
    log(
      `${summary.requests} requests (${summary.perSecond}/s), non-2xx ${summary.non2xx}, errors ${summary.errors}, timeouts ${summary.timeouts}, p99 ${summary.latencyP99Ms} ms, orphan objects ${orphans}; RSS after a full GC (line fitted through ${summary.probes} readings) ${Math.round(rssWarmKb / 1024)} MiB after warm-up → ${Math.round(rssEndKb / 1024)} MiB at the end (${summary.rssGrowthPct} %, limit ${MAX_GROWTH * 100} %; JS heap kept ${Math.round(heapWarmKb / 1024)} → ${Math.round(heapEndKb / 1024)} MiB (${summary.heapGrowthPct} %, limit ${MAX_GROWTH * 100} %); without collecting, medians of the warm-up's last 10 s and the run's last 10 s ${Math.round(summary.rssMedianWarmKb / 1024)} → ${Math.round(summary.rssMedianEndKb / 1024)} MiB, peak ${Math.round(summary.rssMaxKb / 1024)} MiB): ${summary.ok ? 'passed' : 'FAILED'}`,
    );
    if (unexpected.length) log(`unexpected answers: ${unexpected.join(' | ')}`);
    return summary;
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    for (const stop of stops) await stop().catch(() => undefined);
    fs.rmSync(root, { recursive: true, force: true });
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const arg = (name, fallback) => {
    const i = process.argv.indexOf(`--${name}`);
    return i >= 0 ? Number(process.argv[i + 1]) : fallback;
  };
  const seconds = arg('seconds', 600);
  const summary = await runSoak({ seconds, rate: arg('rate', 200), warmup: arg('warmup', Math.min(120, Math.round(seconds / 5))), every: arg('every', 60) });
  process.exit(summary.ok ? 0 : 1);
}

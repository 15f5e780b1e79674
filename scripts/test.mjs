// `npm test`: typecheck, unit + API suites (vitest, supertest), then the browser suite against the
// real server (playwright-core + Debian's Chromium), then the one-minute soak; `npm test -- soak` runs only that.
// Each suite starts its own services in a temporary folder; the demo data under .data/ is never touched. Ends with "N passed, N failed".
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureChromium, ensureEzdxf, ensureNodeModules, ensurePostgresInstalled, log, repoRoot } from './lib/services.mjs';

ensureNodeModules();
ensurePostgresInstalled();
ensureChromium();
ensureEzdxf();

const bin = (n) => path.join(repoRoot, 'node_modules', '.bin', n);
const env = { ...process.env, EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1', NODE_ENV: 'test' };
const totals = { passed: 0, failed: 0, skipped: 0 };
const only = process.argv.slice(2); // e.g. `npm test -- unit api`
const want = (s) => only.length === 0 || only.includes(s);

function step(name, cmd, args) {
  log(`── ${name}`);
  return spawnSync(cmd, args, { cwd: repoRoot, env, stdio: 'inherit' }).status;
}

function vitest(name, config) {
  const out = path.join(os.tmpdir(), `jw-vitest-${name}-${process.pid}.json`);
  const status = step(name, bin('vitest'), ['run', '--config', config, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`]);
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  if (fs.existsSync(out)) {
    const r = JSON.parse(fs.readFileSync(out, 'utf8'));
    passed = r.numPassedTests;
    failed = r.numFailedTests;
    skipped = r.numPendingTests + (r.numTodoTests ?? 0);
    // A file that failed to load has no test results of its own: count it as a failure.
    failed += r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
    fs.rmSync(out);
  }
  if (status !== 0 && failed === 0) failed = 1;
  totals.passed += passed;
  totals.failed += failed;
  totals.skipped += skipped;
  log(`${name}: ${passed} passed, ${failed} failed`);
}

if (want('typecheck')) {
  const status = step('typecheck (tsc --noEmit)', bin('tsc'), ['--noEmit', '-p', 'tsconfig.json']);
  if (status === 0) totals.passed += 1;
  else totals.failed += 1;
}
if (want('unit') || want('api')) vitest('unit and API suites', 'vitest.config.mts');
if (want('browser')) {
  let built = true;
  try {
    const { ensureWebExport } = await import('./lib/web.mjs');
    ensureWebExport();
  } catch (e) {
    console.error(e.message);
    built = false;
    totals.failed += 1;
  }
  if (built) vitest('browser suite', 'vitest.browser.config.mts');
}
// Last and alone, so that its memory and rate readings are not shaped by the other suites.
if (want('soak')) vitest('soak (one minute)', 'vitest.soak.config.mts');

const tail = totals.skipped ? `, ${totals.skipped} skipped` : '';
console.log(`\n${totals.passed} passed, ${totals.failed} failed${tail}`);
process.exit(totals.failed > 0 ? 1 : 0);

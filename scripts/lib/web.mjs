// Builds the Expo web export into dist/ when it is missing or older than its inputs.
import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { log, repoRoot } from './services.mjs';

const inputs = ['app', 'components', 'shared', 'assets', 'index.ts', 'app.json', 'package-lock.json', 'tsconfig.json'];

function walk(p, out) {
  if (!fs.existsSync(p)) return;
  const st = fs.statSync(p);
  if (st.isDirectory()) for (const f of fs.readdirSync(p).sort()) walk(path.join(p, f), out);
  else out.push(`${path.relative(repoRoot, p)}:${st.size}:${Math.floor(st.mtimeMs)}`);
}

export function webInputsHash() {
  const out = [];
  for (const i of inputs) walk(path.join(repoRoot, i), out);
  return crypto.createHash('sha256').update(out.join('\n')).digest('hex');
}

export function ensureWebExport({ force = false } = {}) {
  const dist = path.join(repoRoot, 'dist');
  const stamp = path.join(dist, '.inputs-hash');
  const hash = webInputsHash();
  if (!force && fs.existsSync(stamp) && fs.readFileSync(stamp, 'utf8') === hash && fs.existsSync(path.join(dist, 'index.html'))) {
    return false;
  }
  log('building the web app (expo export; the first build takes about a minute)…');
  // Built beside dist/ and swapped in when complete: a server or test reading dist/ meanwhile
  // (another test run, npm start) keeps the old build instead of meeting an emptied folder.
  const building = `dist.building-${process.pid}`;
  const old = path.join(repoRoot, `dist.old-${process.pid}`);
  fs.rmSync(path.join(repoRoot, building), { recursive: true, force: true });
  const r = spawnSync(path.join(repoRoot, 'node_modules', '.bin', 'expo'), ['export', '--platform', 'web', '--clear', '--output-dir', building], {
    cwd: repoRoot,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1', CI: '1' },
  });
  if (r.status !== 0) {
    fs.rmSync(path.join(repoRoot, building), { recursive: true, force: true });
    throw new Error('expo export failed');
  }
  fs.writeFileSync(path.join(repoRoot, building, '.inputs-hash'), hash);
  if (fs.existsSync(dist)) fs.renameSync(dist, old);
  fs.renameSync(path.join(repoRoot, building), dist);
  fs.rmSync(old, { recursive: true, force: true });
  return true;
}

// Row 2: a 10 MB DXF (about 100 000 LINE / ARC / LWPOLYLINE entities, written by the bench) read
// by importDxf, each run in its own child process for its peak RSS; baseline: dxf-parser's
// parseSync alone on the same text, also in a child. Both children run under tsx like the server.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { repoRoot } from '../scripts/lib/services.mjs';
import { bigMixedDxf } from './dxfFile';
import { judge, type Row } from './lib/report';
import { MB, mb, median, ms, ratio } from './lib/stats';

const RUNS = 3;
const MAX_RSS = 300 * MB;

interface ChildResult {
  mode: string;
  wallMs: number;
  maxRssBytes: number;
  vmHwmBytes: number | null;
  rssBeforeBytes: number;
  paths: number;
}

function child(mode: 'jigwright' | 'parser', file: string): ChildResult {
  const r = spawnSync(path.join(repoRoot, 'node_modules', '.bin', 'tsx'), [path.join(repoRoot, 'bench', 'importChild.ts'), mode, file], {
    cwd: repoRoot,
    encoding: 'utf8',
    timeout: 120_000,
  });
  if (r.status !== 0) throw new Error(`import child (${mode}) failed: ${(r.stderr || r.stdout || String(r.error)).trim().split('\n').slice(-3).join(' ')}`);
  const line = r.stdout.trim().split('\n').pop() ?? '';
  return JSON.parse(line) as ChildResult;
}

export async function benchImport(workDir: string): Promise<{ rows: Row[]; notes: string[] }> {
  const dxf = bigMixedDxf();
  const file = path.join(workDir, 'bench-10mb.dxf');
  fs.writeFileSync(file, dxf.text);
  const bytes = fs.statSync(file).size;
  const total = Object.values(dxf.entities).reduce((a, b) => a + b, 0);
  const ours: ChildResult[] = [];
  const base: ChildResult[] = [];
  for (let i = 0; i < RUNS; i++) {
    // alternate the order so neither always runs on a warmer machine
    if (i % 2 === 0) {
      ours.push(child('jigwright', file));
      base.push(child('parser', file));
    } else {
      base.push(child('parser', file));
      ours.push(child('jigwright', file));
    }
  }
  fs.rmSync(file, { force: true });
  const peak = (r: ChildResult) => Math.max(r.maxRssBytes, r.vmHwmBytes ?? 0);
  const tOurs = median(ours.map((r) => r.wallMs));
  const tBase = median(base.map((r) => r.wallMs));
  const rssOurs = Math.max(...ours.map(peak));
  const rssBase = Math.max(...base.map(peak));
  const before = median(ours.map((r) => r.rssBeforeBytes));
  const t = judge([{ ok: tOurs <= 1.3 * tBase, label: `time ${ratio(tOurs, tBase)} baseline > 1.3×` }]);
  const m = judge([{ ok: rssOurs <= MAX_RSS, label: `peak RSS ${mb(rssOurs)} > 300 MB` }]);
  const what = `Import a ${mb(bytes)} DXF (${total.toLocaleString('en-US')} entities)`;
  return {
    rows: [
      { id: '2a', what: `${what}: wall time (median of ${RUNS})`, measured: ms(tOurs), baseline: `${ms(tBase)} (dxf-parser alone)`, ratio: ratio(tOurs, tBase), target: '≤ 1.3× baseline', ...t },
      { id: '2b', what: `${what}: peak RSS of the importing process (worst of ${RUNS})`, measured: mb(rssOurs), baseline: `${mb(rssBase)} (dxf-parser alone)`, ratio: ratio(rssOurs, rssBase), target: '≤ 300 MB', ...m },
    ],
    notes: [
      `Row 2: entities ${Object.entries(dxf.entities).map(([k, v]) => `${k} ${v}`).join(', ')}; importDxf produced ${ours[0].paths.toLocaleString('en-US')} paths (polylines become one path per segment). Each read runs in a fresh \`tsx\` child (as the server runs); the file is read into memory before the clock starts. RSS of a child before the read: ${mb(before)} (Node + tsx + the 10 MB text). Wall times ours: ${ours.map((r) => ms(r.wallMs)).join(', ')}; dxf-parser: ${base.map((r) => ms(r.wallMs)).join(', ')}. Peak RSS from getrusage maxRSS and /proc/self/status VmHWM (the larger).`,
    ],
  };
}

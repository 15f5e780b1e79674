// One DXF read in a fresh process, so its peak memory is its own. Run by bench/importDxf.ts:
//   tsx bench/importChild.ts jigwright|parser FILE
// prints one JSON line: wall time of the read (file already in memory), peak RSS, RSS before.
import fs from 'node:fs';
import DxfParserModule from 'dxf-parser';
import { importDxf } from '../files/dxf/import';

const DxfParser = ((DxfParserModule as unknown as { default?: typeof DxfParserModule }).default ?? DxfParserModule) as typeof DxfParserModule;

function vmHwmBytes(): number | null {
  try {
    const m = /VmHWM:\s+(\d+)\s+kB/.exec(fs.readFileSync('/proc/self/status', 'utf8'));
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}

const [mode, file] = process.argv.slice(2);
if ((mode !== 'jigwright' && mode !== 'parser') || !file) {
  console.error('usage: tsx bench/importChild.ts jigwright|parser FILE');
  process.exit(2);
}
const text = fs.readFileSync(file, 'utf8');
const rssBefore = process.memoryUsage().rss;
const t0 = performance.now();
let paths = 0;
if (mode === 'jigwright') {
  const r = importDxf(text);
  paths = Object.keys(r.model.paths ?? {}).length;
} else {
  const parsed = new DxfParser().parseSync(text) as { entities?: unknown[] } | null;
  paths = parsed?.entities?.length ?? 0;
}
const wallMs = performance.now() - t0;
const maxRssBytes = process.resourceUsage().maxRSS * 1024;
console.log(JSON.stringify({ mode, wallMs, maxRssBytes, vmHwmBytes: vmHwmBytes(), rssBeforeBytes: rssBefore, paths }));

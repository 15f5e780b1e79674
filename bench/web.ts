// Row 5: the web app. (a) Initial JavaScript, gzipped, of the export in dist/ (the scripts that
// dist/index.html loads); baseline: React's own production builds (react, react-dom client,
// scheduler) gzipped, the floor any React web app ships. (b) First contentful paint of the app in
// headless Chromium on loopback, cache disabled; baseline: a one-heading static page served on
// loopback to the same browser. (c) A drawing with two 5,000-segment layer paths (see the row's
// label for what screen draws it); baseline: the same two path strings drawn into a bare <svg>
// with DOM calls in the same page.
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Page } from 'playwright-core';
import { repoRoot } from '../scripts/lib/services.mjs';
import { openBrowser, WIDE } from '../tests/browser/browser';
import { apiJson, signIn } from './api';
import { twoLayerDxf } from './dxfFile';
import { judge, type Row } from './lib/report';
import { loadText, mb, median, ms, ratio } from './lib/stats';
import type { BenchStack } from './stack';

const FCP_RUNS = 5;
const DRAW_RUNS = 5;
const SEGMENTS = 5000;

const gz = (buf: Buffer) => zlib.gzipSync(buf, { level: 6 }).length;

export function initialJs(): { files: { file: string; raw: number; gzip: number }[]; gzip: number; raw: number } {
  const dist = path.join(repoRoot, 'dist');
  const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8');
  const srcs = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1]).filter((s) => /\/_expo\/static\/js\/web\/[^/]+\.js$/.test(s.split('?')[0]));
  if (srcs.length === 0) throw new Error('dist/index.html loads no script from /_expo/static/js/web/');
  const files = srcs.map((s) => {
    const body = fs.readFileSync(path.join(dist, decodeURIComponent(s.split('?')[0]).replace(/^\//, '')));
    return { file: s, raw: body.length, gzip: gz(body) };
  });
  return { files, gzip: files.reduce((a, f) => a + f.gzip, 0), raw: files.reduce((a, f) => a + f.raw, 0) };
}

function reactFloor(): number {
  const files = ['react/cjs/react.production.js', 'react-dom/cjs/react-dom-client.production.js', 'scheduler/cjs/scheduler.production.js'];
  return files.reduce((a, f) => a + gz(fs.readFileSync(path.join(repoRoot, 'node_modules', f))), 0);
}

/** A page with nothing but a heading, for the browser's own first-paint floor. */
async function staticPageServer(): Promise<{ url: string; close(): Promise<void> }> {
  const body = '<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Bench floor</title></head><body><h1>Bench floor page</h1></body></html>';
  const server = http.createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
    res.end(body);
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const addr = server.address();
  if (!addr || typeof addr === 'string') throw new Error('static page server has no port');
  return { url: `http://127.0.0.1:${addr.port}/`, close: () => new Promise<void>((r) => server.close(() => r())) };
}

async function coldPage(context: Awaited<ReturnType<typeof openBrowser>>['context']): Promise<Page> {
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  return page;
}

async function fcpOf(page: Page, url: string): Promise<number> {
  await page.goto(url, { waitUntil: 'load', timeout: 30_000 });
  await page.waitForFunction(() => performance.getEntriesByName('first-contentful-paint').length > 0, undefined, { timeout: 15_000 });
  return page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0].startTime);
}

/** Set before the app's scripts run: stamps when two big paths are in the drawing and painted. */
function drawingProbe(minLength: number) {
  const w = window as unknown as { __jwDraw?: { dom?: number; painted?: number } };
  w.__jwDraw = {};
  const check = () => {
    const state = w.__jwDraw!;
    if (state.dom !== undefined) return;
    const paths = [...document.querySelectorAll('[data-testid="revision-drawing"] path')].filter((p) => (p.getAttribute('d') ?? '').length > minLength);
    if (paths.length >= 2) {
      state.dom = performance.now();
      // the callback after the next frame's paint
      requestAnimationFrame(() => {
        const ch = new MessageChannel();
        ch.port1.onmessage = () => (state.painted = performance.now());
        ch.port2.postMessage(0);
      });
    }
  };
  new MutationObserver(check).observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ['d'] });
}

/** The two big paths again, drawn with bare DOM calls into a fresh <svg>: time to painted. */
function bareSvgDraw(minLength: number): Promise<{ ms: number; segments: number[] }> {
  const src = [...document.querySelectorAll('[data-testid="revision-drawing"] path')].filter((p) => (p.getAttribute('d') ?? '').length > minLength);
  const svgSrc = src[0].closest('svg')!;
  const ds = src.map((p) => p.getAttribute('d')!);
  const segments = ds.map((d) => (d.match(/[LAQC]/gi) ?? []).length);
  return new Promise((resolve) => {
    const t0 = performance.now();
    const NS = 'http://www.w3.org/2000/svg';
    const svg = document.createElementNS(NS, 'svg');
    svg.setAttribute('width', svgSrc.getAttribute('width') ?? '800');
    svg.setAttribute('height', svgSrc.getAttribute('height') ?? '400');
    svg.setAttribute('viewBox', svgSrc.getAttribute('viewBox') ?? '0 0 300 200');
    for (const [i, d] of ds.entries()) {
      const p = document.createElementNS(NS, 'path');
      p.setAttribute('d', d);
      p.setAttribute('fill', 'none');
      p.setAttribute('stroke', src[i].getAttribute('stroke') ?? '#000');
      p.setAttribute('stroke-width', src[i].getAttribute('stroke-width') ?? '0.5');
      svg.appendChild(p);
    }
    document.body.prepend(svg);
    requestAnimationFrame(() => {
      const ch = new MessageChannel();
      ch.port1.onmessage = () => {
        const dt = performance.now() - t0;
        svg.remove();
        resolve({ ms: dt, segments });
      };
      ch.port2.postMessage(0);
    });
  });
}

function compareRoute(): string | null {
  const hits: string[] = [];
  const walk = (dir: string) => {
    for (const f of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, f.name);
      if (f.isDirectory()) walk(p);
      else if (/compare/i.test(p)) hits.push(path.relative(repoRoot, p));
    }
  };
  walk(path.join(repoRoot, 'app'));
  return hits[0] ?? null;
}

export async function benchWeb(stack: BenchStack, baseUrl: string): Promise<{ rows: Row[]; notes: string[] }> {
  const rows: Row[] = [];
  const notes: string[] = [];

  // (a) initial JavaScript
  const js = initialJs();
  const floor = reactFloor();
  rows.push({
    id: '5a',
    what: `Web: initial JavaScript, gzipped (${js.files.length} script${js.files.length === 1 ? '' : 's'} in dist/index.html)`,
    measured: `${mb(js.gzip)} (${mb(js.raw)} minified)`,
    baseline: `${mb(floor)} (react + react-dom + scheduler production builds)`,
    ratio: ratio(js.gzip, floor),
    target: '≤ 1.5 MB gzipped',
    ...judge([{ ok: js.gzip <= 1.5 * 1024 * 1024, label: `${mb(js.gzip)} > 1.5 MB` }]),
  });

  // the drawing's design: an uploaded DXF with two 5,000-segment runs on two layers
  const token = await signIn(baseUrl, 'editor@larchmere.example', 'larchmere-editor');
  const design = await apiJson<{ id: string }>(baseUrl, token, 'POST', `/shops/${stack.seed.shopId}/designs`, { kind: 'template', title: 'Bench two-layer drawing', tags: ['bench'], material: 'MDF' }, 201);
  const form = new FormData();
  form.set('message', 'Two 5,000-segment runs');
  form.set('file', new Blob([twoLayerDxf(SEGMENTS).text], { type: 'application/dxf' }), 'two-layers.dxf');
  const up = await fetch(`${baseUrl}/api/designs/${design.id}/revisions/upload`, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form });
  if (up.status !== 201) throw new Error(`uploading the drawing answered ${up.status}: ${(await up.text()).slice(0, 200)}`);

  const floorPage = await staticPageServer();
  const b = await openBrowser(WIDE);
  try {
    // (b) first contentful paint, cold cache each time (one warm-up load first)
    const fcpApp: number[] = [];
    const fcpFloor: number[] = [];
    for (let i = 0; i <= FCP_RUNS; i++) {
      for (const [url, into] of [[`${baseUrl}/`, fcpApp], [floorPage.url, fcpFloor]] as const) {
        const page = await coldPage(b.context);
        const v = await fcpOf(page, url);
        await page.close();
        if (i > 0) into.push(v);
      }
    }
    const fApp = median(fcpApp);
    const fFloor = median(fcpFloor);
    rows.push({
      id: '5b',
      what: `Web: first contentful paint of / (headless Chromium, loopback, cache off; median of ${FCP_RUNS})`,
      measured: ms(fApp),
      baseline: `${ms(fFloor)} (static one-heading page)`,
      ratio: ratio(fApp, fFloor),
      target: '≤ 1.5 s',
      ...judge([{ ok: fApp <= 1500, label: `${ms(fApp)} > 1.5 s` }]),
    });
    notes.push(`Row 5b: FCP runs, app: ${fcpApp.map((v) => ms(v)).join(', ')}; floor page: ${fcpFloor.map((v) => ms(v)).join(', ')}. Viewport ${WIDE.width}×${WIDE.height}, signed out.`);

    // (c) the drawing: design page, signed in through the browser's own cookie
    const sign = await b.context.request.post(`${baseUrl}/api/auth/sign-in`, { data: { email: 'editor@larchmere.example', password: 'larchmere-editor' } });
    if (sign.status() !== 200) throw new Error(`browser sign-in answered ${sign.status()}`);
    const minLength = SEGMENTS * 4; // a 5,000-segment path's data is far longer than this; the dimension lines are not
    const drawn: number[] = [];
    const bare: number[] = [];
    let segments: number[] = [];
    const total: number[] = [];
    for (let i = 0; i <= DRAW_RUNS; i++) {
      const page = await coldPage(b.context);
      await page.addInitScript(drawingProbe, minLength);
      await page.goto(`${baseUrl}/help/safety`);
      await page.evaluate((id) => localStorage.setItem('jigwright.currentShop', id), stack.seed.shopId);
      await page.goto(`${baseUrl}/designs/${design.id}`, { waitUntil: 'load' });
      await page.waitForFunction(() => (window as unknown as { __jwDraw?: { painted?: number } }).__jwDraw?.painted !== undefined, undefined, { timeout: 60_000 });
      const t = await page.evaluate(() => {
        const s = (window as unknown as { __jwDraw: { dom: number; painted: number } }).__jwDraw;
        const model = performance.getEntriesByType('resource').filter((e) => /\/api\/revisions\/[^/]+\/model$/.test(e.name)) as PerformanceResourceTiming[];
        return { dom: s.dom, painted: s.painted, modelEnd: model.length ? model[model.length - 1].responseEnd : NaN };
      });
      if (!Number.isFinite(t.modelEnd)) throw new Error('the design page did not fetch the revision model');
      const base = await page.evaluate(bareSvgDraw, minLength);
      await page.close();
      if (i === 0) continue; // warm-up
      drawn.push(t.painted - t.modelEnd);
      total.push(t.painted);
      bare.push(base.ms);
      segments = base.segments;
    }
    const dMed = median(drawn);
    const bMed = median(bare);
    const compare = compareRoute();
    const label = compare
      ? `Web: two 5,000-segment layer paths in Drawing.tsx on the design page (a compare route exists at ${compare}, but this row does not drive it)`
      : 'Web: compare view — no compare screen in app/ yet; measured instead: the design page drawing (Drawing.tsx) of one uploaded revision with two 5,000-segment layer paths, from the model response to painted';
    rows.push({
      id: '5c',
      what: `${label} (median of ${DRAW_RUNS})`,
      measured: ms(dMed),
      baseline: `${ms(bMed)} (same two paths, bare <svg> via DOM)`,
      ratio: ratio(dMed, bMed),
      target: '≤ 300 ms',
      ...judge([{ ok: dMed <= 300, label: `${ms(dMed)} > 300 ms` }]),
    });
    notes.push(
      `Row 5c: paths drawn had ${segments.join(' and ')} segment commands. The time runs from the end of the /model response to the first paint after both paths are in the DOM: it includes JSON parsing, modelLayerPaths (makerjs toSVGPathData) and the React render. Runs: ${drawn.map((v) => ms(v)).join(', ')}; bare SVG: ${bare.map((v) => ms(v)).join(', ')}; navigation start to painted: ${total.map((v) => ms(v)).join(', ')}. Load average at the end: ${loadText()}.`,
    );
  } finally {
    await b.close();
    await floorPage.close();
  }
  return { rows, notes };
}

// Row 5: the web app. (a) Initial JavaScript, gzipped, of the export in dist/ (the scripts that
// dist/index.html loads); baseline: React's own production builds (react, react-dom client,
// scheduler) gzipped, the floor any React web app ships. (b) First contentful paint of the app in
// headless Chromium on loopback, cache disabled; baseline: a one-heading static page served on
// loopback to the same browser. (c) The compare view of two 5,000-segment revisions (or, without a
// compare screen in app/, the design page's drawing with two 5,000-segment layer paths); baseline:
// the same path strings drawn into a bare <svg> with DOM calls on a blank page.
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Page } from 'playwright-core';
import { repoRoot } from '../scripts/lib/services.mjs';
import { openBrowser, WIDE } from '../tests/browser/browser';
import { apiJson, signIn } from './api';
import { twoLayerDxf, zigzagDxf } from './dxfFile';
import { errorRow, judge, type Row } from './lib/report';
import { loadText, MB, mb, median, ms, ratio } from './lib/stats';
import type { BenchStack } from './stack';

const FCP_RUNS = 5;
const DRAW_RUNS = 7;
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

// The two functions below run in the page. They are plain JavaScript source, not TypeScript
// functions handed to Playwright: tsx compiles named functions with an esbuild helper (__name)
// that does not exist in the page.

/**
 * Set before the app's scripts run: stamps when every container named in `need` holds its count of
 * big paths (path data longer than `minLength`), and when the frame after that has painted.
 */
const DRAWING_PROBE = `(function (need, minLength) {
  var state = { };
  window.__jwDraw = state;
  function bigPaths(sel) {
    return Array.prototype.filter.call(document.querySelectorAll(sel + ' path'), function (p) {
      return (p.getAttribute('d') || '').length > minLength;
    });
  }
  function check() {
    if (state.dom !== undefined) return;
    for (var i = 0; i < need.length; i++) if (bigPaths(need[i][0]).length < need[i][1]) return;
    state.dom = performance.now();
    // the task after the next frame: that frame has painted the paths
    requestAnimationFrame(function () {
      var ch = new MessageChannel();
      ch.port1.onmessage = function () { state.painted = performance.now(); };
      ch.port2.postMessage(0);
    });
  }
  window.__jwObserver = new MutationObserver(check);
  window.__jwObserver.observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ['d'] });
})`;

/** The big paths' data and looks, read from the app's page for the baseline. */
const READ_PATHS = `(function (need, minLength) {
  var src = [];
  need.forEach(function (n) {
    Array.prototype.forEach.call(document.querySelectorAll(n[0] + ' path'), function (p) {
      if ((p.getAttribute('d') || '').length > minLength) src.push(p);
    });
  });
  var svg = src[0].closest('svg');
  return {
    width: svg.getAttribute('width') || '800',
    height: svg.getAttribute('height') || '400',
    viewBox: svg.getAttribute('viewBox') || '0 0 300 200',
    paths: src.map(function (p) {
      return { d: p.getAttribute('d'), stroke: p.getAttribute('stroke') || '#000', width: p.getAttribute('stroke-width') || '0.5', dash: p.getAttribute('stroke-dasharray') };
    }),
  };
})`;

/** Draws those paths with bare DOM calls into a fresh <svg> on a blank page: time to painted. */
const BARE_SVG_DRAW = `(function (data) {
  return new Promise(function (resolve) {
    var t0 = performance.now();
    var NS = 'http://www.w3.org/2000/svg';
    var svg = document.createElementNS(NS, 'svg');
    svg.setAttribute('width', data.width);
    svg.setAttribute('height', data.height);
    svg.setAttribute('viewBox', data.viewBox);
    data.paths.forEach(function (p) {
      var el = document.createElementNS(NS, 'path');
      el.setAttribute('d', p.d);
      el.setAttribute('fill', 'none');
      el.setAttribute('stroke', p.stroke);
      el.setAttribute('stroke-width', p.width);
      if (p.dash) el.setAttribute('stroke-dasharray', p.dash);
      svg.appendChild(el);
    });
    document.body.appendChild(svg);
    requestAnimationFrame(function () {
      var ch = new MessageChannel();
      ch.port1.onmessage = function () { resolve(performance.now() - t0); };
      ch.port2.postMessage(0);
    });
  });
})`;

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

type Browser = Awaited<ReturnType<typeof openBrowser>>;
type Part = { rows: Row[]; notes: string[] };

/** (b) first contentful paint of the app and of the floor page, cold cache each time, one warm-up load first. */
async function fcpRows(b: Browser, baseUrl: string): Promise<Part> {
  const floorPage = await staticPageServer();
  try {
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
    return {
      rows: [
        {
          id: '5b',
          what: `Web: first contentful paint of / (headless Chromium, loopback, cache off; median of ${FCP_RUNS})`,
          measured: ms(fApp),
          baseline: `${ms(fFloor)} (static one-heading page)`,
          ratio: ratio(fApp, fFloor),
          target: '≤ 1.5 s',
          ...judge([{ ok: fApp <= 1500, label: `${ms(fApp)} > 1.5 s` }]),
        },
      ],
      notes: [`Row 5b: FCP runs, app: ${fcpApp.map((v) => ms(v)).join(', ')}; floor page: ${fcpFloor.map((v) => ms(v)).join(', ')}. Viewport ${WIDE.width}×${WIDE.height}, signed out.`],
    };
  } finally {
    await floorPage.close();
  }
}

async function upload(baseUrl: string, token: string, designId: string, message: string, dxf: string): Promise<string> {
  const form = new FormData();
  form.set('message', message);
  form.set('file', new Blob([dxf], { type: 'application/dxf' }), 'bench.dxf');
  const up = await fetch(`${baseUrl}/api/designs/${designId}/revisions/upload`, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form });
  if (up.status !== 201) throw new Error(`uploading a bench drawing answered ${up.status}: ${(await up.text()).slice(0, 200)}`);
  return ((await up.json()) as { id: string }).id;
}

/**
 * (c) Two 5,000-segment drawings on screen. With a compare screen in app/: two uploaded
 * revisions of 5,000 segments (the second half changed) on /revisions/:a/compare/:b, both panes and
 * the overlay drawn. Without one: the design page's drawing of one revision with two 5,000-segment
 * layer paths. Signed in through the browser's own cookie; timed from the last /model response.
 */
async function drawingRows(b: Browser, stack: BenchStack, baseUrl: string): Promise<Part> {
  const token = await signIn(baseUrl, 'editor@larchmere.example', 'larchmere-editor');
  const design = await apiJson<{ id: string }>(baseUrl, token, 'POST', `/shops/${stack.seed.shopId}/designs`, { kind: 'template', title: 'Bench drawing', tags: ['bench'], material: 'MDF' }, 201);
  const compare = compareRoute();
  let url: string;
  let need: [string, number][];
  let models: number;
  if (compare) {
    const a = await upload(baseUrl, token, design.id, 'Bench r1: 5,000 segments', zigzagDxf(SEGMENTS).text);
    const bId = await upload(baseUrl, token, design.id, 'Bench r2: 5,000 segments, the second half changed', zigzagDxf(SEGMENTS, SEGMENTS / 2).text);
    url = `${baseUrl}/revisions/${a}/compare/${bId}`;
    need = [['[data-testid="compare-pane-a"]', 1], ['[data-testid="compare-pane-b"]', 1], ['[data-testid="compare-overlay"]', 1]];
    models = 2;
  } else {
    await upload(baseUrl, token, design.id, 'Two 5,000-segment runs', twoLayerDxf(SEGMENTS).text);
    url = `${baseUrl}/designs/${design.id}`;
    need = [['[data-testid="revision-drawing"]', 2]];
    models = 1;
  }

  const sign = await b.context.request.post(`${baseUrl}/api/auth/sign-in`, { data: { email: 'editor@larchmere.example', password: 'larchmere-editor' } });
  if (sign.status() !== 200) throw new Error(`browser sign-in answered ${sign.status()}`);
  const minLength = 10_000; // path data of thousands of segments is far longer; dimension lines and marks are not
  const args = `${JSON.stringify(need)}, ${minLength}`;
  const drawn: number[] = [];
  const bare: number[] = [];
  const total: number[] = [];
  let segments: number[] = [];
  for (let i = 0; i <= DRAW_RUNS; i++) {
    const page = await coldPage(b.context);
    await page.addInitScript({ content: `${DRAWING_PROBE}(${args});` });
    await page.goto(`${baseUrl}/help/safety`);
    await page.evaluate((id) => localStorage.setItem('jigwright.currentShop', id), stack.seed.shopId);
    await page.goto(url, { waitUntil: 'load' });
    try {
      await page.waitForFunction(() => (window as unknown as { __jwDraw?: { painted?: number } }).__jwDraw?.painted !== undefined, undefined, { timeout: 60_000 });
    } catch (e) {
      const seen = await page.evaluate(`(function (need, minLength) {
        return need.map(function (n) {
          var big = Array.prototype.filter.call(document.querySelectorAll(n[0] + ' path'), function (p) { return (p.getAttribute('d') || '').length > minLength; });
          return n[0] + ': ' + big.length + ' of ' + n[1];
        }).join(', ') + '; page text: ' + document.body.innerText.replace(/\\s+/g, ' ').slice(0, 160);
      })(${args})`).catch(() => 'page not readable');
      throw new Error(`${url.replace(baseUrl, '')} was not drawn within 60 s (${String(seen)}): ${(e as Error).message.split('\n')[0]}`);
    }
    const t = await page.evaluate(() => {
      const s = (window as unknown as { __jwDraw: { dom: number; painted: number } }).__jwDraw;
      const ends = (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).filter((e) => /\/api\/revisions\/[^/]+\/model$/.test(e.name)).map((e) => e.responseEnd);
      return { dom: s.dom, painted: s.painted, modelEnds: ends };
    });
    if (t.modelEnds.length < models) throw new Error(`the page fetched ${t.modelEnds.length} revision model(s), not ${models}`);
    const data = (await page.evaluate(`${READ_PATHS}(${args})`)) as { paths: { d: string }[] };
    await page.close();
    // the baseline: the same paths on a blank page of the same browser, nothing else running
    const blank = await coldPage(b.context);
    await blank.setContent('<!doctype html><html><head><meta charset="utf-8"></head><body></body></html>');
    const bareMs = (await blank.evaluate(`${BARE_SVG_DRAW}(${JSON.stringify(data)})`)) as number;
    await blank.close();
    if (i === 0) continue; // warm-up
    drawn.push(t.painted - Math.max(...t.modelEnds));
    total.push(t.painted);
    bare.push(bareMs);
    segments = data.paths.map((p) => (p.d.match(/[LAQC]/gi) ?? []).length);
  }
  const dMed = median(drawn);
  const bMed = median(bare);
  const what = compare
    ? `Web: compare view (${compare}) of two 5,000-segment revisions, both panes and the overlay, from the last model response to painted`
    : 'Web: compare view — no compare screen in app/; measured instead: the design page drawing (Drawing.tsx) of one revision with two 5,000-segment layer paths, from the model response to painted';
  return {
    rows: [
      {
        id: '5c',
        what: `${what} (median of ${DRAW_RUNS})`,
        measured: ms(dMed),
        baseline: `${ms(bMed)} (the same paths, bare <svg> via DOM on a blank page)`,
        ratio: ratio(dMed, bMed),
        target: '≤ 300 ms',
        ...judge([{ ok: dMed <= 300, label: `${ms(dMed)} > 300 ms` }]),
      },
    ],
    notes: [
      `Row 5c: viewport ${WIDE.width}×${WIDE.height}; the big paths drawn had ${segments.join(', ')} segment commands. The time runs from the end of the last /model response to the first paint after every big path is in the DOM: JSON parsing, the screen's own path work${compare ? ' (makerjs path data, segment classification)' : ' (modelLayerPaths, makerjs toSVGPathData)'} and the React render. Runs: ${drawn.map((v) => ms(v)).join(', ')}; bare SVG: ${bare.map((v) => ms(v)).join(', ')}; navigation start to painted: ${total.map((v) => ms(v)).join(', ')}. Load average at the end: ${loadText()}.`,
    ],
  };
}

export async function benchWeb(stack: BenchStack, baseUrl: string): Promise<Part> {
  const out: Part = { rows: [], notes: [] };
  const add = async (fallback: { id: string; what: string; target: string }, fn: () => Promise<Part>) => {
    try {
      const r = await fn();
      out.rows.push(...r.rows);
      out.notes.push(...r.notes);
    } catch (e) {
      console.error(`[bench] row ${fallback.id} failed:`, e);
      out.rows.push(errorRow(fallback.id, fallback.what, fallback.target, e));
    }
  };

  // (a) initial JavaScript
  await add({ id: '5a', what: 'Web: initial JavaScript, gzipped', target: '≤ 1.5 MB gzipped' }, async () => {
    const js = initialJs();
    const floor = reactFloor();
    return {
      rows: [
        {
          id: '5a',
          what: `Web: initial JavaScript, gzipped (${js.files.length} script${js.files.length === 1 ? '' : 's'} in dist/index.html)`,
          measured: `${mb(js.gzip)} (${mb(js.raw)} minified)`,
          baseline: `${mb(floor)} (react + react-dom + scheduler production builds)`,
          ratio: ratio(js.gzip, floor),
          target: '≤ 1.5 MB gzipped',
          ...judge([{ ok: js.gzip <= 1.5 * MB, label: `${mb(js.gzip)} > 1.5 MB` }]),
        },
      ],
      notes: [`Row 5a: ${js.files.map((f) => `${f.file} ${mb(f.raw)} → ${mb(f.gzip)} gzipped`).join('; ')} (gzip level 6, zlib's default). The baseline is the floor any React web app ships.`],
    };
  });

  let b: Browser | undefined;
  try {
    b = await openBrowser(WIDE);
    const browser = b;
    await add({ id: '5b', what: 'Web: first contentful paint', target: '≤ 1.5 s' }, () => fcpRows(browser, baseUrl));
    await add({ id: '5c', what: 'Web: compare view, two 5,000-segment drawings', target: '≤ 300 ms' }, () => drawingRows(browser, stack, baseUrl));
  } catch (e) {
    for (const [id, what, target] of [['5b', 'Web: first contentful paint', '≤ 1.5 s'], ['5c', 'Web: compare view, two 5,000-segment drawings', '≤ 300 ms']]) {
      if (!out.rows.some((r) => r.id === id)) out.rows.push(errorRow(id, what, target, e));
    }
  } finally {
    await b?.close();
  }
  return out;
}

// Stories on the revision, compare and cut-log screens, at 390×844 and 1280×800, with screenshots.
// DXF facts from the Autodesk DXF Reference: HEADER $INSUNITS group 70, 4 = millimeters; LINE
// 10/20–11/21; ARC 10/20 centre, 40 radius, 50/51 start/end angle in degrees counter-clockwise.
// Pocket arithmetic from the charger-insert generator (shared/generators/chargerInsert.ts):
// pocket width = device width + 2 · (case allowance + pocket clearance).
import fs from 'node:fs';
import DxfParserModule from 'dxf-parser';
import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { dxfFile, line } from '../support/dxf';
import { PHONE, WIDE, baseUrl, bringIntoView, openBrowser, pageApi, resize, screenshot, signInOnPage } from './browser';

const DxfParser = ((DxfParserModule as any).default ?? DxfParserModule) as new () => { parseSync(t: string): any };

const EDITOR = { email: 'editor@larchmere.example', password: 'larchmere-editor' };
const LEAD = { email: 'lead@otterbrook.example', password: 'otterbrook-lead' };
const VIEWER = { email: 'viewer@larchmere.example', password: 'larchmere-viewer' };

type Browser = Awaited<ReturnType<typeof openBrowser>>;

const shown = (l: Locator) => l.filter({ visible: true });

async function findDesign(page: Page, shopId: string, title: string) {
  const list = await pageApi<{ items: { id: string; title: string; latestRevisionId: string | null; latestRevision: number }[] }>(page, `/shops/${shopId}/designs?q=${encodeURIComponent(title)}`);
  const d = list.items.find((i) => i.title === title);
  expect(d, `design "${title}" in the demo library`).toBeTruthy();
  return d!;
}

async function useShop(page: Page, shopId: string) {
  await page.evaluate((id) => localStorage.setItem('jigwright.currentShop', id), shopId);
}

/** Takes a picture at the wide size, then at the phone size, scrolled to `focus`, and back. */
async function bothSizes(page: Page, name: string, focus?: () => Locator) {
  await screenshot(page, `${name}-wide`);
  await resize(page, PHONE);
  await page.waitForTimeout(300);
  if (focus) await bringIntoView(shown(focus()).first());
  await screenshot(page, `${name}-phone`);
  await resize(page, WIDE);
  await page.waitForTimeout(300);
}

/** Extents of a parsed DXF's LINE, LWPOLYLINE, CIRCLE and ARC entities (arcs by their quadrant points). */
function dxfExtents(entities: any[]) {
  const xs: number[] = [];
  const ys: number[] = [];
  const add = (x: number, y: number) => {
    xs.push(x);
    ys.push(y);
  };
  for (const e of entities) {
    if (e.type === 'LINE' || e.type === 'LWPOLYLINE' || e.type === 'POLYLINE') for (const v of e.vertices) add(v.x, v.y);
    else if (e.type === 'CIRCLE') {
      add(e.center.x - e.radius, e.center.y - e.radius);
      add(e.center.x + e.radius, e.center.y + e.radius);
    } else if (e.type === 'ARC') {
      // dxf-parser gives the angles in radians.
      let a0 = e.startAngle;
      let a1 = e.endAngle;
      while (a1 < a0) a1 += 2 * Math.PI;
      const at = (a: number) => add(e.center.x + e.radius * Math.cos(a), e.center.y + e.radius * Math.sin(a));
      at(a0);
      at(a1);
      for (let q = Math.ceil(a0 / (Math.PI / 2)); q * (Math.PI / 2) < a1; q++) at(q * (Math.PI / 2));
    }
  }
  return { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

describe('revision, compare and cut-log stories', () => {
  let b: Browser;
  beforeAll(async () => {
    b = await openBrowser(WIDE);
    b.page.on('pageerror', (e) => console.error('[page error]', e.message));
  });
  afterAll(async () => b?.close());
  afterEach(async (ctx) => {
    if (ctx.task.result?.state === 'fail') await screenshot(b.page, `stories-failed-${ctx.task.name.slice(0, 24).replace(/\W+/g, '-')}`).catch(() => {});
  });

  it('S1: the editor regenerates the bedside plate for the rugged-case phone and reads the pocket-width delta', async () => {
    const { page } = b;
    const shops = await signInOnPage(page, EDITOR);
    const larchmere = shops.find((s) => s.name === 'Larchmere Workshop')!;
    await useShop(page, larchmere.id);
    const plate = await findDesign(page, larchmere.id, 'Bedside charger plate');
    const before = await pageApi<{ id: string; number: number; params: Record<string, number>; summary: { features: Record<string, { width: number }> } }>(page, `/revisions/${plate.latestRevisionId}`);

    await page.goto(`${baseUrl()}/revisions/${before.id}`);
    await shown(page.getByTestId('revision-drawing')).waitFor({ timeout: 30000 });
    await shown(page.getByText('Before you cut or wire anything')).first().waitFor();
    await shown(page.getByTestId('template-a4')).waitFor();
    await shown(page.getByTestId('cut-form')).waitFor();

    // Pan and zoom by keyboard: the drawing takes focus and + zooms in, 0 fits again.
    const pan = shown(page.getByTestId('revision-drawing-pan'));
    await pan.focus();
    await page.keyboard.press('+');
    await expect.poll(() => shown(page.getByTestId('zoom-level')).textContent()).toBe('125%');
    await page.keyboard.press('ArrowLeft');
    // Wheel over the drawing zooms about the pointer.
    const box = (await pan.locator('svg').first().boundingBox())!;
    await page.mouse.move(box.x + box.width / 3, box.y + box.height / 2);
    await page.mouse.wheel(0, -300);
    await expect.poll(async () => Number((await shown(page.getByTestId('zoom-level')).textContent())!.replace('%', ''))).toBeGreaterThan(125);
    await page.keyboard.press('0');
    await expect.poll(() => shown(page.getByTestId('zoom-level')).textContent()).toBe('100%');

    // The underside, mirrored, says what it is.
    await shown(page.getByRole('radio', { name: 'Underside' })).click();
    await shown(page.getByTestId('underside-note')).getByText('as cut after turning the plate over', { exact: false }).waitFor();
    await bothSizes(page, 'revision-underside', () => page.getByTestId('revision-drawing'));
    await shown(page.getByRole('radio', { name: 'Top face' })).click();
    await bothSizes(page, 'revision-top');

    // A bad cut record is refused in place.
    await shown(page.getByTestId('cut-bit')).fill('abc');
    await shown(page.getByTestId('cut-submit')).click();
    await shown(page.getByText('Say whether it came out tight, good or loose')).waitFor();
    await shown(page.getByText('Enter a length like 12.5')).first().waitFor();
    await shown(page.getByTestId('cut-bit')).fill('6.35');

    // Regenerate for the rugged case: the devices come from the shop's catalog.
    const devices = (await pageApi<{ items: { id: string; name: string; widthMm: number; caseAllowanceMm: number }[] }>(page, `/shops/${larchmere.id}/devices`)).items;
    const rugged = devices.find((d) => d.name === 'Demo phone L, rugged case')!;
    await shown(page.getByRole('radio', { name: /Demo phone L, rugged case/ })).click();
    await shown(page.getByTestId('regenerate-submit')).click();
    await page.waitForURL(new RegExp(`/revisions/${before.id}/compare/[0-9a-f-]{36}$`), { timeout: 30000 });
    const row = shown(page.getByTestId('diff-geometry-pocket.width-delta'));
    await row.waitFor({ timeout: 30000 });

    // Δ pocket width = Δ device width + 2 · Δ case allowance (the pocket clearance is unchanged).
    const expected = rugged.widthMm - before.params.deviceWidth + 2 * (rugged.caseAllowanceMm - before.params.caseAllowance);
    expect(expected).toBeCloseTo(2.8, 9); // 77.6 − 77.6 + 2 · (3.0 − 1.6), from db/seed.ts
    expect(await row.textContent()).toBe(`+${expected.toFixed(1)} mm`);
    const otherId = page.url().split('/').pop()!;
    const after = await pageApi<{ number: number; summary: { features: Record<string, { width: number }> } }>(page, `/revisions/${otherId}`);
    expect(after.number).toBe(before.number + 1);
    expect(after.summary.features.pocket.width - before.summary.features.pocket.width).toBeCloseTo(expected, 6);
    // The changed rows come first and are marked; in inches the same delta reads 2.8 / 25.4.
    await shown(page.getByText(/rows differ; they come first/)).waitFor();
    await shown(page.getByTestId('compare-overlay')).waitFor();
    await bothSizes(page, 'compare-regenerated', () => page.getByTestId('compare-overlay'));
    await shown(page.getByRole('radio', { name: 'inches' })).click();
    expect(await row.textContent()).toBe(`+${(expected / 25.4).toFixed(3)} in`);
    await bringIntoView(shown(page.getByTestId('diff-table')));
    await screenshot(page, 'compare-table-inches-wide');
    await resize(page, PHONE);
    await shown(page.getByRole('radio', { name: /^A · r/ })).click();
    await shown(page.getByTestId('compare-pane-a')).waitFor();
    await screenshot(page, 'compare-pane-a-phone');
    await bringIntoView(shown(page.getByTestId('diff-table')));
    await screenshot(page, 'compare-table-phone');
    await resize(page, WIDE);
    await shown(page.getByRole('radio', { name: 'mm' })).click();
  });

  it('S1b: the editor records a cut and sees the fit history with the suggested clearance', async () => {
    const { page } = b;
    const shops = await signInOnPage(page, EDITOR);
    const larchmere = shops.find((s) => s.name === 'Larchmere Workshop')!;
    await useShop(page, larchmere.id);
    const plate = await findDesign(page, larchmere.id, 'Bedside charger plate');
    await page.goto(`${baseUrl()}/revisions/${plate.latestRevisionId}`);
    const form = shown(page.getByTestId('cut-form'));
    await form.waitFor({ timeout: 30000 });
    await shown(page.getByTestId('cut-material')).fill('black walnut');
    await shown(page.getByTestId('cut-bit')).fill('6.35');
    await shown(page.getByTestId('cut-clearance')).fill('0.9');
    await form.getByRole('radio', { name: 'Loose' }).click();
    // A photo that is not an image is refused before anything is sent.
    await form.getByTestId('cut-photo').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not a photo') });
    await shown(page.getByText('The photo must be a JPEG or PNG image')).waitFor();
    await shown(page.getByTestId('cut-submit')).click();
    await shown(page.getByText('Cut recorded.')).waitFor({ timeout: 30000 });
    const list = shown(page.getByTestId('cut-list'));
    await list.getByText('black walnut', { exact: false }).first().waitFor();
    const suggestion = shown(page.getByTestId('suggested-clearance'));
    await suggestion.waitFor({ timeout: 30000 });
    // One loose cut at 0.9 mm: common practice steps back 0.25 mm (shared/fit/clearance.ts).
    const hist = await pageApi<{ suggestion: { clearanceMm: number } | null }>(page, `/shops/${larchmere.id}/fit-history?device=${encodeURIComponent('Demo phone L, rugged case')}&material=black%20walnut`);
    expect(hist.suggestion).not.toBeNull();
    await suggestion.getByText(`${hist.suggestion!.clearanceMm} mm`, { exact: false }).waitFor();
    await bothSizes(page, 'cut-log', () => page.getByTestId('fit-history'));
  });

  it('S2: the Otterbrook lead changes a parameter of the forked taper sled and sees r2 of the fork', async () => {
    const { page } = b;
    const shops = await signInOnPage(page, LEAD);
    const otter = shops.find((s) => s.name === 'Otterbrook Makerspace')!;
    await useShop(page, otter.id);
    const fork = await findDesign(page, otter.id, 'Leg taper sled');
    const r1 = await pageApi<{ id: string; number: number; generatorId: string; params: Record<string, number | string> }>(page, `/revisions/${fork.latestRevisionId}`);
    expect(r1.number).toBe(1);
    await page.goto(`${baseUrl()}/revisions/${r1.id}`);
    await shown(page.getByTestId('revision-drawing')).waitFor({ timeout: 30000 });
    // The fork's lineage: its source's revisions are offered for comparing.
    await shown(page.getByTestId('compare-links')).getByText(/Forked from: Leg taper sled/).waitFor();
    // From the design page: "New revision from these parameters" opens the generator with r1's values.
    await page.goto(`${baseUrl()}/designs/${fork.id}`);
    await shown(page.getByRole('link', { name: /New revision from r1/ })).first().click();
    await page.waitForURL(/\/generators\/taper-jig\?revision=/, { timeout: 30000 });
    const wide = shown(page.getByLabel('Wide end', { exact: true })).first();
    await wide.waitFor({ timeout: 30000 });
    await wide.fill(String(Number(r1.params.wideEnd) + 4.2));
    await shown(page.getByLabel('What changed')).first().fill('Wider at the foot for the Otterbrook benches');
    await page.waitForTimeout(600); // the preview settles (debounced) before saving
    await shown(page.getByRole('button', { name: 'Save as new revision' })).first().click();
    await page.waitForURL(new RegExp(`/designs/${fork.id}\\?r=2`), { timeout: 30000 });
    const design = await pageApi<{ revisions: { id: string; number: number; params: Record<string, number> }[] }>(page, `/designs/${fork.id}`);
    const r2 = design.revisions.find((r) => r.number === 2)!;
    expect(r2.params.wideEnd).toBeCloseTo(Number(r1.params.wideEnd) + 4.2, 9);
    await page.goto(`${baseUrl()}/revisions/${r2.id}`);
    await shown(page.getByText('Wider at the foot for the Otterbrook benches')).waitFor({ timeout: 30000 });
    await shown(page.getByRole('heading', { name: 'r2', exact: true })).waitFor();
    await shown(page.getByTestId('compare-links')).getByRole('link', { name: /Compare with Leg taper sled r1/ }).first().click();
    const delta = shown(page.getByTestId('diff-parameters-wideEnd-delta'));
    await delta.waitFor({ timeout: 30000 });
    expect(await delta.textContent()).toBe('−4.2 mm'); // B is r1 here: 50.8 against 55.0
    await bothSizes(page, 'fork-r2-compare', () => page.getByTestId('diff-table'));
  });

  it('S3: the viewer downloads a DXF and it reads back in millimetres at the summary’s size', async () => {
    const { page } = b;
    const shops = await signInOnPage(page, VIEWER);
    const larchmere = shops.find((s) => s.name === 'Larchmere Workshop')!;
    expect(larchmere.role).toBe('viewer');
    await useShop(page, larchmere.id);
    const sled = await findDesign(page, larchmere.id, 'Leg taper sled');
    const rev = await pageApi<{ id: string; summary: { extents: { width: number; height: number } } }>(page, `/revisions/${sled.latestRevisionId}`);
    await page.goto(`${baseUrl()}/revisions/${rev.id}`);
    await shown(page.getByTestId('revision-drawing')).waitFor({ timeout: 30000 });
    // A viewer sees the log but no form, and no regenerate.
    await shown(page.getByText('Viewers see the log; editors record cuts.')).waitFor();
    expect(await shown(page.getByTestId('regenerate')).count()).toBe(0);
    await bringIntoView(shown(page.getByTestId('files')));
    await bothSizes(page, 'viewer-files', () => page.getByTestId('files'));
    const [download] = await Promise.all([page.waitForEvent('download'), shown(page.getByTestId('download-dxf-mm')).click()]);
    const file = await download.path();
    const parsed = new DxfParser().parseSync(fs.readFileSync(file!, 'utf8'));
    expect(parsed.header.$INSUNITS).toBe(4);
    const ext = dxfExtents(parsed.entities);
    expect(ext.width).toBeCloseTo(rev.summary.extents.width, 2);
    expect(ext.height).toBeCloseTo(rev.summary.extents.height, 2);
  });

  it('compares two uploaded 5,000-line revisions without freezing the page', async () => {
    const { page } = b;
    const shops = await signInOnPage(page, EDITOR);
    const larchmere = shops.find((s) => s.name === 'Larchmere Workshop')!;
    await useShop(page, larchmere.id);
    const design = await pageApi<{ id: string }>(page, `/shops/${larchmere.id}/designs`, { method: 'POST', json: { kind: 'template', title: `Dense grid ${Date.now().toString(36)}`, tags: [], material: '' } });
    // 5,000 separate LINEs each: 100 rows of 50 short strokes; B moves every other row 0.5 mm.
    const grid = (shift: number) => {
      const out: string[] = [];
      for (let row = 0; row < 100; row++) for (let k = 0; k < 50; k++) {
        const y = row * 3 + (row % 2 ? shift : 0);
        out.push(line(k * 4, y, k * 4 + 3, y));
      }
      return dxfFile(out, 4);
    };
    const ids: string[] = [];
    for (const [i, text] of [grid(0), grid(0.5)].entries()) {
      const saved = await page.evaluate(
        async ({ designId, text, i }) => {
          const form = new FormData();
          form.append('message', `Dense grid ${i + 1}`);
          form.append('status', 'draft');
          form.append('fitNotes', '{}');
          form.append('file', new Blob([text], { type: 'application/dxf' }), `grid-${i}.dxf`);
          const r = await fetch(`/api/designs/${designId}/revisions/upload`, { method: 'POST', credentials: 'include', headers: { 'X-Jigwright-CSRF': '1' }, body: form });
          return { status: r.status, body: await r.text() };
        },
        { designId: design.id, text, i },
      );
      expect(saved.status, saved.body).toBe(201);
      ids.push(JSON.parse(saved.body).id);
    }
    const t0 = Date.now();
    await page.goto(`${baseUrl()}/revisions/${ids[0]}/compare/${ids[1]}`);
    await shown(page.getByTestId('compare-overlay')).locator('svg').first().waitFor({ timeout: 60000 });
    const wall = Date.now() - t0;
    await expect.poll(() => page.evaluate(() => window.__jwCompareTiming?.paintMs ?? null), { timeout: 20000 }).not.toBeNull();
    const timing = (await page.evaluate(() => window.__jwCompareTiming))!;
    // The page still answers: a click on the units toggle goes through at once.
    const t1 = Date.now();
    await shown(page.getByRole('radio', { name: 'inches' })).click();
    const clickMs = Date.now() - t1;
    await shown(page.getByRole('radio', { name: 'mm' })).click();
    console.log(`[compare 5000×2] classify ${timing.classifyMs.toFixed(0)} ms, to commit ${timing.renderMs.toFixed(0)} ms, to paint ${timing.paintMs!.toFixed(0)} ms; navigation to overlay ${wall} ms; units click ${clickMs} ms`);
    // Half the rows moved: 2,500 unchanged strokes, 2,500 only in A, 2,500 only in B.
    expect(timing.segments).toBe(7500);
    await shown(page.getByText('Unchanged · 2500 segments')).waitFor();
    // Three path elements for the overlay classes, not thousands.
    expect(await shown(page.getByTestId('compare-overlay')).locator('svg').first().locator('path').count()).toBeLessThanOrEqual(3 + 8);
    expect(timing.paintMs!).toBeLessThan(3000);
    await bothSizes(page, 'compare-5000', () => page.getByTestId('compare-overlay'));
  });
});

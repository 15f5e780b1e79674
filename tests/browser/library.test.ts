// The library in the browser, by two people. The demo shop's owner starts a design, uploads a
// hand-written DXF through the upload screen (a damaged file and a file without units first, to see
// both answered in place), checks what was read before saving and saves r1. The demo editor — a
// different account, in a browser of their own — forks it into the second demo shop, sees the
// lineage both ways, then downloads the DXF and reads it back with dxf-parser.
// DXF facts from the Autodesk DXF Reference: HEADER $INSUNITS group 70, 4 = millimeters.
import fs from 'node:fs';
import DxfParserModule from 'dxf-parser';
import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { circle, dxfFile, rectLines } from '../support/dxf';
import { PHONE, WIDE, baseUrl, bringIntoView, openBrowser, resize, screenshot } from './browser';

const DxfParser = ((DxfParserModule as any).default ?? DxfParserModule) as new () => { parseSync(t: string): any };

const OWNER = { email: 'owner@larchmere.example', password: 'larchmere-owner' };
const EDITOR = { email: 'editor@larchmere.example', password: 'larchmere-editor' };
const TITLE = `Shelf insert with pad recess ${Date.now().toString(36)}`;
// The server names downloads `<title>-r<N>.<ext>`, the title folded to lower-case words and dashes.
const FILE_BASE = TITLE.toLowerCase().replace(/\s+/g, '-');

// A 240 × 160 mm plate with a 90 mm round recess: five closed contours' worth of entities.
const GOOD_DXF = dxfFile([...rectLines(240, 160), circle(120, 80, 45)], 4);
const NO_UNITS_DXF = dxfFile(rectLines(10, 6), null);
const DAMAGED_DXF = GOOD_DXF.slice(0, 90);

type Browser = Awaited<ReturnType<typeof openBrowser>>;

async function signIn(context: BrowserContext, who: { email: string; password: string }) {
  // context.request shares the browser's cookie jar, so the session cookie lands in the page too.
  const r = await context.request.post(`${baseUrl()}/api/auth/sign-in`, { data: who });
  expect(r.status(), await r.text()).toBe(200);
  const me = await (await context.request.get(`${baseUrl()}/api/me`)).json();
  return me as { shops: { id: string; name: string; role: string }[] };
}

async function useShop(page: Page, shopId: string) {
  await page.goto(baseUrl() + '/help/safety');
  await page.evaluate((id) => localStorage.setItem('jigwright.currentShop', id), shopId);
}

// Expo Router's stack keeps earlier screens mounted but hidden: look only at the one on show.
const shown = (l: Locator) => l.filter({ visible: true });

/** Waits until the top bar's shop switcher names this shop and role, and no other shop. */
async function switcherShows(page: Page, shopName: string, role: string, notName: string) {
  const switcher = shown(page.getByTestId('shop-switcher'));
  await switcher.getByText(shopName, { exact: true }).waitFor({ timeout: 30000 });
  expect(await switcher.getAttribute('aria-label')).toBe(`Current shop: ${shopName}, ${role}. Switch shop`);
  expect(await switcher.innerText()).not.toContain(notName);
}

const dxfUpload = (name: string, text: string) => ({ name, mimeType: 'application/dxf', buffer: Buffer.from(text) });

describe('library, revisions and forks in the browser', () => {
  let b: Browser; // the owner's browser
  let other: Browser; // the editor's browser
  let shops: { id: string; name: string; role: string }[];
  let editorShops: { id: string; name: string; role: string }[];
  let designUrl = '';

  beforeAll(async () => {
    b = await openBrowser(WIDE);
    other = await openBrowser(WIDE);
    b.page.on('pageerror', (e) => console.error('[page error, owner]', e.message));
    other.page.on('pageerror', (e) => console.error('[page error, editor]', e.message));
    shops = (await signIn(b.context, OWNER)).shops;
    editorShops = (await signIn(other.context, EDITOR)).shops;
  });
  afterAll(async () => {
    await b?.close();
    await other?.close();
  });
  // A failing step leaves a picture of the screens it failed on.
  afterEach(async (ctx) => {
    if (ctx.task.result?.state !== 'fail') return;
    const name = ctx.task.name.slice(0, 24).replace(/\W+/g, '-');
    await screenshot(b.page, `library-failed-${name}`).catch(() => {});
    await screenshot(other.page, `library-failed-${name}-editor`).catch(() => {});
  });

  it('creates a design, checks an uploaded DXF before saving, and shows r1 with its fit notes', async () => {
    const { page } = b;
    const larchmere = shops.find((s) => s.name === 'Larchmere Workshop')!;
    expect(larchmere.role).toBe('owner');
    await useShop(page, larchmere.id);

    await page.goto(baseUrl() + '/library');
    await page.getByText('Jigs, templates and inserts of').waitFor({ timeout: 30000 });
    await page.getByTestId('new-design').click();
    await page.waitForURL('**/designs/new');
    await page.getByTestId('design-submit').click();
    await page.getByText('Give the design a title').waitFor(); // the shared schema's message, in place
    await page.getByTestId('design-title').fill(TITLE);
    await page.getByTestId('design-tags').fill('charger, shelf');
    await page.getByTestId('design-material').fill('Walnut ply');
    await page.getByTestId('design-submit').click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
    designUrl = page.url();
    await shown(page.getByText('No revision yet', { exact: true })).waitFor();

    await page.getByTestId('upload-revision').click();
    await page.waitForURL('**/upload');
    const input = page.getByTestId('file-input');

    // A damaged file: a plain message, and nothing else moves on.
    await input.setInputFiles(dxfUpload('broken.dxf', DAMAGED_DXF));
    await page.getByText('Jigwright could not use this file').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('revision-save').getAttribute('aria-disabled')).toBe('true');

    // A file without units: the screen asks, and the answer is sent with the file again.
    await input.setInputFiles(dxfUpload('no-units.dxf', NO_UNITS_DXF));
    await page.getByText('Which units is it drawn in?').waitFor({ timeout: 30000 });
    await page.getByRole('radio', { name: 'Inches' }).click();
    await page.getByTestId('units-confirm').click();
    await page.getByTestId('inspect-result').getByText('inches, as you chose').waitFor({ timeout: 30000 });

    // The real file: what was read is on screen before anything is saved.
    await input.setInputFiles(dxfUpload('shelf-insert.dxf', GOOD_DXF));
    const result = page.getByTestId('inspect-result');
    await result.getByText('millimetres, from the file’s $INSUNITS header').waitFor({ timeout: 30000 });
    await result.getByText('LINE 4, CIRCLE 1').waitFor();
    await result.getByText('240 × 160 mm').waitFor();
    await result.getByText('2 closed, 0 open').waitFor();

    // Fit notes: a bad length is refused in place and the other boxes keep what was typed.
    await page.getByTestId('include-device').click();
    await page.getByTestId('device-width').fill('71.5');
    await page.getByTestId('device-length').fill('abc');
    await page.getByTestId('device-thickness').fill('8.2');
    await page.getByTestId('clearance').fill('1.5');
    await page.getByTestId('revision-save').click();
    await page.getByText('Say what changed in this revision').waitFor();
    await page.getByText('Enter a length like 12.5').waitFor();
    expect(await page.getByTestId('device-width').inputValue()).toBe('71.5');
    await page.getByTestId('device-length').fill('148');
    await page.getByTestId('revision-message').fill('First cut file from the shop drawing');
    await screenshot(page, 'upload-checked-wide');
    await resize(page, PHONE);
    await bringIntoView(shown(page.getByTestId('inspect-result')));
    await screenshot(page, 'upload-checked-phone');
    await resize(page, WIDE);
    await page.getByTestId('revision-save').click();

    await page.waitForURL(/\/designs\/[0-9a-f-]{36}\?r=1$/, { timeout: 30000 });
    const selected = shown(page.getByTestId('selected-revision'));
    await selected.getByRole('heading', { name: 'r1', exact: true }).waitFor({ timeout: 30000 });
    await selected.getByText('First cut file from the shop drawing').waitFor();
    await shown(page.getByTestId('fit-notes')).getByText('71.5 × 148 × 8.2 mm (W × L × T)').waitFor();
    await shown(page.getByTestId('fit-notes')).getByText('1.5 mm per side').waitFor();
    await shown(page.getByTestId('revision-history')).getByText('Uploaded file', { exact: false }).waitFor();
    await shown(page.getByTestId('activity-log')).getByText('uploaded a DXF file drawn in mm').waitFor();
    await shown(page.getByText('Before you cut or wire anything')).waitFor(); // cautions beside the downloads
    await shown(page.getByTestId('revision-drawing')).waitFor();
    await screenshot(page, 'design-wide');
    // The frame scrolls inside the window: bring the lower parts into view for their own pictures.
    await bringIntoView(shown(page.getByTestId('downloads')));
    await screenshot(page, 'design-wide-downloads');
    await bringIntoView(shown(page.getByTestId('activity-log')));
    await screenshot(page, 'design-wide-history');

    // An editor moves r1 on from draft; the history and the log both say so.
    await shown(page.getByTestId('status-change-1')).click();
    await shown(page.getByRole('radio', { name: 'Trial cut' })).click();
    await shown(page.getByTestId('status-save-1')).click();
    await shown(page.getByTestId('activity-log')).getByText('moved r1 from Draft to Trial cut').waitFor({ timeout: 30000 });
    await shown(page.getByTestId('revision-1')).getByText('Trial cut').waitFor();
  });

  it('another member (the editor, signed in elsewhere) forks r1 into Otterbrook Makerspace and sees the lineage on both designs', async () => {
    const { page } = other;
    const larchmere = editorShops.find((s) => s.name === 'Larchmere Workshop')!;
    const otterbrook = editorShops.find((s) => s.name === 'Otterbrook Makerspace')!;
    expect(larchmere.role).toBe('editor');
    expect(otterbrook?.role).toBe('editor');
    // Start in the other shop: opening a Larchmere design makes Larchmere the current shop.
    await useShop(page, otterbrook.id);
    await page.goto(designUrl);
    await shown(page.getByTestId('design-shop')).getByText('In Larchmere Workshop', { exact: true }).waitFor({ timeout: 30000 });
    await switcherShows(page, 'Larchmere Workshop', 'Editor', 'Otterbrook');
    await page.getByTestId('fork-open').click();
    const panel = page.getByTestId('fork-panel');
    await panel.getByRole('radio', { name: 'Otterbrook Makerspace' }).click();
    await panel.getByTestId('fork-submit').click();
    await page.waitForURL((u) => u.href !== designUrl && /\/designs\/[0-9a-f-]{36}$/.test(u.pathname), { timeout: 30000 });
    const forkUrl = page.url();
    const lineage = shown(page.getByTestId('lineage'));
    await lineage.getByText('in Larchmere Workshop', { exact: false }).waitFor({ timeout: 30000 });
    await lineage.getByRole('link', { name: TITLE }).waitFor();
    await shown(page.getByTestId('design-shop')).getByText('In Otterbrook Makerspace', { exact: true }).waitFor();
    await shown(page.getByTestId('selected-revision')).getByText(`Forked from ${TITLE} r1 (Larchmere Workshop)`).waitFor();
    // The fork opens in its own shop: the switcher follows, and so does the choice kept for next time.
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');
    expect(await page.evaluate(() => localStorage.getItem('jigwright.currentShop'))).toBe(otterbrook.id);
    await screenshot(page, 'design-fork-wide');
    await resize(page, PHONE);
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');
    await screenshot(page, 'design-fork-phone');
    await resize(page, WIDE);

    // Back to the source, a design of the first shop: the top bar switches back.
    await lineage.getByRole('link', { name: TITLE }).click();
    await page.waitForURL(designUrl);
    await shown(page.getByTestId('lineage')).getByText('Forked 1 time').waitFor({ timeout: 30000 });
    await shown(page.getByTestId('lineage')).getByText('in Otterbrook Makerspace, from r1', { exact: false }).waitFor();
    await shown(page.getByTestId('design-shop')).getByText('In Larchmere Workshop', { exact: true }).waitFor();
    await switcherShows(page, 'Larchmere Workshop', 'Editor', 'Otterbrook');

    // The browser's back button shows the fork again (a screen kept in the stack): Otterbrook again.
    await page.goBack();
    await page.waitForURL(forkUrl);
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');

    // The Library link now opens the fork's shop, with the fork in it.
    await shown(page.getByRole('navigation')).getByRole('link', { name: 'Library', exact: true }).click();
    await page.waitForURL('**/library');
    await shown(page.getByText('Jigs, templates and inserts of', { exact: false })).getByText('Otterbrook Makerspace', { exact: true }).waitFor({ timeout: 30000 });
    await shown(page.getByRole('table', { name: 'Designs' })).getByRole('link', { name: TITLE }).waitFor({ timeout: 30000 });

    // Choosing the other shop in the switcher while a design is on show opens that shop's library
    // rather than leaving the top bar naming one shop over the other shop's design.
    await page.goto(forkUrl);
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');
    await shown(page.getByTestId('shop-switcher')).click();
    await shown(page.getByRole('menuitem', { name: 'Switch to Larchmere Workshop' })).click();
    await page.waitForURL('**/library');
    await switcherShows(page, 'Larchmere Workshop', 'Editor', 'Otterbrook');
    await shown(page.getByText('Jigs, templates and inserts of', { exact: false })).getByText('Larchmere Workshop', { exact: true }).waitFor({ timeout: 30000 });

    // A revision of the fork, opened straight from its address, switches to Otterbrook too.
    const forkId = new URL(forkUrl).pathname.split('/').pop()!;
    const fork = (await (await other.context.request.get(`${baseUrl()}/api/designs/${forkId}`)).json()) as { revisions: { id: string; number: number }[] };
    await page.goto(`${baseUrl()}/revisions/${fork.revisions[0]!.id}`);
    await shown(page.getByTestId('design-shop')).getByText('In Otterbrook Makerspace', { exact: true }).waitFor({ timeout: 30000 });
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');
    await screenshot(page, 'revision-fork-wide');
    await resize(page, PHONE);
    await switcherShows(page, 'Otterbrook Makerspace', 'Editor', 'Larchmere');
    await screenshot(page, 'revision-fork-phone');
    await resize(page, WIDE);
  });

  it('the editor downloads r1 as a DXF named <title>-r1.dxf that reads back in millimetres', async () => {
    const { page } = other;
    await page.goto(designUrl);
    const link = page.getByTestId('download-dxf-mm');
    await link.waitFor({ timeout: 30000 });
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toBe(`${FILE_BASE}-r1.dxf`);
    const text = fs.readFileSync((await download.path())!, 'utf8');
    const parsed = new DxfParser().parseSync(text);
    expect(parsed.header.$INSUNITS).toBe(4);
    expect(parsed.entities.length).toBeGreaterThanOrEqual(2);
  });

  it('adds a device to the catalog (a bad length is refused in place) and deletes it again', async () => {
    const { page } = b;
    const name = `Test slate ${Date.now().toString(36)}`;
    await page.goto(baseUrl() + '/catalog');
    await page.getByTestId('device-add').click();
    await page.getByTestId('device-name').fill(name);
    await page.getByTestId('device-width').fill('0');
    await page.getByTestId('device-length').fill('150');
    await page.getByTestId('device-thickness').fill('8');
    await page.getByTestId('device-submit').click();
    await page.getByText('Width must be more than 0 mm').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('device-name').inputValue()).toBe(name);
    await page.getByTestId('device-width').fill('70');
    await page.getByTestId('device-submit').click();
    const table = page.getByRole('table', { name: 'Devices' });
    await table.getByText(name, { exact: true }).waitFor({ timeout: 30000 });
    await table.getByText('70 × 150 × 8 mm').first().waitFor();
    await screenshot(page, 'catalog-wide');
    await page.getByRole('button', { name: `Delete ${name}` }).click();
    await page.getByRole('button', { name: 'Yes, delete' }).click();
    await table.getByText(name, { exact: true }).waitFor({ state: 'detached', timeout: 30000 });
  });

  it('lists the design in the library: a table on wide screens, cards on a phone', async () => {
    const { page } = b;
    await page.goto(baseUrl() + '/library');
    await page.getByRole('table', { name: 'Designs' }).getByRole('link', { name: TITLE }).waitFor({ timeout: 30000 });
    // The search box narrows the list after a pause in typing.
    await page.getByTestId('library-search').fill('shelf pad');
    await page.waitForURL(/q=shelf/);
    await page.getByRole('table', { name: 'Designs' }).getByRole('link', { name: TITLE }).waitFor();
    await page.getByTestId('library-search').fill('');
    await page.waitForURL((u) => !u.search.includes('q='));
    await page.getByRole('link', { name: TITLE }).waitFor();
    await screenshot(page, 'library-wide');

    await resize(page, PHONE);
    await page.getByRole('list', { name: 'Designs' }).getByRole('link', { name: `Open ${TITLE}` }).waitFor({ timeout: 30000 });
    await screenshot(page, 'library-phone');
    await bringIntoView(shown(page.getByRole('list', { name: 'Designs' })));
    await screenshot(page, 'library-phone-cards');
    await page.getByRole('link', { name: `Open ${TITLE}` }).click();
    await shown(page.getByTestId('selected-revision')).waitFor({ timeout: 30000 });
    await shown(page.getByTestId('fit-notes')).waitFor();
    await screenshot(page, 'design-phone');
    await bringIntoView(shown(page.getByTestId('fit-notes')));
    await screenshot(page, 'design-phone-notes');
    await bringIntoView(shown(page.getByTestId('downloads')));
    await screenshot(page, 'design-phone-downloads');
    await bringIntoView(shown(page.getByTestId('revision-history')));
    await screenshot(page, 'design-phone-history');
    await resize(page, WIDE);
  });
});

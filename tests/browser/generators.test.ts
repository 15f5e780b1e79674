// Generator and calculator screens in the real web export: live preview, fit-report warnings with
// their fields flagged, field-level errors, the units toggle with fractional inch input, and a
// calculator result checked against an outside reference. Signed in: the charger insert filled
// from a device in the shop's catalog, with the clearance its fit history suggests.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_DEVICES, DEMO_SHOP } from '../../db/seed';
import type { RevisionInfo } from '../../shared/schemas/library';
import { formatLength } from '../../shared/units';
import { PHONE, WIDE, baseUrl, bringIntoView, openBrowser, pageApi, screenshot, signInOnPage } from './browser';

/** Opens a folded form section (phones start with only the first one open). */
async function openSection(page: Page, title: string) {
  const head = page.getByRole('button', { name: `${title} section` });
  if ((await head.getAttribute('aria-expanded')) === 'false') await head.click();
}

async function textOf(page: Page, testId: string): Promise<string> {
  return (await page.getByTestId(testId).first().innerText()).replace(/\s+/g, ' ');
}

// Signed in as the demo editor of the invented demo shop, with an invented device (db/seed.ts).
const EDITOR = DEMO_ACCOUNTS.find((a) => a.role === 'editor')!;
const device = DEMO_DEVICES.find((d) => d.name === 'Demo phone L')!;
const esc = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

describe('generator and calculator screens', () => {
  for (const [label, viewport] of [['phone', PHONE], ['wide', WIDE]] as const) {
    describe(label, () => {
      let b: Awaited<ReturnType<typeof openBrowser>>;
      const problems: string[] = [];
      beforeAll(async () => {
        b = await openBrowser(viewport);
        b.page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
        b.page.on('console', (m) => {
          // Signed out, the app frame's session check answers 401: expected, and not these screens.
          if (m.type() === 'error' && !/status of 401/.test(m.text())) problems.push(`console: ${m.text()}`);
        });
      });
      afterAll(async () => b?.close());

      it('an address naming no generator or calculator says so and leads back to the list', async () => {
        const { page } = b;
        for (const [kind, list] of [['generator', 'Charger insert plate'], ['calculator', 'Compound miter for a splayed box']] as const) {
          await page.goto(`${baseUrl()}/${kind}s/no-such-${kind}`);
          await page.getByText(`There is no ${kind} called “no-such-${kind}”.`).waitFor({ timeout: 30000 });
          await screenshot(page, `no-such-${kind}-${label}`);
          await page.getByRole('link', { name: `See all ${kind}s` }).click();
          await page.waitForURL(`**/${kind}s`);
          await page.getByRole('link', { name: list }).first().waitFor();
        }
      });

      it('charger insert: live preview, skin warning with flagged fields, bad input, inches with a fraction', async () => {
        const { page } = b;
        await page.goto(baseUrl() + '/generators');
        await page.getByText('Charger insert plate').first().waitFor({ timeout: 30000 });
        await page.getByText('Taper sled for legs').first().waitFor();
        await screenshot(page, `generators-list-${label}`);

        await page.getByRole('link', { name: 'Charger insert plate' }).click();
        await page.waitForURL('**/generators/charger-insert');
        await page.getByTestId('generator-drawing').waitFor({ timeout: 30000 });
        // Start in millimetres whatever an earlier run left in this profile.
        await page.getByRole('radio', { name: 'mm', exact: true }).click();

        // Defaults: 76 mm device + 2 × (1.5 case + 1 clearance) = 81 mm pocket width, 165 mm length.
        expect(await textOf(page, 'value-pocketWidth')).toContain('81 mm');
        expect(await page.getByLabel('Feature sizes').innerText()).toContain('81 × 165 mm');
        const pathsBefore = await page.getByTestId('generator-drawing').locator('svg path').evaluateAll((els) => els.map((e) => e.getAttribute('d')).join('|'));

        // The underside view shows the mirrored recess and channel, without the top pocket.
        await page.getByRole('radio', { name: 'Underside', exact: true }).click();
        await expect.poll(() => page.getByLabel('Layers').innerText()).toContain('Underside recess');
        expect(await page.getByLabel('Layers').innerText()).not.toContain('Pocket (top)');
        await page.getByRole('radio', { name: 'Top', exact: true }).click();
        await expect.poll(() => page.getByLabel('Layers').innerText()).toContain('Pocket (top)');

        await openSection(page, 'Device pocket');
        // Signed out there is no shop catalog to fill from: no picker, and the fields work as typed.
        expect(await page.getByTestId('device-fill').count()).toBe(0);
        const deviceWidth = page.getByLabel('Device width', { exact: true });
        await deviceWidth.fill('70');
        // The preview follows the form after a short pause: 70 + 5 = 75 mm.
        await expect.poll(() => textOf(page, 'value-pocketWidth')).toContain('75 mm');
        await expect.poll(() => page.getByLabel('Feature sizes').innerText()).toContain('75 × 165 mm');
        const pathsAfter = await page.getByTestId('generator-drawing').locator('svg path').evaluateAll((els) => els.map((e) => e.getAttribute('d')).join('|'));
        expect(pathsAfter).not.toBe(pathsBefore);

        // Skin over the pad: without a maker's range the guideline is 3 mm (REFERENCES.md, wireless
        // charging: "without one, warn above about 3 mm of skin", common practice).
        await openSection(page, 'Charger pad');
        expect(await page.getByTestId('warning-skin_too_thick').count()).toBe(0);
        await page.getByLabel('Skin over the pad', { exact: true }).fill('4');
        await page.getByTestId('warning-skin_too_thick').waitFor();
        expect(await textOf(page, 'warning-skin_too_thick')).toContain('over 3 mm');
        expect(await textOf(page, 'warning-skin_too_thick')).toContain('Skin over the pad');
        // The field the warning concerns is flagged in the form.
        expect(await textOf(page, 'field-Skin over the pad')).toContain('see report');

        // With the maker's range the warning follows it: 4 mm is inside 0–5 mm, outside 0–3.5 mm.
        await page.getByRole('switch', { name: 'Maker states a charging range' }).click();
        await expect.poll(() => page.getByTestId('warning-skin_too_thick').count()).toBe(0);
        await page.getByLabel('Rated range: maximum', { exact: true }).fill('3.5');
        await page.getByTestId('warning-skin_too_thick').waitFor();
        expect(await textOf(page, 'warning-skin_too_thick')).toContain('rated 3.5 mm');
        await screenshot(page, `charger-insert-warning-${label}`);

        // Bad input: a field-level message, and the report says it shows the last valid values.
        await deviceWidth.fill('seventy');
        await page.getByText('Enter a length like 12.5').waitFor();
        await page.getByText('Showing the last valid values').first().waitFor();
        await deviceWidth.fill('400');
        await page.getByText('Device width must be at most 300 mm').waitFor();
        await deviceWidth.fill('70');
        await expect.poll(() => page.getByText('Showing the last valid values').count()).toBe(0);

        // Inches: the field is rewritten (70 mm = 2.7559 in) and a fraction is read as typed.
        await page.getByRole('radio', { name: 'inches' }).click();
        await expect.poll(() => deviceWidth.inputValue()).toBe('2.7559');
        await deviceWidth.fill('3-1/4');
        // 3-1/4 in = 82.55 mm (1 in = 25.4 mm exactly, 16 CFR 500.19); pocket = 82.55 + 5 = 87.55 mm.
        const expected = formatLength(87.55, 'in', { digits: 4 });
        await expect.poll(() => textOf(page, 'value-pocketWidth')).toContain(expected);
        // Out of range in inches is stated in inches.
        await deviceWidth.fill('12');
        await page.getByText(/Device width must be at most 11\.811" \(300 mm\)/).waitFor();
        await deviceWidth.fill('3-1/4');
        await expect.poll(() => textOf(page, 'value-pocketWidth')).toContain(expected);
        // The warning's lengths follow the units too: 4 mm = 0.157", 3.5 mm = 0.138" (÷ 25.4, three places).
        expect(await textOf(page, 'warning-skin_too_thick')).toContain('The 0.157" skin is thicker than the charger’s rated 0.138"');
        await screenshot(page, `charger-insert-inches-${label}`);
        // So do the consistency checks: 5/8 in = 15.875 mm of skin + 3 mm pocket = 18.875 mm in an 18 mm
        // plate → 0.743" and 0.709" (÷ 25.4, three places).
        await page.getByLabel('Skin over the pad', { exact: true }).fill('5/8');
        await expect.poll(() => textOf(page, 'field-Skin over the pad')).toContain('Pocket depth + skin (0.743") leaves no room for a recess in a 0.709" plate');
        await page.getByLabel('Skin over the pad', { exact: true }).fill('0.157');
        await expect.poll(() => page.getByText('leaves no room for a recess').count()).toBe(0);

        // The unit choice is remembered on this browser.
        await page.reload();
        await page.getByTestId('generator-drawing').waitFor({ timeout: 30000 });
        expect(await page.getByRole('radio', { name: 'inches' }).getAttribute('aria-checked')).toBe('true');
        await page.getByRole('radio', { name: 'mm', exact: true }).click();
      });

      it('compound bevel: N = 4, splay 15° gives 43.08° blade tilt and 14.51° miter gauge', async () => {
        const { page } = b;
        await page.goto(baseUrl() + '/calculators');
        await page.getByRole('link', { name: 'Compound miter for a splayed box' }).click();
        await page.waitForURL('**/calculators/compound-bevel');
        await page.getByTestId('value-bladeTilt').waitFor({ timeout: 30000 });
        // Reference: REFERENCES.md, "Mitered box" — matches the compound-angle charts printed in
        // table-saw manuals. N = 4: 20° → 41.64° / 18.88°; 15° → 43.08° / 14.51°.
        await page.getByLabel('Sides', { exact: true }).fill('4');
        await page.getByLabel('Splay from vertical', { exact: true }).fill('20');
        await expect.poll(() => textOf(page, 'value-bladeTilt')).toContain('41.64°');
        expect(await textOf(page, 'value-miterGauge')).toContain('18.88°');
        await page.getByLabel('Splay from vertical', { exact: true }).fill('15');
        await expect.poll(() => textOf(page, 'value-bladeTilt')).toContain('43.08°');
        expect(await textOf(page, 'value-miterGauge')).toContain('14.51°');
        await page.getByLabel('Sides', { exact: true }).fill('2');
        await page.getByText('Sides must be at least 3').waitFor();
        await page.getByLabel('Sides', { exact: true }).fill('4');
        await expect.poll(() => page.getByText('Sides must be at least 3').count()).toBe(0);
        await screenshot(page, `calculator-compound-bevel-${label}`);
      });

      it('wood movement: 200 mm flatsawn white oak, 6 → 12 % MC swells 4.38 mm, with its source', async () => {
        const { page } = b;
        await page.goto(baseUrl() + '/calculators/wood-movement');
        await page.getByTestId('value-change').waitFor({ timeout: 30000 });
        await page.getByRole('radio', { name: 'mm', exact: true }).click();
        // Reference: USDA Wood Handbook FPL-GTR-190 Eq. 13-2, Table 13-5 (C_T 0.00365): 200 × 0.00365 × 6 = 4.380 mm.
        await page.getByLabel('Width', { exact: true }).fill('200');
        await expect.poll(() => textOf(page, 'value-change')).toContain('4.38 mm');
        expect(await page.getByTestId('calculator-results').innerText()).toContain('FPL-GTR-190 (2010), Table 13-5');
        await screenshot(page, `calculator-wood-movement-${label}`);
        expect(problems).toEqual([]);
      });

      it('fills the device fields, suggests the clearance from the test cuts, uses it, and the saved revision names the device', async () => {
        const { page } = b;
        const shops = await signInOnPage(page, EDITOR);
        const shop = shops.find((s) => s.name === DEMO_SHOP.name)!;
        await page.evaluate((id) => localStorage.setItem('jigwright.currentShop', id), shop.id);
        const history = (material: string) =>
          pageApi<{ suggestion: { clearanceMm: number; basis: string } | null }>(page, `/shops/${shop.id}/fit-history?${new URLSearchParams({ device: device.name, material })}`);

        await page.goto(baseUrl() + '/generators/charger-insert');
        await page.getByTestId('generator-drawing').waitFor({ timeout: 30000 });
        await page.getByRole('radio', { name: 'mm', exact: true }).click();
        await openSection(page, 'Device pocket');
        const field = (name: string) => page.getByLabel(name, { exact: true });
        const picker = page.getByRole('radiogroup', { name: 'Fill from a saved device' });
        // "Demo phone L · …", not "Demo phone L, rugged case · …".
        const option = picker.getByRole('radio', { name: new RegExp(`^${esc(device.name)} · `) });
        await option.click();

        // The four device fields now hold the saved dimensions (mm).
        await expect.poll(() => field('Device width').inputValue().then(Number)).toBe(device.width_mm);
        expect(Number(await field('Device length').inputValue())).toBe(device.length_mm);
        expect(Number(await field('Device thickness').inputValue())).toBe(device.thickness_mm);
        expect(Number(await field('Case allowance per side').inputValue())).toBe(device.case_allowance_mm);
        expect(await textOf(page, 'device-fill-status')).toContain(`Filled from ${device.name}`);

        // Plywood (the default stock) has no test cuts for this device: one short line says so.
        expect((await history('plywood')).suggestion).toBeNull();
        await page.getByTestId('workbench-suggested-clearance-none').waitFor({ timeout: 30000 });
        expect(await textOf(page, 'workbench-suggested-clearance-none')).toContain(`No test cuts with a clearance recorded for ${device.name} in plywood yet.`);

        // White oak has the seeded cuts (server/library/demoLibrary.ts: 0.5 mm tight, 0.8 mm good);
        // the suggestion itself is the server's (shared/fit/clearance.ts, common practice).
        await openSection(page, 'Stock');
        await page.getByRole('radio', { name: 'White oak', exact: true }).click();
        const s = (await history('white oak')).suggestion!;
        expect(s).not.toBeNull();
        const hint = page.getByTestId('workbench-suggested-clearance');
        await hint.waitFor({ timeout: 30000 });
        expect(await textOf(page, 'workbench-suggested-clearance')).toContain(`Fit history for ${device.name} in white oak: try ${formatLength(s.clearanceMm, 'mm', { digits: 2 })} per side`);
        const clearance = field('Pocket clearance per side');
        expect(Number(await clearance.inputValue())).not.toBe(s.clearanceMm);
        await bringIntoView(field('Device width'));
        await screenshot(page, `generator-device-fill-${label}`);

        await bringIntoView(hint);
        await screenshot(page, `generator-device-suggestion-${label}`);
        await page.getByTestId('workbench-suggested-clearance-use').click();
        await expect.poll(() => clearance.inputValue().then(Number)).toBe(s.clearanceMm);
        await page.getByTestId('workbench-suggested-clearance-in-use').waitFor();
        await bringIntoView(clearance);
        await screenshot(page, `generator-device-suggestion-used-${label}`);
        // Pocket width = device width + 2 · (case allowance + pocket clearance) (shared/generators/chargerInsert.ts).
        const pocket = device.width_mm + 2 * (device.case_allowance_mm + s.clearanceMm);
        await expect.poll(() => textOf(page, 'value-pocketWidth')).toContain(formatLength(pocket, 'mm', { digits: 2 }));

        // Typing over a filled field keeps the change; the device then reads as edited.
        await field('Device width').fill('80');
        await expect.poll(() => textOf(page, 'device-fill-status')).toContain(`${device.name} (edited)`);
        expect(await field('Device width').inputValue()).toBe('80');

        // In inches, choosing the device again fills its sizes in inches (÷ 25.4) and it is no longer edited.
        await page.getByRole('radio', { name: 'inches' }).click();
        await option.click();
        await expect.poll(() => field('Device width').inputValue()).toBe(formatLength(device.width_mm, 'in', { digits: 4 }).replace(/"$/, ''));
        expect(await textOf(page, 'device-fill-status')).toContain(`Filled from ${device.name}`);
        expect(Number(await clearance.inputValue())).toBeCloseTo(s.clearanceMm / 25.4, 4);
        await page.getByRole('radio', { name: 'mm', exact: true }).click();

        // On the phone the saved revision is made from edited sizes, on the wide screen from the saved ones.
        const edited = label === 'phone';
        if (edited) {
          await field('Case allowance per side').fill('2');
          await expect.poll(() => textOf(page, 'device-fill-status')).toContain('(edited)');
        }
        await page.getByLabel('Title of the new design').fill(`Device fill check (${label})`);
        await page.getByRole('button', { name: 'Save as new revision' }).click();
        await page.waitForURL(/\/designs\/[0-9a-f-]{36}/, { timeout: 30000 });
        const designId = new URL(page.url()).pathname.split('/').pop()!;
        const design = await pageApi<{ revisions: RevisionInfo[] }>(page, `/designs/${designId}`);
        const notes = design.revisions[0].fitNotes;
        expect(notes.device?.name).toBe(edited ? `${device.name} (edited)` : device.name);
        expect(notes.device?.width).toBe(device.width_mm);
        expect(notes.device?.length).toBe(device.length_mm);
        expect(notes.clearancePerSide).toBe(s.clearanceMm);
        expect(notes.stock?.material).toBe('white oak');

        // A new revision from a saved one starts with the device its fit notes name chosen, when the
        // catalog has it: the demo desk insert's latest revision fits the rugged-case phone (db/seed.ts).
        const rugged = DEMO_DEVICES.find((d) => d.name === 'Demo phone L, rugged case')!;
        const desk = (await pageApi<{ items: { title: string; latestRevisionId: string }[] }>(page, `/shops/${shop.id}/designs?q=${encodeURIComponent('Desk dock insert')}`)).items.find((d) => d.title === 'Desk dock insert')!;
        const from = await pageApi<RevisionInfo>(page, `/revisions/${desk.latestRevisionId}`);
        expect(from.fitNotes.device?.name).toBe(rugged.name);
        await page.goto(`${baseUrl()}/generators/charger-insert?revision=${from.id}`);
        await page.getByTestId('generator-drawing').waitFor({ timeout: 30000 });
        await openSection(page, 'Device pocket');
        const ruggedOption = picker.getByRole('radio', { name: new RegExp(`^${esc(rugged.name)} · `) });
        await expect.poll(() => ruggedOption.getAttribute('aria-checked')).toBe('true');
        expect(await textOf(page, 'device-fill-status')).toContain(`Filled from ${rugged.name}`);
        expect(Number(await field('Case allowance per side').inputValue())).toBe(rugged.case_allowance_mm);
        // Its stock is white oak (from.fitNotes); whatever the history holds, the line matches the server's answer.
        const ruggedHistory = await pageApi<{ suggestion: { clearanceMm: number } | null }>(page, `/shops/${shop.id}/fit-history?${new URLSearchParams({ device: rugged.name, material: 'white oak' })}`);
        if (ruggedHistory.suggestion) await page.getByTestId('workbench-suggested-clearance').getByText(formatLength(ruggedHistory.suggestion.clearanceMm, 'mm', { digits: 2 }), { exact: false }).first().waitFor();
        else await page.getByTestId('workbench-suggested-clearance-none').getByText(`${rugged.name} in white oak`, { exact: false }).waitFor();
        expect(problems).toEqual([]);
      });
    });
  }
});

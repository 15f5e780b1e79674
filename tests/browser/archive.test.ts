// The shop archive panel on the members screen: an owner imports an archive, imports the same file
// again and is told plainly that the shop has it already (when, by whom, how many designs, nothing
// added), then chooses to import it again as copies. Everything here is invented: the person, the
// shop and its one design.
import { afterEach, describe, expect, it } from 'vitest';
import { uniqueEmail } from '../support/accounts';
import { PHONE, WIDE, baseUrl, bringIntoView, openBrowser, pageApi, screenshot } from './browser';

type Browser = Awaited<ReturnType<typeof openBrowser>>;
const open: Browser[] = [];
afterEach(async () => {
  await Promise.all(open.splice(0).map((b) => b.close()));
});

describe('shop archive import in the browser', () => {
  it('a second import of the same archive is explained, adds nothing, and can be done again as copies', async () => {
    const b = await openBrowser(WIDE);
    open.push(b);
    const page = b.page;
    await page.goto(baseUrl() + '/help/safety');
    const person = { email: uniqueEmail('archivist'), password: 'spokeshave-blade-31', name: 'Tamsin Reed' };
    const signedUp = await page.evaluate(async (body) => {
      const r = await fetch('/api/auth/sign-up', { method: 'POST', credentials: 'include', headers: { 'Content-Type': 'application/json', 'X-Jigwright-CSRF': '1' }, body: JSON.stringify(body) });
      return r.status;
    }, person);
    expect(signedUp).toBe(201);
    const { shop } = await pageApi<{ shop: { id: string } }>(page, '/shops', { method: 'POST', json: { name: 'Hollin Lane Bench' } });
    await pageApi(page, `/shops/${shop.id}/designs`, { method: 'POST', json: { kind: 'jig', title: 'Hollin Lane drill guide' } });
    const designs = async () => (await pageApi<{ items: unknown[] }>(page, `/shops/${shop.id}/designs`)).items.length;

    // The shop's own archive, downloaded as the page would.
    const base64 = await page.evaluate(async (shopId) => {
      const r = await fetch(`/api/shops/${shopId}/archive`, { credentials: 'include' });
      if (!r.ok) throw new Error(`archive download answered ${r.status}`);
      const bytes = new Uint8Array(await r.arrayBuffer());
      let s = '';
      for (const x of bytes) s += String.fromCharCode(x);
      return btoa(s);
    }, shop.id);
    const archive = { name: 'hollin-lane-bench-library.tar.gz', mimeType: 'application/gzip', buffer: Buffer.from(base64, 'base64') };

    await page.goto(baseUrl() + '/shop/members');
    const panel = page.getByTestId('shop-archive');
    await panel.waitFor({ timeout: 30000 });
    await bringIntoView(panel);
    const input = panel.locator('input[type=file]');

    await input.setInputFiles(archive);
    const imported = page.getByTestId('archive-imported');
    await imported.waitFor({ timeout: 30000 });
    expect(await imported.textContent()).toContain('1 design');
    expect(await designs()).toBe(2);

    // The same file again: the server's answer, shown as it is, and nothing added.
    await input.setInputFiles(archive);
    const already = page.getByTestId('archive-already');
    await already.waitFor({ timeout: 30000 });
    const text = (await already.textContent()) ?? '';
    expect(text).toContain('already imported into this shop');
    expect(text).toContain('by Tamsin Reed');
    expect(text).toContain('with 1 design');
    expect(text).toContain('Nothing was added');
    await page.getByText('This archive is already in this shop').waitFor();
    await bringIntoView(page.getByTestId('archive-import-again'));
    await screenshot(page, 'archive-already-imported-wide');
    expect(await designs()).toBe(2);

    // Chosen on purpose: a further copy.
    await page.getByRole('button', { name: 'Import hollin-lane-bench-library.tar.gz again as a second copy of every design in it' }).click();
    await page.getByText('Imported hollin-lane-bench-library.tar.gz again, as copies').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('archive-already').count()).toBe(0);
    expect(await designs()).toBe(3);

    // On a phone: once more, and this time left as it is. The message now counts the copy.
    await page.setViewportSize(PHONE);
    await input.setInputFiles(archive);
    await already.waitFor({ timeout: 30000 });
    expect((await already.textContent()) ?? '').toContain('Nothing was added');
    await bringIntoView(page.getByTestId('archive-leave'));
    await screenshot(page, 'archive-already-imported-phone');
    await page.getByTestId('archive-leave').click();
    await expect.poll(() => page.getByTestId('archive-already').count()).toBe(0);
    expect(await designs()).toBe(3);
  });
});

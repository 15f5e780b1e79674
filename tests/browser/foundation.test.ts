import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PHONE, WIDE, baseUrl, openBrowser, screenshot } from './browser';

describe('web app served by Express', () => {
  for (const [label, viewport] of [['phone', PHONE], ['wide', WIDE]] as const) {
    describe(label, () => {
      let b: Awaited<ReturnType<typeof openBrowser>>;
      beforeAll(async () => {
        b = await openBrowser(viewport);
      });
      afterAll(async () => b?.close());

      it('shows live service status in the shipped font and follows a link to a deep route', async () => {
        const { page } = b;
        await page.goto(baseUrl() + '/');
        await page.getByText('Database: up').waitFor({ timeout: 30000 });
        await page.getByText('File store: up').waitFor();
        await page.getByText('Mail: up').waitFor();
        // The font is bundled with the app; check it is loaded and applied.
        const fontOk = await page.evaluate(async () => {
          await document.fonts.ready;
          return document.fonts.check('16px IBMPlexSans_400Regular');
        });
        expect(fontOk).toBe(true);
        const family = await page.getByText('Service status').evaluate((el) => getComputedStyle(el).fontFamily);
        expect(family).toContain('IBMPlexSans');
        await screenshot(page, `home-${label}`);

        await page.getByText('Read the shop safety notes').click();
        await page.waitForURL('**/help/safety');
        await page.getByText('Chargers inside furniture').waitFor();
        await screenshot(page, `safety-${label}`);
      });

      it('answers an unknown route with the not-found screen, and a deep link loads directly', async () => {
        const { page } = b;
        await page.goto(baseUrl() + '/no/such/bench');
        await page.getByText('Nothing on this bench').waitFor({ timeout: 30000 });
        await page.goto(baseUrl() + '/help/safety');
        await page.getByText('Mains wiring').waitFor({ timeout: 30000 });
      });
    });
  }
});

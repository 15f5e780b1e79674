// Debian's Chromium driven by playwright-core (never a downloaded browser).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { repoRoot } from '../../scripts/lib/services.mjs';

export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1280, height: 800 };
export const artifactsDir = path.join(repoRoot, 'test-artifacts', 'screenshots');

export function baseUrl(): string {
  const u = process.env.E2E_BASE_URL;
  if (!u) throw new Error('E2E_BASE_URL not set: run through vitest.browser.config.mts');
  return u;
}

export async function openBrowser(viewport = PHONE): Promise<{ context: BrowserContext; page: Page; close(): Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
    acceptDownloads: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return {
    context,
    page,
    async close() {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(artifactsDir, { recursive: true });
  const file = path.join(artifactsDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/**
 * Sets the window size and waits until the page has laid itself out again: the app swaps between
 * its phone and wide layouts at a breakpoint, which remounts parts of the screen.
 */
export async function resize(page: Page, viewport: { width: number; height: number }): Promise<void> {
  await page.setViewportSize(viewport);
  await page.waitForFunction((w) => window.innerWidth === w, viewport.width);
  await page.evaluate(() => new Promise<void>((r) => requestAnimationFrame(() => requestAnimationFrame(() => r()))));
}

/** Scrolls an element into view, trying again if a re-render replaced it while it was found. */
export async function bringIntoView(locator: Locator): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await locator.scrollIntoViewIfNeeded({ timeout: 10_000 });
      return;
    } catch (e) {
      if (attempt >= 5 || !/not attached/i.test(String((e as Error).message))) throw e;
      await new Promise((r) => setTimeout(r, 200));
    }
  }
}

/** A JSON call from the page with its session and the CSRF header; throws on a non-2xx answer. */
export async function pageApi<T>(page: Page, path: string, init: { method?: string; json?: unknown } = {}): Promise<T> {
  const out = await page.evaluate(
    async ({ path, init }) => {
      const r = await fetch('/api' + path, {
        method: init.method ?? 'GET',
        credentials: 'include',
        headers: { Accept: 'application/json', 'X-Jigwright-CSRF': '1', ...(init.json !== undefined ? { 'Content-Type': 'application/json' } : {}) },
        body: init.json !== undefined ? JSON.stringify(init.json) : undefined,
      });
      return { status: r.status, body: await r.text() };
    },
    { path, init },
  );
  if (out.status >= 300) throw new Error(`${init.method ?? 'GET'} ${path}: ${out.status} ${out.body}`);
  return JSON.parse(out.body) as T;
}

/** Signs in from the page itself (fetch with credentials), so the cookie is the page's own; answers the person's shops. */
export async function signInOnPage(page: Page, who: { email: string; password: string }): Promise<{ id: string; name: string; role: string }[]> {
  await page.goto(baseUrl() + '/help/safety');
  const body = { email: who.email, password: who.password };
  const status = await page.evaluate(async (body) => {
    await fetch('/api/auth/sign-out', { method: 'POST', credentials: 'include', headers: { 'X-Jigwright-CSRF': '1' } }).catch(() => null);
    const r = await fetch('/api/auth/sign-in', { method: 'POST', credentials: 'include', headers: { 'Content-Type': 'application/json', 'X-Jigwright-CSRF': '1' }, body: JSON.stringify(body) });
    return r.status;
  }, body);
  if (status !== 200) throw new Error(`sign-in as ${who.email} answered ${status}`);
  return (await pageApi<{ shops: { id: string; name: string; role: string }[] }>(page, '/me')).shops;
}

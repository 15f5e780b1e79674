// Debian's Chromium driven by playwright-core (never a downloaded browser).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
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

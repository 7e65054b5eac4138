/** Launches Debian's Chromium for the e2e tests (flags that work as root, offline). */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, selectors } from 'playwright-core';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { CHROMIUM_PATH } from '../../build/scripts/ensure-chromium.mjs';

export { CHROMIUM_PATH };

/** Folder for screenshots and other e2e artefacts. */
export const ARTIFACTS = join(process.cwd(), 'out', 'test-output');

/** Launches Chromium (playwright gives it a fresh profile). Test ids are `data-test`. */
export async function launch(): Promise<Browser> {
  selectors.setTestIdAttribute('data-test');
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/**
 * Registers the suite's hooks: before its tests, makes the artefact folder and launches
 * Chromium; after them, closes it. Returns the running browser (throws before launch).
 */
export function useBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    browser = await launch();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('Chromium is not running: useBrowser() launches it in beforeAll.');
    return browser;
  };
}

/** Opens a page and collects page errors so a test can assert there were none. */
export async function openPage(browser: Browser, url: string): Promise<{ page: Page; errors: string[] }> {
  const page = await browser.newPage({ viewport: { width: 1360, height: 860 } });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  await page.goto(url);
  return { page, errors };
}

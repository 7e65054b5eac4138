/** Launches Debian's Chromium for the e2e tests (flags that work as root, offline). */
import { join } from 'node:path';
import { chromium, selectors } from 'playwright-core';
import type { Browser, Page } from 'playwright-core';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

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

import { describe, expect, inject, it } from 'vitest';
import { join } from 'node:path';
import { ARTIFACTS, openPage, useBrowser } from './chromium';

describe('browser preview shell', () => {
  const browser = useBrowser();

  it('loads the demo plant, shows engine figures and the caution, switches views', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    // 1250 kVA at 400 V: I = S / (√3 V) = 1804.2 A (closed form), computed by the engine in the Web Worker.
    await expect.poll(() => page.locator('[data-test="rated-row-G1"] [data-test="rated-current"]').textContent()).toBe('1804.2');
    expect(await page.getByTestId('status-plant').textContent()).toContain('50 Hz · 400 V');
    expect(await page.getByTestId('caution').textContent()).toContain('planning and training only');
    expect(await page.getByTestId('status-bar').textContent()).toContain('engine: browser preview');
    await page.screenshot({ path: join(ARTIFACTS, 'shell-plant.png'), fullPage: true });
    for (const id of ['sharing', 'synchronizing', 'transients', 'trainer', 'report', 'plant']) {
      await page.getByTestId(`nav-${id}`).click();
      expect(await page.getByTestId(`nav-${id}`).getAttribute('aria-current')).toBe('page');
    }
    expect(errors).toEqual([]);
  });
});

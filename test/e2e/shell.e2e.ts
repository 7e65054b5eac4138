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

  it("edits a load's voltage law (ZIP shares) and its under-frequency shedding stage in the Plant view", async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    await page.locator('[data-test="field-loads[0].model"]').selectOption('zip');
    await page.locator('[data-test="field-loads[0].kWImpedancePct"]').fill('30');
    await page.locator('[data-test="field-loads[0].kWCurrentPct"]').fill('20');
    // The constant-power share is the rest: 100 − 30 − 20 = 50 % (closed form).
    await expect.poll(() => page.getByTestId('load-kw-power-share-0').textContent()).toBe('50.0');
    await page.locator('[data-test="field-loads[0].shedFrequencyPct"]').fill('97');
    // 97 % of 50 Hz = 48.50 Hz (closed form).
    await expect.poll(() => page.getByTestId('load-shed-hz-0').textContent()).toBe('(48.50 Hz)');
    await page.locator('[data-test="field-loads[0].shedFrequencyPct"]').fill('100');
    await expect.poll(() => page.getByTestId('load-detail-0').textContent()).toContain('must be below 100 %');
    await page.getByTestId('load-detail-0').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(ARTIFACTS, 'plant-loads.png') });
    expect(errors).toEqual([]);
  });
});

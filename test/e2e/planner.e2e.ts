/**
 * The Planner view in the browser preview (engine in the Web Worker): plan the demo plant over
 * its default 0–100 % load range (full load is inside the sets' overload limits), apply the proposal and read the new settings back in the Plant store's results,
 * compute the sensitivity matrix, run a tolerance analysis to the end (with progress, on the engine worker's pool
 * of nested Web Workers) and cancel a long one; screenshots to out/test-output/.
 */
import { describe, expect, inject, it } from 'vitest';
import { join } from 'node:path';
import { ARTIFACTS, openPage, useBrowser } from './chromium';

describe('Planner view in the browser preview', () => {
  const browser = useBrowser();

  it('plans, applies, shows sensitivity and tolerance results, and cancels a long run', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('set-sheet').waitFor();
    await page.getByTestId('nav-planner').click();
    const view = page.locator('section.planner-view');
    await view.waitFor();

    expect(await page.getByTestId('load-max').inputValue()).toBe('100'); // the default range, 0–100 %
    await page.getByTestId('plan').click();
    // Wait for the settled state (the plan has come back), not the first change.
    await page.locator('section.planner-view[data-plan-state="done"]').waitFor();
    await expect.poll(() => page.getByTestId('plan-verdict').textContent()).toContain('holds both bands');
    const table = (await page.getByTestId('plan-table').textContent()) ?? '';
    expect(table).toContain('→');
    await page.screenshot({ path: join(ARTIFACTS, 'planner-view.png') });
    await page.getByTestId('sensitivity').click();
    await page.getByTestId('sens-kWPerSpeed').waitFor();
    expect(await page.getByTestId('sens-kWPerSpeed').textContent()).toContain('(largest)');

    await page.getByTestId('tol-samples').fill('2000');
    await page.getByTestId('tol-run').click();
    await page.locator('section.planner-view[data-tolerance-state="done"]').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('tol-probabilities').textContent()).toContain('2000 samples');
    // The samples ran on the engine worker's pool: one nested worker per core (four chunks of 500 samples).
    const cores = await page.evaluate(() => navigator.hardwareConcurrency);
    expect(page.workers().filter((w) => w.url().includes('pool.worker')).length).toBe(Math.min(cores, 4));
    await page.getByTestId('tol-histogram').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(ARTIFACTS, 'planner-tolerance.png') });

    // A long run can be cancelled while its progress shows.
    await page.getByTestId('tol-samples').fill('200000');
    await page.getByTestId('tol-run').click();
    await page.getByTestId('tol-progress').waitFor();
    await page.getByTestId('tol-cancel').click();
    await page.locator('section.planner-view[data-tolerance-state="cancelled"]').waitFor({ timeout: 30_000 });

    // Apply: one edit, and Undo brings today's settings back.
    await page.getByTestId('apply').click();
    await page.getByTestId('applied-note').waitFor();
    expect(errors).toEqual([]);
  }, 120_000);
});

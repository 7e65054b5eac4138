/**
 * The Commissioning view in the browser preview (engine in the Web Worker): import the shipped
 * example record through the file picker, take the guessed columns, describe the test, fit,
 * apply the fitted values (one undoable edit) and make the commissioning record; screenshots
 * to out/test-output/ (also of the top bar with eight views at 1360 px).
 */
import { describe, expect, inject, it } from 'vitest';
import { join } from 'node:path';
import { ARTIFACTS, openPage, useBrowser } from './chromium';

describe('Commissioning view in the browser preview', () => {
  const browser = useBrowser();

  it('imports the example record, fits, applies and makes the record', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('set-sheet').waitFor();
    // The nav holds eight views on one line at 1360 px.
    await page.locator('header.top').screenshot({ path: join(ARTIFACTS, 'commissioning-top-bar.png') });
    const navHeight = await page.locator('nav[aria-label="Views"]').evaluate((n) => n.getBoundingClientRect().height);
    const buttonHeight = await page.getByTestId('nav-plant').evaluate((n) => n.getBoundingClientRect().height);
    expect(navHeight).toBeLessThan(buttonHeight * 1.5);
    await page.getByTestId('nav-commissioning').click();
    const view = page.locator('section.commissioning-view');
    await view.waitFor();

    await page.getByTestId('record-file').setInputFiles(join(process.cwd(), 'renderer/demo/example.load-bank.csv'));
    await page.getByTestId('import-dialog').waitFor();
    await expect.poll(() => page.getByTestId('import-ok').textContent()).toContain('401 samples over 8 s');
    await page.screenshot({ path: join(ARTIFACTS, 'commissioning-import.png') });
    await page.getByTestId('import-accept').click();

    // The test as the example's comment lines describe it (the kW column gives the step's time: 2.01 s, between two samples).
    await page.getByTestId('test-set').selectOption('G1');
    await page.getByTestId('test-start-kw').fill('250');
    await page.getByTestId('test-start-kvar').fill('150');
    await page.getByTestId('test-step-kw').fill('500');
    await page.getByTestId('test-step-kvar').fill('300');
    await page.getByTestId('test-step-at').fill('2.01');
    await page.getByTestId('fit-run').click();
    await page.locator('section.commissioning-view[data-fit-state="done"]').waitFor({ timeout: 90_000 });
    const values = (await page.getByTestId('fit-values').textContent()) ?? '';
    expect(values).toContain('inertia constant H');
    expect(values).not.toContain('NaN');
    expect(await page.getByTestId('measured-verdict').textContent()).toContain('class G2');
    await page.getByTestId('fit-values').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(ARTIFACTS, 'commissioning-fit.png'), fullPage: false });

    await page.getByTestId('fit-apply').click();
    await page.getByTestId('fit-applied').waitFor();

    await page.getByTestId('signoff-by').fill('A. Technician');
    await page.getByTestId('record-build').click();
    await page.getByTestId('record').waitFor();
    expect(await page.getByTestId('record').textContent()).toContain('A. Technician');
    // The load-bank test section: measured figures beside the model's.
    await page.locator('[data-test="record"] caption', { hasText: 'Load-bank test' }).evaluate((c) => c.scrollIntoView({ block: 'start' }));
    await page.screenshot({ path: join(ARTIFACTS, 'commissioning-record.png') });
    expect(errors).toEqual([]);
  }, 180_000);
});

import { describe, expect, inject, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { ARTIFACTS, openPage, useBrowser } from './chromium';

async function download(page: Page, testId: string): Promise<{ name: string; text: string }> {
  const [d] = await Promise.all([page.waitForEvent('download'), page.getByTestId(testId).click()]);
  const path = join(ARTIFACTS, d.suggestedFilename());
  await d.saveAs(path);
  return { name: d.suggestedFilename(), text: readFileSync(path, 'utf8') };
}

/** A screenshot of the whole view: the shell scrolls inside <main>, so the window is made tall first. */
async function tall(page: Page, name: string): Promise<void> {
  const height = await page.evaluate(() => document.querySelector('main')!.scrollHeight + 200);
  await page.setViewportSize({ width: 1360, height: Math.min(height, 6000) });
  await page.screenshot({ path: join(ARTIFACTS, name) });
  await page.setViewportSize({ width: 1360, height: 860 });
}

describe('transients and report in the browser preview', () => {
  const browser = useBrowser();

  it('runs a scenario, plots it, zooms, reads the cursor and exports CSV', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    await page.getByTestId('nav-transients').click();
    await page.getByTestId('scenario-editor').waitFor();
    // A shorter run keeps the test quick: 6 s of the starter block-load step.
    await page.getByTestId('scenario-duration').fill('6');
    // Drag the event's mark to the middle of the time line (3 s), then back to 1 s by typing.
    const track = (await page.locator('[data-test="event-timeline"] .track').boundingBox())!;
    const mark = (await page.getByTestId('timeline-mark-0').boundingBox())!;
    await page.mouse.move(mark.x + mark.width / 2, mark.y + mark.height / 2);
    await page.mouse.down();
    await page.mouse.move(track.x + track.width * 0.3, mark.y + mark.height / 2, { steps: 4 });
    await page.mouse.move(track.x + track.width * 0.5, mark.y + mark.height / 2, { steps: 4 });
    await page.mouse.up();
    expect(Number(await page.getByTestId('event-at').inputValue())).toBeCloseTo(3, 1);
    await page.getByTestId('event-at').fill('1');
    await page.getByTestId('run').click();
    await page.getByTestId('plot-frequency').waitFor({ timeout: 30_000 });
    await page.getByTestId('metrics-table').waitFor();
    expect(await page.getByTestId('run-status').textContent()).toContain('Run 1');
    // The plot has drawn something: the canvas is not one flat colour.
    const inked = await page.locator('[data-test="plot-frequency"] canvas').evaluate((c: HTMLCanvasElement) => {
      const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      const first = d.slice(0, 4).join();
      let other = 0;
      for (let i = 0; i < d.length; i += 4 * 97) if (d.slice(i, i + 4).join() !== first) other++;
      return other;
    });
    expect(inked).toBeGreaterThan(20);
    const verdicts = await page.locator('[data-test="class-table-A"] [data-test="verdict-G2"]').allTextContents();
    expect(verdicts.length).toBeGreaterThan(0);
    for (const v of verdicts) expect(v).toMatch(/meets|fails|not judged/);

    // Cursor readout follows the pointer; the wheel zooms every plot's time axis.
    const box = (await page.locator('[data-test="plot-frequency"] canvas').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.4, box.y + box.height * 0.4);
    await expect.poll(() => page.getByTestId('cursor-readout').textContent()).toContain('At the cursor');
    const t = Number(await page.getByTestId('readout-t').first().textContent());
    expect(t).toBeGreaterThan(0.5);
    expect(t).toBeLessThan(5);
    await page.mouse.wheel(0, -300);
    await expect.poll(() => page.locator('.hint').textContent()).toMatch(/Showing \d+\.\d+–\d+\.\d+ s/);
    await tall(page, 'transients-run.png');

    const csv = await download(page, 'export-series-csv');
    expect(csv.name).toMatch(/^run-1-block-load-step-series\.csv$/);
    const lines = csv.text
      .replace(/^\ufeff/, '')
      .trim()
      .split('\r\n');
    expect(lines[0]).toBe('t (s),frequency (Hz),bus voltage (V),G1 kW,G1 kVAR,G1 current (A),G2 kW,G2 kVAR,G2 current (A),G3 kW,G3 kVAR,G3 current (A)');
    expect(lines.length).toBeGreaterThan(100);
    const last = lines[lines.length - 1]!.split(',').map(Number);
    expect(last[0]).toBeCloseTo(6, 1);
    expect(last[1]).toBeGreaterThan(45);

    // A second run with a larger block, compared with the first.
    await page.getByTestId('event-kW').fill('700');
    await page.getByTestId('run').click();
    await expect.poll(() => page.getByTestId('run-status').textContent(), { timeout: 30_000 }).toContain('Run 2');
    await page.getByTestId('metrics-head-B').waitFor();
    await tall(page, 'transients-compare.png');
    await page.emulateMedia({ colorScheme: 'dark' });
    await tall(page, 'transients-compare-dark.png');
    await page.emulateMedia({ colorScheme: 'light' });
    // A blank required field is named with its rule, and Run turns off.
    await page.getByTestId('event-kW').fill('');
    await expect.poll(() => page.getByTestId('scenario-issues').textContent()).toContain('event 1, active power: must be a number');
    await expect.poll(() => page.getByTestId('run').isDisabled()).toBe(true);
    await page.getByTestId('scenario-editor').screenshot({ path: join(ARTIFACTS, 'transients-editor-invalid.png') });
    expect(errors).toEqual([]);
  });

  it('builds the report, shows every section and exports a table as CSV', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    await page.getByTestId('nav-report').click();
    await page.getByTestId('report-use-scenarios').uncheck();
    await page.getByTestId('report-build').click();
    await page.getByTestId('report-sections').waitFor({ timeout: 60_000 });
    const sections = await page.getByTestId('report-sections').textContent();
    for (const s of ['Plant and generating sets', 'Load sharing', 'Droop lines', 'Sync-check', 'Transient metrics', 'Definitions', 'Cautions'])
      expect(sections).toContain(s);
    const page1 = page.getByTestId('report-page');
    await expect.poll(() => page1.evaluate((el) => el.shadowRoot?.querySelectorAll('section').length ?? 0)).toBe(8);
    expect(await page1.evaluate((el) => getComputedStyle(el.shadowRoot!.querySelector('h2')!).borderBottomStyle)).toBe('solid');
    const csv = await download(page, 'report-csv-sharing-bus');
    expect(csv.text.replace(/^\ufeff/, '').split('\r\n')[0]).toBe('Load,Load kW,Load kVAR,Bus frequency (Hz),Bus voltage (V),Notes');
    const png = await download(page, 'report-png-droop-speed');
    expect(png.name).toMatch(/droop-speed\.png$/);
    await tall(page, 'report.png');
    // Printing from the Report view prints the report alone (the shell's bars and the options hide).
    await page.evaluate(() => document.body.classList.add('print-report'));
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('header.top').evaluate((el) => getComputedStyle(el).display)).toBe('none');
    expect(await page.locator('.controls').evaluate((el) => getComputedStyle(el).display)).toBe('none');
    expect(await page1.evaluate((el) => el.shadowRoot!.querySelector('.caution')!.textContent)).toContain('planning and training only');
    await page.screenshot({ path: join(ARTIFACTS, 'report-print.png') });
    await page.emulateMedia({ media: 'screen' });
    expect(errors).toEqual([]);
  });
});

/**
 * The Plant and Sharing views in the browser preview (Chromium, engine in the Web Worker):
 * a droop edit in the set sheet moves the bus frequency by what the droop lines predict,
 * the load slider recomputes, a refused field keeps the last valid results; screenshots of
 * both views (light and dark) and the edit-to-result latency go to out/test-output/.
 */
import { describe, expect, inject, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { ARTIFACTS, openPage, useBrowser } from './chromium';
import { demoPlant } from '../helpers/plants';
import { solveSharingAtMost } from '../../electron/engine';

const num = async (page: Page, testId: string): Promise<number> => parseFloat((await page.getByTestId(testId).first().textContent()) ?? 'NaN');

/**
 * Waits until the Sharing view shows the result for the current plant and `loadPct` (the
 * slider position, or 'plant' for the plant's own loads) and nothing newer is on its way,
 * then returns the bus frequency it shows. Results stream in while a slider moves or an edit
 * lands, so a figure read on the first change may be an intermediate one; this reads the
 * settled one (and checks that a second read agrees).
 */
async function settledBusHz(page: Page, loadPct: string = 'plant'): Promise<number> {
  const view = page.locator(`[data-test="sharing-view"][data-state="settled"][data-load-pct="${loadPct}"]`);
  await view.waitFor();
  const first = await num(page, 'bus-frequency');
  await expect.poll(() => num(page, 'bus-frequency')).toBe(first);
  expect(await page.getByTestId('sharing-view').getAttribute('data-state')).toBe('settled');
  return first;
}

/**
 * Bus frequency of droop sets sharing a total output P (closed form, the speed-droop
 * definition): each set gives P_i = k_i (f_nl,i − f) with
 * k_i = ratedKW_i / (droop_i/100 × f_rated), and Σ P_i = P, so f = (Σ k_i f_nl,i − P) / Σ k_i.
 */
function droopBusHz(sets: { ratedKW: number; droopPct: number; noLoadHz: number }[], ratedHz: number, totalKW: number): number {
  let sumK = 0;
  let sumKF = 0;
  for (const s of sets) {
    const k = s.ratedKW / ((s.droopPct / 100) * ratedHz);
    sumK += k;
    sumKF += k * s.noLoadHz;
  }
  return (sumKF - totalKW) / sumK;
}

describe('Plant and Sharing views in the browser preview', () => {
  const browser = useBrowser();

  it('moves the bus frequency by what the droop lines predict when a droop % is edited', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('set-sheet').waitFor();
    await expect.poll(() => page.getByTestId('plant-bus').textContent()).toContain('Hz');

    await page.getByTestId('nav-sharing').click();
    await page.getByTestId('sharing-table').waitFor();
    const f0 = await settledBusHz(page);
    const p0 = await num(page, 'total-kw');

    // Edit G1's speed droop from 4 % to 5 % in the set sheet.
    await page.getByTestId('nav-plant').click();
    const droop = page.locator('[data-test="field-sets[0].governor.droopPct"]');
    await droop.fill('5');
    await droop.blur();
    await page.getByTestId('nav-sharing').click();
    // Wait for the result of the edited plant (checked and solved), not for the first change.
    const f1 = await settledBusHz(page);
    expect(f1).not.toBe(f0);

    const plant = demoPlant();
    const sets = plant.sets.map((s) => ({ ratedKW: s.ratedKW, droopPct: s.governor.droopPct, noLoadHz: s.governor.noLoadHz }));
    // Before the edit the closed form through the shown total output gives the shown frequency.
    expect(Math.abs(droopBusHz(sets, 50, p0) - f0)).toBeLessThanOrEqual(0.0006);
    sets[0]!.droopPct = 5;
    // Predicted with the total output before the edit (load + feeder losses); the losses shift by
    // a fraction of a kW when the split changes, under 0.001 Hz here, hence the tolerance.
    const predicted = droopBusHz(sets, 50, p0);
    expect(Math.abs(f1 - predicted)).toBeLessThanOrEqual(0.002);
    expect(Math.abs(f1 - f0 - (predicted - f0))).toBeLessThanOrEqual(0.002);
    // A meaningful change: about −0.13 Hz for the demo plant.
    expect(f1 - f0).toBeLessThan(-0.1);
    await page.setViewportSize({ width: 1360, height: 1900 });
    await page.screenshot({ path: join(ARTIFACTS, 'sharing-view.png') });
    await page.setViewportSize({ width: 1360, height: 860 });

    // Export CSV downloads a file carrying the shown bus frequency; copy says what it did.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-csv').click()]);
    expect(download.suggestedFilename()).toBe('kestrel-ford-water-treatment-works-demo-sharing.csv');
    const csv = readFileSync((await download.path())!, 'utf8');
    const busLine = csv.split('\r\n')[1]!.split(',');
    expect(busLine[0]).toBe('bus frequency (Hz)');
    expect(parseFloat(busLine[1]!).toFixed(3)).toBe(f1.toFixed(3));
    await page.getByTestId('copy-text').click();
    await expect.poll(() => page.getByTestId('export-note').textContent()).toMatch(/copied as text|clipboard is not available/);
    expect(errors).toEqual([]);
  });

  it('the load slider at 100 % and 110 % shows a table: full load, and the most the sets can carry beyond it, said in words', async () => {
    const { page, errors } = await openPage(browser(), `${inject('previewUrl')}#/sharing`);
    await page.getByTestId('sharing-table').waitFor();
    const plant = demoPlant();
    const ratedKW = plant.sets.reduce((a, s) => a + (s.online ? s.ratedKW : 0), 0);
    const setSlider = (pct: number) =>
      page.getByTestId('load-slider').evaluate((el, v) => {
        const input = el as HTMLInputElement;
        input.value = String(v);
        input.dispatchEvent(new Event('input', { bubbles: true }));
      }, pct);
    // The expected figures, from the engine itself (the same plant, the slider's load at the plant loads' kVAR/kW).
    const qPerP = plant.loads.reduce((a, l) => a + l.kVAR, 0) / plant.loads.reduce((a, l) => a + l.kW, 0);
    const at = (pct: number) => solveSharingAtMost(plant, { kW: (ratedKW * pct) / 100, kVAR: ((ratedKW * pct) / 100) * qPerP });

    await setSlider(100);
    const full = at(100);
    expect(full.capped).toBeUndefined();
    // Settled when the readout says 100 % and the table shows that load.
    await expect
      .poll(async () => [(await page.getByTestId('load-readout').textContent())?.includes('100.0 %'), await page.getByTestId('total-load-kw').textContent()])
      .toEqual([true, full.totals.loadKW.toFixed(1)]);
    expect(await page.getByTestId('share-row-G1').getByTestId('share-kw').textContent()).toBe(full.sets[0]!.kW.toFixed(1));
    await expect(page.getByTestId('sharing-error').count()).resolves.toBe(0);

    await setSlider(110);
    const over = at(110);
    expect(over.capped).toBeDefined();
    await expect
      .poll(async () => [(await page.getByTestId('load-readout').textContent())?.includes('110.0 %'), await page.getByTestId('total-load-kw').textContent()])
      .toEqual([true, over.totals.loadKW.toFixed(1)]);
    const capped = (await page.getByTestId('sharing-capped').textContent()) ?? '';
    expect(capped).toContain(`The load asked for (${(ratedKW * 1.1).toFixed(0)} kW) has no steady state`);
    expect(capped).toContain(`${over.capped!.carriedKW.toFixed(0)} kW`);
    for (const s of over.sets) expect(await page.getByTestId(`share-row-${s.id}`).getByTestId('share-kw').textContent()).toBe(s.kW.toFixed(1));
    await page.setViewportSize({ width: 1360, height: 1500 });
    await page.screenshot({ path: join(ARTIFACTS, 'sharing-view-110pct.png') });
    await page.setViewportSize({ width: 1360, height: 860 });
    expect(errors).toEqual([]);
  });

  it('recomputes while the load slider moves and keeps the last valid results for a refused field', async () => {
    const { page, errors } = await openPage(browser(), `${inject('previewUrl')}#/sharing`);
    await page.getByTestId('sharing-table').waitFor();
    const f0 = await settledBusHz(page);
    const slider = page.getByTestId('load-slider');
    await slider.focus();
    for (let i = 0; i < 20; i++) await page.keyboard.press('ArrowRight');
    // Results stream in while the slider moves: wait for the one computed for the slider's
    // final position, with nothing newer on its way.
    const finalPct = String(Number(await slider.inputValue()));
    const f1 = await settledBusHz(page, finalPct);
    // More load on droop sets: lower frequency (droop line).
    expect(f1).toBeLessThan(f0);
    // Twenty 0.5 % steps up from the plant's own 57.4 %.
    expect(parseFloat((await page.getByTestId('load-readout').textContent()) ?? '')).toBeGreaterThan(66);

    await page.getByTestId('nav-plant').click();
    const kva = page.locator('[data-test="field-sets[1].ratedKVA"]');
    await kva.fill('0');
    await expect.poll(() => page.locator('[data-test="field-issue"]').first().textContent()).toContain('must be greater than 0');
    expect(await page.getByTestId('edit-state').textContent()).toContain('refused');
    await page.setViewportSize({ width: 1360, height: 2250 });
    await page.screenshot({ path: join(ARTIFACTS, 'plant-editor-refused-field.png') });
    await page.setViewportSize({ width: 1360, height: 860 });
    await page.getByTestId('nav-sharing').click();
    expect(await page.getByTestId('stale-note').textContent()).toContain('last valid plant');
    // The refused draft is checked and nothing was recomputed: the settled figure is the one before.
    expect(await settledBusHz(page, finalPct)).toBe(f1);
    await page.getByTestId('nav-plant').click();
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('[data-test="field-issue"]').count()).toBe(0);
    expect(errors).toEqual([]);
  });

  it('screenshots the plant editor and the dark theme, and measures edit-to-result time', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.setViewportSize({ width: 1360, height: 2250 });
    await page.getByTestId('set-sheet').waitFor();
    await expect.poll(() => page.getByTestId('plant-bus').textContent()).toContain('Hz');
    await page.screenshot({ path: join(ARTIFACTS, 'plant-editor.png') });

    // Edit-to-result latency: from the input event to the bus figure changing in the DOM;
    // and the main thread's busy time per edit (Chromium's TaskDuration, through CDP).
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Performance.enable');
    const busyS = async () => (await cdp.send('Performance.getMetrics')).metrics.find((m) => m.name === 'TaskDuration')?.value ?? NaN;
    const busy0 = await busyS();
    const times = await page.evaluate(async () => {
      const input = document.querySelector<HTMLInputElement>('[data-test="field-sets[1].governor.droopPct"]')!;
      const bus = document.querySelector('[data-test="plant-bus"]')!;
      const out: number[] = [];
      for (const v of ['4.5', '5', '3.5', '4', '4.2', '3.8', '4.6', '4.1', '3.9', '4']) {
        const before = bus.textContent;
        const t0 = performance.now();
        const changed = new Promise<number>((done) => {
          const mo = new MutationObserver(() => {
            if (bus.textContent !== before) {
              mo.disconnect();
              done(performance.now() - t0);
            }
          });
          mo.observe(bus, { subtree: true, characterData: true, childList: true });
        });
        input.value = v;
        input.dispatchEvent(new Event('input', { bubbles: true }));
        out.push(await changed);
      }
      return out;
    });
    const busyPerEditMs = ((await busyS()) - busy0) * 100;
    const sorted = [...times].sort((a, b) => a - b);
    writeFileSync(
      join(ARTIFACTS, 'sharing-edit-latency.json'),
      JSON.stringify(
        {
          what: 'ms from a droop edit to the new bus frequency in the DOM (demo plant, browser preview); main-thread busy ms per edit (TaskDuration)',
          times,
          medianMs: sorted[5],
          minMs: sorted[0],
          mainThreadBusyPerEditMs: busyPerEditMs,
        },
        null,
        2,
      ),
    );

    await page.emulateMedia({ colorScheme: 'dark' });
    await page.getByTestId('nav-sharing').click();
    await page.getByTestId('sharing-table').waitFor();
    await page.setViewportSize({ width: 1360, height: 1900 });
    await page.screenshot({ path: join(ARTIFACTS, 'sharing-view-dark.png') });
    expect(errors).toEqual([]);
  });
});

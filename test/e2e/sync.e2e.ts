/**
 * Synchronizing and Trainer views in the browser preview (Chromium): the live scope, the
 * closing map with hover readout, a trainer exercise closed by key presses, screenshots of
 * both views, and the frame times of the live scopes (printed, not asserted: speed is a
 * measurement, not a test).
 */
import { afterAll, describe, expect, inject, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { ARTIFACTS, openPage, useBrowser } from './chromium';

interface FrameRecord {
  workMs: number[];
  intervalMs: number[];
}

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  if (!s.length) return NaN;
  return s[Math.min(s.length - 1, Math.floor(q * (s.length - 1) + 0.5))]!;
}

/** Lets the scope run for `seconds` and summarises its frames. */
async function measureFrames(page: Page, name: string, seconds: number): Promise<string> {
  await page.evaluate((n) => {
    const f = window.__drooplineFrames?.[n];
    if (f) {
      f.workMs.length = 0;
      f.intervalMs.length = 0;
    }
  }, name);
  // Main-thread busy time from Chromium's own counters (script, style, layout, paint: every task), per frame.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Performance.enable');
  const busy = async (): Promise<number> => {
    const m = (await cdp.send('Performance.getMetrics')) as { metrics: { name: string; value: number }[] };
    return m.metrics.find((x) => x.name === 'TaskDuration')?.value ?? NaN;
  };
  const busy0 = await busy();
  await page.waitForTimeout(seconds * 1000);
  const busyS = (await busy()) - busy0;
  await cdp.detach();
  const rec = (await page.evaluate((n) => window.__drooplineFrames?.[n] ?? null, name)) as FrameRecord | null;
  expect(rec, `frame meter "${name}" missing`).not.toBeNull();
  const w = rec!.workMs;
  const i = rec!.intervalMs;
  return (
    `${name}: ${w.length} frames in ${seconds} s (${(w.length / seconds).toFixed(0)} per second); work per frame (rAF callback to DOM patched) p50 ${quantile(w, 0.5).toFixed(2)} ms, ` +
    `p95 ${quantile(w, 0.95).toFixed(2)} ms, max ${Math.max(...w).toFixed(2)} ms; frame interval p50 ${quantile(i, 0.5).toFixed(1)} ms, p95 ${quantile(i, 0.95).toFixed(1)} ms; ` +
    `main thread busy ${((busyS * 1000) / Math.max(1, w.length)).toFixed(2)} ms per frame on average (Chromium TaskDuration)`
  );
}

describe('Synchronizing and Trainer in the browser preview', () => {
  const browser = useBrowser();
  const figures: string[] = [];
  afterAll(() => {
    if (figures.length) {
      const text = `Live scope frame times, headless Chromium (${new Date().toISOString()}):\n${figures.join('\n')}\n`;
      writeFileSync(join(ARTIFACTS, 'live-scope-frames.txt'), text);
      console.log(text);
    }
  });

  it('turns the scope, shows the permissive state, computes and hovers the closing map', async () => {
    const base = inject('previewUrl');
    const { page, errors } = await openPage(browser(), `${base}?measure-frames#/synchronizing`);
    await page.getByTestId('synchronizing-view').waitFor();
    await expect.poll(() => page.getByTestId('permissive').textContent()).toMatch(/Permissive|Blocked/);
    // The angle turns: wait for a new reading (on a busy machine frames may come late).
    const angle = page.getByTestId('readout-angle').locator('[data-test="readout-value"]');
    const a1 = await angle.textContent();
    await expect.poll(() => angle.textContent(), { message: 'the angle turns' }).not.toBe(a1);
    figures.push(await measureFrames(page, 'synchronizing', 8));

    await page.getByTestId('map-compute').click();
    await page.getByTestId('closing-map').waitFor({ timeout: 20_000 });
    const box = (await page.locator('[data-test="closing-map"] canvas').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.55, box.y + box.height * 0.45);
    await expect.poll(() => page.getByTestId('map-hover').textContent()).toMatch(/surge [\d.]+ pu \(\d+ A rms\), torque step -?[\d.]+ pu/);
    await page.getByTestId('turn-toggle').click();
    // The view scrolls inside the shell: a tall window shows all of it in one picture.
    await page.setViewportSize({ width: 1360, height: 2300 });
    const box2 = (await page.locator('[data-test="closing-map"] canvas').boundingBox())!;
    await page.mouse.move(box2.x + box2.width * 0.5, box2.y + box2.height * 0.42);
    await expect.poll(() => page.getByTestId('map-hover').textContent()).toMatch(/surge/);
    await page.screenshot({ path: join(ARTIFACTS, 'sync-view.png'), fullPage: true });
    // The time-domain map runs on the engine worker's pool of nested workers, with progress, and can be cancelled.
    await page.getByTestId('map-method').selectOption('time-domain');
    await page.getByTestId('map-compute').click();
    await page.getByTestId('map-progress').waitFor();
    await expect.poll(() => page.workers().filter((w) => w.url().includes('pool.worker')).length, { timeout: 20_000 }).toBeGreaterThan(0);
    await page.getByTestId('map-cancel').click();
    await expect.poll(() => page.locator('.map-bar').textContent()).toContain('Closing map cancelled.');
    expect(await page.getByTestId('caution').textContent()).toContain('planning and training only');
    expect(errors).toEqual([]);
    await page.close();
  });

  it('refuses every invalid input beside its field and shows "settings invalid" instead of any permissive', async () => {
    const base = inject('previewUrl');
    const { page, errors } = await openPage(browser(), `${base}#/synchronizing`);
    await page.getByTestId('synchronizing-view').waitFor();
    const state = () => page.getByTestId('permissive').getAttribute('data-state');
    await expect.poll(state, { timeout: 15_000 }).toMatch(/^(permissive|blocked)$/);
    const cases: [string, string, string, string, string][] = [
      ['incoming-frequency', '500', 'incoming.frequencyHz', 'must be within 15 %', '50.1'],
      ['bus-frequency', '-1', 'bus.frequencyHz', 'must be 0 or more', '50'],
      ['limit-angle', '200', 'limits.angleDeg', 'must be 180° or less', '10'],
      ['limit-voltage', '', 'limits.voltagePct', 'must be a number', '5'],
      ['breaker-ms', '-50', 'breakerClosingMs', 'must be greater than 0', '100'],
      ['limit-slip', '-0.2', 'limits.slipHz', 'must be greater than 0', '0.2'],
      ['incoming-voltage', '', 'incoming.voltageV', 'must be a number', '404'],
      ['dead-dead', '90', 'dead.deadPct', 'must be below the live threshold', '20'],
      ['dead-live', '200', 'dead.livePct', 'must be 150 % or less', '80'],
      ['bus-voltage', '-400', 'bus.voltageV', 'must be 0 or more', '400'],
    ];
    for (const [field, bad, path, rule, good] of cases) {
      const input = page.getByTestId(field);
      await input.fill(bad);
      await input.press('Tab');
      // Wait for the settled state meant: the refusal, with its rule beside the field.
      await expect.poll(state, { message: `${field} = "${bad}" withdraws the verdict` }).toBe('invalid');
      await expect.poll(() => page.getByTestId(`error-${path}`).textContent()).toContain(rule);
      expect(await page.getByTestId('permissive').textContent()).toContain('Settings invalid');
      expect(await page.getByTestId('permissive').textContent()).not.toContain('Permissive');
      // The window plane withdraws its operating point with the verdict.
      expect(await page.getByTestId('plane-point').count()).toBe(0);
      await input.fill(good);
      await input.press('Tab');
      await expect.poll(state, { message: `${field} put right` }).toMatch(/^(permissive|blocked)$/);
    }
    // The phase angle is typed on a frozen diagram: a blank one is refused too.
    await page.getByTestId('turn-toggle').click();
    const angle = page.getByTestId('angle-input');
    await angle.fill('');
    await angle.press('Tab');
    await expect.poll(state, { message: 'blank phase angle withdraws the verdict' }).toBe('invalid');
    await expect.poll(() => page.getByTestId('error-incoming.angleDeg').textContent()).toContain('must be a number');
    expect(await page.getByTestId('permissive').textContent()).not.toContain('Permissive');
    await angle.fill('3');
    await angle.press('Tab');
    await expect.poll(state, { message: 'phase angle put right' }).toMatch(/^(permissive|blocked)$/);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('runs a trainer exercise from the keyboard to a close and shows the verdict and the log', async () => {
    const base = inject('previewUrl');
    const { page, errors } = await openPage(browser(), `${base}?measure-frames#/trainer`);
    await page.getByTestId('trainer-view').waitFor();
    await expect.poll(() => page.getByTestId('trainer-state').textContent(), { timeout: 15_000 }).toMatch(/window/);
    expect(await page.getByTestId('trainer-caution').textContent()).toContain('not an authorisation to operate');
    figures.push(await measureFrames(page, 'trainer', 8));
    // Hold raise speed for a second: the set speeds up.
    const before = await page.getByTestId('readout-incoming').locator('[data-test="readout-value"]').textContent();
    await page.keyboard.down('ArrowUp');
    await page.waitForTimeout(1000);
    await page.keyboard.up('ArrowUp');
    await expect.poll(() => page.getByTestId('readout-incoming').locator('[data-test="readout-value"]').textContent()).not.toBe(before);
    await page.screenshot({ path: join(ARTIFACTS, 'trainer-running.png'), fullPage: true });
    await page.keyboard.press(' ');
    await page.getByTestId('trainer-verdict').waitFor({ timeout: 10_000 });
    await page.setViewportSize({ width: 1360, height: 2000 });
    expect(await page.getByTestId('verdict-text').textContent()).toMatch(/Surge [\d.]+ pu/);
    expect(await page.getByTestId('attempt-log').textContent()).toContain('1 attempt');
    await page.screenshot({ path: join(ARTIFACTS, 'trainer-verdict.png'), fullPage: true });
    expect(errors).toEqual([]);
    await page.close();
  });

  it('builds an exercise set with a scripted fault, runs it as a session and exports the session log as CSV', async () => {
    const base = inject('previewUrl');
    const { page, errors } = await openPage(browser(), `${base}#/trainer`);
    await page.getByTestId('trainer-view').waitFor();
    await expect.poll(() => page.getByTestId('trainer-state').textContent(), { timeout: 15_000 }).toMatch(/window/);
    await page.getByTestId('instructor').locator('summary').click();
    await page.getByTestId('instructor-add-set').click();
    await page.getByTestId('set-name').fill('Shift B, week 1');
    await page.getByTestId('set-name').press('Tab');
    await page.getByTestId('fault-breaker').check();
    await page.getByTestId('fault-breaker-ms').fill('250');
    await page.getByTestId('fault-breaker-ms').press('Tab');
    await page.getByTestId('set-add-exercise').click();
    await page.getByTestId('fault-dead').nth(1).check();
    await page.setViewportSize({ width: 1360, height: 1500 });
    await page.screenshot({ path: join(ARTIFACTS, 'trainer-instructor.png'), fullPage: true });
    await page.getByTestId('set-run').click();
    await expect.poll(() => page.getByTestId('session-bar').textContent()).toContain('exercise 1 of 2');
    await page.keyboard.press(' ');
    await page.getByTestId('trainer-verdict').waitFor({ timeout: 10_000 });
    await expect.poll(() => page.getByTestId('verdict-text').textContent()).toContain('250 ms slower than its 80 ms setting');
    await expect.poll(() => page.getByTestId('session-pass').textContent()).toMatch(/Passed|Not passed/);
    await page.getByTestId('session-next').click();
    await expect.poll(() => page.getByTestId('session-bar').textContent()).toContain('exercise 2 of 2');
    await expect.poll(() => page.getByTestId('trainer-state').textContent()).toContain('Dead bus');
    await page.keyboard.press(' ');
    await expect.poll(() => page.getByTestId('verdict-text').textContent(), { timeout: 10_000 }).toContain('Dead bus energised');
    await expect.poll(() => page.getByTestId('session-summary').textContent()).toContain('Session finished');
    const download = page.waitForEvent('download');
    await page.getByTestId('session-csv').click();
    const file = await (await download).path();
    const csv = readFileSync(file, 'utf8');
    const lines = csv.split('\r\n');
    expect(lines[0]).toMatch(/^# Caution: planning and training only/);
    expect(lines[1]).toContain('Set "Shift B, week 1": 2 attempts');
    expect(lines[2]).toContain('score (0-100)');
    expect(lines).toHaveLength(6);
    await page.screenshot({ path: join(ARTIFACTS, 'trainer-session.png'), fullPage: true });
    expect(errors).toEqual([]);
    await page.close();
  });
});

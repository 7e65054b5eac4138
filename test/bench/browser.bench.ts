/**
 * The browser preview in Chromium (engine in the Web Worker, demo plant), measured, not asserted:
 * - start → first computed figure: from navigation start to the bus frequency the engine computed
 *   showing in the Plant view (fresh browser context each time, so nothing is cached), and what
 *   came before it (DOM ready, the app mounted);
 * - edit → sharing figures in the DOM: from the input event of a droop edit in the set sheet to
 *   the new bus frequency (the sharing result) in the Plant view's edit bar, after warm-up edits.
 * Builds the preview into out/bench-preview and serves it on 127.0.0.1 for the run. Skipped, with a
 * line that says so, when Chromium is not installed.
 */
import { existsSync, rmSync } from 'node:fs';
import { loadavg } from 'node:os';
import { resolve } from 'node:path';
import { build, preview } from 'vite';
import { chromium } from 'playwright-core';
import type { Browser } from 'playwright-core';
import { CHROMIUM_PATH } from '../../build/scripts/ensure-chromium.mjs';
import type { BenchResult } from './harness';

const STARTS = 8;
const WARM_EDITS = 10;
const EDITS = 200;

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(q * s.length) - 1)]!;
}

interface StartTimes {
  domReady: number;
  mounted: number;
  firstFigure: number;
}

async function startOnce(browser: Browser, url: string): Promise<StartTimes> {
  const context = await browser.newContext({ viewport: { width: 1360, height: 860 } });
  const page = await context.newPage();
  await page.addInitScript(() => {
    const w = window as unknown as { __times: Record<string, number> };
    w.__times = {};
    const mo = new MutationObserver(() => {
      const app = document.getElementById('app');
      if (app && app.childElementCount > 0 && w.__times.mounted === undefined) w.__times.mounted = performance.now();
      const bus = document.querySelector('[data-test="plant-bus"]');
      if (bus && /Hz/.test(bus.textContent ?? '') && w.__times.firstFigure === undefined) {
        w.__times.firstFigure = performance.now();
        mo.disconnect();
      }
    });
    mo.observe(document, { subtree: true, childList: true, characterData: true });
  });
  await page.goto(url);
  await page.waitForFunction(() => (window as unknown as { __times: Record<string, number> }).__times.firstFigure !== undefined, undefined, {
    timeout: 60_000,
  });
  const t = await page.evaluate(() => {
    const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined;
    const w = window as unknown as { __times: Record<string, number> };
    return { domReady: nav?.domContentLoadedEventEnd ?? NaN, mounted: w.__times.mounted ?? NaN, firstFigure: w.__times.firstFigure! };
  });
  await context.close();
  return t;
}

async function editTimes(browser: Browser, url: string): Promise<number[]> {
  const context = await browser.newContext({ viewport: { width: 1360, height: 860 } });
  const page = await context.newPage();
  await page.goto(url);
  await page.waitForFunction(() => /Hz/.test(document.querySelector('[data-test="plant-bus"]')?.textContent ?? ''), undefined, { timeout: 60_000 });
  const values = ['4.5', '3.5', '5', '3', '4.2', '3.8', '4.6', '3.4', '4.8', '4'];
  const seq = Array.from({ length: WARM_EDITS + EDITS }, (_, k) => values[k % values.length]!);
  const times = await page.evaluate(async (vals: string[]) => {
    const input = document.querySelector<HTMLInputElement>('[data-test="field-sets[1].governor.droopPct"]')!;
    const bus = document.querySelector('[data-test="plant-bus"]')!;
    const out: number[] = [];
    for (const v of vals) {
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
      // Let the frame finish before the next edit, as a person typing would.
      await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
    }
    return out;
  }, seq);
  await context.close();
  return times.slice(WARM_EDITS);
}

export async function run(): Promise<BenchResult[]> {
  if (!existsSync(CHROMIUM_PATH)) return [{ name: `browser preview: skipped (no Chromium at ${CHROMIUM_PATH})`, medianMs: Number.NaN, runs: 0 }];
  const outDir = resolve('out', 'bench-preview');
  await build({ logLevel: 'warn', build: { outDir, emptyOutDir: true } });
  const server = await preview({ build: { outDir }, preview: { host: '127.0.0.1', port: 0, strictPort: false, open: false }, logLevel: 'warn' });
  const url = server.resolvedUrls?.local[0];
  const browser = await chromium.launch({
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
  try {
    if (!url) throw new Error('The preview server did not report its URL.');
    // The machine's 1-minute load average around each part: on a shared machine the tails follow it.
    const load = () => loadavg()[0]!.toFixed(1);
    const startLoad = load();
    const starts: StartTimes[] = [];
    for (let k = 0; k < STARTS; k++) starts.push(await startOnce(browser, url));
    const editLoad = load();
    const edits = await editTimes(browser, url);
    const endLoad = load();
    const first = starts.map((s) => s.firstFigure);
    const med = (xs: number[]) => quantile(xs, 0.5);
    return [
      {
        name: 'preview start → first computed figure (demo plant, fresh context)',
        medianMs: med(first),
        runs: STARTS,
        extra: {
          p95: `${quantile(first, 0.95).toFixed(0)} ms`,
          'DOM ready (median)': `${med(starts.map((s) => s.domReady)).toFixed(0)} ms`,
          'app mounted (median)': `${med(starts.map((s) => s.mounted)).toFixed(0)} ms`,
          'load average': `${startLoad}–${editLoad}`,
        },
      },
      {
        name: 'plant edit → sharing figures in the DOM (droop edit, demo plant)',
        medianMs: med(edits),
        runs: edits.length,
        extra: { p95: `${quantile(edits, 0.95).toFixed(1)} ms`, max: `${Math.max(...edits).toFixed(1)} ms`, 'load average': `${editLoad}–${endLoad}` },
      },
    ];
  } finally {
    await browser.close();
    await new Promise<void>((done) => server.httpServer.close(() => done()));
    rmSync(outDir, { recursive: true, force: true });
  }
}

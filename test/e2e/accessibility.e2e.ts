/**
 * Accessibility audit: axe-core 4 runs in Chromium over every view of the browser preview, in the
 * light and the dark theme. No serious or critical finding may remain; the findings of every
 * impact are written to out/test-output/accessibility.json for review.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { VIEWS } from '../../renderer/stores/ui';
import { ARTIFACTS, useBrowser } from './chromium';

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface Finding {
  id: string;
  impact: string | null;
  help: string;
  nodes: number;
  targets: string[];
}

describe('accessibility (axe-core)', () => {
  const browser = useBrowser();

  it('finds nothing serious or critical on any view, light or dark', async () => {
    // The preview's Content Security Policy forbids inline scripts; the audit's own page lifts it
    // (bypassCSP) only so that the axe-core source can be put in.
    const page = await browser().newPage({ viewport: { width: 1360, height: 860 }, bypassCSP: true });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    await page.goto(inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    await page.addScriptTag({ content: AXE_SOURCE });
    const summary: Record<string, Finding[]> = {};
    for (const theme of ['light', 'dark'] as const) {
      await page.getByTestId('theme-choice').selectOption(theme);
      await expect.poll(() => page.evaluate(() => document.documentElement.dataset.theme)).toBe(theme);
      for (const v of VIEWS) {
        await page.getByTestId(`nav-${v.id}`).click();
        await expect.poll(() => page.getByTestId(`nav-${v.id}`).getAttribute('aria-current')).toBe('page');
        // Let the view's first engine round settle (its readouts are in place) before auditing.
        await page.waitForLoadState('networkidle');
        await page.waitForTimeout(400);
        const violations = await page.evaluate(async () => {
          const axe = (
            window as unknown as {
              axe: {
                run: (
                  ctx: Document,
                  opts: object,
                ) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] }[] }>;
              };
            }
          ).axe;
          const r = await axe.run(document, { resultTypes: ['violations'] });
          return r.violations.map((x) => ({
            id: x.id,
            impact: x.impact,
            help: x.help,
            nodes: x.nodes.length,
            targets: x.nodes.slice(0, 5).map((n) => String(n.target.join(' '))),
          }));
        });
        summary[`${theme}/${v.id}`] = violations;
      }
    }
    writeFileSync(join(ARTIFACTS, 'accessibility.json'), JSON.stringify(summary, null, 2));
    const serious = Object.entries(summary).flatMap(([where, list]) =>
      list.filter((f) => f.impact === 'serious' || f.impact === 'critical').map((f) => `${where}: ${f.id} (${f.impact}) ${f.targets.join(', ')}`),
    );
    expect(serious).toEqual([]);
    // Every part of the page sits in a landmark (header, nav, main, footer or a named region).
    expect(
      Object.entries(summary)
        .filter(([, list]) => list.some((f) => f.id === 'region'))
        .map(([where]) => where),
    ).toEqual([]);
    expect(errors).toEqual([]);
    // Eight views in two themes: on a shared, loaded machine this passes the default minute.
  }, 180_000);
});

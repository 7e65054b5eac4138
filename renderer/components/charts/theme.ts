/**
 * Chart colours read from the app's CSS variables (`renderer/styles/base.css`), so charts
 * follow the light and dark themes; the light values are the shared `CHART_PALETTE` (also the report's). `useChartTheme()` re-reads them when the
 * theme in use changes.
 */
import { effectScope, shallowRef, watch } from 'vue';
import { themeInUse } from '../../theme-mode';
import type { ShallowRef } from 'vue';
import { CHART_PALETTE } from '../../../shared-types';

/** The colours a chart needs. */
export interface ChartTheme {
  fg: string;
  muted: string;
  grid: string;
  panel: string;
  accent: string;
  good: string;
  warn: string;
  bad: string;
  /** Colours of the sets, in plant order (wraps around). */
  series: string[];
}

/** The light theme's values, used where CSS variables cannot be read (tests). */
const FALLBACK: ChartTheme = {
  fg: CHART_PALETTE.fg,
  muted: CHART_PALETTE.muted,
  grid: CHART_PALETTE.grid,
  panel: CHART_PALETTE.panel,
  accent: CHART_PALETTE.accent,
  good: CHART_PALETTE.good,
  warn: CHART_PALETTE.warn,
  bad: CHART_PALETTE.bad,
  series: [...CHART_PALETTE.series],
};

/** Reads the theme from the document's CSS variables. */
export function readChartTheme(): ChartTheme {
  if (typeof document === 'undefined' || typeof getComputedStyle === 'undefined') return FALLBACK;
  const css = getComputedStyle(document.documentElement);
  const v = (name: string, fallback: string) => css.getPropertyValue(name).trim() || fallback;
  return {
    fg: v('--fg', FALLBACK.fg),
    muted: v('--muted', FALLBACK.muted),
    grid: v('--border', FALLBACK.grid),
    panel: v('--panel', FALLBACK.panel),
    accent: v('--accent', FALLBACK.accent),
    good: v('--good', FALLBACK.good),
    warn: v('--warn', FALLBACK.warn),
    bad: v('--bad', FALLBACK.bad),
    series: FALLBACK.series.map((c, i) => v(`--series-${i + 1}`, c)),
  };
}

let shared: ShallowRef<ChartTheme> | null = null;

/**
 * The current chart theme, updated when the theme in use changes (the switch, or the system's setting under
 * "System"). One for the whole app, read from the CSS once per theme: every chart and swatch used to read it as it
 * mounted, and each read of computed styles while a view is being built makes the browser work out the style of the
 * whole page again (about a tenth of the Plant view's first drawing).
 */
export function useChartTheme(): ShallowRef<ChartTheme> {
  if (!shared) {
    const theme = shallowRef(readChartTheme());
    // Its own scope: the watch lives as long as the app, not as long as the first component that asked.
    effectScope(true).run(() =>
      watch(
        themeInUse,
        () => {
          theme.value = readChartTheme();
        },
        { flush: 'post' },
      ),
    );
    shared = theme;
  }
  return shared;
}

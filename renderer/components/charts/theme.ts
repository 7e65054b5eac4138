/**
 * Chart colours read from the app's CSS variables (`renderer/styles/base.css`), so charts
 * follow the light and dark themes; the light values are the shared `CHART_PALETTE` (also the report's). `useChartTheme()` re-reads them when the system
 * theme changes.
 */
import { onBeforeUnmount, shallowRef, watch } from 'vue';
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

/** The current chart theme, updated when the system switches between light and dark. */
export function useChartTheme(): ShallowRef<ChartTheme> {
  const theme = shallowRef(readChartTheme());
  // Follows the theme in use (the switch, or the system's setting under "System").
  const stop = watch(
    themeInUse,
    () => {
      theme.value = readChartTheme();
    },
    { flush: 'post' },
  );
  onBeforeUnmount(stop);
  return theme;
}

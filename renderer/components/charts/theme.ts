/**
 * Chart colours read from the app's CSS variables (`renderer/styles/base.css`), so charts
 * follow the light and dark themes. `useChartTheme()` re-reads them when the system
 * theme changes.
 */
import { onBeforeUnmount, shallowRef, watch } from 'vue';
import { themeInUse } from '../../theme-mode';
import type { ShallowRef } from 'vue';

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
  fg: '#1d2329',
  muted: '#5b6670',
  grid: '#d4d9de',
  panel: '#ffffff',
  accent: '#1f6f8b',
  good: '#1b7a43',
  warn: '#8a5a00',
  bad: '#b02a2a',
  series: ['#1f6f8b', '#a85a12', '#6b4c9a', '#2e7d32', '#8d2f4f'],
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

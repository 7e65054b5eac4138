/**
 * The frame the charts share (Sharing, Planner and Commissioning; the capability chart's legend): a titled linear axis in the theme's colours, the
 * legend under the chart, and the options of a still chart that fills its panel. Pure.
 */
import type { ScaleOptions } from 'chart.js';
import type { ChartTheme } from './theme';

/** A linear axis titled `title` (quantity, unit), ticks and grid in the theme's colours; `extra` adds or overrides options. */
export function linearAxis(theme: ChartTheme, title: string, extra: ScaleOptions<'linear'> | object = {}): ScaleOptions<'linear'> {
  return {
    type: 'linear',
    title: { display: true, text: title, color: theme.fg },
    ticks: { color: theme.muted },
    grid: { color: theme.grid },
    border: { color: theme.grid },
    ...extra,
  } as ScaleOptions<'linear'>;
}

/** The legend under the chart, each series by its point style. */
export const bottomLegend = (theme: ChartTheme) => ({ position: 'bottom' as const, labels: { color: theme.fg, usePointStyle: true, boxHeight: 8 } });

/** No animation (results redraw at once), and the chart fills its panel's height. */
export const STILL_CHART = { animation: false, responsive: true, maintainAspectRatio: false } as const;

/**
 * How each set is drawn, the same in every chart and swatch: a colour from the theme
 * plus a dash pattern and a point shape, so sets stay apart without colour (grey-scale
 * print, colour-blind readers).
 */
import type { PointStyle } from 'chart.js';
import type { ChartTheme } from './theme';

/** Dash patterns, px (solid first). */
export const DASHES: readonly number[][] = [[], [9, 4], [2, 3], [12, 3, 2, 3], [5, 5], [1, 2, 6, 2]];
/** Point shapes. */
export const POINT_STYLES: readonly PointStyle[] = ['circle', 'triangle', 'rect', 'rectRot', 'star', 'crossRot'];

/** The drawing style of the set at position `index` in the plant. */
export interface SeriesStyle {
  color: string;
  dash: number[];
  pointStyle: PointStyle;
}

/** Style of the set at `index` (patterns cycle independently of colours, so pairs repeat late). */
export function seriesStyle(index: number, theme: ChartTheme): SeriesStyle {
  const n = theme.series.length;
  return {
    color: theme.series[index % n] ?? theme.fg,
    dash: DASHES[index % DASHES.length] ?? [],
    pointStyle: POINT_STYLES[index % POINT_STYLES.length] ?? 'circle',
  };
}

/** `color` at `alpha` (0..1), for hex colours `#rrggbb`; other forms are returned unchanged. */
export function withAlpha(color: string, alpha: number): string {
  const m = /^#([0-9a-f]{6})$/i.exec(color.trim());
  if (!m?.[1]) return color;
  const a = Math.round(Math.min(1, Math.max(0, alpha)) * 255)
    .toString(16)
    .padStart(2, '0');
  return `#${m[1]}${a}`;
}

/**
 * A diagonal hatch fill (for "above rating" and kVA bars), or the plain colour where no
 * canvas is available.
 */
export function hatch(color: string, background = 'transparent', spacingPx = 6): CanvasPattern | string {
  if (typeof document === 'undefined') return color;
  const c = document.createElement('canvas');
  c.width = spacingPx;
  c.height = spacingPx;
  const g = c.getContext('2d');
  if (!g) return color;
  g.fillStyle = background;
  g.fillRect(0, 0, spacingPx, spacingPx);
  g.strokeStyle = color;
  g.lineWidth = 1.5;
  g.beginPath();
  g.moveTo(0, spacingPx);
  g.lineTo(spacingPx, 0);
  g.moveTo(-1, 1);
  g.lineTo(1, -1);
  g.moveTo(spacingPx - 1, spacingPx + 1);
  g.lineTo(spacingPx + 1, spacingPx - 1);
  g.stroke();
  return g.createPattern(c, 'repeat') ?? color;
}

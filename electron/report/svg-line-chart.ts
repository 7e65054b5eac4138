/**
 * A small SVG line chart for the report: axes with nice ticks, series told apart by colour,
 * dash pattern and marker shape (legible in print and for colour-blind readers), optional
 * reference lines. Pure string building: no DOM.
 */
import { CHART_PALETTE } from '../../shared-types';
import { escapeHtml, formatNumber } from './format';
import { linearScale, niceTicks, tickDecimals } from './svg-axes';

/** The shared chart palette (shared-types/presentation.ts). */
const C = CHART_PALETTE;

/** Marker shapes, assigned with the series so shape alone tells series apart. */
export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond' | 'cross';

/** One series: a line through its points, or markers only. */
export interface ChartSeries {
  label: string;
  x: readonly number[];
  y: readonly (number | null)[];
  /** Style slot 0..n: picks colour, dash and marker. */
  style: number;
  /** Draw markers only (operating points), no line. */
  markersOnly?: boolean;
  /** Put a marker on every point of a line (for short lines such as droop lines). */
  markEvery?: boolean;
}

/** A labelled horizontal or vertical reference line (rated frequency, a band edge). */
export interface ReferenceLine {
  axis: 'x' | 'y';
  value: number;
  label: string;
}

/** What to draw. Sizes are px. */
export interface LineChartSpec {
  title: string;
  xLabel: string;
  yLabel: string;
  series: ChartSeries[];
  references?: ReferenceLine[];
  widthPx?: number;
  heightPx?: number;
  /** Force the y range to include these values (e.g. rated frequency). */
  yInclude?: number[];
}

/** Print-safe colours (the app's light palette) and dash patterns, cycled together. */
export const SERIES_COLOURS = [...CHART_PALETTE.series, CHART_PALETTE.muted] as const;
export const SERIES_DASHES = ['', '7 4', '2 3', '9 3 2 3', '4 2', '12 4'] as const;
export const SERIES_MARKERS: readonly MarkerShape[] = ['circle', 'square', 'triangle', 'diamond', 'cross'];

const at = <T>(list: readonly T[], i: number): T => list[((i % list.length) + list.length) % list.length]!;

/** SVG for one marker centred at (x, y). */
export function markerSvg(shape: MarkerShape, x: number, y: number, colour: string, r = 3.5): string {
  const p = (n: number) => n.toFixed(1);
  switch (shape) {
    case 'circle':
      return `<circle cx="${p(x)}" cy="${p(y)}" r="${r}" fill="#fff" stroke="${colour}" stroke-width="1.6"/>`;
    case 'square':
      return `<rect x="${p(x - r)}" y="${p(y - r)}" width="${2 * r}" height="${2 * r}" fill="${colour}"/>`;
    case 'triangle':
      return `<path d="M${p(x)} ${p(y - r - 0.8)}L${p(x + r + 0.6)} ${p(y + r * 0.8)}L${p(x - r - 0.6)} ${p(y + r * 0.8)}Z" fill="${colour}"/>`;
    case 'diamond':
      return `<path d="M${p(x)} ${p(y - r - 1)}L${p(x + r + 1)} ${p(y)}L${p(x)} ${p(y + r + 1)}L${p(x - r - 1)} ${p(y)}Z" fill="#fff" stroke="${colour}" stroke-width="1.6"/>`;
    case 'cross':
      return `<path d="M${p(x - r)} ${p(y - r)}L${p(x + r)} ${p(y + r)}M${p(x - r)} ${p(y + r)}L${p(x + r)} ${p(y - r)}" stroke="${colour}" stroke-width="1.8"/>`;
  }
}

function extent(values: Iterable<number | null>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v === null || !Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}

/** Builds the chart's SVG. Points with a null or non-finite y break the line. */
export function lineChartSvg(spec: LineChartSpec): { svg: string; widthPx: number; heightPx: number } {
  const width = spec.widthPx ?? 640;
  const legendRows = Math.ceil(spec.series.length / 3);
  const height = spec.heightPx ?? 300 + legendRows * 18;
  const m = { left: 64, right: 16, top: 30, bottom: 46 + legendRows * 18 };
  const xs = spec.series.flatMap((s) => [...s.x]).concat(spec.references?.filter((r) => r.axis === 'x').map((r) => r.value) ?? []);
  const ys = spec.series.flatMap((s) => [...s.y]).concat(spec.references?.filter((r) => r.axis === 'y').map((r) => r.value) ?? [], spec.yInclude ?? []);
  const [x0, x1] = extent(xs);
  const [y0, y1] = extent(ys);
  const xt = niceTicks(Number.isFinite(x0) ? x0 : 0, Number.isFinite(x1) ? x1 : 1, 6);
  // A little headroom so lines and markers at the extremes do not sit on the frame.
  const yPad = Number.isFinite(y0) && Number.isFinite(y1) ? (y1 - y0) * 0.04 : 0;
  const yt = niceTicks(Number.isFinite(y0) ? y0 - yPad : 0, Number.isFinite(y1) ? y1 + yPad : 1, 5);
  const sx = linearScale(xt.min, xt.max, m.left, width - m.right);
  const sy = linearScale(yt.min, yt.max, height - m.bottom, m.top);
  const xd = tickDecimals(xt.step);
  const yd = tickDecimals(yt.step);
  const p = (n: number) => n.toFixed(1);
  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(spec.title)}" font-family="system-ui, Arial, sans-serif" font-size="11">`,
    `<rect x="0" y="0" width="${width}" height="${height}" fill="${C.panel}"/>`,
    `<text x="${m.left}" y="18" font-size="13" font-weight="600" fill="${C.fg}">${escapeHtml(spec.title)}</text>`,
  );
  for (const v of yt.ticks) {
    out.push(`<line x1="${m.left}" x2="${width - m.right}" y1="${p(sy(v))}" y2="${p(sy(v))}" stroke="${C.gridLine}"/>`);
    out.push(`<text x="${m.left - 6}" y="${p(sy(v) + 3.5)}" text-anchor="end" fill="${C.muted}">${formatNumber(v, yd)}</text>`);
  }
  for (const v of xt.ticks) {
    out.push(`<line x1="${p(sx(v))}" x2="${p(sx(v))}" y1="${m.top}" y2="${height - m.bottom}" stroke="${C.gridMinor}"/>`);
    out.push(`<text x="${p(sx(v))}" y="${height - m.bottom + 15}" text-anchor="middle" fill="${C.muted}">${formatNumber(v, xd)}</text>`);
  }
  out.push(`<rect x="${m.left}" y="${m.top}" width="${width - m.left - m.right}" height="${height - m.top - m.bottom}" fill="none" stroke="${C.frame}"/>`);
  out.push(`<text x="${(m.left + width - m.right) / 2}" y="${height - m.bottom + 32}" text-anchor="middle" fill="${C.fg}">${escapeHtml(spec.xLabel)}</text>`);
  out.push(
    `<text transform="translate(14 ${(m.top + height - m.bottom) / 2}) rotate(-90)" text-anchor="middle" fill="${C.fg}">${escapeHtml(spec.yLabel)}</text>`,
  );
  for (const r of spec.references ?? []) {
    const [ax1, ay1, ax2, ay2] = r.axis === 'y' ? [m.left, sy(r.value), width - m.right, sy(r.value)] : [sx(r.value), m.top, sx(r.value), height - m.bottom];
    out.push(`<line x1="${p(ax1)}" y1="${p(ay1)}" x2="${p(ax2)}" y2="${p(ay2)}" stroke="${C.warn}" stroke-width="1" stroke-dasharray="3 3"/>`);
    const lx = r.axis === 'y' ? width - m.right - 4 : ax1 + 4;
    const ly = r.axis === 'y' ? ay1 - 4 : m.top + 12;
    out.push(`<text x="${p(lx)}" y="${p(ly)}" text-anchor="${r.axis === 'y' ? 'end' : 'start'}" fill="${C.warn}">${escapeHtml(r.label)}</text>`);
  }
  out.push(`<g>`);
  for (const s of spec.series) {
    const colour = at(SERIES_COLOURS, s.style);
    const dash = at(SERIES_DASHES, s.style);
    const shape = at(SERIES_MARKERS, s.style);
    if (!s.markersOnly) {
      let d = '';
      let pen = false;
      for (let i = 0; i < s.x.length; i++) {
        const y = s.y[i];
        const x = s.x[i]!;
        if (y === null || y === undefined || !Number.isFinite(y) || !Number.isFinite(x)) {
          pen = false;
          continue;
        }
        d += `${pen ? 'L' : 'M'}${p(sx(x))} ${p(sy(y))}`;
        pen = true;
      }
      if (d) out.push(`<path d="${d}" fill="none" stroke="${colour}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''} stroke-linejoin="round"/>`);
    }
    if (s.markersOnly || s.markEvery) {
      for (let i = 0; i < s.x.length; i++) {
        const y = s.y[i];
        if (y === null || y === undefined || !Number.isFinite(y)) continue;
        out.push(markerSvg(shape, sx(s.x[i]!), sy(y), colour));
      }
    }
  }
  out.push('</g>');
  spec.series.forEach((s, i) => {
    const col = i % 3;
    const row = Math.floor(i / 3);
    const lx = m.left + col * ((width - m.left - m.right) / 3);
    const ly = height - m.bottom + 48 + row * 18;
    const colour = at(SERIES_COLOURS, s.style);
    const dash = at(SERIES_DASHES, s.style);
    if (!s.markersOnly)
      out.push(
        `<line x1="${lx}" x2="${lx + 26}" y1="${ly - 4}" y2="${ly - 4}" stroke="${colour}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`,
      );
    if (s.markersOnly || s.markEvery) out.push(markerSvg(at(SERIES_MARKERS, s.style), lx + 13, ly - 4, colour));
    out.push(`<text x="${lx + 32}" y="${ly}" fill="${C.fg}">${escapeHtml(s.label)}</text>`);
  });
  out.push('</svg>');
  return { svg: out.join(''), widthPx: width, heightPx: height };
}

/**
 * SVG heat map for the closing map (surge over closing angle × slip). Cells are shaded on a
 * single-hue ramp whose lightness falls with the value, so the order reads in grey print and
 * for colour-blind readers; a scale bar gives the numbers and a dashed box marks the window.
 */
import { CHART_PALETTE } from '../../shared-types';
import { escapeHtml, formatNumber } from './format';
import { linearScale, niceTicks, tickDecimals } from './svg-axes';

/** The shared chart palette (shared-types/presentation.ts). */
const C = CHART_PALETTE;

/** What to draw: `values` row-major, rows follow `y`, columns follow `x` (both ascending). */
export interface HeatMapSpec {
  title: string;
  xLabel: string;
  yLabel: string;
  valueLabel: string;
  x: readonly number[];
  y: readonly number[];
  values: readonly number[];
  /** A rectangle to outline, in data units (e.g. the sync-check window). */
  box?: { x0: number; x1: number; y0: number; y1: number; label: string };
  widthPx?: number;
  heightPx?: number;
}

/** Lightness ramp from pale (low) to deep blue (high), t in 0..1. */
export function rampColour(t: number): string {
  const u = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  const lerp = (a: number, b: number) => Math.round(a + (b - a) * u);
  // #f4f8fb → #0e3550: lightness falls monotonically.
  const hex = (n: number) => n.toString(16).padStart(2, '0');
  return `#${hex(lerp(0xf4, 0x0e))}${hex(lerp(0xf8, 0x35))}${hex(lerp(0xfb, 0x50))}`;
}

/** Cell edges around centres (half-way between neighbours; the ends extend by half a step). */
function edges(centres: readonly number[]): number[] {
  const n = centres.length;
  if (n === 1) return [centres[0]! - 0.5, centres[0]! + 0.5];
  const e = [centres[0]! - (centres[1]! - centres[0]!) / 2];
  for (let i = 0; i + 1 < n; i++) e.push((centres[i]! + centres[i + 1]!) / 2);
  e.push(centres[n - 1]! + (centres[n - 1]! - centres[n - 2]!) / 2);
  return e;
}

/** Builds the heat map's SVG. */
export function heatMapSvg(spec: HeatMapSpec): { svg: string; widthPx: number; heightPx: number } {
  const width = spec.widthPx ?? 640;
  const height = spec.heightPx ?? 360;
  const m = { left: 64, right: 96, top: 30, bottom: 46 };
  const p = (n: number) => n.toFixed(1);
  const xe = edges(spec.x);
  const ye = edges(spec.y);
  const sx = linearScale(xe[0]!, xe[xe.length - 1]!, m.left, width - m.right);
  const sy = linearScale(ye[0]!, ye[ye.length - 1]!, height - m.bottom, m.top);
  let vmin = Infinity;
  let vmax = -Infinity;
  for (const v of spec.values) {
    if (!Number.isFinite(v)) continue;
    vmin = Math.min(vmin, v);
    vmax = Math.max(vmax, v);
  }
  if (!Number.isFinite(vmin)) [vmin, vmax] = [0, 1];
  const span = vmax - vmin || 1;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(spec.title)}" font-family="system-ui, Arial, sans-serif" font-size="11">`,
    `<rect x="0" y="0" width="${width}" height="${height}" fill="${C.panel}"/>`,
    `<text x="${m.left}" y="18" font-size="13" font-weight="600" fill="${C.fg}">${escapeHtml(spec.title)}</text>`,
  ];
  for (let r = 0; r < spec.y.length; r++) {
    for (let c = 0; c < spec.x.length; c++) {
      const v = spec.values[r * spec.x.length + c];
      const fill = v === undefined || !Number.isFinite(v) ? C.panel : rampColour((v - vmin) / span);
      const x0 = sx(xe[c]!);
      const x1 = sx(xe[c + 1]!);
      const y0 = sy(ye[r + 1]!);
      const y1 = sy(ye[r]!);
      out.push(`<rect x="${p(x0)}" y="${p(y0)}" width="${p(x1 - x0 + 0.4)}" height="${p(y1 - y0 + 0.4)}" fill="${fill}"/>`);
    }
  }
  const xt = niceTicks(spec.x[0]!, spec.x[spec.x.length - 1]!, 8);
  const yt = niceTicks(spec.y[0]!, spec.y[spec.y.length - 1]!, 6);
  for (const v of xt.ticks.filter((t) => t >= xe[0]! && t <= xe[xe.length - 1]!)) {
    out.push(`<line x1="${p(sx(v))}" x2="${p(sx(v))}" y1="${height - m.bottom}" y2="${height - m.bottom + 4}" stroke="${C.muted}"/>`);
    out.push(`<text x="${p(sx(v))}" y="${height - m.bottom + 15}" text-anchor="middle" fill="${C.muted}">${formatNumber(v, tickDecimals(xt.step))}</text>`);
  }
  for (const v of yt.ticks.filter((t) => t >= ye[0]! && t <= ye[ye.length - 1]!)) {
    out.push(`<line x1="${m.left - 4}" x2="${m.left}" y1="${p(sy(v))}" y2="${p(sy(v))}" stroke="${C.muted}"/>`);
    out.push(`<text x="${m.left - 6}" y="${p(sy(v) + 3.5)}" text-anchor="end" fill="${C.muted}">${formatNumber(v, tickDecimals(yt.step))}</text>`);
  }
  out.push(`<rect x="${m.left}" y="${m.top}" width="${width - m.left - m.right}" height="${height - m.top - m.bottom}" fill="none" stroke="${C.frame}"/>`);
  out.push(`<text x="${(m.left + width - m.right) / 2}" y="${height - 12}" text-anchor="middle" fill="${C.fg}">${escapeHtml(spec.xLabel)}</text>`);
  out.push(
    `<text transform="translate(14 ${(m.top + height - m.bottom) / 2}) rotate(-90)" text-anchor="middle" fill="${C.fg}">${escapeHtml(spec.yLabel)}</text>`,
  );
  if (spec.box) {
    const b = spec.box;
    const bx0 = sx(Math.max(b.x0, xe[0]!));
    const bx1 = sx(Math.min(b.x1, xe[xe.length - 1]!));
    const by0 = sy(Math.min(b.y1, ye[ye.length - 1]!));
    const by1 = sy(Math.max(b.y0, ye[0]!));
    // White under black dashes: visible on pale and deep cells alike.
    out.push(`<rect x="${p(bx0)}" y="${p(by0)}" width="${p(bx1 - bx0)}" height="${p(by1 - by0)}" fill="none" stroke="${C.panel}" stroke-width="3.5"/>`);
    out.push(
      `<rect x="${p(bx0)}" y="${p(by0)}" width="${p(bx1 - bx0)}" height="${p(by1 - by0)}" fill="none" stroke="${C.fg}" stroke-width="1.6" stroke-dasharray="6 3"/>`,
    );
    out.push(`<text x="${p(bx0 + 3)}" y="${p(by0 - 4)}" fill="${C.fg}" font-weight="600">${escapeHtml(b.label)}</text>`);
  }
  // Scale bar.
  const barX = width - m.right + 22;
  const barH = height - m.top - m.bottom;
  const steps = 24;
  for (let i = 0; i < steps; i++) {
    const y = m.top + (barH * i) / steps;
    out.push(`<rect x="${barX}" y="${p(y)}" width="14" height="${p(barH / steps + 0.4)}" fill="${rampColour(1 - i / steps)}"/>`);
  }
  out.push(`<rect x="${barX}" y="${m.top}" width="14" height="${barH}" fill="none" stroke="${C.frame}"/>`);
  const vt = niceTicks(vmin, vmax, 4);
  const sv = linearScale(vmin, vmax, m.top + barH, m.top);
  for (const v of vt.ticks.filter((t) => t >= vmin - 1e-12 && t <= vmax + 1e-12)) {
    out.push(`<text x="${barX + 18}" y="${p(sv(v) + 3.5)}" fill="${C.muted}">${formatNumber(v, tickDecimals(vt.step))}</text>`);
  }
  out.push(`<text x="${barX - 4}" y="${m.top - 8}" fill="${C.fg}">${escapeHtml(spec.valueLabel)}</text>`);
  out.push('</svg>');
  return { svg: out.join(''), widthPx: width, heightPx: height };
}

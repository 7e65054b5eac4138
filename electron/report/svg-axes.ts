/** Axis ticks and value-to-pixel scales for the report's SVG charts. */

/** A linear map from a data interval to a pixel interval. */
export interface LinearScale {
  min: number;
  max: number;
  (value: number): number;
}

/** Linear scale from `[min, max]` onto `[fromPx, toPx]` (a zero-width interval maps to the middle). */
export function linearScale(min: number, max: number, fromPx: number, toPx: number): LinearScale {
  const span = max - min;
  const f = ((v: number) => (span === 0 ? (fromPx + toPx) / 2 : fromPx + ((v - min) / span) * (toPx - fromPx))) as LinearScale;
  f.min = min;
  f.max = max;
  return f;
}

/**
 * "Nice" tick values covering `[min, max]` with about `count` steps of 1, 2, 2.5 or 5 × 10^k
 * (the usual axis-labelling rule, e.g. Heckbert, "Nice numbers for graph labels", Graphics Gems 1990).
 */
export function niceTicks(min: number, max: number, count = 5): { min: number; max: number; step: number; ticks: number[] } {
  let lo = Number.isFinite(min) ? min : 0;
  let hi = Number.isFinite(max) ? max : 1;
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.05;
    lo -= pad;
    hi += pad;
  }
  const raw = (hi - lo) / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * mag >= raw) ?? 10) * mag;
  const first = Math.floor(lo / step + 1e-9) * step;
  const last = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = first, i = 0; v <= last + step * 1e-6 && i < 100; v = first + ++i * step) ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return { min: first, max: last, step, ticks };
}

/** Decimals needed to show ticks spaced `step` apart without repeating labels. */
export function tickDecimals(step: number): number {
  if (!(step > 0)) return 0;
  return Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9) + (step / 10 ** Math.floor(Math.log10(step)) === 2.5 ? 1 : 0)));
}

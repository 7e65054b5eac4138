/**
 * Round tick values for chart axes: steps of 1, 2, 2.5 or 5 × 10ⁿ, so axes read 0.5 / 1.0 / 1.5
 * or 500 / 1000 / 1500 rather than 3.7 / 0.3 / −3.1 (common practice in engineering plots).
 */

/** A round step giving about `target` intervals over `span`. */
export function niceStep(span: number, target = 5): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, target);
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 2.5 ? 2.5 : m <= 5 ? 5 : 10) * p;
}

/** Decimals that print every multiple of `step` exactly (0.25 → 2, 5 → 0). */
export function stepDecimals(step: number): number {
  for (let d = 0; d < 10; d++) if (Math.abs(Math.round(step * 10 ** d) - step * 10 ** d) < 1e-9 * 10 ** d) return d;
  return 10;
}

/** Round ticks inside [lo, hi] (both ends included when they fall on a tick). */
export function niceTicks(lo: number, hi: number, target = 5): number[] {
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(hi > lo)) return Number.isFinite(lo) ? [lo] : [];
  const step = niceStep(hi - lo, target);
  const d = stepDecimals(step);
  const out: number[] = [];
  for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + step * 1e-9; k++) out.push(Number((k * step).toFixed(d)) || 0);
  return out;
}

/** [lo, hi] widened outwards to round ticks. */
export function niceBounds(lo: number, hi: number, target = 5): [number, number] {
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(hi > lo)) return [lo, hi];
  const step = niceStep(hi - lo, target);
  const d = stepDecimals(step);
  return [Number((Math.floor(lo / step + 1e-9) * step).toFixed(d)), Number((Math.ceil(hi / step - 1e-9) * step).toFixed(d))];
}

/** A Chart.js `afterBuildTicks` hook that puts the ticks on round values of the scale's range. */
export function roundTicks(target = 5): (scale: { min: number; max: number; ticks: { value: number }[] }) => void {
  return (scale) => {
    scale.ticks = niceTicks(scale.min, scale.max, target).map((value) => ({ value }));
  };
}

/**
 * sin δ and cos δ of each rotor angle, the way the step needs them: the angle moves by a few
 * milliradians per step, so each set keeps the sine and cosine of an anchor angle δ₀ (taken
 * with `Math.sin` / `Math.cos`) and reaches δ = δ₀ + Δ by the angle-addition formulas, with
 * sin Δ and cos Δ − 1 from their Taylor series. Within `ANCHOR_SPAN_RAD` the series'
 * first left-out terms (Δ¹¹/11!, Δ¹²/12!) are below 1e-22, so the result is `Math.sin` /
 * `Math.cos` up to a few units in the last place; a step that takes the angle further takes a new anchor.
 * Four RK4 stages a step and 8 sets make 64 sine–cosine pairs a step without this, about 8 with it.
 */

/** Largest |δ − δ₀|, rad, reached from an anchor (the series' truncation is ≤ 1e-22 within it). */
export const ANCHOR_SPAN_RAD = 0.05;

// Ratios of successive Taylor terms: 1/(2k(2k+1)) for the sine, 1/((2k−1)2k) for the cosine.
const S3 = 1 / 6;
const S5 = 1 / 20;
const S7 = 1 / 42;
const S9 = 1 / 72;
const C4 = 1 / 12;
const C6 = 1 / 30;
const C8 = 1 / 56;
const C10 = 1 / 90;

/**
 * Writes sin δ into `out[sinAt]` and cos δ into `out[cosAt]`, reading and (when it takes a new one)
 * writing the anchor δ₀, sin δ₀, cos δ₀ at `out[anchorAt]`, `out[anchorSinAt]`, `out[anchorCosAt]`.
 * An anchor of NaN means none yet.
 */
export function rotorSinCos(out: Float64Array, d: number, sinAt: number, cosAt: number, anchorAt: number, anchorSinAt: number, anchorCosAt: number): void {
  const dd = d - out[anchorAt]!;
  if (dd >= -ANCHOR_SPAN_RAD && dd <= ANCHOR_SPAN_RAD) {
    const d2 = dd * dd;
    // sin Δ = Δ (1 − Δ²/6 (1 − Δ²/20 (1 − Δ²/42 (1 − Δ²/72)))), cos Δ − 1 = −Δ²/2 (1 − Δ²/12 (1 − Δ²/30 (1 − Δ²/56 (1 − Δ²/90)))).
    const sd = dd * (1 - d2 * S3 * (1 - d2 * S5 * (1 - d2 * S7 * (1 - d2 * S9))));
    const cm1 = -d2 * 0.5 * (1 - d2 * C4 * (1 - d2 * C6 * (1 - d2 * C8 * (1 - d2 * C10))));
    const s0 = out[anchorSinAt]!;
    const c0 = out[anchorCosAt]!;
    out[sinAt] = s0 + (s0 * cm1 + c0 * sd);
    out[cosAt] = c0 + (c0 * cm1 - s0 * sd);
    return;
  }
  const s = Math.sin(d);
  const c = Math.cos(d);
  out[anchorAt] = d;
  out[anchorSinAt] = s;
  out[anchorCosAt] = c;
  out[sinAt] = s;
  out[cosAt] = c;
}

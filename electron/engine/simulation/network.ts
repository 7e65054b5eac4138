/**
 * The common bus, solved at every evaluation: each on-line set is a Norton source
 * (its E'' through X''d and its feeder), loads hang on the bus. With the total
 * admittance A (sets and constant-impedance loads), the Norton current I_N and the
 * constant-power loads S = P + jQ, the bus voltage V solves
 *
 *   A V + S* V / |V|² = I_N
 *
 * by Newton–Raphson on its real and imaginary parts, warm-started from the last
 * solution (2–3 iterations in practice). Constant-power loads turn into constant
 * impedance below `POWER_LOAD_BREAK_PU` (as stability programs do), so a collapsing
 * or building-up bus stays solvable.
 */

/** Below this bus voltage (pu) constant-power loads behave as constant impedance. */
export const POWER_LOAD_BREAK_PU = 0.7;
const BREAK2 = POWER_LOAD_BREAK_PU * POWER_LOAD_BREAK_PU;
const MAX_ITERATIONS = 30;

/** The bus voltage (pu, system base), warm start and answer. */
export interface BusVoltage {
  re: number;
  im: number;
  iterations: number;
  converged: boolean;
}

/** Offsets of the bus solve's inputs in its `Float64Array` (typed storage: nothing is boxed per call). */
export const NET_A_RE = 0;
export const NET_A_IM = 1;
export const NET_IN_RE = 2;
export const NET_IN_IM = 3;
export const NET_P = 4;
export const NET_Q = 5;

/**
 * Solves the bus voltage in place (`bus` holds the warm start and receives the answer).
 * `net` holds the total admittance A, the Norton current I_N and the constant-power load
 * P + jQ, all pu on the system base, at the `NET_*` offsets.
 */
export function solveBus(net: Float64Array, bus: BusVoltage): void {
  const aRe = net[NET_A_RE]!;
  const aIm = net[NET_A_IM]!;
  const inRe = net[NET_IN_RE]!;
  const inIm = net[NET_IN_IM]!;
  const p = net[NET_P]!;
  const q = net[NET_Q]!;
  let x = bus.re;
  let y = bus.im;
  if (!(x * x + y * y > 1e-4)) {
    const d = aRe * aRe + aIm * aIm;
    x = (inRe * aRe + inIm * aIm) / d;
    y = (inIm * aRe - inRe * aIm) / d;
  }
  bus.converged = false;
  let k = 0;
  for (; k < MAX_ITERATIONS; k++) {
    const r2 = x * x + y * y;
    const a = p * x + q * y;
    const b = p * y - q * x;
    let gr: number, gi: number, grx: number, gry: number, gix: number, giy: number;
    if (r2 >= BREAK2) {
      const r4 = r2 * r2;
      gr = a / r2;
      gi = b / r2;
      grx = (p * r2 - 2 * a * x) / r4;
      gry = (q * r2 - 2 * a * y) / r4;
      gix = (-q * r2 - 2 * b * x) / r4;
      giy = (p * r2 - 2 * b * y) / r4;
    } else {
      const c = 1 / BREAK2;
      gr = a * c;
      gi = b * c;
      grx = p * c;
      gry = q * c;
      gix = -q * c;
      giy = p * c;
    }
    const fr = aRe * x - aIm * y + gr - inRe;
    const fi = aRe * y + aIm * x + gi - inIm;
    const j00 = aRe + grx;
    const j01 = -aIm + gry;
    const j10 = aIm + gix;
    const j11 = aRe + giy;
    const det = j00 * j11 - j01 * j10;
    const dx = (fr * j11 - fi * j01) / det;
    const dyv = (j00 * fi - j10 * fr) / det;
    x -= dx;
    y -= dyv;
    if (Math.abs(dx) + Math.abs(dyv) < 1e-12) {
      bus.converged = true;
      k++;
      break;
    }
  }
  bus.re = x;
  bus.im = y;
  bus.iterations = k;
}

/**
 * The common bus, solved at every evaluation: each on-line set is a Norton source
 * (its E'' through X''d and its feeder), loads hang on the bus. With the total
 * admittance A (sets and the constant-impedance load shares), the Norton current I_N, the
 * constant-power load shares S_P = P + jQ and the constant-current shares S_I = P_I + jQ_I
 * (their power at 1 pu; ZIP model, `sharing/bus-loads.ts`), the bus voltage V solves
 *
 *   A V + S_P* V / |V|² + S_I* V / |V| = I_N
 *
 * directly when the loads have no constant-current share (a quadratic in |V|², `solveDirect`), else by
 * Newton–Raphson on its real and imaginary parts, warm-started from the last solution (2–3 iterations in
 * practice). Below the break voltage b (the plant's
 * `powerLoadBreakPct`) the constant-power and constant-current shares turn into constant
 * impedance (S_P |V|²/b², S_I |V|²/b: continuous at b), as stability programs do, so a
 * collapsing or building-up bus stays solvable; the run says how much load that leaves unserved.
 */

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
/** Constant-current load shares, pu at 1 pu voltage. */
export const NET_PI = 6;
export const NET_QI = 7;
/** The break voltage, pu. */
export const NET_BREAK = 8;
/** Length of the bus solve's input array. */
export const NET_LENGTH = 9;

/**
 * The bus voltage without iterating, when the loads have no constant-current share and the bus is above the
 * break voltage: with r = |V|², A V + S_P* V / |V|² = I_N times V* gives A r + S_P* = I_N V*, whose squared
 * modulus is the quadratic |A|² r² + (2 Re(A S_P) − |I_N|²) r + |S_P|² = 0; the larger root is the operating
 * voltage and V = conj((A r + S_P*) / I_N). With no constant-power share either, V = I_N / A. Taken only when it is
 * the answer Newton's method would reach from the warm start (x, y): the larger root above the break, not near
 * the nose of the curve (where the roots meet) and within 0.1 pu of the warm start; otherwise false, and the
 * caller iterates.
 */
function solveDirect(aRe: number, aIm: number, inRe: number, inIm: number, p: number, q: number, brk2: number, x: number, y: number, bus: BusVoltage): boolean {
  const a2 = aRe * aRe + aIm * aIm;
  let vx: number;
  let vy: number;
  if (p === 0 && q === 0) {
    vx = (inRe * aRe + inIm * aIm) / a2;
    vy = (inIm * aRe - inRe * aIm) / a2;
  } else {
    const in2 = inRe * inRe + inIm * inIm;
    const b = in2 - 2 * (aRe * p - aIm * q);
    const disc = b * b - 4 * a2 * (p * p + q * q);
    // Near the nose the roots meet and the quadratic loses digits: leave it to Newton.
    if (!(b > 0 && disc > 1e-6 * b * b)) return false;
    const r = (b + Math.sqrt(disc)) / (2 * a2);
    if (!(r >= brk2)) return false;
    const nr = aRe * r + p;
    const ni = aIm * r - q;
    vx = (nr * inRe + ni * inIm) / in2;
    vy = (nr * inIm - ni * inRe) / in2;
  }
  const dx = vx - x;
  const dy = vy - y;
  if (!(dx * dx + dy * dy < 0.01)) return false;
  bus.re = vx;
  bus.im = vy;
  bus.iterations = 0;
  bus.converged = true;
  return true;
}

/**
 * Solves the bus voltage in place (`bus` holds the warm start and receives the answer).
 * `net` holds the total admittance A, the Norton current I_N, the constant-power load
 * P + jQ, the constant-current load P_I + jQ_I, all pu on the system base, and the break
 * voltage, at the `NET_*` offsets.
 */
export function solveBus(net: Float64Array, bus: BusVoltage): void {
  const aRe = net[NET_A_RE]!;
  const aIm = net[NET_A_IM]!;
  const inRe = net[NET_IN_RE]!;
  const inIm = net[NET_IN_IM]!;
  const p = net[NET_P]!;
  const q = net[NET_Q]!;
  const pi = net[NET_PI]!;
  const qi = net[NET_QI]!;
  const brk = net[NET_BREAK]!;
  const brk2 = brk * brk;
  let x = bus.re;
  let y = bus.im;
  if (!(x * x + y * y > 1e-4)) {
    const d = aRe * aRe + aIm * aIm;
    x = (inRe * aRe + inIm * aIm) / d;
    y = (inIm * aRe - inRe * aIm) / d;
  }
  if (pi === 0 && qi === 0 && x * x + y * y >= brk2 && solveDirect(aRe, aIm, inRe, inIm, p, q, brk2, x, y, bus)) return;
  bus.converged = false;
  let k = 0;
  for (; k < MAX_ITERATIONS; k++) {
    const r2 = x * x + y * y;
    const a = p * x + q * y;
    const b = p * y - q * x;
    let gr: number, gi: number, grx: number, gry: number, gix: number, giy: number;
    const ai = pi * x + qi * y;
    const bi = pi * y - qi * x;
    if (r2 >= brk2) {
      // One division: the reciprocals of |V|² and |V|⁴ serve every term.
      const ir2 = 1 / r2;
      const ir4 = ir2 * ir2;
      gr = a * ir2;
      gi = b * ir2;
      grx = (p * r2 - 2 * a * x) * ir4;
      gry = (q * r2 - 2 * a * y) * ir4;
      gix = (-q * r2 - 2 * b * x) * ir4;
      giy = (p * r2 - 2 * b * y) * ir4;
      if (pi !== 0 || qi !== 0) {
        // S_I* V / |V|: d(a_i / r)/dx = (p_i r² − a_i x) / r³, and alike.
        const r = Math.sqrt(r2);
        const r3 = r2 * r;
        gr += ai / r;
        gi += bi / r;
        grx += (pi * r2 - ai * x) / r3;
        gry += (qi * r2 - ai * y) / r3;
        gix += (-qi * r2 - bi * x) / r3;
        giy += (pi * r2 - bi * y) / r3;
      }
    } else {
      const c = 1 / brk2;
      const ci = 1 / brk;
      gr = a * c + ai * ci;
      gi = b * c + bi * ci;
      grx = p * c + pi * ci;
      gry = q * c + qi * ci;
      gix = -q * c - qi * ci;
      giy = p * c + pi * ci;
    }
    const fr = aRe * x - aIm * y + gr - inRe;
    const fi = aRe * y + aIm * x + gi - inIm;
    const j00 = aRe + grx;
    const j01 = -aIm + gry;
    const j10 = aIm + gix;
    const j11 = aRe + giy;
    const idet = 1 / (j00 * j11 - j01 * j10);
    const dx = (fr * j11 - fi * j01) * idet;
    const dyv = (j00 * fi - j10 * fr) * idet;
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

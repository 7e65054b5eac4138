/**
 * The plant with feeders: each online set reaches the common bus through R + jX per
 * phase, and the small AC network is solved exactly by Newton–Raphson.
 *
 * Unknowns. Outer: the active-power variable (bus frequency, or the isochronous group's
 * loading λ while it holds frequency), the bus voltage magnitude (the bus is the angle
 * reference), and, when a set or the cross-current group holds voltage, that unit's
 * kVAR level. Inner, per set: the kW and kVAR it delivers into the bus. For given
 * receiving-end powers the feeder is explicit (three-phase, V line-to-line, Z per phase):
 * `I' = (P_r − jQ_r) / V_b`, `V_t = V_b + Z I'`, `P_s = P_r + R|I'|²`, `Q_s = Q_r + X|I'|²`
 * (Glover, Sarma & Overbye, ch. 5, the short line: sending end = receiving end + series drop).
 * Each set's governor fixes `P_s`, its regulator one relation among `Q_s` and `|V_t|`:
 * a 2 × 2 Newton per set. The outer Jacobian comes from those per-set solves by implicit
 * differentiation, so the whole is an exact Newton–Raphson in O(n) per iteration.
 * The bus balance (Σ P_r = load kW, Σ Q_r = load kVAR) and the voltage unit's setpoint
 * close the system.
 */
import { Diverged, EngineError, NoSteadyState } from '../errors';
import * as codes from './sharing-model';
import type { SharingModel } from './sharing-model';
import { governorKW, isoKW, isoLambdaRange } from './active-sharing';
import type { IsoState } from './active-sharing';
import { busLoadKVAR, busLoadKVARdV, busLoadKW, busLoadKWdV, busLoadKWLinear } from './bus-loads';
import type { OperatingPoint } from './sharing-result';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const GOV_BASE = codes.GOV_BASE;
const GOV_DROOP = codes.GOV_DROOP;
const GOV_ISO = codes.GOV_ISO;
const REG_CROSS = codes.REG_CROSS;
const REG_DROOP = codes.REG_DROOP;
const REG_PF = codes.REG_PF;


const MAX_OUTER = 60;
const MAX_INNER = 40;
const MAX_HALVINGS = 12;
const OUTER_TOL = 1e-12;
/** Below this (per Hz, per unit of the plant's kVA) the balance counts as flat in frequency. */
const FLAT = 1e-12;

/** Per-solve work arrays (allocated once; the iterations allocate nothing). */
interface Work {
  m: SharingModel;
  /** Outer unknowns: [0] frequency Hz or λ (pu), [1] bus V, [2] unit kVAR level (VAR, or VAR per kVA for cross-current). */
  y: Float64Array;
  ny: number;
  isoMode: boolean;
  /** λ of a saturated isochronous group (frequency mode), else NaN. */
  isoLambdaFixed: number;
  pr: Float64Array;
  qr: Float64Array;
  prSave: Float64Array;
  qrSave: Float64Array;
  ps: Float64Array;
  qs: Float64Array;
  ev: Float64Array;
  angle: Float64Array;
  /** d(P_r, Q_r, |V_t|)_i / d y_j, at [3 i + j]. */
  dPr: Float64Array;
  dQr: Float64Array;
  dE: Float64Array;
  f: Float64Array;
  jac: Float64Array;
  step: Float64Array;
  /** Weight of each set in the voltage unit's setpoint equation (0 outside the unit). */
  unitWeight: Float64Array;
  unitWeightSum: number;
  loadW: number;
  loadVAR: number;
  sBaseVA: number;
  /** Isochronous group loading range (pu of ratedKW) where every set is between limits. */
  isoLo: number;
  isoHi: number;
  /** Scratch: the governor target of the set being solved, W, and its derivative. */
  targetW: number;
  targetD: number;
  /** Scratch of `localEval`: sending-end powers, terminal phasor parts and magnitude, residuals. */
  lps: number;
  lqs: number;
  lA: number;
  lB: number;
  lE: number;
  le1: number;
  le2: number;
  /** Continuation factor on every feeder impedance (1 = the real feeders). */
  zScale: number;
}

function setTarget(w: Work, p: number, d: number): void {
  w.targetW = p;
  w.targetD = d;
}

/** Governor target of set i at the sending end, W, and its derivative by the active-power unknown (into `w.targetW`, `w.targetD`). */
function target(w: Work, i: number): void {
  const m = w.m;
  const y0 = w.y[0]!;
  const maxW = m.maxKW[i]! * 1000;
  const minW = m.minKW[i]! * 1000;
  if (w.isoMode) {
    if (m.gov[i] !== GOV_ISO) return setTarget(w, governorKW(m, i, m.isoSetpointHz) * 1000, 0);
    const r = m.ratedKW[i]! * 1000;
    // Beyond the group's range the line is extended with slope r so that Newton can see
    // past saturation; the caller then switches mode.
    if (y0 >= w.isoHi) return setTarget(w, maxW + (y0 - w.isoHi) * r, r);
    if (y0 <= w.isoLo) return setTarget(w, minW + (y0 - w.isoLo) * r, r);
    const raw = y0 * r;
    if (raw >= maxW) return setTarget(w, maxW, 0);
    if (raw <= minW) return setTarget(w, minW, 0);
    return setTarget(w, raw, r);
  }
  if (m.gov[i] === GOV_ISO) return setTarget(w, isoKW(m, i, w.isoLambdaFixed) * 1000, 0);
  if (m.gov[i] === GOV_BASE) return setTarget(w, m.baseKW[i]! * 1000, 0);
  const raw = m.slopeKWPerHz[i]! * (m.noLoadHz[i]! - y0) * 1000;
  if (raw >= maxW) return setTarget(w, maxW, 0);
  if (raw <= minW) return setTarget(w, minW, 0);
  return setTarget(w, raw, -m.slopeKWPerHz[i]! * 1000);
}

/**
 * Solves set i's two local equations for (P_r, Q_r) at the current outer unknowns, and
 * fills the derivatives of P_r, Q_r and |V_t| by the outer unknowns. False if it fails.
 */
/**
 * Set i's local residuals at receiving-end powers (pr, qr), W and VAR; stores the feeder
 * quantities in `w.l*`. Returns |e1| + |e2|.
 */
function localEval(w: Work, pr: number, qr: number, vb: number, R: number, X: number, droopLaw: boolean, a: number, v0: number, tp: number, qTarget: number): number {
  const L = (pr * pr + qr * qr) / (vb * vb);
  const ps = pr + R * L;
  const qs = qr + X * L;
  const A = vb + (R * pr + X * qr) / vb;
  const B = (X * pr - R * qr) / vb;
  const E = Math.hypot(A, B);
  w.lps = ps;
  w.lqs = qs;
  w.lA = A;
  w.lB = B;
  w.lE = E;
  w.le1 = ps - tp;
  w.le2 = droopLaw ? qs - a * (v0 - E) : qs - qTarget;
  return Math.abs(w.le1) + Math.abs(w.le2);
}

function solveSet(w: Work, i: number): boolean {
  const m = w.m;
  const vb = w.y[1]!;
  const R = m.rOhm[i]! * w.zScale;
  const X = m.xOhm[i]! * w.zScale;
  const reg = m.reg[i]!;
  const a = m.slopeKVARPerV[i]! * 1000;
  const v0 = m.noLoadV[i]!;
  const tan = m.tanPhi[i]!;
  target(w, i);
  const tp = w.targetW;
  const td = w.targetD;
  const inUnit = w.unitWeight[i]! > 0;
  const droopLaw = reg === REG_DROOP && !inUnit;
  const qTarget = inUnit ? (reg === REG_CROSS ? w.y[2]! * m.ratedKVA[i]! : w.y[2]!) : reg === REG_PF ? tan * tp : 0;
  const scale = Math.max(1, m.ratedKVA[i]! * 1000);
  const inv = 1 / (vb * vb);
  let pr = w.pr[i]!;
  let qr = w.qr[i]!;
  let res = localEval(w, pr, qr, vb, R, X, droopLaw, a, v0, tp, qTarget);
  if (!Number.isFinite(res)) {
    // A poor warm start (far outside the feeder's reach): start from the targets.
    pr = tp;
    qr = qTarget;
    res = localEval(w, pr, qr, vb, R, X, droopLaw, a, v0, tp, qTarget);
  }
  let ok = false;
  for (let k = 0; k < MAX_INNER && Number.isFinite(res); k++) {
    if (res <= 1e-13 * scale) {
      ok = true;
      break;
    }
    const A = w.lA;
    const B = w.lB;
    const E = w.lE;
    const e1 = w.le1;
    const e2 = w.le2;
    const j11 = 1 + 2 * R * pr * inv;
    const j12 = 2 * R * qr * inv;
    let j21 = 2 * X * pr * inv;
    let j22 = 1 + 2 * X * qr * inv;
    if (droopLaw) {
      j21 += (a * (A * R + B * X)) / (vb * E);
      j22 += (a * (A * X - B * R)) / (vb * E);
    }
    const det = j11 * j22 - j12 * j21;
    if (!(Math.abs(det) > 1e-300)) return false;
    const dp = (e1 * j22 - e2 * j12) / det;
    const dq = (e2 * j11 - e1 * j21) / det;
    // Damped Newton: halve the step until the residual falls (stiff droop behind a resistive feeder overshoots).
    let t = 1;
    let accepted = false;
    for (let h = 0; h < 30; h++) {
      const r2 = localEval(w, pr - t * dp, qr - t * dq, vb, R, X, droopLaw, a, v0, tp, qTarget);
      if (r2 < res) {
        pr -= t * dp;
        qr -= t * dq;
        res = r2;
        accepted = true;
        break;
      }
      t *= 0.5;
    }
    if (!accepted) {
      // No decrease even for tiny steps: at the floor of rounding, or no local solution.
      ok = res <= 1e-9 * scale;
      localEval(w, pr, qr, vb, R, X, droopLaw, a, v0, tp, qTarget);
      break;
    }
  }
  if (!ok && res <= 1e-9 * scale) ok = true;
  const A = w.lA;
  const B = w.lB;
  const E = w.lE;
  if (!ok || !(E > 0)) return false;
  const ps = w.lps;
  const qs = w.lqs;
  const dEdP = (A * R + B * X) / (vb * E);
  const dEdQ = (A * X - B * R) / (vb * E);
  const j11 = 1 + 2 * R * pr * inv;
  const j12 = 2 * R * qr * inv;
  const j21 = 2 * X * pr * inv + (droopLaw ? a * dEdP : 0);
  const j22 = 1 + 2 * X * qr * inv + (droopLaw ? a * dEdQ : 0);
  w.pr[i] = pr;
  w.qr[i] = qr;
  w.ps[i] = ps;
  w.qs[i] = qs;
  w.ev[i] = E;
  w.angle[i] = Math.atan2(B, A);

  // Implicit differentiation: dz/dy = −J⁻¹ ∂e/∂y, z = (P_r, Q_r).
  const det = j11 * j22 - j12 * j21;
  const S2 = pr * pr + qr * qr;
  const dL = (-2 * S2) / (vb * vb * vb);
  const c1 = R * pr + X * qr;
  const c2 = X * pr - R * qr;
  const dEdVb = (A * (1 - c1 / (vb * vb)) + B * (-c2 / (vb * vb))) / E;
  const droopHere = reg === REG_DROOP && !inUnit;
  for (let j = 0; j < w.ny; j++) {
    // ∂e/∂y_j for y = (f or λ, V_b, unit kVAR level).
    const de1 = j === 0 ? -td : j === 1 ? R * dL : 0;
    const de2 =
      j === 0
        ? reg === REG_PF && !inUnit
          ? -tan * td
          : 0
        : j === 1
          ? X * dL + (droopHere ? a * dEdVb : 0)
          : inUnit
            ? reg === REG_CROSS
              ? -m.ratedKVA[i]!
              : -1
            : 0;
    const dp = -(de1 * j22 - de2 * j12) / det;
    const dq = -(de2 * j11 - de1 * j21) / det;
    w.dPr[3 * i + j] = dp;
    w.dQr[3 * i + j] = dq;
    w.dE[3 * i + j] = dEdP * dp + dEdQ * dq + (j === 1 ? dEdVb : 0);
  }
  return true;
}

/** Evaluates the outer residuals (and Jacobian) at `w.y`; false if a set's local solve fails. */
function evaluate(w: Work): boolean {
  const m = w.m;
  const vb = w.y[1]!;
  if (!(vb > 0) || !Number.isFinite(w.y[0]!)) return false;
  for (let i = 0; i < m.n; i++) if (!solveSet(w, i)) return false;
  const fHz = w.isoMode ? m.isoSetpointHz : w.y[0]!;
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  w.loadW = busLoadKW(m.loads, vb, fHz, vr, fr) * 1000;
  w.loadVAR = busLoadKVAR(m.loads, vb, vr) * 1000;
  let sp = 0;
  let sq = 0;
  let se = 0;
  const jac = w.jac;
  jac.fill(0);
  for (let i = 0; i < m.n; i++) {
    sp += w.pr[i]!;
    sq += w.qr[i]!;
    const wt = w.unitWeight[i]!;
    se += wt * w.ev[i]!;
    for (let j = 0; j < w.ny; j++) {
      jac[j] = jac[j]! + w.dPr[3 * i + j]!;
      jac[3 + j] = jac[3 + j]! + w.dQr[3 * i + j]!;
      if (wt > 0) jac[6 + j] = jac[6 + j]! + (wt * w.dE[3 * i + j]!) / w.unitWeightSum;
    }
  }
  w.f[0] = sp - w.loadW;
  w.f[1] = sq - w.loadVAR;
  if (w.ny === 3) w.f[2] = se / w.unitWeightSum - m.voltageSetpointV;
  if (!w.isoMode) jac[0] = jac[0]! - busLoadKWLinear(m.loads, vb, fHz, vr, fr).b * 1000;
  jac[1] = jac[1]! - busLoadKWdV(m.loads, vb, fHz, vr, fr) * 1000;
  jac[4] = jac[4]! - busLoadKVARdV(m.loads, vb, vr) * 1000;
  return true;
}

function residualNorm(w: Work): number {
  const a = Math.abs(w.f[0]!) / w.sBaseVA;
  const b = Math.abs(w.f[1]!) / w.sBaseVA;
  const c = w.ny === 3 ? Math.abs(w.f[2]!) / w.m.ratedVoltageV : 0;
  return Math.max(a, b, c);
}

/** Solves jac · step = −f (ny ≤ 3) by Gaussian elimination with partial pivoting; false if singular. */
function newtonStep(w: Work): boolean {
  const n = w.ny;
  const a = w.jac;
  const b = w.step;
  for (let r = 0; r < n; r++) b[r] = -w.f[r]!;
  // Row scaling: rows are in W, VAR and V.
  for (let r = 0; r < n; r++) {
    const s = 1 / (r === 2 ? w.m.ratedVoltageV : w.sBaseVA);
    b[r] = b[r]! * s;
    for (let c = 0; c < n; c++) a[3 * r + c] = a[3 * r + c]! * s;
  }
  // Every droop set at a kW limit: the balance is flat in frequency. If it is already met,
  // hold the frequency (row 0 becomes Δf = 0) and let the other equations converge.
  // (Only a frequency-sensitive load then gives the column a trace of slope.)
  if (!w.isoMode && Math.abs(a[0]!) < FLAT && Math.abs(a[3]!) < FLAT && Math.abs(a[6]!) < FLAT) {
    if (Math.abs(b[0]!) > OUTER_TOL) return false;
    a[0] = 1;
    a[1] = 0;
    a[2] = 0;
    b[0] = 0;
  }
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[3 * r + c]!) > Math.abs(a[3 * piv + c]!)) piv = r;
    if (!(Math.abs(a[3 * piv + c]!) > 1e-300)) return false;
    if (piv !== c) {
      for (let k = 0; k < n; k++) {
        const tmp = a[3 * c + k]!;
        a[3 * c + k] = a[3 * piv + k]!;
        a[3 * piv + k] = tmp;
      }
      const tb = b[c]!;
      b[c] = b[piv]!;
      b[piv] = tb;
    }
    for (let r = c + 1; r < n; r++) {
      const f = a[3 * r + c]! / a[3 * c + c]!;
      for (let k = c; k < n; k++) a[3 * r + k] = a[3 * r + k]! - f * a[3 * c + k]!;
      b[r] = b[r]! - f * b[c]!;
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let k = r + 1; k < n; k++) s -= a[3 * r + k]! * b[k]!;
    b[r] = s / a[3 * r + r]!;
  }
  for (let r = 0; r < n; r++) if (!Number.isFinite(b[r]!)) return false;
  // Trust region: no Newton step moves frequency or voltage by more than half of rated.
  const m = w.m;
  const limits0 = w.isoMode ? 1 : 0.5 * m.ratedFrequencyHz;
  let shrink = 1;
  if (Math.abs(b[0]!) > limits0) shrink = Math.min(shrink, limits0 / Math.abs(b[0]!));
  if (Math.abs(b[1]!) > 0.5 * m.ratedVoltageV) shrink = Math.min(shrink, (0.5 * m.ratedVoltageV) / Math.abs(b[1]!));
  if (shrink < 1) for (let r = 0; r < n; r++) b[r] = b[r]! * shrink;
  return true;
}

/** Runs Newton–Raphson from `w.y`; returns the iteration count or throws. */
function iterate(w: Work): number {
  if (!evaluate(w)) throw new Diverged('The network solve could not start: a set cannot deliver its output through its feeder at the starting voltage. Check the feeder impedances.');
  let norm = residualNorm(w);
  const y0 = new Float64Array(3);
  for (let it = 1; it <= MAX_OUTER; it++) {
    if (norm <= OUTER_TOL) return it - 1;
    if (!newtonStep(w)) {
      if (!w.isoMode && escapePlateau(w)) {
        if (!evaluate(w)) throw new Diverged('The network solve lost its way while the droop sets were at their limits. Check the feeder impedances.');
        norm = residualNorm(w);
        continue;
      }
      throw new Diverged('The network solve met a singular Jacobian (the operating point is not defined by the settings). Check setpoints and feeders.');
    }
    y0.set(w.y);
    w.prSave.set(w.pr);
    w.qrSave.set(w.qr);
    let t = 1;
    let accepted = false;
    for (let h = 0; h <= MAX_HALVINGS; h++) {
      for (let j = 0; j < w.ny; j++) w.y[j] = y0[j]! + t * w.step[j]!;
      if (evaluate(w)) {
        const nn = residualNorm(w);
        if (nn < norm || h === MAX_HALVINGS) {
          norm = nn;
          accepted = true;
          break;
        }
      }
      w.pr.set(w.prSave);
      w.qr.set(w.qrSave);
      t *= 0.5;
    }
    if (!accepted) {
      if (!w.isoMode && allDroopAtMax(w)) throw capabilityError(w);
      throw new NoSteadyState(
        'The sets cannot deliver the load through their feeders at any bus voltage the solver could find: the voltage collapses. Check feeder impedances, the reactive load and the voltage settings.',
      );
    }
  }
  if (norm <= 1e-9) return MAX_OUTER;
  if (!w.isoMode && allDroopAtMax(w)) throw capabilityError(w);
  throw new Diverged(`The network solve did not converge in ${MAX_OUTER} iterations (residual ${norm.toExponential(1)} of rating). Check for extreme feeder impedances or setpoints.`);
}

/**
 * With every droop set at a kW limit the balance is flat in frequency and Newton has no
 * slope. Move the frequency just inside the nearest droop line in the direction the
 * imbalance asks for; if there is none, no steady state exists. Returns true if moved.
 */
function escapePlateau(w: Work): boolean {
  const m = w.m;
  const f = w.y[0]!;
  const short = w.f[0]! < 0; // the sets deliver less than the load: frequency must fall
  let target = short ? -Infinity : Infinity;
  for (let i = 0; i < m.n; i++) {
    if (m.gov[i] !== GOV_DROOP) continue;
    const k = m.slopeKWPerHz[i]!;
    const fMax = m.noLoadHz[i]! - m.maxKW[i]! / k; // at or below: at max
    const fMin = m.noLoadHz[i]! - m.minKW[i]! / k; // at or above: at min
    const inside = 0.01 * (fMin - fMax);
    if (short && fMin <= f + 1e-12) target = Math.max(target, fMin - inside);
    if (!short && fMax >= f - 1e-12) target = Math.min(target, fMax + inside);
  }
  if (!Number.isFinite(target)) {
    if (short) throw capabilityError(w);
    throw new NoSteadyState(
      `The load (${Math.round(w.loadW / 1000)} kW) is less than the sets' minimum output: frequency would rise until a set trips. Take a set off line or lower the base-load settings.`,
    );
  }
  w.y[0] = target;
  return true;
}

/** First continuation step, and the smallest before giving up (fractions of the feeder impedances). */
const CONTINUATION_FIRST = 0.125;
const CONTINUATION_MIN = 1 / 512;

/**
 * Newton–Raphson from the closed-form start; if that start is too far from the answer
 * (stiff regulators behind long feeders), grow the feeder impedances from a small
 * fraction to their real values, predicting each step from the last two solutions and
 * halving the step when Newton fails (natural-parameter continuation).
 */
function iterateWithContinuation(w: Work): number {
  const y = Float64Array.from(w.y);
  const pr = Float64Array.from(w.pr);
  const qr = Float64Array.from(w.qr);
  try {
    w.zScale = 1;
    return iterate(w);
  } catch (e) {
    if (!(e instanceof Diverged)) throw e;
  }
  w.y.set(y);
  w.pr.set(pr);
  w.qr.set(qr);
  // Last accepted point (s, y, P_r, Q_r) and the one before, for the secant predictor.
  const yPrev = new Float64Array(3);
  let sPrev = -1;
  let s = 0;
  let ds = CONTINUATION_FIRST;
  let total = 0;
  let lastError: EngineError | null = null;
  try {
    while (s < 1) {
      const sTry = Math.min(1, s + ds);
      y.set(w.y);
      pr.set(w.pr);
      qr.set(w.qr);
      if (sPrev >= 0) {
        const k = (sTry - s) / (s - sPrev);
        for (let j = 0; j < w.ny; j++) w.y[j] = y[j]! + k * (y[j]! - yPrev[j]!);
      }
      w.zScale = sTry;
      try {
        total += iterate(w);
      } catch (e) {
        if (!(e instanceof EngineError)) throw e;
        lastError = e;
        w.y.set(y);
        w.pr.set(pr);
        w.qr.set(qr);
        ds *= 0.5;
        if (ds < CONTINUATION_MIN) break;
        continue;
      }
      yPrev.set(y);
      sPrev = s;
      s = sTry;
      ds = Math.min(2 * ds, 0.25);
    }
  } finally {
    w.zScale = 1;
  }
  if (s >= 1) return total;
  if (lastError instanceof NoSteadyState) throw lastError;
  throw new Diverged(
    'No operating point was found for this network: the feeders may be too weak for the power and reactive power they must carry (voltage collapse), or the regulator settings too far apart. Check feeder impedances and voltage setpoints.',
  );
}

function allDroopAtMax(w: Work): boolean {
  const m = w.m;
  for (let i = 0; i < m.n; i++) {
    if (m.gov[i] !== GOV_DROOP) continue;
    if (m.slopeKWPerHz[i]! * (m.noLoadHz[i]! - w.y[0]!) < m.maxKW[i]!) return false;
  }
  return true;
}

function capabilityError(w: Work): NoSteadyState {
  return new NoSteadyState(
    `The load (${Math.round(w.loadW / 1000)} kW) plus feeder losses is more than the online sets can supply at full output: there is no steady state. Bring another set online or shed load.`,
  );
}

/** The starting point: the closed-form operating point (feeders ignored). */
export interface NetworkStart {
  frequencyHz: number;
  voltageV: number;
  kW: Float64Array;
  kVAR: Float64Array;
  isoState: IsoState;
}

/**
 * Solves the feeder network of `m` from the closed-form `start`.
 * @throws NoSteadyState when the load plus losses exceeds capability or the voltage collapses.
 * @throws Diverged when Newton–Raphson does not converge within its iteration bound.
 */
export function solveNetwork(m: SharingModel, start: NetworkStart): OperatingPoint {
  const n = m.n;
  const hasUnit = m.voltageUnit.length > 0;
  const w: Work = {
    m,
    y: new Float64Array(3),
    ny: hasUnit ? 3 : 2,
    isoMode: false,
    isoLambdaFixed: NaN,
    pr: new Float64Array(n),
    qr: new Float64Array(n),
    prSave: new Float64Array(n),
    qrSave: new Float64Array(n),
    ps: new Float64Array(n),
    qs: new Float64Array(n),
    ev: new Float64Array(n),
    angle: new Float64Array(n),
    dPr: new Float64Array(3 * n),
    dQr: new Float64Array(3 * n),
    dE: new Float64Array(3 * n),
    f: new Float64Array(3),
    jac: new Float64Array(9),
    step: new Float64Array(3),
    unitWeight: new Float64Array(n),
    unitWeightSum: 0,
    loadW: 0,
    loadVAR: 0,
    sBaseVA: 0,
    isoLo: 0,
    isoHi: 0,
    targetW: 0,
    targetD: 0,
    lps: 0,
    lqs: 0,
    lA: 0,
    lB: 0,
    lE: 0,
    le1: 0,
    le2: 0,
    zScale: 1,
  };
  for (let i = 0; i < n; i++) w.sBaseVA += m.ratedKVA[i]! * 1000;
  const cross = hasUnit && m.reg[m.voltageUnit[0]!] === REG_CROSS;
  for (const i of m.voltageUnit) w.unitWeight[i] = cross ? m.ratedKVA[i]! : 1;
  for (const i of m.voltageUnit) w.unitWeightSum += w.unitWeight[i]!;

  const init = () => {
    for (let i = 0; i < n; i++) {
      w.pr[i] = start.kW[i]! * 1000;
      w.qr[i] = start.kVAR[i]! * 1000;
    }
    w.y[1] = start.voltageV;
    if (hasUnit) {
      const u = m.voltageUnit[0]!;
      w.y[2] = cross ? (start.kVAR[u]! * 1000) / m.ratedKVA[u]! : start.kVAR[u]! * 1000;
    }
  };
  const { lo, hi } = m.isoGroup.length > 0 ? isoLambdaRange(m) : { lo: 0, hi: 0 };
  w.isoLo = lo;
  w.isoHi = hi;
  // The closed forms suggest whether the isochronous group holds frequency; feeder losses
  // can change that, so the other states are tried when the suggested one fails or
  // contradicts itself (a saturated group whose frequency lands on the wrong side of its setpoint).
  const tried: IsoState[] = [];
  let firstError: EngineError | null = null;
  let isoState: IsoState = start.isoState;
  let iterations = 0;
  const nextUntried = (): IsoState | null => {
    if (m.isoGroup.length === 0) return null;
    for (const s of ['holding', 'at-max', 'at-min'] as const) if (!tried.includes(s)) return s;
    return null;
  };
  for (;;) {
    tried.push(isoState);
    init();
    if (isoState === 'holding') {
      w.isoMode = true;
      let pIso = 0;
      let rIso = 0;
      for (const i of m.isoGroup) {
        pIso += start.kW[i]!;
        rIso += m.ratedKW[i]!;
      }
      w.y[0] = pIso / rIso;
    } else {
      w.isoMode = false;
      w.isoLambdaFixed = isoState === 'at-max' ? hi : lo;
      w.y[0] = start.frequencyHz;
    }
    let next: IsoState | null = null;
    try {
      iterations += iterateWithContinuation(w);
    } catch (e) {
      if (!(e instanceof EngineError)) throw e;
      firstError ??= e;
      next = nextUntried();
      if (next === null) throw firstError;
      isoState = next;
      continue;
    }
    if (w.isoMode) {
      const lambda = w.y[0]!;
      if (lambda > hi + 1e-12 || lambda < lo - 1e-12) {
        let anyDroop = false;
        for (let i = 0; i < n; i++) if (m.gov[i] === GOV_DROOP) anyDroop = true;
        if (!anyDroop) {
          const ids = m.isoGroup.map((i) => m.sets[i]!.id).join(', ');
          throw new NoSteadyState(
            lambda > hi
              ? `The load (${Math.round(w.loadW / 1000)} kW) plus feeder losses is more than the online sets can supply: the isochronous set(s) ${ids} would run at full output and frequency would collapse. Bring another set online or shed load.`
              : `The load (${Math.round(w.loadW / 1000)} kW) is less than the sets' minimum output: the isochronous set(s) ${ids} cannot back off further and frequency would rise until a set trips.`,
          );
        }
        next = lambda > hi ? 'at-max' : 'at-min';
      }
    } else if (m.isoGroup.length > 0) {
      const f = w.y[0]!;
      if ((isoState === 'at-max' && f > m.isoSetpointHz) || (isoState === 'at-min' && f < m.isoSetpointHz)) next = 'holding';
    }
    if (next === null) return finish(w, isoState, iterations);
    if (tried.includes(next)) {
      throw firstError ?? new Diverged('The network solve could not decide whether the isochronous sets hold frequency (it switched back and forth). Check the isochronous setpoints and limits.');
    }
    isoState = next;
  }
}

function finish(w: Work, isoState: IsoState, iterations: number): OperatingPoint {
  const m = w.m;
  const n = m.n;
  const kW = new Float64Array(n);
  const kVAR = new Float64Array(n);
  const lossKW = new Float64Array(n);
  const lossKVAR = new Float64Array(n);
  const terminalV = new Float64Array(n);
  const terminalAngleDeg = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    kW[i] = w.ps[i]! / 1000;
    kVAR[i] = w.qs[i]! / 1000;
    lossKW[i] = (w.ps[i]! - w.pr[i]!) / 1000;
    lossKVAR[i] = (w.qs[i]! - w.qr[i]!) / 1000;
    terminalV[i] = w.ev[i]!;
    terminalAngleDeg[i] = (w.angle[i]! * 180) / Math.PI;
  }
  return {
    frequencyHz: w.isoMode ? m.isoSetpointHz : w.y[0]!,
    busVoltageV: w.y[1]!,
    kW,
    kVAR,
    terminalV,
    terminalAngleDeg,
    lossKW,
    lossKVAR,
    loadKW: w.loadW / 1000,
    loadKVAR: w.loadVAR / 1000,
    isoState,
    method: 'newton-raphson',
    iterations,
  };
}

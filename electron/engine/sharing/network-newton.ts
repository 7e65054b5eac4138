/**
 * The outer Newton–Raphson of the feeder network: bus balance (Σ P_r = load kW,
 * Σ Q_r = load kVAR) and the voltage unit's setpoint in the unknowns (frequency or
 * isochronous loading, bus voltage, unit kVAR). Damped by step halving, a trust region on
 * frequency and voltage, a way off flat stretches where every droop set sits at a limit,
 * and natural-parameter continuation in the feeder impedances when the start is too far.
 */
import { Diverged, EngineError, NoSteadyState } from '../errors';
import * as codes from '../mode-codes';
import { busLoadKVAR, busLoadKVARdF, busLoadKVARdV, busLoadKW, busLoadKWdV, busLoadKWLinear } from './bus-loads';
import { solveSet } from './feeder-solve';
import { overCapabilityMessage, underMinimumMessage } from './active-sharing';
import type { Work } from './network-work';

// Module-local copy: hot loops compare against a plain constant, not a live import binding.
const GOV_DROOP = codes.GOV_DROOP;

const MAX_OUTER = 60;
const MAX_HALVINGS = 12;
const OUTER_TOL = 1e-12;
/** Below this (per Hz, per unit of the plant's kVA) the balance counts as flat in frequency. */
const FLAT = 1e-12;

/** Evaluates the outer residuals (and Jacobian) at `w.y`; false if a set's local solve fails. */
export function evaluate(w: Work): boolean {
  const m = w.m;
  const vb = w.y[1]!;
  if (!(vb > 0) || !Number.isFinite(w.y[0]!)) return false;
  for (let i = 0; i < m.n; i++) if (!solveSet(w, i)) return false;
  const fHz = w.isoMode ? m.isoSetpointHz : w.y[0]!;
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  w.loadW = busLoadKW(m.loads, vb, fHz, vr, fr) * 1000;
  w.loadVAR = busLoadKVAR(m.loads, vb, fHz, vr, fr) * 1000;
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
  if (!w.isoMode) {
    jac[0] = jac[0]! - busLoadKWLinear(m.loads, vb, fHz, vr, fr).b * 1000;
    jac[3] = jac[3]! - busLoadKVARdF(m.loads, vb, fHz, vr, fr) * 1000;
  }
  jac[1] = jac[1]! - busLoadKWdV(m.loads, vb, fHz, vr, fr) * 1000;
  jac[4] = jac[4]! - busLoadKVARdV(m.loads, vb, fHz, vr, fr) * 1000;
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
  if (!evaluate(w))
    throw new Diverged(
      'The network solve could not start: a set cannot deliver its output through its feeder at the starting voltage. Check the feeder impedances.',
    );
  let norm = residualNorm(w);
  const y0 = w.ySave;
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
    // Plain loops: the arrays are a few entries long, where TypedArray#set costs more than the copy.
    const n = w.m.n;
    const pr = w.pr;
    const qr = w.qr;
    const prSave = w.prSave;
    const qrSave = w.qrSave;
    y0[0] = w.y[0]!;
    y0[1] = w.y[1]!;
    y0[2] = w.y[2]!;
    for (let i = 0; i < n; i++) {
      prSave[i] = pr[i]!;
      qrSave[i] = qr[i]!;
    }
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
      for (let i = 0; i < n; i++) {
        pr[i] = prSave[i]!;
        qr[i] = qrSave[i]!;
      }
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
  throw new Diverged(
    `The network solve did not converge in ${MAX_OUTER} iterations (residual ${norm.toExponential(1)} of rating). Check for extreme feeder impedances or setpoints.`,
  );
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
    throw new NoSteadyState(underMinimumMessage(w.loadW / 1000, sumSentKW(w)));
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
export function iterateWithContinuation(w: Work): number {
  const y = w.yCont;
  const pr = w.prCont;
  const qr = w.qrCont;
  y.set(w.y);
  pr.set(w.pr);
  qr.set(w.qr);
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
  const yPrev = w.yPrev.fill(0);
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

/** What the sets deliver into the bus now, kW (after feeder losses). */
function sumSentKW(w: Work): number {
  let s = 0;
  for (let i = 0; i < w.m.n; i++) s += w.pr[i]! / 1000;
  return s;
}

function capabilityError(w: Work): NoSteadyState {
  return new NoSteadyState(overCapabilityMessage(w.loadW / 1000, sumSentKW(w), true));
}

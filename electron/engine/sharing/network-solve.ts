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
import { Diverged, NoSteadyState } from '../errors';
import { GOV_BASE, GOV_DROOP, GOV_ISO, REG_CROSS, REG_DROOP, REG_PF } from './sharing-model';
import type { SharingModel } from './sharing-model';
import { governorKW, isoKW, isoLambdaRange } from './active-sharing';
import type { IsoState } from './active-sharing';
import { busLoadKVAR, busLoadKVARdV, busLoadKW, busLoadKWdV, busLoadKWLinear } from './bus-loads';
import type { OperatingPoint } from './sharing-result';

const MAX_OUTER = 60;
const MAX_INNER = 40;
const MAX_HALVINGS = 12;
const OUTER_TOL = 1e-12;

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
    if (y0 > w.isoHi) return setTarget(w, maxW + (y0 - w.isoHi) * r, r);
    if (y0 < w.isoLo) return setTarget(w, minW + (y0 - w.isoLo) * r, r);
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
function solveSet(w: Work, i: number): boolean {
  const m = w.m;
  const vb = w.y[1]!;
  const R = m.rOhm[i]!;
  const X = m.xOhm[i]!;
  const reg = m.reg[i]!;
  const a = m.slopeKVARPerV[i]! * 1000;
  const v0 = m.noLoadV[i]!;
  const tan = m.tanPhi[i]!;
  target(w, i);
  const tp = w.targetW;
  const td = w.targetD;
  const inUnit = w.unitWeight[i]! > 0;
  const qGiven = !inUnit ? 0 : reg === REG_CROSS ? w.y[2]! * m.ratedKVA[i]! : w.y[2]!;
  const scale = Math.max(1, m.ratedKVA[i]! * 1000);
  const inv = 1 / (vb * vb);
  let pr = w.pr[i]!;
  let qr = w.qr[i]!;
  let j11 = 1;
  let j12 = 0;
  let j21 = 0;
  let j22 = 1;
  let dEdP = 0;
  let dEdQ = 0;
  let A = vb;
  let B = 0;
  let E = vb;
  let ps = pr;
  let qs = qr;
  let ok = false;
  for (let k = 0; k < MAX_INNER; k++) {
    const L = (pr * pr + qr * qr) * inv;
    ps = pr + R * L;
    qs = qr + X * L;
    A = vb + (R * pr + X * qr) / vb;
    B = (X * pr - R * qr) / vb;
    E = Math.hypot(A, B);
    const e1 = ps - tp;
    const e2 = reg === REG_DROOP && !inUnit ? qs - a * (v0 - E) : reg === REG_PF && !inUnit ? qs - tan * tp : qs - qGiven;
    dEdP = (A * R + B * X) / (vb * E);
    dEdQ = (A * X - B * R) / (vb * E);
    j11 = 1 + 2 * R * pr * inv;
    j12 = 2 * R * qr * inv;
    j21 = 2 * X * pr * inv;
    j22 = 1 + 2 * X * qr * inv;
    if (reg === REG_DROOP && !inUnit) {
      j21 += a * dEdP;
      j22 += a * dEdQ;
    }
    const res = Math.abs(e1) + Math.abs(e2);
    if (!Number.isFinite(res)) return false;
    if (res <= 1e-13 * scale) {
      ok = true;
      break;
    }
    const det = j11 * j22 - j12 * j21;
    if (!(Math.abs(det) > 1e-300)) return false;
    const dp = (e1 * j22 - e2 * j12) / det;
    const dq = (e2 * j11 - e1 * j21) / det;
    pr -= dp;
    qr -= dq;
    if (Math.abs(dp) + Math.abs(dq) <= 1e-15 * scale) {
      ok = k > 0 || res <= 1e-9 * scale;
      if (ok) {
        const L2 = (pr * pr + qr * qr) * inv;
        ps = pr + R * L2;
        qs = qr + X * L2;
        A = vb + (R * pr + X * qr) / vb;
        B = (X * pr - R * qr) / vb;
        E = Math.hypot(A, B);
      }
      break;
    }
  }
  if (!ok || !(E > 0)) return false;
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
  return true;
}

/** Runs Newton–Raphson from `w.y`; returns the iteration count or throws. */
function iterate(w: Work): number {
  const m = w.m;
  if (!evaluate(w)) throw new Diverged('The network solve could not start: a set cannot deliver its output through its feeder at the starting voltage. Check the feeder impedances.');
  let norm = residualNorm(w);
  const y0 = new Float64Array(3);
  for (let it = 1; it <= MAX_OUTER; it++) {
    if (norm <= OUTER_TOL) return it - 1;
    if (!newtonStep(w)) {
      if (!w.isoMode) {
        let free = false;
        for (let i = 0; i < m.n; i++) {
          if (m.gov[i] !== GOV_DROOP) continue;
          const raw = m.slopeKWPerHz[i]! * (m.noLoadHz[i]! - w.y[0]!);
          if (raw < m.maxKW[i]! && raw > m.minKW[i]!) free = true;
        }
        if (!free) throw capabilityError(w);
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
  let isoState: IsoState = start.isoState;
  let iterations = 0;
  for (let attempt = 0; attempt < 3; attempt++) {
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
    iterations += iterate(w);
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
        isoState = lambda > hi ? 'at-max' : 'at-min';
        continue;
      }
      isoState = 'holding';
    } else if (m.isoGroup.length > 0) {
      const f = w.y[0]!;
      // Saturated at max but the frequency rose above the setpoint: the group can hold it after all.
      if ((isoState === 'at-max' && f > m.isoSetpointHz) || (isoState === 'at-min' && f < m.isoSetpointHz)) {
        isoState = 'holding';
        continue;
      }
    }
    return finish(w, isoState, iterations);
  }
  throw new Diverged('The network solve could not decide whether the isochronous sets hold frequency (it switched back and forth). Check the isochronous setpoints and limits.');
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

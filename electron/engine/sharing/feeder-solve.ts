/**
 * One set's feeder at given outer unknowns: the 2 × 2 Newton in the receiving-end powers
 * (P_r, Q_r) that meets the set's governor target and regulator law, and the derivatives of
 * P_r, Q_r and |V_t| by the outer unknowns (implicit differentiation, dz/dy = −J⁻¹ ∂e/∂y).
 * Three-phase, V line-to-line, Z per phase: `I' = (P_r − jQ_r) / V_b`, `V_t = V_b + Z I'`,
 * `P_s = P_r + R|I'|²`, `Q_s = Q_r + X|I'|²` (the short-line model, Glover, Sarma & Overbye, ch. 5).
 */
import * as codes from '../mode-codes';
import { target } from './network-work';
import type { Work } from './network-work';
import { limitKVAR, lowerKVAR, upperKVAR } from './reactive-sharing';
import { fieldLimitSlope } from '../capability';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const REG_CROSS = codes.REG_CROSS;
const REG_DROOP = codes.REG_DROOP;
const REG_PF = codes.REG_PF;

const MAX_INNER = 40;

/**
 * Set i's local residuals at receiving-end powers (pr, qr), W and VAR; stores the feeder
 * quantities in `w.l*`. Returns |e1| + |e2|.
 */
function localEval(
  w: Work,
  pr: number,
  qr: number,
  vb: number,
  R: number,
  X: number,
  droopLaw: boolean,
  a: number,
  v0: number,
  tp: number,
  qTarget: number,
): number {
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

/** Result of the local Newton: whether it converged, and the receiving-end powers (W, VAR). */
interface LocalOutcome {
  ok: boolean;
  pr: number;
  qr: number;
}

/** The local 2 × 2 damped Newton from (pr, qr); leaves the feeder quantities of the answer in `w.l*`. */
function localNewton(
  w: Work,
  pr: number,
  qr: number,
  vb: number,
  R: number,
  X: number,
  droopLaw: boolean,
  a: number,
  v0: number,
  tp: number,
  qTarget: number,
  scale: number,
  out: LocalOutcome,
): void {
  const inv = 1 / (vb * vb);
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
    if (!(Math.abs(det) > 1e-300)) break;
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
  out.ok = ok && w.lE > 0;
  out.pr = pr;
  out.qr = qr;
}

const outcome: LocalOutcome = { ok: false, pr: 0, qr: 0 };

/** How a set's kVAR is fixed in the local solve: its law, or held at a regulator limit. */
const Q_LAW = 0;
const Q_LEAD = 1;
const Q_FIELD = 2;

/**
 * Solves set i's two local equations for (P_r, Q_r) at the current outer unknowns, and
 * fills the derivatives of P_r, Q_r and |V_t| by the outer unknowns. A set in reactive droop
 * or power-factor control whose kVAR would leave its field-heating or leading limit is held
 * at that limit (its regulator's limiter). False if it fails.
 */
export function solveSet(w: Work, i: number): boolean {
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
  let droopLaw = reg === REG_DROOP && !inUnit;
  const limited = m.limited[i] === 1 && !inUnit;
  const hiVAR = limited ? upperKVAR(m, i, tp / 1000) * 1000 : Infinity;
  const loVAR = limited ? lowerKVAR(m, i) * 1000 : -Infinity;
  let qMode = Q_LAW;
  let qTarget = inUnit ? (reg === REG_CROSS ? w.y[2]! * m.ratedKVA[i]! : w.y[2]!) : reg === REG_PF ? tan * tp : 0;
  if (limited && reg === REG_PF) {
    const held = limitKVAR(m, i, tp / 1000, qTarget / 1000) * 1000;
    if (held !== qTarget) qMode = held === hiVAR ? Q_FIELD : Q_LEAD;
    qTarget = held;
  }
  const scale = Math.max(1, m.ratedKVA[i]! * 1000);
  const inv = 1 / (vb * vb);
  localNewton(w, w.pr[i]!, w.qr[i]!, vb, R, X, droopLaw, a, v0, tp, qTarget, scale, outcome);
  if (outcome.ok && droopLaw && limited && (w.lqs > hiVAR || w.lqs < loVAR)) {
    const held = limitKVAR(m, i, tp / 1000, w.lqs / 1000) * 1000;
    qMode = held === hiVAR ? Q_FIELD : Q_LEAD;
    qTarget = held;
    droopLaw = false;
    localNewton(w, outcome.pr, outcome.qr, vb, R, X, false, a, v0, tp, qTarget, scale, outcome);
  }
  if (!outcome.ok) return false;
  const pr = outcome.pr;
  const qr = outcome.qr;
  const A = w.lA;
  const B = w.lB;
  const E = w.lE;
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
  // d(q target)/d(y0): the PF law follows P; the field limit moves along its circle with P.
  const dQtdP = qMode === Q_FIELD ? fieldLimitSlope(m.sets[i]!, tp / 1000) : qMode === Q_LEAD ? 0 : reg === REG_PF && !inUnit ? tan : 0;
  for (let j = 0; j < w.ny; j++) {
    // ∂e/∂y_j for y = (f or λ, V_b, unit kVAR level).
    const de1 = j === 0 ? -td : j === 1 ? R * dL : 0;
    const de2 = j === 0 ? -dQtdP * td : j === 1 ? X * dL + (droopLaw ? a * dEdVb : 0) : inUnit ? (reg === REG_CROSS ? -m.ratedKVA[i]! : -1) : 0;
    const dp = -(de1 * j22 - de2 * j12) / det;
    const dq = -(de2 * j11 - de1 * j21) / det;
    w.dPr[3 * i + j] = dp;
    w.dQr[3 * i + j] = dq;
    w.dE[3 * i + j] = dEdP * dp + dEdQ * dq + (j === 1 ? dEdVb : 0);
  }
  return true;
}

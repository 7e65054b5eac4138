/**
 * One set's feeder at given outer unknowns: the 2 × 2 Newton in the receiving-end powers
 * (P_r, Q_r) that meets the set's governor target and regulator law, and the derivatives of
 * P_r, Q_r and |V_t| by the outer unknowns (implicit differentiation, dz/dy = −J⁻¹ ∂e/∂y).
 * Three-phase, V line-to-line, Z per phase: `I' = (P_r − jQ_r) / V_b`, `V_t = V_b + Z I'`,
 * `P_s = P_r + R|I'|²`, `Q_s = Q_r + X|I'|²` (the short-line model, Glover, Sarma & Overbye, ch. 5).
 */
import * as codes from './sharing-model';
import { target } from './network-work';
import type { Work } from './network-work';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const REG_CROSS = codes.REG_CROSS;
const REG_DROOP = codes.REG_DROOP;
const REG_PF = codes.REG_PF;

const MAX_INNER = 40;

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

/**
 * Solves set i's two local equations for (P_r, Q_r) at the current outer unknowns, and
 * fills the derivatives of P_r, Q_r and |V_t| by the outer unknowns. False if it fails.
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

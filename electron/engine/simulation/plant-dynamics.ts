/**
 * The whole plant's right-hand side: rotor angles and dampers give each set's E'', the
 * bus is solved, currents and powers follow, then each set's machine, governor and
 * regulator derivatives. The outputs of the last evaluation stay in the `Outputs`
 * arrays (the simulator reads them after the first RK4 stage of each step).
 */
import { DELTA, ED2, EFD, EQ1, EQ2, OMEGA, PMECH, STATES_PER_SET } from './layout';
import { GOV_ISO, REG_CROSS } from '../mode-codes';
import { MIN_TORQUE_SPEED_PU } from './machine';
import { controlDerivatives } from './controls';
import { NET_A_IM, NET_A_RE, NET_BREAK, NET_IN_IM, NET_IN_RE, NET_LENGTH, NET_P, NET_PI, NET_Q, NET_QI, solveBus } from './network';
import type { SimModel } from './sim-types';
import { rotorSinCos } from './rotor-trig';
import {
  P_DAMPING_PU,
  P_GOV_MODE,
  P_INERTIA_KVA,
  P_INV2_H,
  P_INV_TD0,
  P_INV_TD20,
  P_ISO_LINKED,
  P_KW_PU,
  P_ONLINE,
  P_OWN_SCALE,
  P_RATED_KVA,
  P_REG_MODE,
  P_RESIDUAL_PU,
  P_SHUTDOWN,
  P_XD1_MINUS_XD2,
  P_XD_MINUS_XD1,
  P_Y_IM,
  P_Y_RE,
  P_ZF_IM,
  P_ZF_RE,
  OUT_COLUMNS,
  O_ANCHOR_COS,
  O_ANCHOR_D,
  O_ANCHOR_SIN,
  O_COS_D,
  O_E_IM,
  O_E_RE,
  O_ID,
  O_IQ,
  O_I_IM,
  O_I_RE,
  O_P_OWN,
  O_Q_OWN,
  O_SIN_D,
  O_VT,
  O_VT_IM,
  O_VT_RE,
  O_V_SENSED,
} from './par-layout';

export type { Outputs } from './sim-types';
import type { Outputs } from './sim-types';

/** Offsets of the frequency-independent load sums in `Outputs.loadSums` (pu at 1 pu voltage and rated frequency). */
const LOAD_PZ = 0;
const LOAD_PI = 1;
const LOAD_PP = 2;
const LOAD_QZ = 3;
const LOAD_QI = 4;
const LOAD_QP = 5;
const LOAD_SUMS = 6;

/** Allocates the output arrays for `n` sets. */
export function createOutputs(n: number): Outputs {
  const buf = new Float64Array(OUT_COLUMNS * n);
  const f = (k: number) => buf.subarray(k * n, (k + 1) * n);
  // No rotor-angle anchor yet: the first evaluation takes one.
  f(O_ANCHOR_D).fill(Number.NaN);
  return {
    buf,
    eRe: f(O_E_RE),
    eIm: f(O_E_IM),
    sinD: f(O_SIN_D),
    cosD: f(O_COS_D),
    iRe: f(O_I_RE),
    iIm: f(O_I_IM),
    vtRe: f(O_VT_RE),
    vtIm: f(O_VT_IM),
    vt: f(O_VT),
    pOwn: f(O_P_OWN),
    qOwn: f(O_Q_OWN),
    id: f(O_ID),
    iq: f(O_IQ),
    vSensed: f(O_V_SENSED),
    // Non-integer starting values keep these fields stored as doubles.
    t: 0.5,
    pBarIso: 0.5,
    qBarCross: 0.5,
    bus: { re: 1, im: 0, iterations: 0, converged: true },
    net: new Float64Array(NET_LENGTH),
    loadSums: new Float64Array(LOAD_SUMS),
    frequencyLoads: [],
    anyOnline: false,
    omegaBus: 1,
    loadP: 0,
    loadQ: 0,
    feederLossP: 0,
    unservedP: 0,
    unservedQ: 0,
    unconverged: 0,
  };
}

/**
 * Evaluates the plant at time `out.t` (the caller sets it), state `y`: writes dy/dt into `dy` and the algebraic
 * outputs into `out`. Allocates nothing. `stage` is true for the RK4 stages after the first of a step
 * (nothing about the plant has changed since the step's first evaluation, only the state). Runs four times per step (the RK4 stages), so
 * every per-set parameter array is read into a local once per call and each pass is one
 * plain loop over the sets; the machine, governor and regulator each take the whole plant
 * in one call.
 */
export function evaluatePlant(m: SimModel, y: Float64Array, dy: Float64Array, out: Outputs, stage = false): void {
  const n = m.n;
  const P = m.par;
  const O = out.buf;
  // Column offsets, in locals once per call.
  const oCosD = O_COS_D * n;
  const oEIm = O_E_IM * n;
  const oERe = O_E_RE * n;
  const oId = O_ID * n;
  const oIq = O_IQ * n;
  const oIIm = O_I_IM * n;
  const oIRe = O_I_RE * n;
  const oPOwn = O_P_OWN * n;
  const oQOwn = O_Q_OWN * n;
  const oSinD = O_SIN_D * n;
  const oVt = O_VT * n;
  const oVtIm = O_VT_IM * n;
  const oVtRe = O_VT_RE * n;
  const oVSensed = O_V_SENSED * n;
  const oAnchorD = O_ANCHOR_D * n;
  const oAnchorSin = O_ANCHOR_SIN * n;
  const oAnchorCos = O_ANCHOR_COS * n;
  const pGovMode = P_GOV_MODE * n;
  const pInertiaKva = P_INERTIA_KVA * n;
  const pIsoLinked = P_ISO_LINKED * n;
  const pKwPu = P_KW_PU * n;
  const pOnline = P_ONLINE * n;
  const pOwnScale = P_OWN_SCALE * n;
  const pRatedKva = P_RATED_KVA * n;
  const pRegMode = P_REG_MODE * n;
  const pShutdown = P_SHUTDOWN * n;
  const pYIm = P_Y_IM * n;
  const pYRe = P_Y_RE * n;
  const pZfIm = P_ZF_IM * n;
  const pZfRe = P_ZF_RE * n;
  const pDampingPu = P_DAMPING_PU * n;
  const pInv2H = P_INV2_H * n;
  const pInvTd0 = P_INV_TD0 * n;
  const pInvTd20 = P_INV_TD20 * n;
  const pResidualPu = P_RESIDUAL_PU * n;
  const pXd1MinusXd2 = P_XD1_MINUS_XD2 * n;
  const pXdMinusXd1 = P_XD_MINUS_XD1 * n;
  // Pass 1: internal voltages in the network frame, bus speed, Norton sums.
  let hw = 0;
  let hsum = 0;
  let aRe = 0;
  let aIm = 0;
  let inRe = 0;
  let inIm = 0;
  let anyOnline = false;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    rotorSinCos(O, y[o + DELTA]!, oSinD + i, oCosD + i, oAnchorD + i, oAnchorSin + i, oAnchorCos + i);
    const s = O[oSinD + i]!;
    const c = O[oCosD + i]!;
    const ed = y[o + ED2]!;
    const eq = y[o + EQ2]!;
    // (E''d + jE''q) e^{j(δ − π/2)} = (E''d + jE''q)(sin δ − j cos δ)
    const er = ed * s + eq * c;
    const ei = eq * s - ed * c;
    O[oERe + i] = er;
    O[oEIm + i] = ei;
    if (P[pOnline + i]) {
      anyOnline = true;
      const hi = P[pInertiaKva + i]!;
      hw += hi * y[o + OMEGA]!;
      hsum += hi;
      const yr = P[pYRe + i]!;
      const yi = P[pYIm + i]!;
      aRe += yr;
      aIm += yi;
      inRe += yr * er - yi * ei;
      inIm += yr * ei + yi * er;
    }
  }
  const omegaBus = anyOnline ? hw / hsum : 1;
  out.omegaBus = omegaBus;
  out.anyOnline = anyOnline;

  // Loads (ZIP): the constant-impedance shares join A; constant-current and constant-power
  // shares (with their frequency factors) stay apart.
  // The loads that do not follow frequency are summed once a step (`stage` false: loads switch only
  // between steps) and kept in `out.loadSums`; the others are worked out at every evaluation.
  const sums = out.loadSums;
  const varying = out.frequencyLoads;
  if (!stage) {
    let sPZ = 0;
    let sPI = 0;
    let sPP = 0;
    let sQZ = 0;
    let sQI = 0;
    let sQP = 0;
    // Emptied only when it holds any: setting `length` calls into the runtime, once a step for nothing otherwise.
    if (varying.length !== 0) varying.length = 0;
    const loads = m.loads;
    for (let k = 0; k < loads.length; k++) {
      const l = loads[k]!;
      if (!l.on) continue;
      if (l.frequencySensitivity !== 0 || l.kVARFrequencySensitivity !== 0) {
        varying.push(l);
        continue;
      }
      sPZ += l.pPU * l.pZ;
      sPI += l.pPU * l.pI;
      sPP += l.pPU * l.pP;
      sQZ += l.qPU * l.qZ;
      sQI += l.qPU * l.qI;
      sQP += l.qPU * l.qP;
    }
    sums[LOAD_PZ] = sPZ;
    sums[LOAD_PI] = sPI;
    sums[LOAD_PP] = sPP;
    sums[LOAD_QZ] = sQZ;
    sums[LOAD_QI] = sQI;
    sums[LOAD_QP] = sQP;
  }
  let pZ = sums[LOAD_PZ]!;
  let pI = sums[LOAD_PI]!;
  let pP = sums[LOAD_PP]!;
  let qZ = sums[LOAD_QZ]!;
  let qI = sums[LOAD_QI]!;
  let qP = sums[LOAD_QP]!;
  for (let k = 0; k < varying.length; k++) {
    const l = varying[k]!;
    let p = l.pPU;
    let q = l.qPU;
    if (l.frequencySensitivity !== 0) {
      const fp = 1 + l.frequencySensitivity * (omegaBus - 1);
      p *= fp > 0 ? fp : 0;
    }
    if (l.kVARFrequencySensitivity !== 0) {
      const fq = 1 + l.kVARFrequencySensitivity * (omegaBus - 1);
      q *= fq > 0 ? fq : 0;
    }
    pZ += p * l.pZ;
    pI += p * l.pI;
    pP += p * l.pP;
    qZ += q * l.qZ;
    qI += q * l.qI;
    qP += q * l.qP;
  }
  const bus = out.bus;
  const brk = m.breakPU;
  if (anyOnline) {
    const net = out.net;
    net[NET_A_RE] = aRe + pZ;
    net[NET_A_IM] = aIm - qZ;
    net[NET_IN_RE] = inRe;
    net[NET_IN_IM] = inIm;
    net[NET_P] = pP;
    net[NET_Q] = qP;
    net[NET_PI] = pI;
    net[NET_QI] = qI;
    net[NET_BREAK] = brk;
    solveBus(net, bus);
    if (!bus.converged) out.unconverged++;
  } else {
    bus.re = 0;
    bus.im = 0;
  }
  const vr = bus.re;
  const vi = bus.im;
  const v2 = vr * vr + vi * vi;
  const v1 = Math.sqrt(v2);
  // Above the break: constant power and |V| for the current shares; below it, impedance.
  const below = v1 < brk;
  const pScale = below ? v2 / (brk * brk) : 1;
  const iScale = below ? v2 / brk : v1;
  out.loadP = pZ * v2 + pI * iScale + pP * pScale;
  out.loadQ = qZ * v2 + qI * iScale + qP * pScale;
  out.unservedP = below ? pP * (1 - pScale) + pI * (v1 - iScale) : 0;
  out.unservedQ = below ? qP * (1 - pScale) + qI * (v1 - iScale) : 0;

  // Pass 2: currents, terminal voltages, powers, the current on each rotor's d- and q-axes,
  // group sums for the sharing links, and the machine's derivatives (`machine.ts`), which need
  // nothing from the other sets.
  const omegaS = m.omegaS;
  let isoKW = 0;
  let isoRated = 0;
  let crossKVAR = 0;
  let crossKVA = 0;
  let crossV = 0;
  let loss = 0;
  let anyCross = false;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    const er = O[oERe + i]!;
    const ei = O[oEIm + i]!;
    const on = P[pOnline + i]!;
    let p = 0;
    let idOwn = 0;
    let iqOwn = 0;
    if (on) {
      const dr = er - vr;
      const di = ei - vi;
      const yr = P[pYRe + i]!;
      const yi = P[pYIm + i]!;
      const ir = yr * dr - yi * di;
      const ii = yr * di + yi * dr;
      O[oIRe + i] = ir;
      O[oIIm + i] = ii;
      const zr = P[pZfRe + i]!;
      const zi = P[pZfIm + i]!;
      const tr = vr + zr * ir - zi * ii;
      const ti = vi + zr * ii + zi * ir;
      O[oVtRe + i] = tr;
      O[oVtIm + i] = ti;
      const vmag = Math.sqrt(tr * tr + ti * ti);
      O[oVt + i] = vmag;
      O[oVSensed + i] = vmag;
      const scale = P[pOwnScale + i]!;
      p = (tr * ir + ti * ii) * scale;
      const q = (ti * ir - tr * ii) * scale;
      O[oPOwn + i] = p;
      O[oQOwn + i] = q;
      loss += zr * (ir * ir + ii * ii);
      // Rotor frame: x_dq = x (sin δ + j cos δ).
      const irOwn = ir * scale;
      const iiOwn = ii * scale;
      const s = O[oSinD + i]!;
      const c = O[oCosD + i]!;
      idOwn = irOwn * s - iiOwn * c;
      iqOwn = irOwn * c + iiOwn * s;
      if (!P[pShutdown + i]) {
        const sk = P[pRatedKva + i]!;
        if (P[pGovMode + i] === GOV_ISO && P[pIsoLinked + i]) {
          isoKW += p * sk;
          isoRated += P[pKwPu + i]! * sk;
        }
        if (P[pRegMode + i] === REG_CROSS) {
          anyCross = true;
          crossKVAR += q * sk;
          crossV += vmag * sk;
          crossKVA += sk;
        }
      }
    } else {
      O[oIRe + i] = 0;
      O[oIIm + i] = 0;
      O[oVtRe + i] = er;
      O[oVtIm + i] = ei;
      const vmag = Math.sqrt(er * er + ei * ei);
      O[oVt + i] = vmag;
      O[oVSensed + i] = vmag;
      O[oPOwn + i] = 0;
      O[oQOwn + i] = 0;
    }
    O[oId + i] = idOwn;
    O[oIq + i] = iqOwn;
    // The machine: swing equation (torque form) and the d-axis flux dynamics.
    const w = y[o + OMEGA]!;
    // Math.max keeps the value unboxed (a conditional between w and the module constant makes V8 box it every set, every stage).
    const wt = Math.max(w, MIN_TORQUE_SPEED_PU);
    dy[o + DELTA] = omegaS * (w - 1);
    const damp = on ? P[pDampingPu + i]! * (w - omegaBus) : 0;
    let dw = ((y[o + PMECH]! - p) / wt - damp) * P[pInv2H + i]!;
    // A stopped engine does not run backwards.
    if (w <= 0 && dw < 0) dw = 0;
    dy[o + OMEGA] = dw;
    const eq1 = y[o + EQ1]!;
    dy[o + EQ1] = (y[o + EFD]! + P[pResidualPu + i]! - eq1 - P[pXdMinusXd1 + i]! * idOwn) * P[pInvTd0 + i]!;
    const t2 = P[pInvTd20 + i]!;
    const k = P[pXd1MinusXd2 + i]!;
    dy[o + EQ2] = (eq1 - y[o + EQ2]! - k * idOwn) * t2;
    dy[o + ED2] = (-y[o + ED2]! + k * iqOwn) * t2;
  }
  out.feederLossP = loss;
  out.pBarIso = isoRated > 0 ? isoKW / isoRated : 0;
  out.qBarCross = crossKVA > 0 ? crossKVAR / crossKVA : 0;
  const vBarCross = crossKVA > 0 ? crossV / crossKVA : 0;
  // The voltage each regulator compares with its reference: its own, or the cross-current group's mean.
  if (anyCross) {
    for (let i = 0; i < n; i++) if (P[pOnline + i] && P[pRegMode + i] === REG_CROSS && !P[pShutdown + i]) O[oVSensed + i] = vBarCross;
  }

  // Pass 3: the controls' derivatives, one call per block for the whole plant (inputs through `out`).
  controlDerivatives(m, y, dy, out);
}

/**
 * The whole plant's right-hand side: rotor angles and dampers give each set's E'', the
 * bus is solved, currents and powers follow, then each set's machine, governor and
 * regulator derivatives. The outputs of the last evaluation stay in the `Outputs`
 * arrays (the simulator reads them after the first RK4 stage of each step).
 */
import { DELTA, ED2, EQ2, OMEGA, STATES_PER_SET } from './layout';
import { GOV_ISO, REG_CROSS } from '../mode-codes';
import { machineDerivatives } from './machine';
import { governorDerivatives } from './governor';
import { regulatorDerivatives } from './regulator';
import { NET_A_IM, NET_A_RE, NET_IN_IM, NET_IN_RE, NET_P, NET_Q, POWER_LOAD_BREAK_PU, solveBus } from './network';

const BREAK2 = POWER_LOAD_BREAK_PU * POWER_LOAD_BREAK_PU;
import type { Outputs, SimModel } from './sim-types';


/** Allocates the output arrays for `n` sets. */
export function createOutputs(n: number): Outputs {
  const f = () => new Float64Array(n);
  return {
    eRe: f(), eIm: f(), sinD: f(), cosD: f(), iRe: f(), iIm: f(), vtRe: f(), vtIm: f(), vt: f(), pOwn: f(), qOwn: f(),
    id: f(), iq: f(), vSensed: f(),
    // Non-integer starting values keep these fields stored as doubles.
    t: 0.5,
    pBarIso: 0.5,
    qBarCross: 0.5,
    bus: { re: 1, im: 0, iterations: 0, converged: true },
    net: new Float64Array(6),
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
 * Evaluates the plant at time `t`, state `y`: writes dy/dt into `dy` and the algebraic
 * outputs into `out`. Allocates nothing.
 */
export function evaluatePlant(m: SimModel, t: number, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const n = m.n;
  const { eRe, eIm, sinD, cosD, iRe, iIm, vtRe, vtIm, vt, pOwn, qOwn } = out;
  // Pass 1: internal voltages in the network frame, bus speed, Norton sums.
  let hw = 0;
  let hsum = 0;
  let aRe = 0;
  let aIm = 0;
  let inRe = 0;
  let inIm = 0;
  let anyOnline = false;
  for (let i = 0; i < n; i++) {
    const o = i * STATES_PER_SET;
    const d = y[o + DELTA]!;
    const s = Math.sin(d);
    const c = Math.cos(d);
    sinD[i] = s;
    cosD[i] = c;
    const ed = y[o + ED2]!;
    const eq = y[o + EQ2]!;
    // (E''d + jE''q) e^{j(δ − π/2)} = (E''d + jE''q)(sin δ − j cos δ)
    const er = ed * s + eq * c;
    const ei = eq * s - ed * c;
    eRe[i] = er;
    eIm[i] = ei;
    if (m.online[i]) {
      anyOnline = true;
      const hi = m.inertiaS[i]! * m.ratedKVA[i]!;
      hw += hi * y[o + OMEGA]!;
      hsum += hi;
      const yr = m.yRe[i]!;
      const yi = m.yIm[i]!;
      aRe += yr;
      aIm += yi;
      inRe += yr * er - yi * ei;
      inIm += yr * ei + yi * er;
    }
  }
  const omegaBus = anyOnline ? hw / hsum : 1;
  out.omegaBus = omegaBus;
  out.anyOnline = anyOnline;

  // Loads: constant impedance joins A; constant power (with its frequency factor) stays apart.
  let pP = 0;
  let qP = 0;
  let pZ = 0;
  let qZ = 0;
  const loads = m.loads;
  for (let k = 0; k < loads.length; k++) {
    const l = loads[k]!;
    if (!l.on) continue;
    let fp = 1;
    if (l.frequencySensitivity !== 0) {
      fp = 1 + l.frequencySensitivity * (omegaBus - 1);
      if (fp < 0) fp = 0;
    }
    if (l.impedance) {
      pZ += l.pPU * fp;
      qZ += l.qPU;
    } else {
      pP += l.pPU * fp;
      qP += l.qPU;
    }
  }
  const bus = out.bus;
  if (anyOnline) {
    const net = out.net;
    net[NET_A_RE] = aRe + pZ;
    net[NET_A_IM] = aIm - qZ;
    net[NET_IN_RE] = inRe;
    net[NET_IN_IM] = inIm;
    net[NET_P] = pP;
    net[NET_Q] = qP;
    solveBus(net, bus);
    if (!bus.converged) out.unconverged++;
  } else {
    bus.re = 0;
    bus.im = 0;
  }
  const vr = bus.re;
  const vi = bus.im;
  const v2 = vr * vr + vi * vi;
  const pScale = v2 >= BREAK2 ? 1 : v2 / BREAK2;
  out.loadP = pZ * v2 + pP * pScale;
  out.loadQ = qZ * v2 + qP * pScale;
  out.unservedP = pP * (1 - pScale);
  out.unservedQ = qP * (1 - pScale);

  // Pass 2: currents, terminal voltages, powers; group sums for the sharing links.
  let isoKW = 0;
  let isoRated = 0;
  let crossKVAR = 0;
  let crossKVA = 0;
  let crossV = 0;
  let loss = 0;
  for (let i = 0; i < n; i++) {
    const sk = m.ratedKVA[i]!;
    if (m.online[i]) {
      const dr = eRe[i]! - vr;
      const di = eIm[i]! - vi;
      const yr = m.yRe[i]!;
      const yi = m.yIm[i]!;
      const ir = yr * dr - yi * di;
      const ii = yr * di + yi * dr;
      iRe[i] = ir;
      iIm[i] = ii;
      const zr = m.zfRe[i]!;
      const zi = m.zfIm[i]!;
      const tr = vr + zr * ir - zi * ii;
      const ti = vi + zr * ii + zi * ir;
      vtRe[i] = tr;
      vtIm[i] = ti;
      vt[i] = Math.sqrt(tr * tr + ti * ti);
      const scale = m.baseKVA / sk;
      const p = (tr * ir + ti * ii) * scale;
      const q = (ti * ir - tr * ii) * scale;
      pOwn[i] = p;
      qOwn[i] = q;
      loss += zr * (ir * ir + ii * ii);
      if (m.govMode[i] === GOV_ISO && m.isoLinked[i] && !m.shutdown[i]) {
        isoKW += p * sk;
        isoRated += m.kwPU[i]! * sk;
      }
      if (m.regMode[i] === REG_CROSS && !m.shutdown[i]) {
        crossKVAR += q * sk;
        crossV += vt[i]! * sk;
        crossKVA += sk;
      }
    } else {
      iRe[i] = 0;
      iIm[i] = 0;
      vtRe[i] = eRe[i]!;
      vtIm[i] = eIm[i]!;
      vt[i] = Math.sqrt(eRe[i]! * eRe[i]! + eIm[i]! * eIm[i]!);
      pOwn[i] = 0;
      qOwn[i] = 0;
    }
  }
  out.feederLossP = loss;
  out.t = t;
  out.pBarIso = isoRated > 0 ? isoKW / isoRated : 0;
  out.qBarCross = crossKVA > 0 ? crossKVAR / crossKVA : 0;
  const vBarCross = crossKVA > 0 ? crossV / crossKVA : 0;

  // Pass 3: derivatives. Per-set inputs go through the typed arrays of `out`, not as
  // number arguments, so no value is boxed per call.
  const { id, iq, vSensed } = out;
  for (let i = 0; i < n; i++) {
    const scale = m.baseKVA / m.ratedKVA[i]!;
    const ir = iRe[i]! * scale;
    const ii = iIm[i]! * scale;
    // Rotor frame: x_dq = x (sin δ + j cos δ).
    const s = sinD[i]!;
    const c = cosD[i]!;
    id[i] = ir * s - ii * c;
    iq[i] = ir * c + ii * s;
    vSensed[i] = m.online[i] && m.regMode[i] === REG_CROSS && !m.shutdown[i] ? vBarCross : vt[i]!;
  }
  for (let i = 0; i < n; i++) {
    const o = i * STATES_PER_SET;
    machineDerivatives(m, i, o, y, dy, out);
    governorDerivatives(m, i, o, y, dy, out);
    regulatorDerivatives(m, i, o, y, dy, out);
  }
}

/**
 * The feeder-network solver's state: the outer unknowns, per-set feeder quantities and
 * their derivatives, allocated once per solve so that the iterations allocate nothing;
 * and each set's governor target for the current outer unknowns.
 */
import * as codes from '../mode-codes';
import type { SharingModel } from './sharing-model';
import { governorKW, isoKW } from './active-sharing';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const GOV_BASE = codes.GOV_BASE;
const GOV_ISO = codes.GOV_ISO;
const REG_CROSS = codes.REG_CROSS;

/** Per-solve work arrays (allocated once; the iterations allocate nothing). */
export interface Work {
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
  /** Scratch of the outer iteration and the continuation: saved unknowns and receiving-end powers. */
  ySave: Float64Array;
  yCont: Float64Array;
  yPrev: Float64Array;
  prCont: Float64Array;
  qrCont: Float64Array;
  /** The answer's per-set arrays (`OperatingPoint`), read before the state's next solve. */
  outKW: Float64Array;
  outKVAR: Float64Array;
  outLossKW: Float64Array;
  outLossKVAR: Float64Array;
  outTerminalV: Float64Array;
  outAngleDeg: Float64Array;
}

/**
 * The work state for `m`: weights of the voltage unit, the kVA base. `reuse`, a state this
 * returned before and no longer read, lends its arrays when it has as many sets (a Monte-Carlo
 * run solves thousands of plants of one size); every entry a solve reads is written first.
 */
export function createNetworkWork(m: SharingModel, reuse?: Work): Work {
  const n = m.n;
  const hasUnit = m.voltageUnit.length > 0;
  if (reuse !== undefined && reuse.m.n === n) return resetWork(reuse, m, hasUnit);
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
    ySave: new Float64Array(3),
    yCont: new Float64Array(3),
    yPrev: new Float64Array(3),
    prCont: new Float64Array(n),
    qrCont: new Float64Array(n),
    outKW: new Float64Array(n),
    outKVAR: new Float64Array(n),
    outLossKW: new Float64Array(n),
    outLossKVAR: new Float64Array(n),
    outTerminalV: new Float64Array(n),
    outAngleDeg: new Float64Array(n),
  };
  weigh(w, m, hasUnit);
  return w;
}

/** `w` made ready for a solve of `m` as if new. */
function resetWork(w: Work, m: SharingModel, hasUnit: boolean): Work {
  w.m = m;
  w.y.fill(0);
  w.ny = hasUnit ? 3 : 2;
  w.isoMode = false;
  w.isoLambdaFixed = NaN;
  w.pr.fill(0);
  w.qr.fill(0);
  w.ps.fill(0);
  w.qs.fill(0);
  w.ev.fill(0);
  w.angle.fill(0);
  w.dPr.fill(0);
  w.dQr.fill(0);
  w.dE.fill(0);
  w.f.fill(0);
  w.step.fill(0);
  w.unitWeight.fill(0);
  w.unitWeightSum = 0;
  w.loadW = 0;
  w.loadVAR = 0;
  w.sBaseVA = 0;
  w.isoLo = 0;
  w.isoHi = 0;
  w.zScale = 1;
  weigh(w, m, hasUnit);
  return w;
}

/** The kVA base and the voltage unit's weights of `m`. */
function weigh(w: Work, m: SharingModel, hasUnit: boolean): void {
  const n = m.n;
  for (let i = 0; i < n; i++) w.sBaseVA += m.ratedKVA[i]! * 1000;
  const cross = hasUnit && m.reg[m.voltageUnit[0]!] === REG_CROSS;
  for (const i of m.voltageUnit) w.unitWeight[i] = cross ? m.ratedKVA[i]! : 1;
  for (const i of m.voltageUnit) w.unitWeightSum += w.unitWeight[i]!;
}

function setTarget(w: Work, p: number, d: number): void {
  w.targetW = p;
  w.targetD = d;
}

/** Governor target of set i at the sending end, W, and its derivative by the active-power unknown (into `w.targetW`, `w.targetD`). */
export function target(w: Work, i: number): void {
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

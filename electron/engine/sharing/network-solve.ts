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
import * as codes from '../mode-codes';
import type { SharingModel } from './sharing-model';
import { isoLambdaRange, overCapabilityMessage, underMinimumMessage } from './active-sharing';
import type { IsoState } from './active-sharing';
import { iterateWithContinuation } from './network-newton';
import { createNetworkWork } from './network-work';
import type { Work } from './network-work';
import type { OperatingPoint } from './sharing-result';

const GOV_DROOP = codes.GOV_DROOP;
const REG_CROSS = codes.REG_CROSS;

/** The starting point: the closed-form operating point (feeders ignored). */
export interface NetworkStart {
  frequencyHz: number;
  voltageV: number;
  kW: Float64Array;
  kVAR: Float64Array;
  isoState: IsoState;
}

/**
 * Solves the feeder network of `m` from the closed-form `start`; `work`, when given, is a fresh state of `m` (`createNetworkWork`).
 * @throws NoSteadyState when the load plus losses exceeds capability or the voltage collapses.
 * @throws Diverged when Newton–Raphson does not converge within its iteration bound.
 */
export function solveNetwork(m: SharingModel, start: NetworkStart, work?: Work): OperatingPoint {
  const n = m.n;
  const hasUnit = m.voltageUnit.length > 0;
  const w = work ?? createNetworkWork(m);
  const cross = hasUnit && m.reg[m.voltageUnit[0]!] === REG_CROSS;

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
          let atLimitKW = 0;
          for (let i = 0; i < n; i++) atLimitKW += m.gov[i] === codes.GOV_ISO ? (lambda > hi ? m.maxKW[i]! : m.minKW[i]!) : w.pr[i]! / 1000;
          throw new NoSteadyState(lambda > hi ? overCapabilityMessage(w.loadW / 1000, atLimitKW, true) : underMinimumMessage(w.loadW / 1000, atLimitKW));
        }
        next = lambda > hi ? 'at-max' : 'at-min';
      }
    } else if (m.isoGroup.length > 0) {
      const f = w.y[0]!;
      if ((isoState === 'at-max' && f > m.isoSetpointHz) || (isoState === 'at-min' && f < m.isoSetpointHz)) next = 'holding';
    }
    if (next === null) return finish(w, isoState, iterations);
    if (tried.includes(next)) {
      throw (
        firstError ??
        new Diverged(
          'The network solve could not decide whether the isochronous sets hold frequency (it switched back and forth). Check the isochronous setpoints and limits.',
        )
      );
    }
    isoState = next;
  }
}

function finish(w: Work, isoState: IsoState, iterations: number): OperatingPoint {
  const m = w.m;
  const n = m.n;
  const kW = w.outKW;
  const kVAR = w.outKVAR;
  const lossKW = w.outLossKW;
  const lossKVAR = w.outLossKVAR;
  const terminalV = w.outTerminalV;
  const terminalAngleDeg = w.outAngleDeg;
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

/**
 * The first seconds after the breaker closes: the incoming set swings against the
 * running bus. Two machines behind their transient reactances (classical model, Kundur
 * 1994 §13.1): the incoming EMF at the contact voltage, the bus at its own voltage
 * with the running sets' inertia and a droop governor; the incoming governor keeps acting. The coupling
 * reactance blends from subtransient (X''d) at contact to transient (X'd) with T''d, as in
 * the usual short-circuit decrement (Kundur 1994 §5.1), so the first power and current
 * equal the closed-form closing surge.
 */
import type { TrainerState, TrainerTraces } from '../../../shared-types';
import { busReactanceOnMachineBasePU } from './contact-stress';
import { governorDroopPU } from './live-model';

/** Subtransient time constant used for the current decrement, s (a typical value, from memory). */
const SUBTRANSIENT_TC_S = 0.035;

/** Droop of the running sets' governors, pu (4 %, common practice). */
const BUS_DROOP_PU = 0.04;
/** Lag of the running sets' governors and engines together, s (a typical figure). */
const BUS_GOVERNOR_LAG_S = 0.5;

/** Options of the after-close run. */
export interface AfterCloseOptions {
  /** Length of the traces, s (default 3). */
  durationS: number;
  /** Integration step, s (default 0.5 ms). */
  stepS: number;
  /** Interval between kept points, s (default 10 ms). */
  outputS: number;
}

const DEFAULTS: AfterCloseOptions = { durationS: 3, stepS: 0.0005, outputS: 0.01 };

/**
 * Integrates the swing after contact (RK4) from a state whose phase is `closed`.
 * Returns decimated traces; the caller's state is not touched.
 */
export function afterCloseTraces(state: TrainerState, options: Partial<AfterCloseOptions> = {}): TrainerTraces {
  const o = { ...DEFAULTS, ...options };
  const m = state.machine;
  const fr = m.ratedFrequencyHz;
  const omegaS = 2 * Math.PI * fr;
  const xBus = busReactanceOnMachineBasePU(m, state.bus);
  const xTransient = m.xdpPU + xBus;
  const xSub = m.xddpPU + xBus;
  const e = state.incomingVoltageV / m.ratedVoltageV;
  const vb = state.busVoltageV / m.ratedVoltageV;
  const hBus = (state.bus.inertiaS * state.bus.ratedKVA) / m.ratedKVA;
  const r = governorDroopPU(m);
  const fRefPU = state.speedReferenceHz / fr;
  const busPU = state.busFrequencyHz / fr;
  const kwLimit = m.ratedKW / m.ratedKVA;

  // The running sets' governors answer the bus speed change in droop (4 %, common practice) through a 0.5 s lag,
  // on the incoming set's base: ΔP = −(S_bus / S_incoming) (ω_bus − ω_bus,0) / R_bus.
  const busGovGain = state.bus.ratedKVA / m.ratedKVA / BUS_DROOP_PU;
  // State vector: δ (rad), incoming speed, bus speed (pu), actuator, mechanical power (pu), bus governor change (pu).
  const N = 6;
  const y = [(state.angleDeg * Math.PI) / 180, state.incomingFrequencyHz / fr, busPU, state.actuatorPU, state.mechanicalPU, 0];
  const k1 = new Array<number>(N).fill(0);
  const k2 = new Array<number>(N).fill(0);
  const k3 = new Array<number>(N).fill(0);
  const k4 = new Array<number>(N).fill(0);
  const tmp = new Array<number>(N).fill(0);
  // Reciprocal reactance: subtransient at contact decaying to transient (so the first power step equals the closed form's).
  const admittanceAt = (t: number): number => (1 / xSub - 1 / xTransient) * Math.exp(-t / SUBTRANSIENT_TC_S) + 1 / xTransient;
  const rhs = (t: number, v: number[], out: number[]): void => {
    const pe = e * vb * admittanceAt(t) * Math.sin(v[0]!);
    const cmd = Math.min(1.1 * kwLimit, Math.max(-0.1 * kwLimit, (fRefPU - v[1]!) / r));
    out[0] = omegaS * (v[1]! - v[2]!);
    out[1] = (v[4]! - pe - m.dampingPU * (v[1]! - v[2]!)) / (2 * m.inertiaS);
    // The running sets take the incoming power as a fall of their load; their governors then pull the bus back.
    out[2] = (pe + m.dampingPU * (v[1]! - v[2]!) + v[5]!) / (2 * hBus);
    out[3] = m.actuatorLagS > 0 ? (cmd - v[3]!) / m.actuatorLagS : 0;
    out[4] = m.engineLagS > 0 ? (v[3]! - v[4]!) / m.engineLagS : 0;
    out[5] = (-busGovGain * (v[2]! - busPU) - v[5]!) / BUS_GOVERNOR_LAG_S;
  };

  const steps = Math.round(o.durationS / o.stepS);
  const every = Math.max(1, Math.round(o.outputS / o.stepS));
  const traces: TrainerTraces = { tS: [], angleDeg: [], currentPU: [], powerPU: [], speedHz: [], source: 'two-machine' };
  const keep = (t: number): void => {
    const d = y[0]!;
    const dv = Math.sqrt(Math.max(0, e * e + vb * vb - 2 * e * vb * Math.cos(d)));
    const admittance = admittanceAt(t);
    traces.tS.push(t);
    traces.angleDeg.push((d * 180) / Math.PI);
    traces.currentPU.push(dv * admittance);
    traces.powerPU.push(e * vb * admittance * Math.sin(d));
    traces.speedHz.push(y[1]! * fr);
  };
  keep(0);
  const h = o.stepS;
  for (let i = 1; i <= steps; i++) {
    const t0 = (i - 1) * h;
    rhs(t0, y, k1);
    for (let j = 0; j < N; j++) tmp[j] = y[j]! + 0.5 * h * k1[j]!;
    rhs(t0 + 0.5 * h, tmp, k2);
    for (let j = 0; j < N; j++) tmp[j] = y[j]! + 0.5 * h * k2[j]!;
    rhs(t0 + 0.5 * h, tmp, k3);
    for (let j = 0; j < N; j++) tmp[j] = y[j]! + h * k3[j]!;
    rhs(t0 + h, tmp, k4);
    for (let j = 0; j < N; j++) y[j] = y[j]! + (h / 6) * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!);
    if (i % every === 0) keep(i * h);
  }
  return traces;
}

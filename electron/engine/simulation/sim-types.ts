/**
 * The simulator's shared types, in a file of their own so that the model builder, the plant's derivatives and the
 * governor, machine and regulator laws all import them without importing each other: the compiled plant
 * (`SimModel`, `LoadSlot`) and what one evaluation computes besides the derivatives (`Outputs`).
 */
import type { BusVoltage } from './network';

/** One load on the bus, in pu of `baseKVA` at rated voltage and frequency. */
export interface LoadSlot {
  id: string;
  on: boolean;
  pPU: number;
  qPU: number;
  impedance: boolean;
  frequencySensitivity: number;
  /** Under-frequency shedding pickup, pu of rated frequency (0: never shed), and its delay, s. */
  shedPU: number;
  shedDelayS: number;
  /** Time the bus frequency has been below `shedPU`, s. */
  shedTimer: number;
}

/** The simulator's working model of a plant. */
export interface SimModel {
  n: number;
  ids: string[];
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  /** System base, kVA. */
  baseKVA: number;
  /** Rated angular speed ωs = 2π f_rated, rad/s. */
  omegaS: number;

  ratedKVA: Float64Array;
  /** ratedKW / ratedKVA. */
  kwPU: Float64Array;
  /** Qbase / ratedKVA = √(1 − ratedPF²): the kVAR at rated current and rated power factor, the reactive-droop base. */
  qBasePU: Float64Array;
  inertiaS: Float64Array;
  dampingPU: Float64Array;
  xdPU: Float64Array;
  xd1PU: Float64Array;
  xd2PU: Float64Array;
  td0S: Float64Array;
  td20S: Float64Array;
  residualPU: Float64Array;
  /** Admittance of X''d plus the feeder, pu on the system base. */
  yRe: Float64Array;
  yIm: Float64Array;
  /** Feeder impedance, pu on the system base. */
  zfRe: Float64Array;
  zfIm: Float64Array;

  // Governor
  govMode: Int8Array;
  isoLinked: Uint8Array;
  droop: Float64Array;
  /** Speed references, pu of rated frequency. */
  noLoadPU: Float64Array;
  setpointPU: Float64Array;
  /** Base-load output, pu of ratedKW (ramps move it; see `rampT0`). */
  basePU: Float64Array;
  minPU: Float64Array;
  maxPU: Float64Array;
  actuatorS: Float64Array;
  engineS: Float64Array;
  resetS: Float64Array;
  rampT0: Float64Array;
  rampT1: Float64Array;
  rampFrom: Float64Array;
  rampTo: Float64Array;
  reverseTripPU: Float64Array;
  /** Reverse-power (32) delay, s. */
  reverseDelayS: Float64Array;
  /** Motoring power at zero fuel, pu of ratedKW (the plant's `motoringPct`). */
  motoringPU: Float64Array;
  /**
   * Protection pickups (pu of rated frequency or voltage; 0 = off) and delays (s), one row
   * of `n` per element of `PROTECTION_DEVICES`: index `d * n + i`.
   */
  protPickupPU: Float64Array;
  protDelayS: Float64Array;

  // Regulator
  regMode: Int8Array;
  regDroop: Float64Array;
  /** Voltage references, pu of rated voltage. */
  noLoadVPU: Float64Array;
  setpointVPU: Float64Array;
  tanPhi: Float64Array;
  gainPU: Float64Array;
  exciterS: Float64Array;
  avrResetS: Float64Array;
  ceilingPU: Float64Array;
  shunt: Uint8Array;
  /** V/Hz roll-off knee (pu speed) and slope (pu voltage per pu speed below it); slope 0 = off. */
  vhzKneePU: Float64Array;
  vhzSlopePU: Float64Array;
  /** Over-excitation limit, pu field (0 = off), its delay (s), and whether it holds the field now. */
  oelPU: Float64Array;
  oelDelayS: Float64Array;
  oelActive: Uint8Array;

  // Breaker and engine status
  online: Uint8Array;
  shutdown: Uint8Array;

  loads: LoadSlot[];
  /** Time constants raised to two steps so the fixed-step integrator stays stable. */
  raised: string[];
}

/** What one evaluation computes besides the derivatives (system base unless noted). */
export interface Outputs {
  /** E'' of each set, network frame. */
  eRe: Float64Array;
  eIm: Float64Array;
  sinD: Float64Array;
  cosD: Float64Array;
  /** Stator current into the network. */
  iRe: Float64Array;
  iIm: Float64Array;
  /** Terminal voltage phasor and magnitude. */
  vtRe: Float64Array;
  vtIm: Float64Array;
  vt: Float64Array;
  /** Electrical power and terminal kVAR, pu on the set's own base. */
  pOwn: Float64Array;
  qOwn: Float64Array;
  /** Stator current on the rotor's d- and q-axes, pu on the set's own base. */
  id: Float64Array;
  iq: Float64Array;
  /** Voltage each regulator compares with its reference, pu (its own terminal voltage, or the cross-current group's mean). */
  vSensed: Float64Array;
  /** Time of this evaluation, s. */
  t: number;
  /** Linked isochronous group's loading, pu of ratedKW. */
  pBarIso: number;
  /** Cross-current group's mean kVAR, pu of ratedKVA. */
  qBarCross: number;
  bus: BusVoltage;
  /** Inputs of the bus solve (see `network.ts`). */
  net: Float64Array;
  anyOnline: boolean;
  /** Bus speed: inertia-weighted mean speed of the on-line sets, pu. */
  omegaBus: number;
  /** Power taken by the loads and lost in the feeders, pu. */
  loadP: number;
  loadQ: number;
  feederLossP: number;
  /**
   * Constant-power load the bus does not serve because the voltage is below
   * `POWER_LOAD_BREAK_PU` (those loads then behave as constant impedance), pu.
   */
  unservedP: number;
  unservedQ: number;
  /** Evaluations whose bus solve did not converge. */
  unconverged: number;
}

/**
 * The simulator's shared types: the compiled plant (`SimModel`), its load slots and the per-step
 * outputs (`Outputs`). The model's parts (machine, governor, regulator, events) import these types
 * from here, so no part imports the module that calls it.
 */
import type { ZipShares } from '../../../shared-types';
import type { BusVoltage } from './network';

/**
 * One load on the bus, in pu of `baseKVA` at rated voltage and frequency, with its ZIP
 * shares (constant impedance, current, power; `bus-loads.ts` of the steady state has the law).
 */
export interface LoadSlot extends ZipShares {
  id: string;
  on: boolean;
  pPU: number;
  qPU: number;
  frequencySensitivity: number;
  kVARFrequencySensitivity: number;
  /** Under-frequency shedding pickup, pu of rated frequency (0: never shed), and its delay, s. */
  shedPU: number;
  shedDelayS: number;
  /** Time the bus frequency has been below `shedPU`, s. */
  shedTimer: number;
}

/** The simulator's working model of a plant. */
export interface SimModel {
  n: number;
  /**
   * Every per-set parameter and status below in one array, column by column (`par-layout.ts`):
   * the named per-set fields are views of its columns.
   */
  par: Float64Array;
  ids: string[];
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  /** System base, kVA. */
  baseKVA: number;
  /** Below this bus voltage, pu, constant-power and constant-current load shares draw as constant impedance. */
  breakPU: number;
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
  /** `codes.ts` governor mode, and 1 when in the isochronous load-sharing link. */
  govMode: Float64Array;
  isoLinked: Float64Array;
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
  /** Isochronous proportional gain, pu power per pu speed error. */
  isoGainPU: Float64Array;
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
  /** `codes.ts` regulator mode. */
  regMode: Float64Array;
  regDroop: Float64Array;
  /** Voltage references, pu of rated voltage. */
  noLoadVPU: Float64Array;
  setpointVPU: Float64Array;
  tanPhi: Float64Array;
  gainPU: Float64Array;
  exciterS: Float64Array;
  avrResetS: Float64Array;
  /** Time constant of the power-factor trim, s. */
  pfTrimS: Float64Array;
  ceilingPU: Float64Array;
  /** 1 when shunt (self) excited. */
  shunt: Float64Array;
  /** V/Hz roll-off knee (pu speed) and slope (pu voltage per pu speed below it); slope 0 = off. */
  vhzKneePU: Float64Array;
  vhzSlopePU: Float64Array;
  /**
   * Over-excitation limit, pu field (0 = off), its delay (s), the time the demand must stay
   * below it before the limiter lets go (s), and whether it holds the field now.
   */
  oelPU: Float64Array;
  oelDelayS: Float64Array;
  oelResetS: Float64Array;
  oelActive: Float64Array;

  // Breaker and engine status (1 or 0)
  online: Float64Array;
  shutdown: Float64Array;

  // Constants derived once from the fields above for the hot loop (none of them changes
  // with an event): reciprocals turn the per-stage divisions into multiplications.
  /** 1 / (2H), 1/s. */
  inv2H: Float64Array;
  /** H · ratedKVA, the weight of each set in the bus speed, kVA·s. */
  inertiaKVA: Float64Array;
  /** baseKVA / ratedKVA: system-base pu to the set's own base. */
  ownScale: Float64Array;
  /** Xd − X'd and X'd − X''d, pu own base. */
  xdMinusXd1: Float64Array;
  xd1MinusXd2: Float64Array;
  /** 1 / T'd0 and 1 / T''d0, 1/s. */
  invTd0: Float64Array;
  invTd20: Float64Array;
  /** 1 / droop (pu), and the reciprocals of the governor lags and isochronous reset, 1/s. */
  invDroop: Float64Array;
  invActuatorS: Float64Array;
  invEngineS: Float64Array;
  invResetS: Float64Array;
  /** Cross-current loop gain (`crossCurrentGain`), and the reciprocals of the regulator's reset and exciter lag, 1/s. */
  crossGain: Float64Array;
  invAvrResetS: Float64Array;
  invExciterS: Float64Array;
  /** 1 / the power-factor trim's time constant, 1/s. */
  invPfTrimS: Float64Array;
  /** Reactive droop over its base, regDroop / qBasePU: pu voltage per pu (own kVA base) of kVAR. */
  regDroopPerQBase: Float64Array;

  loads: LoadSlot[];
  /** Time constants raised to two steps so the fixed-step integrator stays stable. */
  raised: string[];
}

/** What one evaluation computes besides the derivatives (system base unless noted). */
export interface Outputs {
  /** The per-set outputs below in one array, column by column (`O_*`). */
  buf: Float64Array;
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
  /** Time of this evaluation, s (set by the caller before it evaluates). */
  t: number;
  /** Linked isochronous group's loading, pu of ratedKW. */
  pBarIso: number;
  /** Cross-current group's mean kVAR, pu of ratedKVA. */
  qBarCross: number;
  bus: BusVoltage;
  /** Inputs of the bus solve (see `network.ts`). */
  net: Float64Array;
  /**
   * The on-line loads that do not follow frequency, summed per ZIP share (`plant-dynamics.ts`), and the on-line
   * loads that do; both worked out at the first evaluation of each step and reused by its later RK4 stages.
   */
  loadSums: Float64Array;
  frequencyLoads: LoadSlot[];
  anyOnline: boolean;
  /** Bus speed: inertia-weighted mean speed of the on-line sets, pu. */
  omegaBus: number;
  /** Power taken by the loads and lost in the feeders, pu. */
  loadP: number;
  loadQ: number;
  feederLossP: number;
  /**
   * Load the bus does not serve because the voltage is below the break voltage (`m.breakPU`;
   * the constant-power and constant-current shares then draw as constant impedance): what
   * their own law would draw less what they draw, pu.
   */
  unservedP: number;
  unservedQ: number;
  /** Evaluations whose bus solve did not converge. */
  unconverged: number;
}

/**
 * The plant model: generating sets, their governors and regulators, feeders and loads.
 * Field names carry their unit. Per-unit machine data is on the set's own base
 * (`ratedKVA`, `ratedVoltageV` of the plant). `electron/handlers/plant-schema.ts` is the
 * file's definition (rules and defaults).
 */

/** File format tag of a plant file. */
export const PLANT_FORMAT = 'droopline.plant' as const;
/** Current plant file version. */
export const PLANT_VERSION = 1 as const;

/**
 * Defaults of the per-set figures the plant file may leave out; the schema, the Plant view's
 * new set and the engine all take them from here (one home).
 */
export const SET_DEFAULTS = {
  /**
   * Overload allowance of a prime-rated set: 110 % of rated kW for one hour in twelve
   * (ISO 8528-1, prime power rating; value from memory — verify against the maker's rating).
   */
  overloadPct: 110,
  /**
   * Motoring power of a four-stroke diesel engine, % of rating: 25 % (IEEE C37.102, table of
   * typical motoring power by prime mover; value from memory). A well run-in engine may draw
   * much less; verify with the engine maker.
   */
  motoringPct: 25,
  /** Reverse-power (32) delay, s: common practice 2–10 s for engine sets (value from memory). */
  reversePowerDelayS: 3,
  /**
   * Field ceiling when the plant file gives none, as a multiple of the field at rated load and
   * rated power factor: 1.6 × (brushless engine-set exciters commonly reach 1.5–2 × the
   * rated-load field; common practice, value from memory). With this margin a set accepts a
   * rated load step at rated power factor.
   */
  fieldCeilingFactor: 1.6,
  /** Below this margin of the ceiling over the rated-load field, % , a run and the Plant view warn. */
  fieldCeilingMarginPct: 30,
  /**
   * Generator protection settings (device numbers of IEEE C37.2: 81U/81O frequency, 27
   * undervoltage, 59 overvoltage), pickup in % of rated and time delay in s. Common practice
   * for engine sets, values from memory: verify against the protection study of the site.
   * A pickup of 0 switches the element off.
   */
  protection: {
    underFrequencyPct: 95,
    underFrequencyDelayS: 5,
    overFrequencyPct: 108,
    overFrequencyDelayS: 5,
    underVoltagePct: 80,
    underVoltageDelayS: 5,
    overVoltagePct: 115,
    overVoltageDelayS: 3,
  },
  /**
   * Under-frequency (V/Hz) roll-off of the voltage regulator: below `vhzKneeBelowHz` under rated
   * frequency the voltage reference falls by `vhzSlopePctPerHz` % of rated voltage per Hz, so an
   * engine pulled down by a load step is not also asked for full voltage. Common practice on
   * engine sets: knee 1–2 Hz below rated, a few % per Hz (values from memory).
   */
  vhzKneeBelowHz: 2,
  vhzSlopePctPerHz: 3,
  /**
   * Over-excitation limiter: when the field stays above `oelPct` % of the rated-load field for
   * `oelDelayS`, the regulator holds it there until its demand falls back (field forcing allowed
   * for about 10 s; common practice, values from memory).
   */
  oelPct: 110,
  oelDelayS: 10,
  /**
   * Over-excitation limiter release: once the field demand has stayed below the limit for
   * `oelResetS`, the limiter lets go and the field may force again (limiters reset after a
   * cool-down of some tens of seconds; common practice, value from memory).
   */
  oelResetS: 30,
  /** Delay of an under-frequency load-shedding stage when a load gives none, s (common practice, value from memory). */
  shedDelayS: 0.5,
  /**
   * Subtransient open-circuit time constant T''d0, s: 0.03 s sits inside the 0.01–0.05 s
   * typical of engine-set alternators (typical data of engine-set alternators; value from memory).
   */
  tddopS: 0.03,
  /**
   * Proportional gain of the isochronous governor, pu power per pu speed error: 20, a 5 %
   * transient droop (common practice for engine governors; value from memory).
   */
  isoGainPU: 20,
  /** Integral (reset) time of the voltage regulator, s: 1 s (common practice for engine-set regulators; value from memory). */
  regulatorResetS: 1,
  /**
   * Time constant of the power-factor controller's trim of the voltage reference, s: 5 s
   * (power-factor controllers act over seconds; common practice, value from memory).
   */
  pfTrimS: 5,
} as const;

/**
 * Plant-wide defaults. `powerLoadBreakPct`: below this bus voltage, % of rated, the
 * simulator's constant-power and constant-current load shares draw as constant impedance (as
 * stability programs do, so a collapsing or building-up bus stays solvable; 70 % is common
 * practice in stability programs, value from memory). The run says so, with the kW not served.
 */
export const PLANT_DEFAULTS = {
  powerLoadBreakPct: 70,
} as const;

/** How a set's governor controls speed (one list: the type and the plant schema use it). */
export const GOVERNOR_MODES = ['droop', 'isochronous', 'baseload'] as const;
export type GovernorMode = (typeof GOVERNOR_MODES)[number];
/** How a set's voltage regulator controls terminal voltage. */
export const REGULATOR_MODES = ['reactive-droop', 'cross-current', 'voltage', 'power-factor'] as const;
export type RegulatorMode = (typeof REGULATOR_MODES)[number];
/** How a load responds to voltage. */
export const LOAD_MODELS = ['constant-power', 'constant-impedance', 'zip'] as const;
export type LoadModel = (typeof LOAD_MODELS)[number];

/** Governor (speed control) settings of one set. */
export interface Governor {
  mode: GovernorMode;
  /** Speed droop, % of rated frequency from no load to rated kW. Used in `droop` mode. */
  droopPct: number;
  /** No-load frequency, Hz (droop mode). */
  noLoadHz: number;
  /** Frequency held in isochronous mode, Hz. */
  setpointHz: number;
  /** Output held in base-load mode, kW. */
  baseKW: number;
  /**
   * Isochronous mode: the set shares load with the other isochronous sets through a
   * load-sharing link (kW in proportion to `ratedKW`). Default true (the schema fills it in).
   */
  loadSharingLink?: boolean;
  /** Time-domain data (simulator only). Defaults are applied by the schema. */
  actuatorLagS: number;
  /** Engine torque lag, s (simulator). */
  engineLagS: number;
  /** Isochronous PI reset time, s (simulator). */
  isoResetS: number;
  /** Isochronous proportional gain, pu power per pu speed error (simulator). Default `SET_DEFAULTS.isoGainPU`. */
  isoGainPU?: number;
}

/** Voltage regulator (excitation control) settings of one set. */
export interface Regulator {
  mode: RegulatorMode;
  /** Reactive droop, % of rated voltage at `Qbase = ratedKVA * sqrt(1 - ratedPF^2)`. */
  droopPct: number;
  /** No-load voltage, V line-to-line (reactive-droop mode). */
  noLoadV: number;
  /** Voltage held in voltage and cross-current modes, V line-to-line. */
  setpointV: number;
  /** Power factor held in power-factor mode (lagging, 0 < pf ≤ 1). */
  pf: number;
  /** Exciter time constant, s (simulator). */
  exciterLagS: number;
  /** Regulator gain, pu field voltage per pu voltage error (simulator). */
  gainPU: number;
  /**
   * Field-voltage ceiling, pu (simulator). Left out, it is derived from the machine data:
   * `SET_DEFAULTS.fieldCeilingFactor` × the field at rated load and rated power factor.
   */
  ceilingPU?: number;
  /** Shunt (self) excitation: the ceiling scales with terminal voltage (simulator). */
  shuntExcited: boolean;
  /** Residual-magnetism voltage, pu of rated, for shunt build-up (simulator). */
  residualPU: number;
  /** V/Hz roll-off knee, Hz below rated frequency (simulator). Default `SET_DEFAULTS.vhzKneeBelowHz`. */
  vhzKneeBelowHz?: number;
  /** V/Hz roll-off slope, % of rated voltage per Hz below the knee; 0 = off. Default `SET_DEFAULTS.vhzSlopePctPerHz`. */
  vhzSlopePctPerHz?: number;
  /** Over-excitation limit, % of the field at rated load; 0 = off. Default `SET_DEFAULTS.oelPct`. */
  oelPct?: number;
  /** Time the field may stay above the over-excitation limit before it is held there, s. Default `SET_DEFAULTS.oelDelayS`. */
  oelDelayS?: number;
  /** Time the field demand must stay below the limit before the limiter lets go, s. Default `SET_DEFAULTS.oelResetS`. */
  oelResetS?: number;
  /** Integral (reset) time of the regulator, s (simulator). Default `SET_DEFAULTS.regulatorResetS`. */
  resetS?: number;
  /** Time constant of the power-factor trim, s (simulator, power-factor mode). Default `SET_DEFAULTS.pfTrimS`. */
  pfTrimS?: number;
}

/** Synchronous machine data, per unit on the set's base (`ratedKVA`, plant `ratedVoltageV`). */
export interface Machine {
  /** Synchronous reactance X d, pu. */
  xdPU: number;
  /** Transient reactance X'd, pu. */
  xdpPU: number;
  /** Subtransient reactance X''d, pu. */
  xddpPU: number;
  /** Open-circuit transient time constant T'd0, s. */
  tdopS: number;
  /** Inertia constant H of set and engine, s (kW·s per kVA). */
  inertiaS: number;
  /** Damping coefficient, pu power per pu speed deviation (simulator). */
  dampingPU: number;
  /** Armature resistance, pu (closing surge R/X, simulator). */
  raPU: number;
  /** Subtransient open-circuit time constant T''d0, s (simulator). Default `SET_DEFAULTS.tddopS`. */
  tddopS?: number;
}

/**
 * Generator protection of one set (IEEE C37.2 device numbers). Pickups in % of rated frequency
 * or voltage, delays in s; a pickup of 0 switches that element off. Reverse power (32) is the
 * set's `reversePowerTripPct` / `reversePowerDelayS`. Defaults: `SET_DEFAULTS.protection`.
 */
export interface Protection {
  /** 81U under-frequency pickup, % of rated frequency (trips below). */
  underFrequencyPct: number;
  underFrequencyDelayS: number;
  /** 81O over-frequency pickup, % of rated frequency (trips above). */
  overFrequencyPct: number;
  overFrequencyDelayS: number;
  /** 27 undervoltage pickup, % of rated voltage (trips below). */
  underVoltagePct: number;
  underVoltageDelayS: number;
  /** 59 overvoltage pickup, % of rated voltage (trips above). */
  overVoltagePct: number;
  overVoltageDelayS: number;
}

/** The cable or bus duct from a set's terminals to the common bus (per phase). */
export interface Feeder {
  rOhm: number;
  xOhm: number;
}

/** One generating set. */
export interface GenSet {
  id: string;
  name: string;
  /** Breaker closed and set running on the bus. */
  online: boolean;
  ratedKVA: number;
  ratedKW: number;
  /** Rated power factor (lagging). */
  ratedPF: number;
  poles: number;
  /** Lowest output the governor may be asked for, kW (≥ negative reverse-power trip). */
  minKW: number;
  /** Reverse-power trip setting (device 32), % of `ratedKW`. */
  reversePowerTripPct: number;
  /** Reverse-power (device 32) time delay, s. Default `SET_DEFAULTS.reversePowerDelayS`. */
  reversePowerDelayS: number;
  /**
   * Overload capability, % of `ratedKW`: the governor's fuel limit in every mode. Between
   * `ratedKW` and this the set carries the `overload-kW` flag. Default `SET_DEFAULTS.overloadPct`.
   */
  overloadPct: number;
  /**
   * Motoring power, % of `ratedKW`: what the set draws from the bus at zero fuel (friction,
   * pumping). The steady state and the simulator use this one figure. Default `SET_DEFAULTS.motoringPct`.
   */
  motoringPct: number;
  /** Under-excitation (leading kVAR) warning limit, % of `ratedKVA`. */
  leadingKVARLimitPct: number;
  governor: Governor;
  regulator: Regulator;
  machine: Machine;
  feeder: Feeder;
  /** Generator protection; the schema fills `SET_DEFAULTS.protection` where the file gives none. */
  protection?: Protection;
}

/** One load on the common bus. */
export interface Load {
  id: string;
  name: string;
  online: boolean;
  /** Active power at rated voltage and frequency, kW. */
  kW: number;
  /** Reactive power at rated voltage, kVAR (positive = lagging, absorbs VARs). */
  kVAR: number;
  /**
   * How the load responds to voltage: constant power, constant impedance, or `zip` — shares of
   * constant impedance (∝ V²), constant current (∝ V) and constant power given by the fields below.
   */
  model: LoadModel;
  /** ZIP model: share of the kW that is constant impedance, %. Default 0. */
  kWImpedancePct?: number;
  /** ZIP model: share of the kW that is constant current, %; the rest (100 − Z − I) is constant power. Default 0. */
  kWCurrentPct?: number;
  /** ZIP model: share of the kVAR that is constant impedance, %. Default 0. */
  kVARImpedancePct?: number;
  /** ZIP model: share of the kVAR that is constant current, %; the rest is constant power. Default 0. */
  kVARCurrentPct?: number;
  /** Frequency sensitivity: % change of kW per % change of frequency (0 = none). */
  frequencySensitivity: number;
  /** Frequency sensitivity of the kVAR: % change of kVAR per % change of frequency (0 = none). Default 0. */
  kVARFrequencySensitivity?: number;
  /**
   * Under-frequency load shedding: the load is switched off when the bus frequency stays
   * below this, % of rated frequency, for `shedDelayS`. Left out: never shed.
   */
  shedFrequencyPct?: number;
  /** Delay of the load-shedding stage, s. Default `SET_DEFAULTS.shedDelayS`. */
  shedDelayS?: number;
}

/** A whole plant: the sets and loads on one common bus. */
export interface Plant {
  format: typeof PLANT_FORMAT;
  version: typeof PLANT_VERSION;
  name: string;
  ratedFrequencyHz: number;
  /** Line-to-line rated voltage, V. */
  ratedVoltageV: number;
  sets: GenSet[];
  loads: Load[];
  /**
   * Below this bus voltage, % of rated, the simulator's constant-power and constant-current
   * load shares draw as constant impedance (and the run says how much is not served).
   * Default `PLANT_DEFAULTS.powerLoadBreakPct`.
   */
  powerLoadBreakPct?: number;
}

/** The shares of a load's kW and kVAR by voltage law (fractions 0–1, each triple sums to 1). */
export interface ZipShares {
  pZ: number;
  pI: number;
  pP: number;
  qZ: number;
  qI: number;
  qP: number;
}

/**
 * The voltage-law shares of a load: constant power (0, 0, 1), constant impedance (1, 0, 0), or
 * the ZIP fields (constant power the rest). Fields of the ZIP model are not used by the others.
 */
export function zipShares(l: Pick<Load, 'model' | 'kWImpedancePct' | 'kWCurrentPct' | 'kVARImpedancePct' | 'kVARCurrentPct'>): ZipShares {
  if (l.model === 'constant-impedance') return { pZ: 1, pI: 0, pP: 0, qZ: 1, qI: 0, qP: 0 };
  if (l.model !== 'zip') return { pZ: 0, pI: 0, pP: 1, qZ: 0, qI: 0, qP: 1 };
  const pZ = (l.kWImpedancePct ?? 0) / 100;
  const pI = (l.kWCurrentPct ?? 0) / 100;
  const qZ = (l.kVARImpedancePct ?? 0) / 100;
  const qI = (l.kVARCurrentPct ?? 0) / 100;
  return { pZ, pI, pP: Math.max(0, 1 - pZ - pI), qZ, qI, qP: Math.max(0, 1 - qZ - qI) };
}

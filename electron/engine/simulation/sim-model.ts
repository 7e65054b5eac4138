/**
 * The plant compiled for the simulator: per-set parameters in typed arrays on a
 * common per-unit base, the controls that events change, and the load slots on the
 * bus. Built once per simulation; events change the control arrays, never the caller's
 * plant.
 *
 * Per-unit bases: machine, governor and regulator quantities are on each set's own
 * base (`ratedKVA`, plant `ratedVoltageV`); the network is solved on the system base
 * `baseKVA` (the sum of all sets' ratings) at the same voltage base.
 */
import { lowerLimitKW, overloadLimitKW } from '../sharing/set-limits';
import { PLANT_DEFAULTS, SET_DEFAULTS, zipShares } from '../../../shared-types';
import type { Load, LoadModel, Plant, ZipShares } from '../../../shared-types';
import { crossCurrentGain } from './regulator';
import { fieldCeiling } from './excitation';

import { GOV_BASE, GOV_DROOP, GOV_ISO, REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from './codes';
import { PAR_COLUMNS, PAR_FIELDS } from './par-layout';
import type { ParField } from './par-layout';

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

/** A load slot of `kW`, `kVAR` on a system base of `baseKVA`, under one of the plain models (no shedding, no frequency dependence). */
export function plainLoadSlot(id: string, kW: number, kVAR: number, baseKVA: number, model: LoadModel): LoadSlot {
  return {
    id,
    on: true,
    pPU: kW / baseKVA,
    qPU: kVAR / baseKVA,
    ...zipShares({ model }),
    frequencySensitivity: 0,
    kVARFrequencySensitivity: 0,
    shedPU: 0,
    shedDelayS: 0,
    shedTimer: 0,
  };
}

/** The load slot of a plant load. */
function plantLoadSlot(l: Load, baseKVA: number): LoadSlot {
  return {
    id: l.id,
    on: l.online,
    pPU: l.kW / baseKVA,
    qPU: l.kVAR / baseKVA,
    ...zipShares(l),
    frequencySensitivity: l.frequencySensitivity,
    kVARFrequencySensitivity: l.kVARFrequencySensitivity ?? 0,
    shedPU: (l.shedFrequencyPct ?? 0) / 100,
    shedDelayS: l.shedDelayS ?? SET_DEFAULTS.shedDelayS,
    shedTimer: 0,
  };
}

/** Protection elements of a set, in the order checked (IEEE C37.2 device numbers). */
export const PROTECTION_DEVICES = ['81U', '81O', '27', '59'] as const;

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

  loads: LoadSlot[];
  /** Time constants raised to two steps so the fixed-step integrator stays stable. */
  raised: string[];
}

/**
 * Compiles a validated plant (defaults filled) for a step of `stepS` seconds.
 * Lags shorter than two steps are raised to two steps (a lag that short has no
 * visible effect at this step and would make RK4 unstable); each is named in `raised`.
 */
export function buildSimModel(plant: Plant, stepS: number): SimModel {
  const n = plant.sets.length;
  const par = new Float64Array(PAR_COLUMNS * n);
  const views = {} as Record<ParField, Float64Array>;
  for (const [name, k] of Object.entries(PAR_FIELDS)) views[name as ParField] = par.subarray(k * n, (k + 1) * n);
  let baseKVA = 0;
  for (const s of plant.sets) baseKVA += s.ratedKVA;
  const vr = plant.ratedVoltageV;
  const fr = plant.ratedFrequencyHz;
  const zBaseOhm = (vr * vr) / (baseKVA * 1000);
  const m: SimModel = {
    n,
    ids: plant.sets.map((s) => s.id),
    ratedFrequencyHz: fr,
    ratedVoltageV: vr,
    baseKVA,
    breakPU: (plant.powerLoadBreakPct ?? PLANT_DEFAULTS.powerLoadBreakPct) / 100,
    omegaS: 2 * Math.PI * fr,
    par,
    ...views,
    protPickupPU: new Float64Array(4 * n), protDelayS: new Float64Array(4 * n),
    loads: [],
    raised: [],
  };
  const minLag = 2 * stepS;
  const lag = (value: number, what: string) => {
    if (value >= minLag) return value;
    if (value > 0) m.raised.push(`${what} ${value} s`);
    return minLag;
  };
  plant.sets.forEach((s, i) => {
    const g = s.governor;
    const r = s.regulator;
    const mc = s.machine;
    m.ratedKVA[i] = s.ratedKVA;
    m.kwPU[i] = s.ratedKW / s.ratedKVA;
    m.qBasePU[i] = Math.sqrt(1 - s.ratedPF * s.ratedPF);
    m.inertiaS[i] = mc.inertiaS;
    m.dampingPU[i] = mc.dampingPU;
    m.xdPU[i] = mc.xdPU;
    m.xd1PU[i] = Math.min(mc.xdpPU, mc.xdPU);
    m.xd2PU[i] = Math.min(mc.xddpPU, m.xd1PU[i]!);
    m.td0S[i] = lag(mc.tdopS, `${s.id} machine.tdopS`);
    m.td20S[i] = lag(mc.tddopS ?? SET_DEFAULTS.tddopS, `${s.id} machine.tddopS`);
    m.residualPU[i] = r.residualPU;
    const zfRe = s.feeder.rOhm / zBaseOhm;
    const zfIm = s.feeder.xOhm / zBaseOhm;
    m.zfRe[i] = zfRe;
    m.zfIm[i] = zfIm;
    // X''d on the system base: the same ohms, so pu scale with baseKVA / ratedKVA.
    const zr = zfRe;
    const zi = zfIm + m.xd2PU[i]! * (baseKVA / s.ratedKVA);
    const d2 = zr * zr + zi * zi;
    m.yRe[i] = zr / d2;
    m.yIm[i] = -zi / d2;

    m.govMode[i] = g.mode === 'droop' ? GOV_DROOP : g.mode === 'isochronous' ? GOV_ISO : GOV_BASE;
    m.isoLinked[i] = g.loadSharingLink === false ? 0 : 1;
    m.droop[i] = g.droopPct / 100;
    m.noLoadPU[i] = g.noLoadHz / fr;
    m.setpointPU[i] = g.setpointHz / fr;
    m.basePU[i] = g.baseKW / s.ratedKW;
    // The steady state's limits (one home): the overload (fuel) limit above in every mode;
    // below, zero fuel (−motoring power) for droop, the load controller's minKW otherwise.
    m.minPU[i] = lowerLimitKW(s) / s.ratedKW;
    m.maxPU[i] = overloadLimitKW(s) / s.ratedKW;
    m.actuatorS[i] = lag(g.actuatorLagS, `${s.id} governor.actuatorLagS`);
    m.engineS[i] = lag(g.engineLagS, `${s.id} governor.engineLagS`);
    m.resetS[i] = g.isoResetS;
    m.isoGainPU[i] = g.isoGainPU ?? SET_DEFAULTS.isoGainPU;
    m.rampT0[i] = Infinity;
    m.rampT1[i] = Infinity;
    m.reverseTripPU[i] = s.reversePowerTripPct / 100;
    m.reverseDelayS[i] = s.reversePowerDelayS;
    m.motoringPU[i] = s.motoringPct / 100;
    const pr = { ...SET_DEFAULTS.protection, ...s.protection };
    const pick = [pr.underFrequencyPct, pr.overFrequencyPct, pr.underVoltagePct, pr.overVoltagePct];
    const del = [pr.underFrequencyDelayS, pr.overFrequencyDelayS, pr.underVoltageDelayS, pr.overVoltageDelayS];
    for (let d = 0; d < 4; d++) {
      m.protPickupPU[d * n + i] = pick[d]! / 100;
      m.protDelayS[d * n + i] = del[d]!;
    }

    m.regMode[i] = r.mode === 'reactive-droop' ? REG_DROOP : r.mode === 'cross-current' ? REG_CROSS : r.mode === 'voltage' ? REG_VOLTAGE : REG_PF;
    m.regDroop[i] = r.droopPct / 100;
    m.noLoadVPU[i] = r.noLoadV / vr;
    m.setpointVPU[i] = r.setpointV / vr;
    m.tanPhi[i] = Math.sqrt(1 - r.pf * r.pf) / r.pf;
    m.gainPU[i] = r.gainPU;
    m.exciterS[i] = lag(r.exciterLagS, `${s.id} regulator.exciterLagS`);
    m.avrResetS[i] = r.resetS ?? SET_DEFAULTS.regulatorResetS;
    m.pfTrimS[i] = r.pfTrimS ?? SET_DEFAULTS.pfTrimS;
    const fc = fieldCeiling(s);
    m.ceilingPU[i] = fc.ceilingPU;
    m.vhzKneePU[i] = 1 - (r.vhzKneeBelowHz ?? SET_DEFAULTS.vhzKneeBelowHz) / fr;
    m.vhzSlopePU[i] = ((r.vhzSlopePctPerHz ?? SET_DEFAULTS.vhzSlopePctPerHz) / 100) * fr;
    m.oelPU[i] = ((r.oelPct ?? SET_DEFAULTS.oelPct) / 100) * fc.ratedFieldPU;
    m.oelDelayS[i] = r.oelDelayS ?? SET_DEFAULTS.oelDelayS;
    m.oelResetS[i] = r.oelResetS ?? SET_DEFAULTS.oelResetS;
    m.shunt[i] = r.shuntExcited ? 1 : 0;
    m.online[i] = s.online ? 1 : 0;

    m.inv2H[i] = 1 / (2 * m.inertiaS[i]!);
    m.inertiaKVA[i] = m.inertiaS[i]! * m.ratedKVA[i]!;
    m.ownScale[i] = baseKVA / s.ratedKVA;
    m.xdMinusXd1[i] = m.xdPU[i]! - m.xd1PU[i]!;
    m.xd1MinusXd2[i] = m.xd1PU[i]! - m.xd2PU[i]!;
    m.invTd0[i] = 1 / m.td0S[i]!;
    m.invTd20[i] = 1 / m.td20S[i]!;
    m.invDroop[i] = 1 / m.droop[i]!;
    m.invActuatorS[i] = 1 / m.actuatorS[i]!;
    m.invEngineS[i] = 1 / m.engineS[i]!;
    m.invResetS[i] = 1 / m.resetS[i]!;
    m.crossGain[i] = crossCurrentGain(m, i);
    m.invAvrResetS[i] = 1 / m.avrResetS[i]!;
    m.invExciterS[i] = 1 / m.exciterS[i]!;
    m.invPfTrimS[i] = 1 / m.pfTrimS[i]!;
  });
  for (const l of plant.loads) m.loads.push(plantLoadSlot(l, baseKVA));
  return m;
}

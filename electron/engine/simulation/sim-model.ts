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
import { PLANT_DEFAULTS, SET_DEFAULTS, kVARBase, tanPhi, zipShares } from '../../../shared-types';
import type { Load, LoadModel, Plant } from '../../../shared-types';
import { crossCurrentGain } from './regulator';
import { fieldCeiling } from './excitation';

import { GOV_BASE, GOV_DROOP, GOV_ISO, REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from '../mode-codes';
import { PAR_COLUMNS, PAR_FIELDS } from './par-layout';
import type { ParField } from './par-layout';

export type { LoadSlot, SimModel } from './sim-types';
import type { LoadSlot, SimModel } from './sim-types';

/** The per-set parameter columns by name, in the layout's order. */
const PAR_FIELD_NAMES = Object.keys(PAR_FIELDS) as ParField[];

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

/**
 * Compiles a validated plant (defaults filled) for a step of `stepS` seconds.
 * Lags shorter than two steps are raised to two steps (a lag that short has no
 * visible effect at this step and would make RK4 unstable); each is named in `raised`.
 */
export function buildSimModel(plant: Plant, stepS: number): SimModel {
  const n = plant.sets.length;
  const par = new Float64Array(PAR_COLUMNS * n);
  let baseKVA = 0;
  for (const s of plant.sets) baseKVA += s.ratedKVA;
  const vr = plant.ratedVoltageV;
  const fr = plant.ratedFrequencyHz;
  const zBaseOhm = (vr * vr) / (baseKVA * 1000);
  // The per-set views are put on the model one by one (in the same order every time, so every model has the same
  // shape): spreading a record of them into the literal cost more than the rest of the compile, and a time-domain
  // closing map compiles the plant once per cell.
  const m = {
    n,
    ids: plant.sets.map((s) => s.id),
    ratedFrequencyHz: fr,
    ratedVoltageV: vr,
    baseKVA,
    breakPU: (plant.powerLoadBreakPct ?? PLANT_DEFAULTS.powerLoadBreakPct) / 100,
    omegaS: 2 * Math.PI * fr,
    par,
    protPickupPU: new Float64Array(4 * n),
    protDelayS: new Float64Array(4 * n),
    loads: [],
    raised: [],
  } as unknown as SimModel;
  const views = m as unknown as Record<ParField, Float64Array>;
  for (const name of PAR_FIELD_NAMES) views[name] = par.subarray(PAR_FIELDS[name] * n, (PAR_FIELDS[name] + 1) * n);
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
    m.qBasePU[i] = kVARBase(1, s.ratedPF);
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
    m.tanPhi[i] = tanPhi(r.pf);
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
    m.regDroopPerQBase[i] = m.regDroop[i]! / m.qBasePU[i]!;
  });
  for (const l of plant.loads) m.loads.push(plantLoadSlot(l, baseKVA));
  return m;
}

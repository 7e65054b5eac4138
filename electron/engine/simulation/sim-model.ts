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
import { SET_DEFAULTS, kVARBase, tanPhi } from '../../../shared-types';
import type { Plant } from '../../../shared-types';
import { REGULATOR_RESET_S } from './regulator';
import { fieldCeiling } from './excitation';

import { GOV_BASE, GOV_DROOP, GOV_ISO, REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from '../mode-codes';
import type { SimModel } from './sim-types';

/**
 * Subtransient open-circuit time constant T''d0, s, for every set: the plant file has no
 * field for it. 0.03 s sits inside the 0.01–0.05 s typical of sets of this size
 * (typical data of engine-set alternators; value from memory).
 */
export const TDDO_S = 0.03;


/** Protection elements of a set, in the order checked (IEEE C37.2 device numbers). */
export const PROTECTION_DEVICES = ['81U', '81O', '27', '59'] as const;


/**
 * Compiles a validated plant (defaults filled) for a step of `stepS` seconds.
 * Lags shorter than two steps are raised to two steps (a lag that short has no
 * visible effect at this step and would make RK4 unstable); each is named in `raised`.
 */
export function buildSimModel(plant: Plant, stepS: number): SimModel {
  const n = plant.sets.length;
  const f = () => new Float64Array(n);
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
    omegaS: 2 * Math.PI * fr,
    ratedKVA: f(), kwPU: f(), qBasePU: f(), inertiaS: f(), dampingPU: f(),
    xdPU: f(), xd1PU: f(), xd2PU: f(), td0S: f(), td20S: f(), residualPU: f(),
    yRe: f(), yIm: f(), zfRe: f(), zfIm: f(),
    govMode: new Int8Array(n), isoLinked: new Uint8Array(n), droop: f(), noLoadPU: f(), setpointPU: f(),
    basePU: f(), minPU: f(), maxPU: f(), actuatorS: f(), engineS: f(), resetS: f(),
    rampT0: f(), rampT1: f(), rampFrom: f(), rampTo: f(), reverseTripPU: f(), reverseDelayS: f(), motoringPU: f(),
    regMode: new Int8Array(n), regDroop: f(), noLoadVPU: f(), setpointVPU: f(), tanPhi: f(),
    gainPU: f(), exciterS: f(), avrResetS: f(), ceilingPU: f(), shunt: new Uint8Array(n),
    vhzKneePU: f(), vhzSlopePU: f(), oelPU: f(), oelDelayS: f(), oelActive: new Uint8Array(n),
    online: new Uint8Array(n), shutdown: new Uint8Array(n),
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
    m.qBasePU[i] = kVARBase(1, s.ratedPF);
    m.inertiaS[i] = mc.inertiaS;
    m.dampingPU[i] = mc.dampingPU;
    m.xdPU[i] = mc.xdPU;
    m.xd1PU[i] = Math.min(mc.xdpPU, mc.xdPU);
    m.xd2PU[i] = Math.min(mc.xddpPU, m.xd1PU[i]!);
    m.td0S[i] = lag(mc.tdopS, `${s.id} machine.tdopS`);
    m.td20S[i] = lag(TDDO_S, `${s.id} T''d0`);
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
    m.avrResetS[i] = REGULATOR_RESET_S;
    const fc = fieldCeiling(s);
    m.ceilingPU[i] = fc.ceilingPU;
    m.vhzKneePU[i] = 1 - (r.vhzKneeBelowHz ?? SET_DEFAULTS.vhzKneeBelowHz) / fr;
    m.vhzSlopePU[i] = ((r.vhzSlopePctPerHz ?? SET_DEFAULTS.vhzSlopePctPerHz) / 100) * fr;
    m.oelPU[i] = ((r.oelPct ?? SET_DEFAULTS.oelPct) / 100) * fc.ratedFieldPU;
    m.oelDelayS[i] = r.oelDelayS ?? SET_DEFAULTS.oelDelayS;
    m.shunt[i] = r.shuntExcited ? 1 : 0;
    m.online[i] = s.online ? 1 : 0;
  });
  for (const l of plant.loads) {
    m.loads.push({
      id: l.id,
      on: l.online,
      pPU: l.kW / baseKVA,
      qPU: l.kVAR / baseKVA,
      impedance: l.model === 'constant-impedance',
      frequencySensitivity: l.frequencySensitivity,
      shedPU: (l.shedFrequencyPct ?? 0) / 100,
      shedDelayS: l.shedDelayS ?? SET_DEFAULTS.shedDelayS,
      shedTimer: 0,
    });
  }
  return m;
}

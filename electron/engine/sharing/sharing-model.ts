/**
 * The plant reduced to what the steady-state solvers need: per online set, its governor
 * and regulator law as numbers in typed arrays; the loads as voltage- and
 * frequency-dependent terms. Built once per solve; the solvers only read it.
 */
import { formatNumber, kVARBase, reactiveDroopKVARPerV, speedDroopKWPerHz, tanPhi, zipShares } from '../../../shared-types';
import type { GenSet, Load, LoadOverride, Plant, ZipShares } from '../../../shared-types';
import { NoSteadyState } from '../errors';
import { GOV_BASE, GOV_DROOP, GOV_ISO, REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from '../mode-codes';
import { leadingLimitKVAR } from '../capability';
import { lowerLimitKW, overloadLimitKW } from './set-limits';

/**
 * One load term on the common bus (powers at rated voltage and frequency) with its ZIP
 * shares: P(V) = kW (pZ u² + pI u + pP), Q(V) = kVAR (qZ u² + qI u + qP), u = V / V_rated.
 */
export interface LoadTerm extends ZipShares {
  kW: number;
  kVAR: number;
  /** % change of kW per % change of frequency. */
  frequencySensitivity: number;
  /** % change of kVAR per % change of frequency. */
  kVARFrequencySensitivity: number;
}

/** A constant-power load term. */
export function constantPowerTerm(kW: number, kVAR: number): LoadTerm {
  return { kW, kVAR, ...zipShares({ model: 'constant-power' }), frequencySensitivity: 0, kVARFrequencySensitivity: 0 };
}

/** The load term of a plant load. */
export function loadTerm(l: Load): LoadTerm {
  return { kW: l.kW, kVAR: l.kVAR, ...zipShares(l), frequencySensitivity: l.frequencySensitivity, kVARFrequencySensitivity: l.kVARFrequencySensitivity ?? 0 };
}

/** The solver's view of a plant. Arrays are indexed by online set. */
export interface SharingModel {
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  /** The online sets, in plant order. */
  sets: GenSet[];
  /** Index of each online set in `plant.sets`. */
  plantIndex: number[];
  n: number;
  gov: Int8Array;
  reg: Int8Array;
  /** Droop slope, kW per Hz: ratedKW / (droop · f_rated) (the speed-droop definition of the README). */
  slopeKWPerHz: Float64Array;
  noLoadHz: Float64Array;
  /** Lowest steady output, kW: −motoring power (zero fuel) in droop, else `minKW` (`set-limits.ts`). */
  minKW: Float64Array;
  /** The governor's fuel limit, kW: the overload limit in every mode (`set-limits.ts`). */
  maxKW: Float64Array;
  baseKW: Float64Array;
  ratedKW: Float64Array;
  ratedKVA: Float64Array;
  /** Reactive droop slope, kVAR per V: Qbase / (droop · V_rated) (the reactive-droop definition of the README). */
  slopeKVARPerV: Float64Array;
  noLoadV: Float64Array;
  /** tan φ of the power-factor setpoint (lagging). */
  tanPhi: Float64Array;
  /** Leading (under-excitation) limit, kVAR (negative): a regulator in reactive droop or PF control holds it. */
  leadKVAR: Float64Array;
  /**
   * Whether the set's regulator limiters hold its kVAR inside the field-heating and leading
   * limits (reactive-droop and power-factor sets). The voltage-holding unit is not held: it
   * is flagged when beyond a limit.
   */
  limited: Uint8Array;
  /**
   * Whether limited regulators hold the field-heating limit. `solveSharing` clears it and
   * solves again when no operating point exists with every such set held (the reactive load
   * is beyond the sets' field capability): the answer then shows them beyond the limit.
   */
  holdField: boolean;
  /** Feeder resistance and reactance per phase, Ω. */
  rOhm: Float64Array;
  xOhm: Float64Array;
  /** Isochronous sets that share through a load-sharing link (online indices). */
  isoGroup: number[];
  /** Frequency the isochronous group holds, Hz (ratedKW-weighted mean of setpoints). */
  isoSetpointHz: number;
  /** Online indices of the set(s) holding voltage: one voltage-mode set, or the cross-current group. */
  voltageUnit: number[];
  /** Voltage the voltage unit holds, V (ratedKVA-weighted mean of setpoints). */
  voltageSetpointV: number;
  loads: LoadTerm[];
  /** The plant's load list `loads` was built from (none with a load override): a reused model keeps its terms for the same list. */
  loadsFrom: readonly Load[] | null;
  /** True when any online set has a non-zero feeder impedance. */
  hasFeeders: boolean;
  /** Notes gathered while building (setpoint mismatches inside a group). */
  notes: string[];
}

function names(sets: GenSet[], idx: number[]): string {
  const ids = idx.map((i) => sets[i]!.id);
  return ids.length <= 1 ? ids.join('') : `${ids.slice(0, -1).join(', ')} and ${ids[ids.length - 1]}`;
}

/**
 * Builds the solver model of `plant`; `load` replaces the plant's loads by one
 * constant-power load. Throws `NoSteadyState` for control structures with no defined
 * operating point (no set online, no frequency or voltage reference, two units
 * fighting over frequency or voltage). `reuse`, a model this returned before and no longer
 * read, lends its typed arrays when it has as many online sets (the figures do not depend on it).
 */
export function buildSharingModel(plant: Plant, load?: LoadOverride, reuse?: SharingModel): SharingModel {
  const plantIndex: number[] = [];
  plant.sets.forEach((s, i) => {
    if (s.online) plantIndex.push(i);
  });
  const sets = plantIndex.map((i) => plant.sets[i]!);
  const n = sets.length;
  if (n === 0) throw new NoSteadyState('No set is online, so nothing supplies the bus: put at least one set online.');
  const fr = plant.ratedFrequencyHz;
  const vr = plant.ratedVoltageV;
  // A Monte-Carlo run hands back its last model: its typed arrays are refilled, not reallocated
  // (every entry is written below, the two mode-dependent slopes after a clear).
  const r = reuse !== undefined && reuse.n === n ? reuse : undefined;
  if (r) {
    r.slopeKWPerHz.fill(0);
    r.slopeKVARPerV.fill(0);
  }
  const m: SharingModel = {
    ratedFrequencyHz: fr,
    ratedVoltageV: vr,
    sets,
    plantIndex,
    n,
    gov: r ? r.gov : new Int8Array(n),
    reg: r ? r.reg : new Int8Array(n),
    slopeKWPerHz: r ? r.slopeKWPerHz : new Float64Array(n),
    noLoadHz: r ? r.noLoadHz : new Float64Array(n),
    minKW: r ? r.minKW : new Float64Array(n),
    maxKW: r ? r.maxKW : new Float64Array(n),
    baseKW: r ? r.baseKW : new Float64Array(n),
    ratedKW: r ? r.ratedKW : new Float64Array(n),
    ratedKVA: r ? r.ratedKVA : new Float64Array(n),
    slopeKVARPerV: r ? r.slopeKVARPerV : new Float64Array(n),
    noLoadV: r ? r.noLoadV : new Float64Array(n),
    tanPhi: r ? r.tanPhi : new Float64Array(n),
    leadKVAR: r ? r.leadKVAR : new Float64Array(n),
    limited: r ? r.limited : new Uint8Array(n),
    holdField: true,
    rOhm: r ? r.rOhm : new Float64Array(n),
    xOhm: r ? r.xOhm : new Float64Array(n),
    isoGroup: [],
    isoSetpointHz: fr,
    voltageUnit: [],
    voltageSetpointV: vr,
    loads: [],
    loadsFrom: null,
    hasFeeders: false,
    notes: [],
  };
  const isoUnlinked: number[] = [];
  const voltageSets: number[] = [];
  const crossSets: number[] = [];
  for (let i = 0; i < n; i++) {
    const s = sets[i]!;
    const g = s.governor;
    const r = s.regulator;
    m.ratedKW[i] = s.ratedKW;
    m.ratedKVA[i] = s.ratedKVA;
    m.maxKW[i] = overloadLimitKW(s);
    m.minKW[i] = lowerLimitKW(s);
    m.noLoadHz[i] = g.noLoadHz;
    m.baseKW[i] = Math.min(m.maxKW[i]!, Math.max(m.minKW[i]!, g.baseKW));
    if (g.mode === 'baseload' && m.baseKW[i] !== g.baseKW)
      m.notes.push(
        `${s.id}'s base-load setting (${g.baseKW} kW) is outside what its governor can give (${Math.round(m.minKW[i]!)} to ${Math.round(m.maxKW[i]!)} kW): it runs at ${Math.round(m.baseKW[i]!)} kW.`,
      );
    if (g.mode === 'droop') {
      m.gov[i] = GOV_DROOP;
      m.slopeKWPerHz[i] = speedDroopKWPerHz(s.ratedKW, g.droopPct, fr);
    } else if (g.mode === 'isochronous') {
      m.gov[i] = GOV_ISO;
      if (g.loadSharingLink === false) isoUnlinked.push(i);
      else m.isoGroup.push(i);
    } else m.gov[i] = GOV_BASE;
    const qBase = kVARBase(s.ratedKVA, s.ratedPF);
    m.noLoadV[i] = r.noLoadV;
    m.tanPhi[i] = tanPhi(r.pf);
    m.leadKVAR[i] = leadingLimitKVAR(s);
    m.limited[i] = r.mode === 'reactive-droop' || r.mode === 'power-factor' ? 1 : 0;
    if (r.mode === 'reactive-droop') {
      m.reg[i] = REG_DROOP;
      m.slopeKVARPerV[i] = reactiveDroopKVARPerV(qBase, r.droopPct, vr);
    } else if (r.mode === 'cross-current') {
      m.reg[i] = REG_CROSS;
      crossSets.push(i);
    } else if (r.mode === 'voltage') {
      m.reg[i] = REG_VOLTAGE;
      voltageSets.push(i);
    } else m.reg[i] = REG_PF;
    m.rOhm[i] = s.feeder.rOhm;
    m.xOhm[i] = s.feeder.xOhm;
    if (s.feeder.rOhm > 0 || s.feeder.xOhm > 0) m.hasFeeders = true;
  }

  // Frequency reference: isochronous units (a linked group counts as one unit).
  const isoUnits = isoUnlinked.length + (m.isoGroup.length > 0 ? 1 : 0);
  if (isoUnits > 1) {
    const all = [...m.isoGroup, ...isoUnlinked].sort((a, b) => a - b);
    throw new NoSteadyState(
      `Sets ${names(sets, all)} are isochronous without a common load-sharing link: each tries to hold frequency alone, so their kW split is undefined. Link them (loadSharingLink) or put all but one in droop.`,
    );
  }
  if (isoUnlinked.length === 1) m.isoGroup.push(isoUnlinked[0]!);
  if (m.isoGroup.length > 0) {
    let w = 0;
    let sum = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (const i of m.isoGroup) {
      const sp = sets[i]!.governor.setpointHz;
      w += m.ratedKW[i]!;
      sum += m.ratedKW[i]! * sp;
      lo = Math.min(lo, sp);
      hi = Math.max(hi, sp);
    }
    m.isoSetpointHz = sum / w;
    if (hi - lo > 1e-6)
      m.notes.push(
        `The linked isochronous sets have different frequency setpoints (${lo} to ${hi} Hz); the link holds their kW-weighted mean, ${formatNumber(m.isoSetpointHz, 3)} Hz.`,
      );
  } else {
    let anyDroop = false;
    for (let i = 0; i < n; i++) if (m.gov[i] === GOV_DROOP) anyDroop = true;
    if (!anyDroop) throw new NoSteadyState('No online set controls frequency (all are in base load): put at least one set in droop or isochronous.');
  }

  // Voltage reference: one voltage-mode set, or the cross-current group, at most.
  const voltageUnits = voltageSets.length + (crossSets.length > 0 ? 1 : 0);
  if (voltageUnits > 1) {
    const all = [...voltageSets, ...crossSets].sort((a, b) => a - b);
    throw new NoSteadyState(
      `Sets ${names(sets, all)} all hold voltage without reactive droop or a shared cross-current loop: their kVAR split is undefined and circulating current would run away. Use reactive droop, or put them all in cross-current.`,
    );
  }
  if (voltageSets.length === 1) {
    m.voltageUnit = voltageSets;
    m.voltageSetpointV = sets[voltageSets[0]!]!.regulator.setpointV;
  } else if (crossSets.length > 0) {
    m.voltageUnit = crossSets;
    let w = 0;
    let sum = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (const i of crossSets) {
      const sp = sets[i]!.regulator.setpointV;
      w += m.ratedKVA[i]!;
      sum += m.ratedKVA[i]! * sp;
      lo = Math.min(lo, sp);
      hi = Math.max(hi, sp);
    }
    m.voltageSetpointV = sum / w;
    if (hi - lo > 1e-6)
      m.notes.push(
        `The cross-current sets have different voltage setpoints (${lo} to ${hi} V); the loop holds their kVA-weighted mean, ${formatNumber(m.voltageSetpointV, 1)} V.`,
      );
  } else {
    let anyDroop = false;
    for (let i = 0; i < n; i++) if (m.reg[i] === REG_DROOP) anyDroop = true;
    if (!anyDroop)
      throw new NoSteadyState(
        'No online set controls voltage (all are in power-factor control): put at least one set in reactive droop, cross-current or voltage control.',
      );
  }

  if (load) m.loads.push(constantPowerTerm(load.kW, load.kVAR));
  else if (r && r.loadsFrom === plant.loads) {
    // The same load list as the reused model's (a Monte-Carlo run varies the sets only): its terms stand.
    m.loads = r.loads;
    m.loadsFrom = plant.loads;
  } else {
    for (const l of plant.loads) if (l.online) m.loads.push(loadTerm(l));
    m.loadsFrom = plant.loads;
  }
  return m;
}

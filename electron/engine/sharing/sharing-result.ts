/**
 * Turns a solved operating point into the `SharingResult` the views and the CLI show:
 * per-set kVA, power factor, current, loading, sharing error against a proportional
 * split, circulating current, flags; totals and warnings.
 */
import type { Plant, SetResult, SharingResult } from '../../../shared-types';
import { flagSentences, setFlags } from './flags';
import { settingWarnings } from '../setting-checks';
import type { IsoState } from './active-sharing';
import type { SharingModel } from './sharing-model';
import { formatHz, formatNumber, formatPercent } from '../../../shared-types';

/** A solved operating point, arrays indexed by online set. Powers at the set's terminals. */
export interface OperatingPoint {
  frequencyHz: number;
  busVoltageV: number;
  kW: Float64Array;
  kVAR: Float64Array;
  terminalV: Float64Array;
  /** Terminal voltage angle relative to the bus, degrees (feeder solve only). */
  terminalAngleDeg?: Float64Array;
  lossKW: Float64Array;
  lossKVAR: Float64Array;
  loadKW: number;
  loadKVAR: number;
  isoState: IsoState;
  method: SharingResult['method'];
  iterations: number;
}

const SQRT3 = Math.sqrt(3);

/**
 * Frequency deviation beyond which a warning is given, % of rated [practice]: wide enough
 * that sets in the usual 3–5 % droop at light load stay quiet.
 */
export const FREQUENCY_WARN_PCT = 5;
/** Voltage band beyond which a warning is given, % of rated (ISO 8528-5 class G1 steady-state voltage deviation ±5 %). */
export const VOLTAGE_WARN_PCT = 5;

function offlineResult(plant: Plant, idx: number): SetResult {
  const s = plant.sets[idx]!;
  return {
    id: s.id,
    name: s.name,
    online: false,
    kW: 0,
    kVAR: 0,
    kVA: 0,
    pf: 1,
    pfLagging: true,
    currentA: 0,
    terminalV: 0,
    terminalAngleDeg: 0,
    feederLossKVAR: 0,
    loadingPct: 0,
    loadingKVAPct: 0,
    sharingErrorKWPct: 0,
    sharingErrorKVARPct: 0,
    circulatingA: 0,
    circulatingPct: 0,
    feederLossKW: 0,
    flags: ['offline'],
    notes: [],
  };
}

/**
 * The figures of `op` a Monte-Carlo run reads, per plant set (offline sets 0), without the result's words (flags,
 * notes, warnings): the same formulas as `buildSharingResult`, which a test keeps equal.
 */
export interface SharingFigures {
  frequencyHz: number;
  voltageV: number;
  kW: Float64Array;
  kVAR: Float64Array;
  kVA: Float64Array;
  loadingPct: Float64Array;
  circulatingA: Float64Array;
}

/** Empty figures for a plant of `sets` sets. */
export function createSharingFigures(sets: number): SharingFigures {
  return {
    frequencyHz: 0,
    voltageV: 0,
    kW: new Float64Array(sets),
    kVAR: new Float64Array(sets),
    kVA: new Float64Array(sets),
    loadingPct: new Float64Array(sets),
    circulatingA: new Float64Array(sets),
  };
}

/** Writes the figures of `op` into `out`. */
export function writeSharingFigures(m: SharingModel, op: OperatingPoint, out: SharingFigures): void {
  out.kW.fill(0);
  out.kVAR.fill(0);
  out.kVA.fill(0);
  out.loadingPct.fill(0);
  out.circulatingA.fill(0);
  let ratedKVASum = 0;
  let iqSum = 0;
  for (let i = 0; i < m.n; i++) {
    ratedKVASum += m.ratedKVA[i]!;
    const vt = op.terminalV[i]!;
    if (vt > 0) iqSum += (op.kVAR[i]! * 1000) / (SQRT3 * vt);
  }
  for (let i = 0; i < m.n; i++) {
    const s = m.sets[i]!;
    const kW = op.kW[i]!;
    const kVAR = op.kVAR[i]!;
    const vt = op.terminalV[i]!;
    const iq = vt > 0 ? (kVAR * 1000) / (SQRT3 * vt) : 0;
    const k = m.plantIndex[i]!;
    out.kW[k] = kW;
    out.kVAR[k] = kVAR;
    out.kVA[k] = Math.hypot(kW, kVAR);
    out.loadingPct[k] = (100 * kW) / s.ratedKW;
    out.circulatingA[k] = iq - (iqSum * s.ratedKVA) / ratedKVASum;
  }
  out.frequencyHz = op.frequencyHz;
  out.voltageV = op.busVoltageV;
}

/** Builds the full result of `op` for `plant` (offline sets are listed with zeros and the `offline` flag). */
export function buildSharingResult(plant: Plant, m: SharingModel, op: OperatingPoint): SharingResult {
  const warnings: string[] = [...m.notes, ...settingWarnings(plant)];
  let totKW = 0;
  let totKVAR = 0;
  let ratedKWSum = 0;
  let ratedKVASum = 0;
  let iqSum = 0;
  let lossKW = 0;
  let lossKVAR = 0;
  for (let i = 0; i < m.n; i++) {
    totKW += op.kW[i]!;
    totKVAR += op.kVAR[i]!;
    ratedKWSum += m.ratedKW[i]!;
    ratedKVASum += m.ratedKVA[i]!;
    lossKW += op.lossKW[i]!;
    lossKVAR += op.lossKVAR[i]!;
    const vt = op.terminalV[i]!;
    if (vt > 0) iqSum += (op.kVAR[i]! * 1000) / (SQRT3 * vt);
  }
  const sets: SetResult[] = plant.sets.map((_, idx) => offlineResult(plant, idx));
  let fieldBeyond = false;
  for (let i = 0; i < m.n; i++) {
    const s = m.sets[i]!;
    const kW = op.kW[i]!;
    const kVAR = op.kVAR[i]!;
    const kVA = Math.hypot(kW, kVAR);
    const vt = op.terminalV[i]!;
    const currentA = vt > 0 ? (kVA * 1000) / (SQRT3 * vt) : 0;
    const iq = vt > 0 ? (kVAR * 1000) / (SQRT3 * vt) : 0;
    const circulatingA = iq - (iqSum * s.ratedKVA) / ratedKVASum;
    const ratedA = (s.ratedKVA * 1000) / (SQRT3 * m.ratedVoltageV);
    const flags = setFlags(s, { kW, kVAR, kVA });
    const inUnit = m.voltageUnit.includes(i);
    const held = m.limited[i] === 1 && !inUnit;
    if (held && !m.holdField && flags.includes('field-limit')) fieldBeyond = true;
    const notes = flagSentences(s, { kW, kVAR, kVA }, flags, held && (m.holdField || !flags.includes('field-limit')));
    warnings.push(...notes);
    sets[m.plantIndex[i]!] = {
      id: s.id,
      name: s.name,
      online: true,
      kW,
      kVAR,
      kVA,
      pf: kVA > 0 ? Math.abs(kW) / kVA : 1,
      pfLagging: kVAR >= 0,
      currentA,
      terminalV: vt,
      terminalAngleDeg: op.terminalAngleDeg ? op.terminalAngleDeg[i]! : 0,
      feederLossKVAR: op.lossKVAR[i]!,
      loadingPct: (100 * kW) / s.ratedKW,
      loadingKVAPct: (100 * kVA) / s.ratedKVA,
      sharingErrorKWPct: (100 * (kW - (totKW * s.ratedKW) / ratedKWSum)) / s.ratedKW,
      sharingErrorKVARPct: (100 * (kVAR - (totKVAR * s.ratedKVA) / ratedKVASum)) / s.ratedKVA,
      circulatingA,
      circulatingPct: (100 * circulatingA) / ratedA,
      feederLossKW: op.lossKW[i]!,
      flags,
      notes,
    };
  }
  if (fieldBeyond)
    warnings.unshift(
      'The sets cannot carry this reactive load inside their field-heating limits (with their regulators held at the limit the voltage would collapse): the figures show them beyond the limit, which the field can stand only for a short time.',
    );
  const isoIds = m.isoGroup.map((i) => m.sets[i]!.id).join(', ');
  if (op.isoState === 'at-max')
    warnings.unshift(`The isochronous set(s) ${isoIds} are at full output: frequency is now set by the droop sets (${formatNumber(op.frequencyHz, 3)} Hz).`);
  if (op.isoState === 'at-min')
    warnings.unshift(`The isochronous set(s) ${isoIds} are at minimum output: frequency is now set by the droop sets (${formatNumber(op.frequencyHz, 3)} Hz).`);
  const fDevPct = (100 * (op.frequencyHz - m.ratedFrequencyHz)) / m.ratedFrequencyHz;
  if (Math.abs(fDevPct) > FREQUENCY_WARN_PCT)
    warnings.push(`Bus frequency ${formatHz(op.frequencyHz, 2)} is ${formatPercent(fDevPct)} from rated (more than ±${FREQUENCY_WARN_PCT} %).`);
  const vDevPct = (100 * (op.busVoltageV - m.ratedVoltageV)) / m.ratedVoltageV;
  if (Math.abs(vDevPct) > VOLTAGE_WARN_PCT)
    warnings.push(`Bus voltage ${formatNumber(op.busVoltageV, 0)} V is ${formatPercent(vDevPct)} from rated (more than ±${VOLTAGE_WARN_PCT} %).`);
  return {
    bus: { frequencyHz: op.frequencyHz, voltageV: op.busVoltageV },
    sets,
    totals: {
      kW: totKW,
      kVAR: totKVAR,
      kVA: Math.hypot(totKW, totKVAR),
      loadKW: op.loadKW,
      loadKVAR: op.loadKVAR,
      feederLossKW: lossKW,
      feederLossKVAR: lossKVAR,
    },
    warnings,
    method: op.method,
    iterations: op.iterations,
  };
}

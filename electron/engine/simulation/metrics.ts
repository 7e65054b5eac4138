/**
 * Figures read off a run: frequency nadir and peak, transient deviations, recovery
 * times into a band, voltage dip and rise, the final operating point, and the
 * ISO 8528-5 class verdicts. Deviations follow ISO 8528-5's form
 * `(f_extreme − f_initial) / f_rated × 100 %` (ISO 8528-5 definition of the transient
 * frequency deviation; value from memory).
 */
import type { ClassCheck, CloseRecord, FinalSet, ProtectionTrip, PerformanceClass, SimulationMetrics } from '../../../shared-types';
import { ISO_8528_5_LIMITS, PERFORMANCE_CLASSES, judge, recoveryBandPct } from './iso-8528-5';
import type { ClassLimitKey } from './iso-8528-5';
import type { SteadyTarget } from './steady-target';
import { formatNumber } from '../../../shared-types';

/** A trace of (t, x) samples in typed arrays. */
export interface Trace {
  t: Float64Array;
  x: Float64Array;
  length: number;
}

/**
 * Seconds from `tStart` until `x` stays inside `final ± band`, 0 if it never leaves, or
 * null if it is still outside within the last tenth of the window (not settled in the run).
 */
export function recoveryTime(tr: Trace, tStart: number, final: number, band: number): number | null {
  const tEnd = tr.length > 0 ? tr.t[tr.length - 1]! : tStart;
  let lastOut = -1;
  for (let k = tr.length - 1; k >= 0; k--) {
    const tk = tr.t[k]!;
    if (tk < tStart) break;
    if (Math.abs(tr.x[k]! - final) > band) {
      lastOut = k;
      break;
    }
  }
  if (lastOut < 0) return 0;
  const tOut = lastOut + 1 < tr.length ? tr.t[lastOut + 1]! : tEnd;
  if (tOut > tStart + 0.9 * (tEnd - tStart)) return null;
  return tOut - tStart;
}

/** What the simulator hands over to build the metrics. */
export interface MetricsInput {
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  /** First event time (0 without events). */
  disturbanceS: number;
  initialFrequencyHz: number;
  initialVoltageV: number;
  nadirHz: number;
  peakHz: number;
  minVoltageV: number;
  maxVoltageV: number;
  frequency: Trace;
  voltage: Trace;
  finalSets: FinalSet[];
  /** Largest speed droop of the sets on line at the end, % (0 if none is in droop). */
  droopPct: number;
  /** Constant-power load not served below the low-voltage break, kWh, and its largest value, kW. */
  unservedKWh: number;
  maxUnservedKW: number;
  closes: CloseRecord[];
  trips: ProtectionTrip[];
  /** Closed-form steady state of the final plant (recovery is measured into a band around it). */
  target: SteadyTarget;
}

function band(tr: Trace, from: number): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = tr.length - 1; k >= 0 && tr.t[k]! >= from; k--) {
    lo = Math.min(lo, tr.x[k]!);
    hi = Math.max(hi, tr.x[k]!);
  }
  return hi >= lo ? hi - lo : 0;
}

/** Builds the metrics and the ISO 8528-5 class table. */
export function computeMetrics(inp: MetricsInput): SimulationMetrics {
  const fr = inp.ratedFrequencyHz;
  const vr = inp.ratedVoltageV;
  const fTr = inp.frequency;
  const vTr = inp.voltage;
  const finalF = fTr.length > 0 ? fTr.x[fTr.length - 1]! : 0;
  const finalV = vTr.length > 0 ? vTr.x[vTr.length - 1]! : 0;
  const tEnd = fTr.length > 0 ? fTr.t[fTr.length - 1]! : 0;
  const t0 = inp.disturbanceS;
  // Nothing on line during the whole window: no extremes to speak of.
  if (!Number.isFinite(inp.nadirHz)) {
    inp = { ...inp, nadirHz: inp.initialFrequencyHz, peakHz: inp.initialFrequencyHz, minVoltageV: inp.initialVoltageV, maxVoltageV: inp.initialVoltageV };
  }
  const dipF = ((inp.nadirHz - inp.initialFrequencyHz) / fr) * 100;
  const riseF = ((inp.peakHz - inp.initialFrequencyHz) / fr) * 100;
  const dipV = ((inp.minVoltageV - inp.initialVoltageV) / vr) * 100;
  const riseV = ((inp.maxVoltageV - inp.initialVoltageV) / vr) * 100;
  // Recovery (ISO 8528-5, frequency and voltage recovery time): into the class's band around
  // the steady state the controls should reach for the final load, not around the run's end.
  const target = inp.target;
  const offTarget = (x: number, ref: number | null, bandAbs: number) => ref !== null && Math.abs(x - ref) > bandAbs;
  const bandF = (c: PerformanceClass) => (recoveryBandPct('frequency', c) / 100) * fr;
  const bandV = (c: PerformanceClass) => (recoveryBandPct('voltage', c) / 100) * vr;
  const recF = (c: PerformanceClass) =>
    target.frequencyHz === null || offTarget(finalF, target.frequencyHz, bandF(c)) ? null : recoveryTime(fTr, t0, target.frequencyHz, bandF(c));
  const recV = (c: PerformanceClass) =>
    target.voltageV === null || offTarget(finalV, target.voltageV, bandV(c)) ? null : recoveryTime(vTr, t0, target.voltageV, bandV(c));
  const perClass = (fn: (c: PerformanceClass) => number | null) => ({ G1: fn('G1'), G2: fn('G2'), G3: fn('G3') });
  const settleFrom = tEnd - 0.1 * (tEnd - t0);
  const measured: Record<ClassLimitKey, number | null> = {
    frequencyDroop: inp.droopPct,
    frequencyBand: (band(fTr, settleFrom) / fr) * 100,
    frequencyDip: Math.min(0, dipF),
    frequencyRise: Math.max(0, riseF),
    frequencyRecovery: recF('G2'),
    voltageDeviation: (Math.abs(finalV - inp.initialVoltageV) / (2 * vr)) * 100,
    voltageDip: Math.min(0, dipV),
    voltageRise: Math.max(0, riseV),
    voltageRecovery: recV('G2'),
  };
  const notes: Partial<Record<ClassLimitKey, string>> = {
    frequencyDroop: 'the droop setting of the sets in droop (largest), not measured from the run',
  };
  const endNote = (x: number, ref: number, unit: string, digits: number, ratedX: number, bandPct: (c: PerformanceClass) => number) => {
    const off = ((x - ref) / ratedX) * 100;
    const failing = PERFORMANCE_CLASSES.filter((c) => Math.abs(off) > bandPct(c));
    if (failing.length === 0) return undefined;
    return `the run ends at ${formatNumber(x, digits)} ${unit}, ${formatNumber(Math.abs(off), 2)} % ${off < 0 ? 'below' : 'above'} the ${formatNumber(ref, digits)} ${unit} steady state of the final loads (closed form): outside the band of ${failing.join(', ')}`;
  };
  if (target.frequencyHz === null) notes.frequencyRecovery = `no steady state to recover to: ${target.note}`;
  else {
    const n = endNote(finalF, target.frequencyHz, 'Hz', 2, fr, (c) => recoveryBandPct('frequency', c));
    if (n) notes.frequencyRecovery = n;
  }
  if (target.voltageV === null) notes.voltageRecovery = `no steady state to recover to: ${target.note}`;
  else {
    const n = endNote(finalV, target.voltageV, 'V', 1, vr, (c) => recoveryBandPct('voltage', c));
    if (n) notes.voltageRecovery = n;
  }
  const byClass: Partial<Record<ClassLimitKey, Record<PerformanceClass, number | null>>> = {
    frequencyRecovery: perClass(recF),
    voltageRecovery: perClass(recV),
  };
  const classes: ClassCheck[] = ISO_8528_5_LIMITS.map((l) => {
    const mbc = byClass[l.key];
    const pass = {} as Record<PerformanceClass, boolean | null>;
    for (const c of PERFORMANCE_CLASSES) {
      const value = mbc ? mbc[c]! : measured[l.key];
      // A recovery that never settles inside the run fails rather than going unjudged.
      pass[c] = mbc && value === null ? false : judge(l, c, value);
    }
    const row: ClassCheck = { quantity: l.quantity, unit: l.unit, measured: measured[l.key], limits: { ...l.limits }, pass, source: l.source };
    if (mbc) row.measuredByClass = mbc;
    const note = notes[l.key];
    if (note) row.note = note;
    return row;
  });
  return {
    initial: { frequencyHz: inp.initialFrequencyHz, voltageV: inp.initialVoltageV },
    frequencyNadirHz: inp.nadirHz,
    frequencyPeakHz: inp.peakHz,
    frequencyDeviationPct: Math.abs(dipF) > Math.abs(riseF) ? dipF : riseF,
    frequencyRecoveryS: measured.frequencyRecovery,
    frequencyBandPct: recoveryBandPct('frequency', 'G2'),
    voltageDipPct: Math.max(0, -dipV),
    voltagePeakPct: Math.max(0, riseV),
    voltageRecoveryS: measured.voltageRecovery,
    voltageBandPct: recoveryBandPct('voltage', 'G2'),
    final: { frequencyHz: finalF, voltageV: finalV, sets: inp.finalSets },
    steadyState: target.frequencyHz === null ? null : { frequencyHz: target.frequencyHz, voltageV: target.voltageV },
    steadyStateNote: target.note,
    unservedKWh: inp.unservedKWh,
    maxUnservedKW: inp.maxUnservedKW,
    closes: inp.closes.map((c) => ({ ...c, reasons: [...c.reasons] })),
    trips: inp.trips.map((x) => ({ ...x })),
    classes,
  };
}

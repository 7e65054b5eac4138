/**
 * The ISO 8528-5 verdict of a measured record: the simulator's own metrics and class table
 * (`simulation/metrics.ts`, limits in `simulation/iso-8528-5.ts`) applied to the record's samples.
 * The initial values are the mean of the samples before the step; the steady state recovery is
 * measured into is the mean of the last tenth of the record after the step (what the set
 * settled at on site, not a model's figure).
 */
import type { RecordVerdict } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { computeMetrics } from '../simulation/metrics';

export interface VerdictInput {
  tS: ArrayLike<number>;
  frequencyHz: ArrayLike<number>;
  voltageV: ArrayLike<number>;
  stepAtS: number;
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  /** The speed droop setting of the set (0 when it is not in droop). */
  droopPct: number;
}

function mean(x: ArrayLike<number>, from: number, to: number): number {
  let s = 0;
  for (let k = from; k < to; k++) s += x[k]!;
  return s / (to - from);
}

/** ISO 8528-5 figures and class verdicts of a record of one load step. */
export function recordVerdict(inp: VerdictInput): RecordVerdict {
  const n = inp.tS.length;
  const t = Float64Array.from(inp.tS);
  const f = Float64Array.from(inp.frequencyHz);
  const v = Float64Array.from(inp.voltageV);
  const tEnd = t[n - 1]!;
  if (!(inp.stepAtS < tEnd)) throw new InvalidInput(`test.stepAtS: the step at ${inp.stepAtS} s is not inside the record (it ends at ${tEnd} s)`);
  const notes: string[] = [];
  let first = 0;
  while (first < n && t[first]! < inp.stepAtS) first++;
  let f0: number;
  let v0: number;
  if (first === 0) {
    f0 = f[0]!;
    v0 = v[0]!;
    notes.push('the record starts at the step: its first sample is taken as the value before the step');
  } else {
    f0 = mean(f, 0, first);
    v0 = mean(v, 0, first);
  }
  let nadir = Infinity;
  let peak = -Infinity;
  let vMin = Infinity;
  let vMax = -Infinity;
  for (let k = first; k < n; k++) {
    nadir = Math.min(nadir, f[k]!);
    peak = Math.max(peak, f[k]!);
    vMin = Math.min(vMin, v[k]!);
    vMax = Math.max(vMax, v[k]!);
  }
  const settleFrom = tEnd - 0.1 * (tEnd - inp.stepAtS);
  let s0 = n - 1;
  while (s0 > first && t[s0 - 1]! >= settleFrom) s0--;
  const fSettled = mean(f, s0, n);
  const vSettled = mean(v, s0, n);
  notes.push(
    `values before the step: mean of ${first === 0 ? 1 : first} samples; steady state after it: mean of the last ${n - s0} samples (the last tenth of the record after the step)`,
  );
  const m = computeMetrics({
    ratedFrequencyHz: inp.ratedFrequencyHz,
    ratedVoltageV: inp.ratedVoltageV,
    disturbanceS: inp.stepAtS,
    initialFrequencyHz: f0,
    initialVoltageV: v0,
    nadirHz: nadir,
    peakHz: peak,
    minVoltageV: vMin,
    maxVoltageV: vMax,
    frequency: { t, x: f, length: n },
    voltage: { t, x: v, length: n },
    finalSets: [],
    droopPct: inp.droopPct,
    unservedKWh: 0,
    maxUnservedKW: 0,
    closes: [],
    trips: [],
    target: { frequencyHz: fSettled, voltageV: vSettled, note: null },
  });
  return {
    initialFrequencyHz: f0,
    initialVoltageV: v0,
    frequencyNadirHz: nadir,
    frequencyPeakHz: peak,
    voltageMinV: vMin,
    voltageMaxV: vMax,
    settledFrequencyHz: fSettled,
    settledVoltageV: vSettled,
    frequencyRecoveryS: m.frequencyRecoveryS,
    voltageRecoveryS: m.voltageRecoveryS,
    classes: m.classes,
    notes,
  };
}

/**
 * Fits chosen model parameters of one set to a load-bank test record by least squares on the
 * simulator's own response.
 *
 * - The test is rebuilt as a scenario: the sets on line as the test had them, one
 *   constant-power load at the starting kW/kVAR, and the step as a load block at its time.
 *   Simulated time 0 is the record's first sample.
 * - Record and model are compared as deviations from their own values before the step, in % of
 *   rated frequency and rated voltage, at the record's times (the model's series interpolated):
 *   a setpoint a little off on site shifts both traces alike and does not pull the dynamics.
 * - The optimiser is `ml-levenberg-marquardt` (Levenberg–Marquardt, finite-difference
 *   Jacobian) on each parameter scaled to its bounds (0 at the lower bound, 1 at the upper), so
 *   one damping suits parameters of any size and the answer does not depend on their order.
 *   The iteration cap bounds the work: (parameters + 2) simulations per iteration at most.
 * - Confidence: each parameter alone is moved 10 % of its bound span each way from the fitted
 *   value, and the rise of the RMS error (% of the fitted RMS error) says how well the record
 *   pins it down (our own rule: 10 % or more "well determined", 1 % or more "weakly
 *   determined", less "not determined").
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import type { FitParameterKey, FitRequest, FitResidual, FitResult, FitTrace, FittedParameter, FitConfidence, Plant, Scenario } from '../../../shared-types';
import { Cancelled, EngineError, InvalidInput } from '../errors';
import { simulate } from '../simulation/simulate';
import { fitParameterInfo, parameterValue, withParameters } from './fit-parameters';
import { recordVerdict } from './record-verdict';

/** Default and largest iteration cap of the optimiser. */
export const DEFAULT_FIT_ITERATIONS = 30;
export const MAX_FIT_ITERATIONS = 200;
/** Default integration step of the fit's simulations, ms. */
export const DEFAULT_FIT_STEP_MS = 2;
/** Step of the finite-difference Jacobian, in scaled units (fraction of the bound span). */
const GRADIENT_STEP = 1e-3;
/** Move of each parameter for its sensitivity, fraction of the bound span. */
const SENSITIVITY_MOVE = 0.1;
/** Floor of the RMS error the sensitivity is relative to, % (a noise-free record must not divide by zero). */
const RMS_FLOOR_PCT = 1e-3;
/** Iterations per round of the optimiser; between rounds the fit checks for progress and cancelling. */
const ROUND_ITERATIONS = 4;
/** The fit has converged when a round lowers the squared error by less than this fraction. */
const CONVERGED_FRACTION = 1e-4;

/** Optional callbacks of a fit (between rounds of the optimiser). */
export interface FitHooks {
  progress?(fraction: number): void;
  isCancelled?(): boolean;
}

/** Penalty added to every point of a simulation that fails (no operating point, diverged), %. */
const FAILED_PENALTY_PCT = 100;

interface Prepared {
  plant: Plant;
  setIndex: number;
  keys: FitParameterKey[];
  min: number[];
  max: number[];
  start: number[];
  scenario: Omit<Scenario, 'plant'>;
  /** Record times shifted to simulated time. */
  simT: Float64Array;
  /** Samples before the step (at least 1). */
  before: number;
  measuredPct: Float64Array;
  fr: number;
  vr: number;
  warnings: string[];
}

function clampWarn(warnings: string[], what: string, x: number, lo: number, hi: number): number {
  if (x < lo || x > hi) {
    const c = Math.min(hi, Math.max(lo, x));
    warnings.push(`${what}: the set's value ${x} is outside the bounds ${lo} to ${hi}; the fit starts from ${c}`);
    return c;
  }
  return x;
}

function prepare(req: FitRequest): Prepared {
  const { plant, record, test } = req;
  const warnings: string[] = [];
  const setIndex = plant.sets.findIndex((s) => s.id === test.setId);
  if (setIndex < 0) throw new InvalidInput(`test.setId: there is no set "${test.setId}" in the plant`);
  test.onlineSetIds.forEach((id, k) => {
    if (!plant.sets.some((s) => s.id === id)) throw new InvalidInput(`test.onlineSetIds[${k}]: there is no set "${id}" in the plant`);
  });
  if (!test.onlineSetIds.includes(test.setId)) throw new InvalidInput(`test.onlineSetIds: must include the fitted set "${test.setId}"`);
  if (req.params.length === 0) throw new InvalidInput('params: choose at least one parameter to fit');
  const set = plant.sets[setIndex]!;
  const keys: FitParameterKey[] = [];
  const min: number[] = [];
  const max: number[] = [];
  const start: number[] = [];
  req.params.forEach((p, k) => {
    const info = fitParameterInfo(p.key);
    if (!info) throw new InvalidInput(`params[${k}].key: "${String(p.key)}" is not a parameter a fit may change`);
    if (keys.includes(p.key)) throw new InvalidInput(`params[${k}].key: "${p.key}" is chosen twice`);
    if (!(p.min >= info.lowest)) throw new InvalidInput(`params[${k}].min: must be ${info.lowest} ${info.unit} or more`);
    if (!(p.max <= info.highest)) throw new InvalidInput(`params[${k}].max: must be ${info.highest} ${info.unit} or less`);
    if (!(p.max > p.min)) throw new InvalidInput(`params[${k}].max: must be greater than min (${p.min} ${info.unit})`);
    keys.push(p.key);
    min.push(p.min);
    max.push(p.max);
    start.push(clampWarn(warnings, `params[${k}] (${p.key})`, p.start ?? parameterValue(set, p.key), p.min, p.max));
  });
  const t = record.tS;
  const n = t.length;
  if (n < 3) throw new InvalidInput('record.tS: a fit needs at least 3 samples');
  if (record.frequencyHz.length !== n || record.voltageV.length !== n) throw new InvalidInput('record: tS, frequencyHz and voltageV must have the same length');
  const t0 = t[0]!;
  const tEnd = t[n - 1]!;
  if (!(test.stepAtS >= t0 && test.stepAtS < tEnd)) throw new InvalidInput(`test.stepAtS: must be inside the record (${t0} s to ${tEnd} s)`);
  let before = 0;
  while (before < n && t[before]! < test.stepAtS) before++;
  if (before === 0) {
    before = 1;
    warnings.push('the record has no sample before the step: its first sample is taken as the value before it');
  }
  const onLine = new Set(test.onlineSetIds);
  const testPlant: Plant = {
    ...plant,
    // Sets off line during the test play no part in it: left out, each simulation costs less.
    sets: plant.sets.filter((s) => onLine.has(s.id)).map((s) => ({ ...s, online: true })),
    loads: [
      {
        id: 'test-start',
        name: 'Load bank before the step',
        online: true,
        kW: test.startKW,
        kVAR: test.startKVAR,
        model: 'constant-power',
        frequencySensitivity: 0,
      },
    ],
  };
  const stepMs = req.stepMs ?? DEFAULT_FIT_STEP_MS;
  const simT = new Float64Array(n);
  for (let k = 0; k < n; k++) simT[k] = t[k]! - t0;
  const fr = plant.ratedFrequencyHz;
  const vr = plant.ratedVoltageV;
  const measuredPct = deviationsPct(record.frequencyHz, record.voltageV, before, fr, vr);
  return {
    plant: testPlant,
    setIndex: testPlant.sets.findIndex((s) => s.id === test.setId),
    keys,
    min,
    max,
    start,
    scenario: {
      name: 'load-bank test',
      durationS: tEnd - t0 + stepMs / 1000,
      stepMs,
      outputPoints: Math.min(100_000, Math.max(2000, 2 * n)),
      events: [{ atS: test.stepAtS - t0, type: 'load-step', kW: test.stepKW, kVAR: test.stepKVAR, model: 'constant-power' }],
    },
    simT,
    before,
    measuredPct,
    fr,
    vr,
    warnings,
  };
}

/** [frequency…, voltage…] as deviations from the mean before the step, % of rated. */
function deviationsPct(f: ArrayLike<number>, v: ArrayLike<number>, before: number, fr: number, vr: number): Float64Array {
  const n = f.length;
  let f0 = 0;
  let v0 = 0;
  for (let k = 0; k < before; k++) {
    f0 += f[k]!;
    v0 += v[k]!;
  }
  f0 /= before;
  v0 /= before;
  const out = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) {
    out[k] = ((f[k]! - f0) / fr) * 100;
    out[n + k] = ((v[k]! - v0) / vr) * 100;
  }
  return out;
}

/** Linear interpolation of (xs, ys) at each of `at` (xs increasing). */
function interpolate(xs: number[], ys: number[], at: Float64Array): Float64Array {
  const out = new Float64Array(at.length);
  let j = 0;
  for (let k = 0; k < at.length; k++) {
    const x = at[k]!;
    while (j < xs.length - 2 && xs[j + 1]! < x) j++;
    const x0 = xs[j]!;
    const x1 = xs[Math.min(j + 1, xs.length - 1)]!;
    const y0 = ys[j]!;
    const y1 = ys[Math.min(j + 1, ys.length - 1)]!;
    out[k] = x1 > x0 ? y0 + (y1 - y0) * Math.min(1, Math.max(0, (x - x0) / (x1 - x0))) : y0;
  }
  return out;
}

interface ModelRun {
  f: Float64Array;
  v: Float64Array;
  pct: Float64Array;
  failed: string | null;
}

function runModel(p: Prepared, values: ArrayLike<number>, measuredAt: 'set' | 'bus'): ModelRun {
  const set = withParameters(p.plant.sets[p.setIndex]!, p.keys, values);
  const plant: Plant = { ...p.plant, sets: p.plant.sets.map((s, i) => (i === p.setIndex ? set : s)) };
  try {
    const r = simulate({ ...p.scenario, plant });
    const s = r.series;
    const i = s.setIds.indexOf(set.id);
    const fs = measuredAt === 'bus' ? s.frequencyHz : s.setSpeedHz[i]!;
    const vs = measuredAt === 'bus' ? s.voltageV : s.setTerminalV[i]!;
    const f = interpolate(s.t, fs, p.simT);
    const v = interpolate(s.t, vs, p.simT);
    const pct = deviationsPct(f, v, p.before, p.fr, p.vr);
    for (let k = 0; k < pct.length; k++) if (!Number.isFinite(pct[k]!)) throw new EngineError('DIVERGED', 'the simulation gave a value that is not finite');
    return { f, v, pct, failed: null };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    const pct = new Float64Array(p.measuredPct.length);
    for (let k = 0; k < pct.length; k++) pct[k] = p.measuredPct[k]! + FAILED_PENALTY_PCT;
    return { f: new Float64Array(p.simT.length), v: new Float64Array(p.simT.length), pct, failed: err.message };
  }
}

function residual(measured: Float64Array, model: Float64Array): FitResidual {
  const n = measured.length / 2;
  let sf = 0;
  let sv = 0;
  for (let k = 0; k < n; k++) {
    sf += (measured[k]! - model[k]!) ** 2;
    sv += (measured[n + k]! - model[n + k]!) ** 2;
  }
  return { frequencyPct: Math.sqrt(sf / n), voltagePct: Math.sqrt(sv / n), totalPct: Math.sqrt((sf + sv) / (2 * n)) };
}

function confidenceOf(sensitivityPct: number): FitConfidence {
  return sensitivityPct >= 10 ? 'well determined' : sensitivityPct >= 1 ? 'weakly determined' : 'not determined';
}

function trace(t: number[], f: ArrayLike<number>, v: ArrayLike<number>): FitTrace {
  return { tS: [...t], frequencyHz: Array.from(f), voltageV: Array.from(v) };
}

/**
 * Fits the chosen parameters of `test.setId` to the record.
 * @throws InvalidInput (unknown set or parameter, bounds, a step outside the record),
 *   NoSteadyState / Diverged when the start values themselves cannot run the test.
 */
export function fitTestRecord(req: FitRequest, hooks: FitHooks = {}): FitResult {
  const p = prepare(req);
  const measuredAt = req.test.measuredAt ?? 'set';
  const maxIterations = req.maxIterations ?? DEFAULT_FIT_ITERATIONS;
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1 && maxIterations <= MAX_FIT_ITERATIONS))
    throw new InvalidInput(`maxIterations: must be a whole number from 1 to ${MAX_FIT_ITERATIONS}`);
  const span = p.keys.map((_, k) => p.max[k]! - p.min[k]!);
  const toValues = (u: ArrayLike<number>) => p.keys.map((_, k) => p.min[k]! + span[k]! * Math.min(1, Math.max(0, u[k]!)));
  const info = p.keys.map((k) => fitParameterInfo(k)!);
  let simulations = 0;
  let failures = 0;
  let lastFailure = '';
  const cache = new Map<string, ModelRun>();
  const model = (u: ArrayLike<number>): ModelRun => {
    const values = toValues(u);
    const key = values.join(',');
    const hit = cache.get(key);
    if (hit) return hit;
    const run = runModel(p, values, measuredAt);
    simulations++;
    if (run.failed) {
      failures++;
      lastFailure = run.failed;
    }
    if (cache.size > 8) cache.delete(cache.keys().next().value!);
    cache.set(key, run);
    return run;
  };
  const u0 = p.start.map((s, k) => (s - p.min[k]!) / span[k]!);
  const startRun = model(u0);
  if (startRun.failed) throw new EngineError('DIVERGED', `The test cannot be simulated with the start values: ${startRun.failed}`);
  const n2 = p.measuredPct.length;
  const xs = new Float64Array(n2);
  for (let k = 0; k < n2; k++) xs[k] = k;
  const sq = (run: ModelRun) => {
    let e = 0;
    for (let k = 0; k < n2; k++) e += (p.measuredPct[k]! - run.pct[k]!) ** 2;
    return e;
  };
  // The library stops only at its iteration cap or a zero error, so it runs in rounds and the
  // fit stops when a round no longer lowers the error (or the cap is reached).
  let u = u0;
  let err = sq(startRun);
  let iterations = 0;
  let converged = false;
  while (iterations < maxIterations) {
    if (hooks.isCancelled?.()) throw new Cancelled('The fit was cancelled.');
    const round = levenbergMarquardt(
      { x: xs, y: p.measuredPct },
      (q) => {
        const run = model(q);
        return (x) => run.pct[x]!;
      },
      {
        initialValues: u,
        minValues: p.keys.map(() => 0),
        maxValues: p.keys.map(() => 1),
        gradientDifference: p.keys.map(() => GRADIENT_STEP),
        maxIterations: Math.min(ROUND_ITERATIONS, maxIterations - iterations),
        errorTolerance: 1e-12,
        damping: 1e-2,
      },
    );
    iterations += Math.max(1, round.iterations);
    const next = sq(model(round.parameterValues));
    const better = next < err;
    if (better) u = round.parameterValues;
    hooks.progress?.(iterations / maxIterations);
    if (!better || err - next <= CONVERGED_FRACTION * err) {
      converged = true;
      break;
    }
    err = next;
  }
  const fit = { parameterValues: u, iterations };
  const uFit = fit.parameterValues;
  const best = model(uFit);
  const fitted = residual(p.measuredPct, best.pct);
  const ref = Math.max(fitted.totalPct, RMS_FLOOR_PCT);
  const values = toValues(uFit);
  const parameters: FittedParameter[] = p.keys.map((key, k) => {
    let worst = 0;
    for (const dir of [-1, 1]) {
      const u = [...uFit];
      u[k] = Math.min(1, Math.max(0, u[k]! + dir * SENSITIVITY_MOVE));
      if (u[k] === uFit[k]) continue;
      worst = Math.max(worst, residual(p.measuredPct, model(u).pct).totalPct);
    }
    const sensitivityPct = Math.max(0, ((worst - ref) / ref) * 100);
    const value = values[k]!;
    const edge = 1e-6 * span[k]!;
    return {
      key,
      unit: info[k]!.unit,
      start: p.start[k]!,
      value,
      min: p.min[k]!,
      max: p.max[k]!,
      atBound: value <= p.min[k]! + edge || value >= p.max[k]! - edge,
      sensitivityPct,
      confidence: confidenceOf(sensitivityPct),
    };
  });
  const warnings = [...p.warnings];
  if (failures > 0)
    warnings.push(`${failures} of ${simulations} simulations found no solution and counted as a ${FAILED_PENALTY_PCT} % error (the last: ${lastFailure})`);
  for (const q of parameters)
    if (q.atBound) warnings.push(`${q.key} ended on a bound (${q.value} ${q.unit}): the record may want it beyond; widen the bound if that is plausible`);
  const stoppedAtCap = !converged;
  if (stoppedAtCap) warnings.push(`the fit stopped at the iteration cap (${maxIterations}); it may improve with more`);
  const set = withParameters(req.plant.sets[p.setIndex]!, p.keys, values);
  const fittedPlant: Plant = { ...req.plant, sets: req.plant.sets.map((s, i) => (i === p.setIndex ? set : s)) };
  const droopSet = req.plant.sets[p.setIndex]!;
  const verdictOf = (f: ArrayLike<number>, v: ArrayLike<number>) =>
    recordVerdict({
      tS: req.record.tS,
      frequencyHz: f,
      voltageV: v,
      stepAtS: req.test.stepAtS,
      ratedFrequencyHz: p.fr,
      ratedVoltageV: p.vr,
      droopPct: droopSet.governor.mode === 'droop' ? set.governor.droopPct : 0,
    });
  return {
    setId: req.test.setId,
    parameters,
    residual: fitted,
    startResidual: residual(p.measuredPct, startRun.pct),
    iterations: fit.iterations,
    maxIterations,
    simulations,
    stoppedAtCap,
    fitted: trace(req.record.tS, best.f, best.v),
    startTrace: trace(req.record.tS, startRun.f, startRun.v),
    measured: trace(req.record.tS, req.record.frequencyHz, req.record.voltageV),
    measuredVerdict: verdictOf(req.record.frequencyHz, req.record.voltageV),
    modelVerdict: verdictOf(best.f, best.v),
    fittedPlant,
    notes: [
      `record and model compared as deviations from their values before the step, % of rated frequency (${p.fr} Hz) and rated voltage (${p.vr} V), measured at the ${measuredAt === 'bus' ? 'bus' : `terminals of set ${req.test.setId}`}`,
      `optimiser: Levenberg–Marquardt (ml-levenberg-marquardt), parameters scaled to their bounds, ${fit.iterations} of at most ${maxIterations} iterations, ${simulations} simulations at ${p.scenario.stepMs} ms`,
      `confidence: the rise of the RMS error when each parameter alone moves ${SENSITIVITY_MOVE * 100} % of its bound span (10 % or more: well determined; 1 % or more: weakly determined)`,
    ],
    warnings,
  };
}

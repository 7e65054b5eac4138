/**
 * Setpoint-tolerance analysis: seeded Monte-Carlo of the sharing solver. Each sample draws, set
 * by set in plant order, an error on the speed setpoint (± Hz), the voltage setpoint (± % of
 * rated voltage), the speed droop and the reactive droop (± % of value), then (for a load range)
 * the load; solves; and records each set's kW, kVAR, loading, circulating current and the bus.
 * Every sample has its own random stream from (seed, sample index) and every set draws all four
 * errors whatever its mode, so the result depends only on the seed — never on how the run is cut
 * into chunks or on how many workers run them. `toleranceSamples(request, from, to)` runs samples
 * [from, to) (a pool worker's unit of work); `mergeToleranceChunks` joins chunks, in sample order,
 * into the result.
 *
 * A sample exceeds its rating when a set's kW > ratedKW or kVA > ratedKVA, overloads when kW >
 * ratedKW · overloadPct / 100, and trips on reverse power when kW < −ratedKW ·
 * reversePowerTripPct / 100 — judged from the numbers, not the solver's flags. A sample with no
 * steady state is counted and reported, never dropped; the probabilities are over all samples.
 */
import type { GenSet, LoadOverride, Plant, ToleranceRequest, ToleranceResult } from '../../../shared-types';
import { EngineError, NoSteadyState } from '../errors';
import { createSharingFigures, solveSharingFigures } from '../sharing';
import type { SharingScratch } from '../sharing';
import { summarise } from './distribution-summary';
import { exceedsOverload, exceedsRating, tripsReversePower } from './limit-breaches';
import { kVARAtPF, onlineRatedKW } from './load-points';
import { nudgeSpeed, nudgeVoltage, workingSet } from './setpoint-knobs';
import { sampleDraws } from './tolerance-draws';

/** Defaults of the request. */
export const TOLERANCE_DEFAULTS = { samples: 10_000, seed: 1, bins: 30, pf: 0.8 } as const;

/** Breach bits of one set in one sample. */
const RATING = 1;
const OVERLOAD = 2;
const REVERSE = 4;

/**
 * The raw figures of samples [from, to): plain typed arrays, so a chunk crosses a worker
 * boundary by structured clone. Per-set arrays hold row k · sets + i for sample from + k; a
 * sample without a steady state has `solved[k] = 0` and zeros in its row.
 */
export interface ToleranceChunk {
  from: number;
  to: number;
  sets: number;
  solved: Uint8Array;
  kW: Float64Array;
  kVAR: Float64Array;
  loadingPct: Float64Array;
  circulatingA: Float64Array;
  /** Bits per set and sample: 1 exceeds rating, 2 exceeds overload, 4 trips on reverse power. */
  breaches: Uint8Array;
  busHz: Float64Array;
  busV: Float64Array;
  /** The first no-steady-state sentence in sample order, if any. */
  failReason?: string;
}

/** The sample count of `request`. */
export function toleranceSampleCount(request: ToleranceRequest): number {
  return request.samples ?? TOLERANCE_DEFAULTS.samples;
}

const reset = (w: GenSet, s: GenSet) => {
  w.governor.noLoadHz = s.governor.noLoadHz;
  w.governor.setpointHz = s.governor.setpointHz;
  w.governor.droopPct = s.governor.droopPct;
  w.regulator.noLoadV = s.regulator.noLoadV;
  w.regulator.setpointV = s.regulator.setpointV;
  w.regulator.droopPct = s.regulator.droopPct;
};

/**
 * Runs samples [from, to) of `request` (validated). Pure: the caller's plant is not touched.
 * The figures of a sample are the same whichever chunk it is run in.
 */
export function toleranceSamples(request: ToleranceRequest, from: number, to: number): ToleranceChunk {
  const plant = request.plant;
  const total = toleranceSampleCount(request);
  if (!(Number.isInteger(from) && Number.isInteger(to) && from >= 0 && from <= to && to <= total)) {
    throw new RangeError(`toleranceSamples: [${from}, ${to}) is not a range of the ${total} samples.`);
  }
  const seed = request.seed ?? TOLERANCE_DEFAULTS.seed;
  const distribution = request.distribution ?? 'uniform';
  const hzTol = request.speedTolHz ?? 0;
  const vTol = ((request.voltageTolPct ?? 0) / 100) * plant.ratedVoltageV;
  const droopTol = request.droopTolPct ?? 0;
  const n = plant.sets.length;
  // The working copy is made once per chunk; each sample resets only the fields it changes.
  const work: Plant = { ...plant, sets: plant.sets.map(workingSet) };
  const ratedKW = onlineRatedKW(plant);
  const pf = request.pf ?? TOLERANCE_DEFAULTS.pf;
  const len = to - from;
  const fig = createSharingFigures(n);
  const scratch: SharingScratch = {};
  const out: ToleranceChunk = {
    from,
    to,
    sets: n,
    solved: new Uint8Array(len),
    kW: new Float64Array(len * n),
    kVAR: new Float64Array(len * n),
    loadingPct: new Float64Array(len * n),
    circulatingA: new Float64Array(len * n),
    breaches: new Uint8Array(len * n),
    busHz: new Float64Array(len),
    busV: new Float64Array(len),
  };
  for (let k = 0; k < len; k++) {
    const draws = sampleDraws(seed, from + k, distribution);
    for (let i = 0; i < n; i++) {
      const s = plant.sets[i]!;
      const w = work.sets[i]!;
      reset(w, s);
      nudgeSpeed(w, draws.next(hzTol));
      nudgeVoltage(w, draws.next(vTol));
      w.governor.droopPct = s.governor.droopPct * (1 + draws.next(droopTol) / 100);
      w.regulator.droopPct = s.regulator.droopPct * (1 + draws.next(droopTol) / 100);
    }
    let load: LoadOverride | undefined = request.load;
    if (request.loadRangePct) {
      const pct = draws.uniform(request.loadRangePct.min, request.loadRangePct.max);
      const p = (ratedKW * pct) / 100;
      load = { kW: p, kVAR: kVARAtPF(p, pf) };
    }
    try {
      solveSharingFigures(work, load, fig, scratch);
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      out.failReason ??= err.message;
      continue;
    }
    out.solved[k] = 1;
    const row = k * n;
    for (let i = 0; i < n; i++) {
      const s = plant.sets[i]!;
      const kW = fig.kW[i]!;
      out.kW[row + i] = kW;
      out.kVAR[row + i] = fig.kVAR[i]!;
      out.loadingPct[row + i] = fig.loadingPct[i]!;
      out.circulatingA[row + i] = fig.circulatingA[i]!;
      if (!s.online) continue;
      out.breaches[row + i] =
        (exceedsRating(s, kW, fig.kVA[i]!) ? RATING : 0) | (exceedsOverload(s, kW) ? OVERLOAD : 0) | (tripsReversePower(s, kW) ? REVERSE : 0);
    }
    out.busHz[k] = fig.frequencyHz;
    out.busV[k] = fig.voltageV;
  }
  return out;
}

/**
 * The result of `request` from chunks that together cover every sample once (any order, any
 * sizes). @throws RangeError when they do not; NoSteadyState when no sample has a steady state.
 */
export function mergeToleranceChunks(request: ToleranceRequest, chunks: readonly ToleranceChunk[]): ToleranceResult {
  const plant = request.plant;
  const total = toleranceSampleCount(request);
  const seed = request.seed ?? TOLERANCE_DEFAULTS.seed;
  const bins = request.bins ?? TOLERANCE_DEFAULTS.bins;
  const n = plant.sets.length;
  const ordered = [...chunks].sort((a, b) => a.from - b.from);
  let at = 0;
  for (const c of ordered) {
    if (c.from !== at || c.sets !== n) throw new RangeError(`mergeToleranceChunks: samples from ${at} are missing or repeated.`);
    at = c.to;
  }
  if (at !== total) throw new RangeError(`mergeToleranceChunks: samples from ${at} of ${total} are missing.`);

  let solved = 0;
  for (const c of ordered) for (let k = 0; k < c.solved.length; k++) solved += c.solved[k]!;
  const failReason = ordered.find((c) => c.failReason !== undefined)?.failReason;
  if (solved === 0) throw new NoSteadyState(`None of the ${total} samples has a steady state: ${failReason ?? ''}`);

  // Columns of the solved samples in sample order.
  const cols = (pick: (c: ToleranceChunk) => Float64Array) => {
    const out = Array.from({ length: n }, () => new Float64Array(solved));
    let row = 0;
    for (const c of ordered) {
      const data = pick(c);
      for (let k = 0; k < c.solved.length; k++) {
        if (!c.solved[k]) continue;
        for (let i = 0; i < n; i++) out[i]![row] = data[k * n + i]!;
        row++;
      }
    }
    return out;
  };
  const bus = (pick: (c: ToleranceChunk) => Float64Array) => {
    const out = new Float64Array(solved);
    let row = 0;
    for (const c of ordered) {
      const data = pick(c);
      for (let k = 0; k < c.solved.length; k++) if (c.solved[k]) out[row++] = data[k]!;
    }
    return out;
  };
  const setCount = [new Uint32Array(n), new Uint32Array(n), new Uint32Array(n)] as const;
  let anyRating = 0;
  let anyOverload = 0;
  let anyReverse = 0;
  for (const c of ordered) {
    for (let k = 0; k < c.solved.length; k++) {
      let any = 0;
      for (let i = 0; i < n; i++) {
        const b = c.breaches[k * n + i]!;
        any |= b;
        if (b & RATING) setCount[0][i]! += 1;
        if (b & OVERLOAD) setCount[1][i]! += 1;
        if (b & REVERSE) setCount[2][i]! += 1;
      }
      if (any & RATING) anyRating++;
      if (any & OVERLOAD) anyOverload++;
      if (any & REVERSE) anyReverse++;
    }
  }
  const kW = cols((c) => c.kW);
  const kVAR = cols((c) => c.kVAR);
  const loading = cols((c) => c.loadingPct);
  const circ = cols((c) => c.circulatingA);
  const failed = total - solved;
  return {
    samples: total,
    seed,
    solved,
    noSteadyState: failed,
    ...(failReason === undefined ? {} : { noSteadyStateReason: failReason }),
    sets: plant.sets.map((s, i) => ({
      id: s.id,
      name: s.name,
      kW: summarise(kW[i]!, solved, bins),
      kVAR: summarise(kVAR[i]!, solved, bins),
      loadingPct: summarise(loading[i]!, solved, bins),
      circulatingA: summarise(circ[i]!, solved, bins),
      pExceedsRating: setCount[0][i]! / total,
      pOverload: setCount[1][i]! / total,
      pReversePower: setCount[2][i]! / total,
    })),
    bus: {
      frequencyHz: summarise(
        bus((c) => c.busHz),
        solved,
        bins,
      ),
      voltageV: summarise(
        bus((c) => c.busV),
        solved,
        bins,
      ),
    },
    probabilities: { exceedsRating: anyRating / total, overload: anyOverload / total, reversePower: anyReverse / total, noSteadyState: failed / total },
  };
}

/** A tolerance run that can be advanced in chunks on one thread. */
export interface ToleranceRun {
  readonly total: number;
  readonly done: number;
  /** Runs up to `count` more samples. */
  step(count: number): void;
  /** The result once every sample has run. @throws NoSteadyState when no sample has a steady state. */
  result(): ToleranceResult;
}

/** Starts a run of `request` (validated) on this thread. Pure: the caller's plant is not touched. */
export function createToleranceRun(request: ToleranceRequest): ToleranceRun {
  const total = toleranceSampleCount(request);
  const chunks: ToleranceChunk[] = [];
  let done = 0;
  return {
    total,
    get done() {
      return done;
    },
    step(count: number) {
      const end = Math.min(total, done + Math.max(0, Math.floor(count)));
      if (end === done) return;
      chunks.push(toleranceSamples(request, done, end));
      done = end;
    },
    result: () => mergeToleranceChunks(request, chunks),
  };
}

/** Runs every sample at once (no progress): the tests' and the bench's one-thread entry. */
export function toleranceAnalysis(request: ToleranceRequest): ToleranceResult {
  const run = createToleranceRun(request);
  run.step(run.total);
  return run.result();
}

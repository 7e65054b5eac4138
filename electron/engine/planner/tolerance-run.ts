/**
 * Setpoint-tolerance analysis: seeded Monte-Carlo of the sharing solver. Each sample draws, set
 * by set in plant order, an error on the speed setpoint (± Hz), the voltage setpoint (± % of
 * rated voltage), the speed droop and the reactive droop (± % of value), then (for a load range)
 * the load; solves; and records each set's kW, kVAR, loading, circulating current and the bus.
 * Every set draws all four errors whatever its mode, so the stream — and the result — depends
 * only on the seed, never on how the run is cut into chunks.
 *
 * A sample exceeds its rating when a set's kW > ratedKW or kVA > ratedKVA, overloads when kW >
 * ratedKW · overloadPct / 100, and trips on reverse power when kW < −ratedKW ·
 * reversePowerTripPct / 100 — judged from the numbers, not the solver's flags. A sample with no
 * steady state is counted and reported, never dropped; the probabilities are over all samples.
 */
import type { GenSet, Plant, ToleranceRequest, ToleranceResult } from '../../../shared-types';
import { EngineError, NoSteadyState } from '../errors';
import { solveSharing } from '../sharing';
import { summarise } from './distribution-summary';
import { exceedsOverload, exceedsRating, tripsReversePower } from './limit-breaches';
import { kVARAtPF, onlineRatedKW } from './load-points';
import { nudgeSpeed, nudgeVoltage, workingSet } from './setpoint-knobs';
import { toleranceDraws } from './tolerance-draws';

/** Defaults of the request. */
export const TOLERANCE_DEFAULTS = { samples: 10_000, seed: 1, bins: 30, pf: 0.8 } as const;

/** A tolerance run that can be advanced in chunks. */
export interface ToleranceRun {
  readonly total: number;
  readonly done: number;
  /** Runs up to `count` more samples. */
  step(count: number): void;
  /** The result once every sample has run. @throws NoSteadyState when no sample has a steady state. */
  result(): ToleranceResult;
}

/** Starts a run of `request` (validated). Pure: the caller's plant is not touched. */
export function createToleranceRun(request: ToleranceRequest): ToleranceRun {
  const plant = request.plant;
  const total = request.samples ?? TOLERANCE_DEFAULTS.samples;
  const seed = request.seed ?? TOLERANCE_DEFAULTS.seed;
  const bins = request.bins ?? TOLERANCE_DEFAULTS.bins;
  const hzTol = request.speedTolHz ?? 0;
  const vTol = ((request.voltageTolPct ?? 0) / 100) * plant.ratedVoltageV;
  const droopTol = request.droopTolPct ?? 0;
  const draws = toleranceDraws(seed, request.distribution ?? 'uniform');
  const n = plant.sets.length;
  const work: Plant = { ...plant, sets: plant.sets.map(workingSet) };
  const ratedKW = onlineRatedKW(plant);
  const pf = request.pf ?? TOLERANCE_DEFAULTS.pf;

  const kW = new Float64Array(total * n);
  const kVAR = new Float64Array(total * n);
  const loading = new Float64Array(total * n);
  const circ = new Float64Array(total * n);
  const busHz = new Float64Array(total);
  const busV = new Float64Array(total);
  const setRating = new Uint32Array(n);
  const setOverload = new Uint32Array(n);
  const setReverse = new Uint32Array(n);
  let solved = 0;
  let failed = 0;
  let anyRating = 0;
  let anyOverload = 0;
  let anyReverse = 0;
  let failReason: string | undefined;
  let done = 0;

  const reset = (w: GenSet, s: GenSet) => {
    w.governor.noLoadHz = s.governor.noLoadHz;
    w.governor.setpointHz = s.governor.setpointHz;
    w.governor.droopPct = s.governor.droopPct;
    w.regulator.noLoadV = s.regulator.noLoadV;
    w.regulator.setpointV = s.regulator.setpointV;
    w.regulator.droopPct = s.regulator.droopPct;
  };

  const one = () => {
    for (let i = 0; i < n; i++) {
      const s = plant.sets[i]!;
      const w = work.sets[i]!;
      reset(w, s);
      nudgeSpeed(w, draws.next(hzTol));
      nudgeVoltage(w, draws.next(vTol));
      w.governor.droopPct = s.governor.droopPct * (1 + draws.next(droopTol) / 100);
      w.regulator.droopPct = s.regulator.droopPct * (1 + draws.next(droopTol) / 100);
    }
    let load = request.load;
    if (request.loadRangePct) {
      const pct = draws.uniform(request.loadRangePct.min, request.loadRangePct.max);
      const p = (ratedKW * pct) / 100;
      load = { kW: p, kVAR: kVARAtPF(p, pf) };
    }
    let r;
    try {
      r = solveSharing(work, load);
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      failed++;
      failReason ??= err.message;
      return;
    }
    const row = solved * n;
    let rating = false;
    let overload = false;
    let reverse = false;
    for (let i = 0; i < n; i++) {
      const s = plant.sets[i]!;
      const o = r.sets[i]!;
      kW[row + i] = o.kW;
      kVAR[row + i] = o.kVAR;
      loading[row + i] = o.loadingPct;
      circ[row + i] = o.circulatingA;
      if (!s.online) continue;
      if (exceedsRating(s, o.kW, o.kVA)) {
        setRating[i]! += 1;
        rating = true;
      }
      if (exceedsOverload(s, o.kW)) {
        setOverload[i]! += 1;
        overload = true;
      }
      if (tripsReversePower(s, o.kW)) {
        setReverse[i]! += 1;
        reverse = true;
      }
    }
    busHz[solved] = r.bus.frequencyHz;
    busV[solved] = r.bus.voltageV;
    solved++;
    if (rating) anyRating++;
    if (overload) anyOverload++;
    if (reverse) anyReverse++;
  };

  return {
    total,
    get done() {
      return done;
    },
    step(count: number) {
      const end = Math.min(total, done + count);
      for (; done < end; done++) one();
    },
    result(): ToleranceResult {
      if (solved === 0) throw new NoSteadyState(`None of the ${total} samples has a steady state: ${failReason ?? ''}`);
      const column = (data: Float64Array, i: number) => {
        const out = new Float64Array(solved);
        for (let k = 0; k < solved; k++) out[k] = data[k * n + i]!;
        return summarise(out, solved, bins);
      };
      return {
        samples: total,
        seed,
        solved,
        noSteadyState: failed,
        ...(failReason === undefined ? {} : { noSteadyStateReason: failReason }),
        sets: plant.sets.map((s, i) => ({
          id: s.id,
          name: s.name,
          kW: column(kW, i),
          kVAR: column(kVAR, i),
          loadingPct: column(loading, i),
          circulatingA: column(circ, i),
          pExceedsRating: setRating[i]! / total,
          pOverload: setOverload[i]! / total,
          pReversePower: setReverse[i]! / total,
        })),
        bus: { frequencyHz: summarise(busHz, solved, bins), voltageV: summarise(busV, solved, bins) },
        probabilities: { exceedsRating: anyRating / total, overload: anyOverload / total, reversePower: anyReverse / total, noSteadyState: failed / total },
      };
    },
  };
}

/** Runs every sample at once (no progress): the CLI's and the tests' entry. */
export function toleranceAnalysis(request: ToleranceRequest): ToleranceResult {
  const run = createToleranceRun(request);
  run.step(run.total);
  return run.result();
}

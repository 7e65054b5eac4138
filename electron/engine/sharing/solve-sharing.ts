/**
 * `solveSharing`: where a plant settles. Closed forms when no online set has a feeder
 * impedance; otherwise the small AC network is solved by Newton–Raphson.
 */
import type { LoadOverride, Plant, SharingResult } from '../../../shared-types';
import { solveClosedForm } from './closed-form';
import { solveNetwork } from './network-solve';
import { createNetworkWork } from './network-work';
import type { Work } from './network-work';
import { buildSharingModel } from './sharing-model';
import type { SharingModel } from './sharing-model';
import { buildSharingResult, writeSharingFigures } from './sharing-result';
import type { OperatingPoint, SharingFigures } from './sharing-result';
import { Diverged, NoSteadyState } from '../errors';

/**
 * Steady-state kW/kVAR split, bus frequency and voltage of `plant` (validated, defaults
 * filled). `load` replaces the plant's loads by one constant-power load (kW, kVAR).
 * Pure: `plant` is not touched.
 * @throws NoSteadyState when no operating point exists (overload, undefined split, no reference).
 * @throws Diverged when the network iteration fails to converge within its bound.
 */
export function solveSharing(plant: Plant, load?: LoadOverride): SharingResult {
  const m = buildSharingModel(plant, load);
  try {
    return buildSharingResult(plant, m, solveModel(m));
  } catch (e) {
    if (!(e instanceof NoSteadyState || e instanceof Diverged)) throw e;
    // With every limited regulator held at its field-heating limit the reactive load may have
    // no home; solve again with the field limits not held and say so in the result.
    m.holdField = false;
    return buildSharingResult(plant, m, solveModel(m));
  }
}

/**
 * Work arrays one `solveSharingFigures` caller keeps between solves (the solver model's and the
 * feeder network's), so that a Monte-Carlo of thousands of solves does not allocate them each
 * time. Not shared between callers running at once; the figures never depend on it (a plant whose load list
 * is the same array as the last solve's keeps that solve's load terms, so change loads by a new list, not in place).
 */
export interface SharingScratch {
  model?: SharingModel;
  work?: Work;
}

/**
 * `solveSharing`'s operating point as bare figures written into `out` (see `createSharingFigures`): no flags, notes
 * or warnings are built, so a Monte-Carlo of thousands of solves pays only for the solve. Same errors.
 * `scratch` (optional, start with `{}`) keeps the work arrays for the caller's next solve.
 */
export function solveSharingFigures(plant: Plant, load: LoadOverride | undefined, out: SharingFigures, scratch?: SharingScratch): void {
  const m = buildSharingModel(plant, load, scratch?.model);
  if (scratch) scratch.model = m;
  let op: OperatingPoint;
  try {
    op = solveModel(m, scratch);
  } catch (e) {
    if (!(e instanceof NoSteadyState || e instanceof Diverged)) throw e;
    m.holdField = false;
    op = solveModel(m, scratch);
  }
  writeSharingFigures(m, op, out);
}

function solveModel(m: SharingModel, scratch?: SharingScratch): OperatingPoint {
  const closed = solveClosedForm(m);
  if (!m.hasFeeders) return closed;
  if (scratch) scratch.work = createNetworkWork(m, scratch.work);
  return solveNetwork(
    m,
    {
      frequencyHz: closed.frequencyHz,
      voltageV: closed.busVoltageV,
      kW: closed.kW,
      kVAR: closed.kVAR,
      isoState: closed.isoState,
    },
    scratch?.work,
  );
}

/** Bisection steps on the load scale when looking for the most the sets can carry (2⁻⁴⁰ of the load). */
const MOST_STEPS = 40;

/**
 * Like `solveSharing` with a load override, but when that load is more than the sets can
 * carry (no steady state), solves at the most they can carry instead — the same kVAR/kW,
 * scaled down, found by bisection on the scale — and says so in the result (`capped` and
 * the first warning). Control structures with no answer at any load still throw.
 */
export function solveSharingAtMost(plant: Plant, load: LoadOverride): SharingResult {
  let firstError: unknown;
  try {
    return solveSharing(plant, load);
  } catch (e) {
    if (!(e instanceof NoSteadyState || e instanceof Diverged)) throw e;
    firstError = e;
  }
  let best: SharingResult;
  try {
    best = solveSharing(plant, { kW: 0, kVAR: 0 });
  } catch {
    throw firstError;
  }
  let lo = 0;
  let hi = 1;
  for (let k = 0; k < MOST_STEPS; k++) {
    const mid = 0.5 * (lo + hi);
    try {
      best = solveSharing(plant, { kW: load.kW * mid, kVAR: load.kVAR * mid });
      lo = mid;
    } catch (e) {
      if (!(e instanceof NoSteadyState || e instanceof Diverged)) throw e;
      hi = mid;
    }
  }
  const carriedKW = load.kW * lo;
  const reason = firstError instanceof Error ? firstError.message : '';
  return {
    ...best,
    capped: { requestedKW: load.kW, requestedKVAR: load.kVAR, carriedKW, carriedKVAR: load.kVAR * lo, shortKW: load.kW - carriedKW, reason },
    warnings: [
      `The load asked for (${Math.round(load.kW)} kW) has no steady state: ${reason} Shown instead: the most the sets can carry at the same power factor, ${Math.round(carriedKW)} kW (${Math.round(load.kW - carriedKW)} kW less).`,
      ...best.warnings,
    ],
  };
}

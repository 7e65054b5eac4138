/** `simulate`: a whole scenario, start to end, with progress and cancellation hooks. */
import type { Scenario, SimulationResult } from '../../../shared-types';
import { Cancelled } from '../errors';
import { createSimulation } from './simulation';

/** Optional callbacks of a long run. */
export interface SimulationHooks {
  /** Called with the fraction done (0..1) about every 1 % of the run. */
  progress?(fraction: number): void;
  /** Polled between chunks; returning true stops the run with `Cancelled`. */
  isCancelled?(): boolean;
}

/** Steps per chunk between progress reports and cancellation checks (at least). */
export const MIN_CHUNK_STEPS = 500;

/**
 * Runs `scenario` (plant validated, defaults filled) from rest to `durationS` and
 * returns its metrics, decimated series, log and warnings. Pure and synchronous.
 * @throws InvalidInput, NoSteadyState (no operating point to start from), Diverged, Cancelled.
 */
export function simulate(scenario: Scenario, hooks: SimulationHooks = {}): SimulationResult {
  const sim = createSimulation(scenario);
  const total = Math.round(scenario.durationS / sim.stepS);
  const chunk = Math.max(MIN_CHUNK_STEPS, Math.ceil(total / 100));
  while (sim.stepCount < total) {
    if (hooks.isCancelled?.()) throw new Cancelled('The simulation was cancelled.');
    sim.steps(Math.min(chunk, total - sim.stepCount));
    hooks.progress?.(sim.stepCount / total);
  }
  return sim.result();
}

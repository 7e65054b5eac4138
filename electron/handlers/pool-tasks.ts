/**
 * What a pool worker runs (`poolTasks`) and the pool's shape (`ChunkPool`): apart from the scheduler in
 * `pool.ts`, so the handlers' context can name the pool without importing the scheduler that uses the context.
 */
import { closingMapJobFor, takeRows, toleranceSamples } from '../engine';
import type { ClosingMapJob, ClosingMapRows, ToleranceChunk } from '../engine';
import type { ClosingMapRequest, ToleranceRequest } from '../../shared-types';

/** The job a worker keeps between chunks of one closing map (set up once, not once per chunk). */
let mapJob: { key: string; job: ClosingMapJob } | null = null;

/** What a pool worker runs: plain data in, plain data (typed arrays) out. */
export const poolTasks = {
  /** Tolerance samples [from, to) of a validated request. */
  toleranceSamples(request: ToleranceRequest, from: number, to: number): ToleranceChunk {
    return toleranceSamples(request, from, to);
  },
  /** Closing-map rows [from, to) of a validated request; `key` names the map, so a worker sets it up once. */
  closingMapRows(key: string, request: ClosingMapRequest, from: number, to: number): ClosingMapRows {
    if (mapJob?.key !== key) mapJob = { key, job: closingMapJobFor(request) };
    mapJob.job.fillRows(from, to);
    return takeRows(mapJob.job, from, to);
  },
};

export type PoolTasks = typeof poolTasks;
export type PoolTaskName = keyof PoolTasks;

/** A pool of workers running `poolTasks` (workerpool over worker_threads in Node, Web Workers in the browser). */
export interface ChunkPool {
  /** Workers the pool runs at most. */
  readonly size: number;
  /**
   * Runs `task` on a worker. When `signal` aborts, the worker's task is stopped and the promise rejects with
   * `Cancelled`; an engine error thrown in the worker comes back as the same typed error.
   */
  run<K extends PoolTaskName>(task: K, args: Parameters<PoolTasks[K]>, signal: AbortSignal): Promise<ReturnType<PoolTasks[K]>>;
}

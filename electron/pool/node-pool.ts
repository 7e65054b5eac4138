/**
 * The worker pool of the Node hosts (the CLI and Electron's main process): workerpool over worker_threads, one
 * worker per core. Workers start on the first task and stay for the next ones; `close()` ends them.
 */
import { availableParallelism } from 'node:os';
import workerpool from 'workerpool';
import { chunkPoolOver } from '../handlers/pool';
import type { ChunkPool } from '../handlers/pool';

/** A Node pool and its end. */
export interface NodePool extends ChunkPool {
  /** Ends the workers (running tasks are stopped). */
  close(): Promise<void>;
}

export interface NodePoolOptions {
  /** Workers (default: `DROOPLINE_WORKERS` when set to a whole number ≥ 1, else the machine's available parallelism). */
  size?: number;
  /** Node options of the worker threads. */
  execArgv?: string[];
  /** Young-generation heap of each worker, MB (default `POOL_YOUNG_GENERATION_MB`). */
  youngGenerationMb?: number;
}

/**
 * Young-generation heap of a pool worker, MB. A chunk allocates many short-lived typed arrays (a time-domain map
 * cell starts a whole simulation); with V8's default young generation the scavenger runs so often that it costs
 * more than the cells themselves (measured in `npm run bench`, pool suite: a map cell costs about 0.29 ms of CPU
 * with 8 MB, 0.18 ms with 96 MB, 0.11 ms with 256 MB). 256 MB per worker keeps it rare; the space is taken only as
 * the work needs it.
 */
export const POOL_YOUNG_GENERATION_MB = 256;

/** A pool whose workers run `workerScript` (the built `pool-worker.mjs`, or its TypeScript source under tsx). */
export function createNodePool(workerScript: string, options: NodePoolOptions = {}): NodePool {
  const fromEnv = Number(process.env.DROOPLINE_WORKERS);
  const size = Math.max(1, Math.floor(options.size ?? (Number.isInteger(fromEnv) && fromEnv >= 1 ? fromEnv : availableParallelism())));
  const pool = workerpool.pool(workerScript, {
    workerType: 'thread',
    maxWorkers: size,
    workerThreadOpts: {
      resourceLimits: { maxYoungGenerationSizeMb: options.youngGenerationMb ?? POOL_YOUNG_GENERATION_MB },
      ...(options.execArgv ? { execArgv: options.execArgv } : {}),
    },
  });
  return {
    ...chunkPoolOver(pool, size),
    async close() {
      await pool.terminate(true);
    },
  };
}

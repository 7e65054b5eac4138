/**
 * The browser preview's worker pool: workerpool over Web Workers, one per core the browser reports, started by the
 * engine worker (nested workers) on the first long job and kept for the next ones.
 */
import workerpool from 'workerpool';
import { chunkPoolOver } from '../../electron/handlers/pool';
import type { ChunkPool } from '../../electron/handlers/pool';
import poolWorkerUrl from './pool.worker.ts?worker&url';

/** A pool of `size` Web Workers (default: `navigator.hardwareConcurrency`, at least 1). */
export function createWebPool(size = Math.max(1, globalThis.navigator?.hardwareConcurrency ?? 2)): ChunkPool {
  const pool = workerpool.pool(poolWorkerUrl, { workerType: 'web', maxWorkers: size, workerOpts: { type: 'module' } });
  return chunkPoolOver(pool, size);
}

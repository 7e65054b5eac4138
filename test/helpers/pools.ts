/**
 * Pools for tests: `inProcessPool` runs the pool tasks in this thread, each on a later turn of the event loop (so
 * chunks finish out of order and cancel lands between them), counting the tasks it starts; `nodeTestPool` is the
 * real worker_threads pool on the TypeScript worker entry.
 */
import { fileURLToPath } from 'node:url';
import { Cancelled } from '../../electron/engine';
import { poolTasks } from '../../electron/handlers';
import type { ChunkPool, PoolTaskName, PoolTasks } from '../../electron/handlers';
import { createNodePool } from '../../electron/pool/node-pool';
import type { NodePool } from '../../electron/pool/node-pool';

export interface CountingPool extends ChunkPool {
  started: number;
}

/** A pool of `size` pretend workers in this thread; task k waits (k mod 3) turns, so results come back out of order. */
export function inProcessPool(size: number): CountingPool {
  let k = 0;
  const pool: CountingPool = {
    size,
    started: 0,
    run<K extends PoolTaskName>(task: K, args: Parameters<PoolTasks[K]>, signal: AbortSignal) {
      pool.started++;
      const turns = k++ % 3;
      return new Promise<ReturnType<PoolTasks[K]>>((resolve, reject) => {
        const go = (left: number) => {
          if (signal.aborted) return reject(new Cancelled());
          if (left > 0) return setTimeout(() => go(left - 1), 0);
          const fn = poolTasks[task] as (...a: unknown[]) => ReturnType<PoolTasks[K]>;
          resolve(structuredClone(fn(...(args as unknown[]))));
        };
        setTimeout(() => go(turns), 0);
      });
    },
  };
  return pool;
}

/** The real Node pool (worker_threads) with `size` workers running the TypeScript worker entry under tsx. */
export function nodeTestPool(size: number): NodePool {
  return createNodePool(fileURLToPath(new URL('./pool-worker-tsx.mjs', import.meta.url)), { size });
}

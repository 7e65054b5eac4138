/**
 * The browser preview's worker pool: workerpool over Web Workers, one per core the browser reports, started by the
 * engine worker (nested workers) on the first long job and kept for the next ones.
 */
import workerpool from 'workerpool';
import { Cancelled } from '../../electron/engine/errors';
import { engineErrorFromWorker } from '../../electron/handlers/pool';
import type { ChunkPool, PoolTaskName, PoolTasks } from '../../electron/handlers/pool';
import poolWorkerUrl from './pool.worker.ts?worker&url';

/** A pool of `size` Web Workers (default: `navigator.hardwareConcurrency`, at least 1). */
export function createWebPool(size = Math.max(1, globalThis.navigator?.hardwareConcurrency ?? 2)): ChunkPool {
  const pool = workerpool.pool(poolWorkerUrl, { workerType: 'web', maxWorkers: size, workerOpts: { type: 'module' } });
  return {
    size,
    run<K extends PoolTaskName>(task: K, args: Parameters<PoolTasks[K]>, signal: AbortSignal): Promise<ReturnType<PoolTasks[K]>> {
      if (signal.aborted) return Promise.reject(new Cancelled());
      const p = pool.exec(task, args as unknown[]);
      const onAbort = () => {
        // Ends the worker (workerpool starts a fresh one for the next task); the rejection below says so.
        try {
          p.cancel();
        } catch {
          // already settled
        }
      };
      signal.addEventListener('abort', onAbort, { once: true });
      return new Promise<ReturnType<PoolTasks[K]>>((resolve, reject) => {
        void p.then(
          (v: unknown) => {
            signal.removeEventListener('abort', onAbort);
            resolve(v as ReturnType<PoolTasks[K]>);
          },
          (err: unknown) => {
            signal.removeEventListener('abort', onAbort);
            reject(signal.aborted ? new Cancelled() : engineErrorFromWorker(err));
          },
        );
      });
    },
  };
}

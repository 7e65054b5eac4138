/**
 * Work on all cores. The engine offers chunked pure functions (tolerance samples [from, to), closing-map rows
 * [from, to)); a host (the CLI, Electron's main process, the preview's engine worker) may hand the handlers a
 * `ChunkPool` in their context, whose workers run `poolTasks`. Without one the chunks run here, one after another.
 * Either way the result is the same: each chunk depends only on the request and its range, and the chunks are
 * merged in order.
 */
import { Cancelled, Diverged, EngineError, InvalidInput, NoSteadyState } from '../engine';
import type { EngineErrorCode } from '../../shared-types';
import type { ChunkPool, PoolTaskName, PoolTasks } from './pool-tasks';
import { breathe } from './handler';
import type { HandlerContext } from './handler';

export { poolTasks } from './pool-tasks';
export type { ChunkPool, PoolTaskName, PoolTasks } from './pool-tasks';

const ERRORS: Partial<Record<EngineErrorCode, new (message: string) => EngineError>> = {
  NO_STEADY_STATE: NoSteadyState,
  DIVERGED: Diverged,
  INVALID_INPUT: InvalidInput,
  CANCELLED: Cancelled,
};

/** The typed engine error a worker threw (its `code` crosses the boundary), or the error as it came. */
export function engineErrorFromWorker(err: unknown): unknown {
  const code = (err as { code?: unknown } | null)?.code;
  const message = err instanceof Error ? err.message : String(err);
  const Type = typeof code === 'string' ? ERRORS[code as EngineErrorCode] : undefined;
  return Type ? new Type(message) : err;
}

/** What `chunkPoolOver` needs of a worker pool (workerpool's `Pool` over threads or Web Workers). */
export interface TaskPool {
  exec(task: string, args: unknown[]): PromiseLike<unknown> & { cancel(): unknown };
}

/**
 * A `ChunkPool` of `size` workers over a worker pool: the one scheduling routine of the Node hosts' pool and the
 * preview's Web Worker pool. A cancel stops the task's worker (workerpool ends it and starts a fresh one for the next
 * task) and the task rejects with `Cancelled`; a worker's error comes back as the typed engine error it was.
 */
export function chunkPoolOver(pool: TaskPool, size: number): ChunkPool {
  return {
    size,
    run<K extends PoolTaskName>(task: K, args: Parameters<PoolTasks[K]>, signal: AbortSignal): Promise<ReturnType<PoolTasks[K]>> {
      if (signal.aborted) return Promise.reject(new Cancelled());
      const p = pool.exec(task, args as unknown[]);
      const onAbort = () => {
        // Stops the worker (workerpool ends it and starts a fresh one for the next task); the rejection below says so.
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

/** How `runChunks` cuts and reports a job. */
export interface ChunkPlan<R> {
  /** Units of work (samples, rows). */
  total: number;
  /** Units per chunk. */
  chunk: number;
  /** Progress label. */
  label: string;
  /** Sentence of the `Cancelled` error. */
  cancelled: string;
  /** Runs units [from, to): on the pool when there is one, else here. */
  run(from: number, to: number, pool: ChunkPool | undefined, signal: AbortSignal): R | Promise<R>;
  /** Takes a finished chunk (in any order). */
  take(result: R, from: number, to: number): void;
}

/**
 * Runs a plan's chunks: on `ctx.pool` with as many in flight as it has workers (two per worker, so none waits
 * for the next), else here one by one with a breath between them. Progress after every chunk; on cancel no new
 * chunk starts, running ones are stopped, and `Cancelled` is thrown.
 */
export async function runChunks<R>(plan: ChunkPlan<R>, ctx: HandlerContext): Promise<void> {
  const { total, label } = plan;
  const chunk = Math.max(1, Math.floor(plan.chunk));
  const pool = ctx.pool;
  ctx.progress(0, label);
  let done = 0;
  if (!pool) {
    for (let from = 0; from < total; from += chunk) {
      if (ctx.signal.aborted) throw new Cancelled(plan.cancelled);
      const to = Math.min(total, from + chunk);
      plan.take(await plan.run(from, to, undefined, ctx.signal), from, to);
      done = to;
      ctx.progress(done / total, label);
      if (to < total) await breathe();
    }
    return;
  }
  // One controller for this job's chunks: aborted by the caller's cancel or by a failed chunk.
  const stop = new AbortController();
  const onAbort = () => stop.abort();
  ctx.signal.addEventListener('abort', onAbort, { once: true });
  if (ctx.signal.aborted) stop.abort();
  let next = 0;
  let failure: unknown = null;
  const worker = async () => {
    while (next < total && !stop.signal.aborted) {
      const from = next;
      const to = Math.min(total, from + chunk);
      next = to;
      try {
        const r = await plan.run(from, to, pool, stop.signal);
        if (stop.signal.aborted) return;
        plan.take(r, from, to);
        done += to - from;
        ctx.progress(done / total, label);
      } catch (err) {
        failure ??= err;
        stop.abort();
        return;
      }
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.max(1, 2 * pool.size) }, worker));
  } finally {
    ctx.signal.removeEventListener('abort', onAbort);
  }
  if (ctx.signal.aborted) throw new Cancelled(plan.cancelled);
  if (failure !== null) throw failure instanceof Cancelled ? new Cancelled(plan.cancelled) : failure;
}

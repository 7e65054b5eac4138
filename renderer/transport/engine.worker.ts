/**
 * The browser preview's engine host: runs the handler table off the UI thread.
 *
 * The plant's methods (`checkPlant`, `describePlant`, `validatePlant`) load with the worker; the rest of the table
 * (its schemas take as long to build as everything else the worker loads) comes in a chunk of its own, fetched after
 * the first answer or by the first call that needs it. So the first figure on screen waits only for what the plant
 * editor needs.
 */
import type { EngineMethod, WorkerReply, WorkerRequest } from '../../shared-types';
import type { ChunkPool, HandlerContext } from '../../electron/handlers';
import { runHandler, toErrorShape } from '../../electron/handlers/dispatch-core';
import type { DispatchResult } from '../../electron/handlers/dispatch-core';
import { plantHandlers } from '../../electron/handlers/plant-handlers';
import { createWebPool } from './web-pool';

/** The parts of the worker global this file uses (the DOM lib types `self` as a Window). */
interface WorkerScope {
  postMessage(message: WorkerReply): void;
  addEventListener(type: 'message', listener: (ev: MessageEvent<WorkerRequest>) => void): void;
}
const scope = self as unknown as WorkerScope;
const running = new Map<number, AbortController>();
const post = (m: WorkerReply) => scope.postMessage(m);
// Long jobs' chunks go to a pool of nested Web Workers, one per core; made on the first call, its workers on the
// first long job. A browser without nested workers runs the chunks here.
let pool: ChunkPool | undefined | null = null;
const poolOrNone = (): ChunkPool | undefined => {
  if (pool === null) pool = typeof (globalThis as { Worker?: unknown }).Worker === 'function' ? createWebPool() : undefined;
  return pool;
};

type Dispatch = (method: string, payload: unknown, ctx: HandlerContext) => Promise<DispatchResult<unknown>>;
let full: Promise<Dispatch> | null = null;
/** The whole handler table, loaded once (tried again on the next call if the load failed). */
function loadFull(): Promise<Dispatch> {
  full ??= import('../../electron/handlers/dispatch').then(
    (m) => m.dispatch as Dispatch,
    (e: unknown) => {
      full = null;
      throw e;
    },
  );
  return full;
}

/** Runs a call: the plant's methods at once, the others once the whole table is in. */
function route(method: string, payload: unknown, ctx: HandlerContext): Promise<DispatchResult<unknown>> {
  if (Object.hasOwn(plantHandlers, method)) return runHandler(plantHandlers, method as EngineMethod, payload, ctx);
  return loadFull().then(
    (dispatch) => dispatch(method, payload, ctx),
    (e: unknown) => ({ ok: false, error: toErrorShape(new Error(`the engine's handlers did not load (${e instanceof Error ? e.message : String(e)})`)) }),
  );
}

scope.addEventListener('message', (ev: MessageEvent<WorkerRequest>) => {
  const msg = ev.data;
  if (msg.kind === 'cancel') {
    running.get(msg.id)?.abort();
    return;
  }
  const ctl = new AbortController();
  running.set(msg.id, ctl);
  const workers = poolOrNone();
  void route(msg.method, msg.request, {
    signal: ctl.signal,
    ...(workers ? { pool: workers } : {}),
    progress: (fraction, label) => post({ kind: 'progress', event: { id: msg.id, fraction, label } }),
  }).then((outcome) => {
    running.delete(msg.id);
    post({ kind: 'result', id: msg.id, outcome });
    // With the first answer out, the rest of the table loads while the user reads it.
    loadFull().catch(() => undefined);
  });
});

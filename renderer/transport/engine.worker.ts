/** The browser preview's engine host: runs the handler table off the UI thread. */
import type { WorkerReply, WorkerRequest } from '../../shared-types';
import { dispatch } from '../../electron/handlers';
import type { ChunkPool } from '../../electron/handlers';
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

scope.addEventListener('message', (ev: MessageEvent<WorkerRequest>) => {
  const msg = ev.data;
  if (msg.kind === 'cancel') {
    running.get(msg.id)?.abort();
    return;
  }
  const ctl = new AbortController();
  running.set(msg.id, ctl);
  const workers = poolOrNone();
  void dispatch(msg.method, msg.request, {
    signal: ctl.signal,
    ...(workers ? { pool: workers } : {}),
    progress: (fraction, label) => post({ kind: 'progress', event: { id: msg.id, fraction, label } }),
  }).then((outcome) => {
    running.delete(msg.id);
    post({ kind: 'result', id: msg.id, outcome });
  });
});

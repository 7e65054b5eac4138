/** Engine client over a Web Worker (the browser preview). Progress and cancel by request id. */
import type { EngineMethod, EngineRequest, EngineResponse, WorkerReply, WorkerRequest } from '../../shared-types';
import { EngineCallError } from './engine-client';
import type { CallOptions, EngineClient } from './engine-client';

interface Pending {
  resolve(v: unknown): void;
  reject(e: unknown): void;
  onProgress?: CallOptions['onProgress'];
}

/** Minimal worker surface, so tests can pass a fake. */
export interface WorkerLike {
  postMessage(message: WorkerRequest): void;
  addEventListener(type: 'message', listener: (ev: MessageEvent<WorkerReply>) => void): void;
}

/** Creates a client that sends calls to `worker`. */
export function createWorkerClient(worker: WorkerLike): EngineClient {
  let nextId = 1;
  const pending = new Map<number, Pending>();
  worker.addEventListener('message', (ev) => {
    const msg = ev.data;
    if (msg.kind === 'progress') {
      pending.get(msg.event.id)?.onProgress?.(msg.event.fraction, msg.event.label);
      return;
    }
    const p = pending.get(msg.id);
    if (!p) return;
    pending.delete(msg.id);
    if (msg.outcome.ok) p.resolve(msg.outcome.value);
    else p.reject(new EngineCallError(msg.outcome.error));
  });
  return {
    call<K extends EngineMethod>(method: K, request: EngineRequest<K>, options: CallOptions = {}) {
      const id = nextId++;
      return new Promise<EngineResponse<K>>((resolve, reject) => {
        pending.set(id, { resolve: resolve as (v: unknown) => void, reject, onProgress: options.onProgress });
        options.signal?.addEventListener('abort', () => worker.postMessage({ kind: 'cancel', id }), { once: true });
        // Plain data only: strip Vue proxies before structured cloning.
        worker.postMessage({ kind: 'call', id, method, request: JSON.parse(JSON.stringify(request)) as unknown });
      });
    },
  };
}

/** Engine client over Electron IPC, through the preload's `window.droopline` bridge. */
import type { DrooplineBridge, EngineMethod, EngineRequest, EngineResponse } from '../../shared-types';
import { EngineCallError } from './engine-client';
import type { CallOptions, EngineClient } from './engine-client';

/** Creates a client over the preload bridge. */
export function createIpcClient(bridge: DrooplineBridge): EngineClient {
  let nextId = 1;
  const listeners = new Map<number, NonNullable<CallOptions['onProgress']>>();
  bridge.onProgress((e) => listeners.get(e.id)?.(e.fraction, e.label));
  return {
    async call<K extends EngineMethod>(method: K, request: EngineRequest<K>, options: CallOptions = {}) {
      const id = nextId++;
      if (options.onProgress) listeners.set(id, options.onProgress);
      options.signal?.addEventListener('abort', () => bridge.cancel(id), { once: true });
      try {
        const plain = JSON.parse(JSON.stringify(request)) as EngineRequest<K>;
        const outcome = await bridge.invoke(method, id, plain);
        if (!outcome.ok) throw new EngineCallError(outcome.error);
        return outcome.value as EngineResponse<K>;
      } finally {
        listeners.delete(id);
      }
    },
  };
}

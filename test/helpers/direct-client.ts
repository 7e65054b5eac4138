/** An EngineClient that calls the handler table in-process (component tests). */
import { dispatch } from '../../electron/handlers';
import { EngineCallError } from '../../renderer/transport/engine-client';
import type { EngineClient } from '../../renderer/transport/engine-client';
import type { EngineMethod, EngineRequest, EngineResponse } from '../../shared-types';

export function directClient(): EngineClient {
  return {
    async call<K extends EngineMethod>(
      method: K,
      request: EngineRequest<K>,
      options: { onProgress?: (f: number, l?: string) => void; signal?: AbortSignal } = {},
    ) {
      const r = await dispatch(method, JSON.parse(JSON.stringify(request)) as unknown, {
        progress: (f, l) => options.onProgress?.(f, l),
        signal: options.signal ?? new AbortController().signal,
      });
      if (!r.ok) throw new EngineCallError(r.error);
      return r.value as EngineResponse<K>;
    },
  };
}

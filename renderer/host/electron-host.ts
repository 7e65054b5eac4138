/** Host client over the preload bridge (`window.droopline.host`). */
import type { HostBridge, HostMethod, HostRequest } from '../../shared-types';
import { HostCallError } from './host-client';
import type { HostClient } from './host-client';

/** Creates the client over Electron's preload bridge. */
export function createElectronHost(bridge: HostBridge): HostClient {
  return {
    kind: 'electron',
    savesInPlace: true,
    async call<K extends HostMethod>(method: K, request: HostRequest<K>) {
      const plain = JSON.parse(JSON.stringify(request)) as HostRequest<K>;
      const outcome = await bridge.invoke(method, plain);
      if (!outcome.ok) throw new HostCallError(outcome.error);
      return outcome.value;
    },
    onCommand: (listener) => bridge.onCommand(listener),
    async openDropped(file) {
      const outcome = await bridge.openDropped(file);
      if (outcome === null) return null;
      if (!outcome.ok) throw new HostCallError(outcome.error);
      return outcome.value;
    },
  };
}

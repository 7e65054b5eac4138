/** Picks the transport: Electron IPC when the preload bridge is present, else a Web Worker. */
import type { DrooplineBridge } from '../../shared-types';
import type { EngineClient } from './engine-client';
import { createIpcClient } from './ipc-transport';
import { createWorkerClient } from './worker-transport';

export { EngineCallError, messageOf } from './engine-client';
export { keepDemoCheck, takeDemoCheck } from './early';
export type { EngineClient, CallOptions } from './engine-client';

declare global {
  interface Window {
    droopline?: DrooplineBridge;
  }
}

let client: EngineClient | undefined;

/** The app's engine client (created on first use). */
export function engine(): EngineClient {
  if (!client) {
    client = window.droopline
      ? createIpcClient(window.droopline)
      : createWorkerClient(new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module' }));
  }
  return client;
}

/** Replaces the client (tests). */
export function setEngineClient(c: EngineClient | undefined): void {
  client = c;
}

/** Which transport is in use, for the status bar. */
export function transportName(): 'Electron' | 'browser preview' {
  return typeof window !== 'undefined' && window.droopline ? 'Electron' : 'browser preview';
}

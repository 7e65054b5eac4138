/**
 * Preload (sandboxed, CommonJS): forwards `invoke`, `cancel` and progress events, and
 * nothing else. Channel names come from the contract's keys.
 */
import { contextBridge, ipcRenderer } from 'electron';
import type { DrooplineBridge, EngineControl, EngineEvents, ProgressEvent } from '../shared-types';

const PROGRESS: keyof EngineEvents = 'engineProgress';
const CANCEL: keyof EngineControl = 'engineCancel';

const bridge: DrooplineBridge = {
  invoke: (method, id, request) => ipcRenderer.invoke(method, id, request),
  cancel: (id) => ipcRenderer.send(CANCEL, { id }),
  onProgress: (listener) => {
    const wrapped = (_e: unknown, event: ProgressEvent) => listener(event);
    ipcRenderer.on(PROGRESS, wrapped);
    return () => void ipcRenderer.removeListener(PROGRESS, wrapped);
  },
};

contextBridge.exposeInMainWorld('droopline', Object.freeze(bridge));

/**
 * Preload (sandboxed, CommonJS): forwards `invoke`, `cancel` and progress events, the
 * host's file calls and pushed commands, and nothing else. Channel names come from the
 * contract's keys.
 */
import { contextBridge, ipcRenderer, webUtils } from 'electron';
import type { DrooplineBridge, EngineControl, EngineEvents, HostCommand, HostEvents, ProgressEvent } from '../shared-types';

const PROGRESS: keyof EngineEvents = 'engineProgress';
const CANCEL: keyof EngineControl = 'engineCancel';
const COMMAND: keyof HostEvents = 'hostCommand';

const bridge: DrooplineBridge = {
  invoke: (method, id, request) => ipcRenderer.invoke(method, id, request),
  cancel: (id) => ipcRenderer.send(CANCEL, { id }),
  onProgress: (listener) => {
    const wrapped = (_e: unknown, event: ProgressEvent) => listener(event);
    ipcRenderer.on(PROGRESS, wrapped);
    return () => void ipcRenderer.removeListener(PROGRESS, wrapped);
  },
  host: Object.freeze({
    invoke: (method, request) => ipcRenderer.invoke(method, request),
    onCommand: (listener) => {
      const wrapped = (_e: unknown, command: HostCommand) => listener(command);
      ipcRenderer.on(COMMAND, wrapped);
      return () => void ipcRenderer.removeListener(COMMAND, wrapped);
    },
    pathForFile: (file) => webUtils.getPathForFile(file as File),
  } satisfies DrooplineBridge['host']),
};

contextBridge.exposeInMainWorld('droopline', Object.freeze(bridge));

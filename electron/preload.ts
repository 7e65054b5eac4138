/**
 * Preload (sandboxed, CommonJS): forwards `invoke`, `cancel` and progress events, the
 * host's file calls and pushed commands, and nothing else. Channel names come from the
 * contract's keys.
 */
import { contextBridge, ipcRenderer, webUtils } from 'electron';
import { ENGINE_METHODS, HOST_METHODS, HOST_OPEN_DROPPED } from '../shared-types';
import type { DrooplineBridge, EngineControl, EngineEvents, EngineOutcome, HostCommand, HostEvents, HostOutcome, ProgressEvent } from '../shared-types';

const PROGRESS: keyof EngineEvents = 'engineProgress';
const CANCEL: keyof EngineControl = 'engineCancel';
const COMMAND: keyof HostEvents = 'hostCommand';

const ENGINE = new Set<string>(ENGINE_METHODS);
const HOST = new Set<string>(HOST_METHODS);
const notOurs = (method: unknown) => `"${String(method)}" is not a Droopline method.`;
const engineRefused = (method: unknown): EngineOutcome<never> => ({
  ok: false,
  error: { name: 'EngineError', code: 'UNKNOWN_METHOD', message: notOurs(method) },
});
const hostRefused = (method: unknown): HostOutcome<never> => ({ ok: false, error: { name: 'HostError', code: 'REFUSED', message: notOurs(method) } });

const bridge: DrooplineBridge = {
  // Only the contract's channels: the page can never reach a private or foreign channel.
  invoke: (method, id, request) => (ENGINE.has(method) ? ipcRenderer.invoke(method, id, request) : Promise.resolve(engineRefused(method))),
  cancel: (id) => ipcRenderer.send(CANCEL, { id }),
  onProgress: (listener) => {
    const wrapped = (_e: unknown, event: ProgressEvent) => listener(event);
    ipcRenderer.on(PROGRESS, wrapped);
    return () => void ipcRenderer.removeListener(PROGRESS, wrapped);
  },
  host: Object.freeze({
    invoke: (method, request) => (HOST.has(method) ? ipcRenderer.invoke(method, request) : Promise.resolve(hostRefused(method))),
    onCommand: (listener) => {
      const wrapped = (_e: unknown, command: HostCommand) => listener(command);
      ipcRenderer.on(COMMAND, wrapped);
      return () => void ipcRenderer.removeListener(COMMAND, wrapped);
    },
    openDropped: (file) => {
      const path = webUtils.getPathForFile(file as File);
      return path ? ipcRenderer.invoke(HOST_OPEN_DROPPED, { path }) : Promise.resolve(null);
    },
  } satisfies DrooplineBridge['host']),
};

contextBridge.exposeInMainWorld('droopline', Object.freeze(bridge));

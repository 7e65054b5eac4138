/**
 * Registers one IPC handler per contract method. Every payload is `unknown` until the
 * handler table validates it; senders that are not our own window are refused.
 */
import type { IpcMainInvokeEvent, WebContents } from 'electron';
import { ipcMain } from 'electron';
import { ENGINE_METHODS } from '../shared-types';
import type { EngineControl, EngineEvents, EngineOutcome } from '../shared-types';
import { dispatch } from './handlers';
import type { ChunkPool } from './handlers';

const PROGRESS: keyof EngineEvents = 'engineProgress';
const CANCEL: keyof EngineControl = 'engineCancel';

/**
 * Registers the engine channels; `isTrusted` tells whether a sender is one of our windows. `pool` runs the long
 * jobs' chunks on worker threads (without it they run in the main process).
 */
export function setupEngineIpc(isTrusted: (sender: WebContents) => boolean, pool?: ChunkPool): void {
  const running = new Map<number, AbortController>();
  for (const method of ENGINE_METHODS) {
    ipcMain.handle(method, async (event: IpcMainInvokeEvent, id: unknown, request: unknown): Promise<EngineOutcome<unknown>> => {
      if (!isTrusted(event.sender)) {
        return { ok: false, error: { name: 'EngineError', code: 'INVALID_INPUT', message: 'Request refused: unknown sender.' } };
      }
      const reqId = typeof id === 'number' ? id : -1;
      const ctl = new AbortController();
      running.set(reqId, ctl);
      try {
        return await dispatch(method, request, {
          signal: ctl.signal,
          ...(pool ? { pool } : {}),
          progress: (fraction, label) => {
            if (!event.sender.isDestroyed()) event.sender.send(PROGRESS, { id: reqId, fraction, label });
          },
        });
      } finally {
        running.delete(reqId);
      }
    });
  }
  ipcMain.on(CANCEL, (event, payload: unknown) => {
    if (!isTrusted(event.sender)) return;
    const id = (payload as { id?: unknown } | null)?.id;
    if (typeof id === 'number') running.get(id)?.abort();
  });
}

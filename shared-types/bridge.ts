/**
 * What Electron's preload exposes on `window.droopline`, typed from the contract.
 * The browser preview has no bridge and runs the engine in a Web Worker instead.
 */
import type { EngineErrorShape } from './errors';
import type { EngineMethod, EngineRequest, EngineResponse } from './engine-api';
import type { ProgressEvent } from './progress';

/** A call's outcome as it crosses a process or worker boundary. */
export type EngineOutcome<T> = { ok: true; value: T } | { ok: false; error: EngineErrorShape };

/** The preload's one frozen namespace. */
export interface DrooplineBridge {
  invoke<K extends EngineMethod>(method: K, id: number, request: EngineRequest<K>): Promise<EngineOutcome<EngineResponse<K>>>;
  cancel(id: number): void;
  /** Subscribe to progress of long jobs; returns the unsubscribe function. */
  onProgress(listener: (event: ProgressEvent) => void): () => void;
}

/** Messages to the engine worker. */
export type WorkerRequest =
  | { kind: 'call'; id: number; method: EngineMethod; request: unknown }
  | { kind: 'cancel'; id: number };

/** Messages from the engine worker. */
export type WorkerReply =
  | { kind: 'result'; id: number; outcome: EngineOutcome<unknown> }
  | { kind: 'progress'; event: ProgressEvent };

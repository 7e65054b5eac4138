/**
 * What Electron's preload exposes on `window.droopline`, typed from the contract.
 * The browser preview has no bridge and runs the engine in a Web Worker instead.
 */
import type { EngineErrorShape } from './errors';
import type { EngineMethod, EngineRequest, EngineResponse } from './engine-api';
import type { ProgressEvent } from './progress';
import type { HostCommand, HostMethod, HostOutcome, HostRequest, HostResponse, OpenedFile } from './host-api';

/** A call's outcome as it crosses a process or worker boundary. */
export type EngineOutcome<T> = { ok: true; value: T } | { ok: false; error: EngineErrorShape };

/** The preload's one frozen namespace. */
export interface DrooplineBridge {
  invoke<K extends EngineMethod>(method: K, id: number, request: EngineRequest<K>): Promise<EngineOutcome<EngineResponse<K>>>;
  cancel(id: number): void;
  /** Subscribe to progress of long jobs; returns the unsubscribe function. */
  onProgress(listener: (event: ProgressEvent) => void): () => void;
  /** The desktop host's file services (see `host-api.ts`). */
  host: HostBridge;
}

/** The host part of the bridge: file services, and the commands the host pushes. */
export interface HostBridge {
  invoke<K extends HostMethod>(method: K, request: HostRequest<K>): Promise<HostOutcome<HostResponse<K>>>;
  /** Subscribe to menu and window commands; returns the unsubscribe function. */
  onCommand(listener: (command: HostCommand) => void): () => void;
  /**
   * Opens a dropped `File` by the path Electron knows for it (the page never names the path);
   * null when the file has no path (e.g. dragged from a browser). Typed `object`: the
   * contract has no DOM types.
   */
  openDropped(file: object): Promise<HostOutcome<OpenedFile> | null>;
}

/** Messages to the engine worker. */
export type WorkerRequest = { kind: 'call'; id: number; method: EngineMethod; request: unknown } | { kind: 'cancel'; id: number };

/** Messages from the engine worker. */
export type WorkerReply = { kind: 'result'; id: number; outcome: EngineOutcome<unknown> } | { kind: 'progress'; event: ProgressEvent };

/**
 * The renderer's way to the desktop host's file services, typed from the host contract.
 * Only the project store uses it. In Electron it goes through the preload bridge; in the
 * browser preview the same calls are served in the page (`browser-host.ts`).
 */
import type { HostCommand, HostErrorCode, HostErrorShape, HostMethod, HostRequest, HostResponse, OpenedFile } from '../../shared-types';

/** A host failure revived on the renderer side: a sentence for the user. */
export class HostCallError extends Error {
  readonly code: HostErrorCode;
  constructor(shape: HostErrorShape) {
    super(shape.message);
    this.name = 'HostCallError';
    this.code = shape.code;
  }
}

/** A typed host client. */
export interface HostClient {
  /** "electron": real files, backups and a recent list; "browser": download/upload or the File System Access API. */
  readonly kind: 'electron' | 'browser';
  /** Saving writes back to the opened file (false when the browser can only download). */
  readonly savesInPlace: boolean;
  call<K extends HostMethod>(method: K, request: HostRequest<K>): Promise<HostResponse<K>>;
  /** Menu and window commands; returns the unsubscribe function. */
  onCommand(listener: (command: HostCommand) => void): () => void;
  /**
   * Opens a dropped file through the host when it can read it from disk (Electron: by the
   * path Electron knows for it, so it can be saved in place); null when the page should read
   * the file's bytes itself (browser preview, or a file with no path).
   */
  openDropped(file: File): Promise<OpenedFile | null>;
}

/**
 * The host contract: what the desktop shell (Electron main) does for the renderer
 * besides computing — project files, the recovery copy, recent files, the window's
 * document state — and the commands it pushes back (menu items, close requests).
 * Channel names are these keys; nothing else names a host channel.
 *
 * The browser preview implements the same calls in the page (download/upload or the
 * File System Access API; recovery and recent copies in `localStorage`).
 */
import type { Method } from './engine-api';
import { keysOf } from './engine-api';

/** A file the user opened: where it came from and its raw text (parsed by `parseProject`). */
export interface OpenedFile {
  /** Full path in Electron; `null` when the host cannot save back to it (browser upload). */
  path: string | null;
  /** File name shown to the user, e.g. `water-works.droopline.json`. */
  fileName: string;
  text: string;
  /** Full path of the backup beside it (`<file>.bak`, kept by the last save), or null. */
  backupPath: string | null;
}

/** Where a save went. */
export interface SavedFile {
  path: string | null;
  fileName: string;
  /** ISO 8601 time the save completed. */
  savedAt: string;
  /** The previous contents were kept as this backup file (Electron), or null. */
  backupFileName: string | null;
}

/** One entry of the recent-files list (newest first). */
export interface RecentFile {
  /** Full path (Electron) or a key of the copy kept by the browser preview. */
  path: string;
  fileName: string;
  /** Project name at the last open or save. */
  projectName: string;
  /** ISO 8601 time of the last open or save. */
  usedAt: string;
  /** The file was not found when the list was read. */
  missing: boolean;
}

/** The copy autosaved while a project had unsaved changes. */
export interface RecoveryCopy {
  /** ISO 8601 time of the autosave. */
  savedAt: string;
  projectName: string;
  /** File the project belonged to, or null when it was never saved. */
  path: string | null;
  fileName: string | null;
  /** Project text (the project file format). */
  text: string;
}

/** What the window knows about the open document. */
export interface DocumentState {
  projectName: string;
  fileName: string | null;
  path: string | null;
  /** There are changes not yet saved to the file. */
  dirty: boolean;
}

/** Every host method (request → response). */
export interface HostApi {
  /** Show the open dialog; `null` when the user cancels. */
  fileOpenDialog: Method<Record<string, never>, OpenedFile | null>;
  /**
   * Open a file by path: only a path the host itself offered (the command line, the recent
   * list, the backup beside an opened file); any other path is refused. Dropped files go
   * through the preload's `openDropped`, never a path from the page.
   */
  fileOpenPath: Method<{ path: string }, OpenedFile>;
  /** Save atomically to a path the user already chose; the old file becomes the backup. */
  fileSave: Method<{ path: string; text: string }, SavedFile>;
  /** Show the save dialog and save there; `null` when the user cancels. */
  fileSaveAs: Method<{ suggestedName: string; text: string }, SavedFile | null>;
  recentList: Method<Record<string, never>, RecentFile[]>;
  recentClear: Method<Record<string, never>, RecentFile[]>;
  /** The recovery copy left by a session that ended with unsaved changes, if any. */
  recoveryRead: Method<Record<string, never>, RecoveryCopy | null>;
  /** Replace the recovery copy (called a moment after each edit). */
  recoveryWrite: Method<Omit<RecoveryCopy, 'savedAt'>, { savedAt: string }>;
  /** Forget the recovery copy (after a save, a restore or "discard"). */
  recoveryDiscard: Method<Record<string, never>, null>;
  /** Tell the window the document's name and whether it has unsaved changes. */
  documentState: Method<DocumentState, null>;
  /** The renderer finished a "save and close" (or the user chose not to save): close now. */
  windowClose: Method<Record<string, never>, null>;
  /**
   * Print a report page (self-contained HTML, no scripts) to PDF and save it where the user
   * chooses; `null` when the user cancels. Electron only (Chromium's print to PDF).
   */
  reportSavePdf: Method<{ html: string; suggestedName: string }, SavedFile | null>;
}

export type HostMethod = keyof HostApi;
export type HostRequest<K extends HostMethod> = HostApi[K]['request'];
export type HostResponse<K extends HostMethod> = HostApi[K]['response'];

/** Every host method, once (`satisfies Record<HostMethod, true>`: a missing or unknown key is a type error). */
const HOST_METHODS_LISTED = {
  fileOpenDialog: true,
  fileOpenPath: true,
  fileSave: true,
  fileSaveAs: true,
  recentList: true,
  recentClear: true,
  recoveryRead: true,
  recoveryWrite: true,
  recoveryDiscard: true,
  documentState: true,
  windowClose: true,
  reportSavePdf: true,
} as const satisfies Record<HostMethod, true>;
/** Every host method name at run time, derived from the record above. */
export const HOST_METHODS: readonly HostMethod[] = keysOf(HOST_METHODS_LISTED);

/**
 * Channels the preload calls itself and never forwards for the page: the page cannot name
 * them (the preload refuses channel names outside `HOST_METHODS` and `ENGINE_METHODS`).
 */
export interface HostPrivateApi {
  /** Open a dropped file by the path Electron gives for the dropped `File`. */
  hostOpenDropped: Method<{ path: string }, OpenedFile>;
}

/** The drop channel's name (a key of `HostPrivateApi`). */
export const HOST_OPEN_DROPPED = 'hostOpenDropped' as const satisfies keyof HostPrivateApi;

/** Why a host call failed. */
export type HostErrorCode = 'NOT_FOUND' | 'READ_FAILED' | 'WRITE_FAILED' | 'INVALID_INPUT' | 'REFUSED' | 'UNAVAILABLE';

/** A host failure as it crosses the process boundary: a sentence, never a stack trace. */
export interface HostErrorShape {
  name: 'HostError';
  code: HostErrorCode;
  message: string;
}

/** A host call's outcome. */
export type HostOutcome<T> = { ok: true; value: T } | { ok: false; error: HostErrorShape };

/** A command the host pushes to the renderer (application menu, window close). */
export type HostCommand =
  | { command: 'new' | 'open' | 'save' | 'save-as' }
  /** The user asked to close the window with unsaved changes and chose "Save". */
  | { command: 'save-and-close' }
  /** Open a file by path: a recent file, a file given on the command line or by the OS. */
  | { command: 'open-path'; path: string };

/** Events the host pushes to the renderer; keys are channel names. */
export interface HostEvents {
  hostCommand: HostCommand;
}

/** File-name suffix of project files (a JSON document). */
export const PROJECT_FILE_SUFFIX = '.droopline.json' as const;

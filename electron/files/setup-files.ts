/**
 * The main-process file service: open and save dialogs, atomic saves with a backup, the
 * recovery copy, the recent-files list, the window's unsaved-changes state and the
 * question before closing. Registers one IPC handler per host method (senders other than
 * our window refused, every payload checked) and returns what `main.ts` composes with the
 * menu and the command line.
 */
import type { BrowserWindow, IpcMainInvokeEvent, WebContents } from 'electron';
import { dialog, ipcMain } from 'electron';
import { readFile, stat } from 'node:fs/promises';
import { basename, dirname, extname, join, resolve } from 'node:path';
import { HOST_METHODS, HOST_OPEN_DROPPED, PROJECT_FILE_SUFFIX } from '../../shared-types';
import type {
  DocumentState,
  HostCommand,
  HostEvents,
  HostMethod,
  HostOutcome,
  HostRequest,
  HostResponse,
  OpenedFile,
  RecentFile,
  SavedFile,
} from '../../shared-types';
import { formatPath } from '../schemas/validate';
import { parseProject } from '../project';
import { backupPathOf, nodeSaveSteps, removeStaleTemps, writeFileAtomic } from './atomic-write';
import type { SaveSteps } from './atomic-write';
import { HostFailure, hostErrorOf } from './host-error';
import { printHtmlToPdf } from './print-pdf';
import { dropRequestSchema, hostRequestSchemas } from './host-requests';
import { addRecent, clearRecent, listRecent } from './recent-files';
import { discardRecovery, readRecovery, recoveryPathOf, writeRecovery } from './recovery-store';

const COMMAND: keyof HostEvents = 'hostCommand';
/** Largest file Droopline opens, bytes. */
export const MAX_OPEN_BYTES = 50 * 1024 * 1024;
const OPENABLE = ['.json', '.bak'];
const FILTERS = [
  { name: 'Droopline project or plant (*.json)', extensions: ['json'] },
  { name: 'All files', extensions: ['*'] },
];

/** What `setupFiles` needs from the app. */
export interface FilesOptions {
  /** The app's user-data folder (recovery copy, recent list). */
  userDataDir: string;
  /** Where Save As starts for a project never saved (the user's documents folder). */
  documentsDir: string;
  /** Whether a sender is one of our windows. */
  isTrusted(sender: WebContents): boolean;
  /** The main window, when there is one. */
  window(): BrowserWindow | null;
  /** Called whenever the recent list changes (the menu rebuilds its submenu). */
  onRecentChanged?(files: RecentFile[]): void;
  /** File-system steps of a save (tests interrupt them). */
  steps?: SaveSteps;
  /** Clock (tests). */
  now?(): Date;
  /** Renders report HTML to PDF bytes (tests replace Chromium's print engine). */
  printPdf?(html: string): Promise<Uint8Array>;
}

/** What `main.ts` composes with the menu, the command line and the window. */
export interface FilesService {
  /** Pushes a command (menu item) to the renderer. */
  command(command: HostCommand): void;
  /** Asks the renderer to open a file given by path (command line, second instance); offers the path first. */
  openPath(path: string): void;
  /** Marks a path as offered by the host (the page may then open it by path) without asking the renderer. */
  offer(path: string): void;
  /** Asks before closing `win` while it has unsaved changes. */
  guardClose(win: BrowserWindow): void;
  /** The recent list (for the menu). */
  recent(): Promise<RecentFile[]>;
  /** Resolves when the start-up clean-up of stale temporary files has run. */
  cleaned(): Promise<void>;
}

/**
 * The project file given on a command line (`droopline plant.json`), if any, as an absolute
 * path resolved against `cwd` (the launching shell's folder; a second instance passes its own).
 */
export function fileFromArgv(argv: readonly string[], cwd: string = process.cwd()): string | null {
  const files = argv.slice(1).filter((a) => !a.startsWith('-') && OPENABLE.includes(extname(a).toLowerCase()));
  const file = files.at(-1);
  return file === undefined ? null : resolve(cwd, file);
}

/** Adds the project suffix when a chosen name has no `.json` extension. */
export function withProjectSuffix(path: string): string {
  return extname(path).toLowerCase() === '.json' ? path : `${path}${PROJECT_FILE_SUFFIX}`;
}

/** A file name made safe from a project name (no path separators or reserved characters). */
export function fileNameFor(projectName: string): string {
  const safe = projectName
    // eslint-disable-next-line no-control-regex -- control characters are exactly what must go
    .replace(/[\\/:*?"<>|\u0000-\u001f]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim()
    .slice(0, 120);
  return withProjectSuffix(safe || 'Untitled project');
}

/** What each method does, for messages about unexpected failures. */
const TASK: Record<HostMethod, string> = {
  fileOpenDialog: 'open the file',
  fileOpenPath: 'open the file',
  fileSave: 'save the file',
  fileSaveAs: 'save the file',
  recentList: 'read the recent-files list',
  recentClear: 'clear the recent-files list',
  recoveryRead: 'read the recovery copy',
  recoveryWrite: 'keep the recovery copy',
  recoveryDiscard: 'remove the recovery copy',
  documentState: 'update the window',
  windowClose: 'close the window',
  reportSavePdf: 'save the report as PDF',
};

function checkOpenable(path: string): void {
  if (!OPENABLE.includes(extname(path).toLowerCase())) {
    throw new HostFailure('REFUSED', `"${basename(path)}" is not a Droopline file: Droopline opens project and plant files (.json) and their backups (.bak).`);
  }
}

type Runner = { [K in HostMethod]: (request: HostRequest<K>, sender: WebContents) => Promise<HostResponse<K>> };

/** Registers the host channels and returns the service. */
export function setupFiles(options: FilesOptions): FilesService {
  const steps = options.steps ?? nodeSaveSteps;
  const now = options.now ?? (() => new Date());
  /** Paths the user chose or opened: the only ones `fileSave` may write. */
  const granted = new Set<string>();
  /**
   * Paths the host itself offered for opening by path (command line, backups beside opened
   * files); the recent list is read at the time of the call. A path from the page alone is
   * never opened, so the page cannot read or gain write access to an arbitrary file.
   */
  const offered = new Set<string>();
  let doc: DocumentState = { projectName: '', fileName: null, path: null, dirty: false };
  let lastDir: string | null = null;
  let allowClose = false;
  let asking = false;

  const recentChanged = (files: RecentFile[]) => options.onRecentChanged?.(files);
  // Recent-list reads and writes run one after another, so a read never overtakes a pending write.
  let recentQueue: Promise<unknown> = Promise.resolve();
  function serial<T>(work: () => Promise<T>): Promise<T> {
    const next = recentQueue.then(work);
    recentQueue = next.catch(() => undefined);
    return next;
  }

  async function readOpened(path: string): Promise<OpenedFile> {
    const fileName = basename(path);
    let size: number;
    try {
      const s = await stat(path);
      if (!s.isFile()) throw new HostFailure('NOT_FOUND', `"${fileName}" is a folder, not a file.`);
      size = s.size;
    } catch (e) {
      throw hostErrorOf(e, 'open', path);
    }
    if (size > MAX_OPEN_BYTES) throw new HostFailure('INVALID_INPUT', `"${fileName}" is too large to be a Droopline file (${Math.round(size / 1048576)} MB).`);
    let text: string;
    try {
      text = await readFile(path, 'utf8');
    } catch (e) {
      throw hostErrorOf(e, 'open', path);
    }
    granted.add(path);
    lastDir = dirname(path);
    void removeStaleTemps(path, steps);
    const backup = backupPathOf(path);
    const backupPath = extname(path).toLowerCase() !== '.bak' && (await steps.exists(backup)) ? backup : null;
    if (backupPath) offered.add(backupPath);
    return { path, fileName, text, backupPath };
  }

  async function save(path: string, text: string): Promise<SavedFile> {
    try {
      parseProject(text);
    } catch (e) {
      throw new HostFailure('INVALID_INPUT', `The project was not saved because it would not open again: ${(e as Error).message}`);
    }
    let backupPath: string | null;
    try {
      ({ backupPath } = await writeFileAtomic(path, text, { steps }));
    } catch (e) {
      throw hostErrorOf(e, 'save', path);
    }
    granted.add(path);
    lastDir = dirname(path);
    return { path, fileName: basename(path), savedAt: now().toISOString(), backupFileName: backupPath ? basename(backupPath) : null };
  }

  const run: Runner = {
    async fileOpenDialog() {
      const win = options.window();
      const dialogOptions = { title: 'Open project', properties: ['openFile' as const], filters: FILTERS, ...(lastDir ? { defaultPath: lastDir } : {}) };
      const r = win ? await dialog.showOpenDialog(win, dialogOptions) : await dialog.showOpenDialog(dialogOptions);
      const path = r.filePaths[0];
      return r.canceled || !path ? null : readOpened(path);
    },
    async fileOpenPath({ path }) {
      checkOpenable(path);
      const listed = offered.has(path) || granted.has(path) || (await serial(() => listRecent(options.userDataDir))).some((f) => f.path === path);
      if (!listed) {
        throw new HostFailure('REFUSED', `Droopline opens "${basename(path)}" only from the Open dialog, a dropped file, the recent list or the command line.`);
      }
      return readOpened(path);
    },
    async fileSave({ path, text }) {
      if (!granted.has(path)) throw new HostFailure('REFUSED', `Droopline saves only to files you opened or chose; use Save As for "${basename(path)}".`);
      return save(path, text);
    },
    async fileSaveAs({ suggestedName, text }) {
      const win = options.window();
      const defaultPath = join(lastDir ?? (doc.path ? dirname(doc.path) : options.documentsDir), fileNameFor(suggestedName));
      const dialogOptions = { title: 'Save project as', defaultPath, filters: FILTERS };
      const r = win ? await dialog.showSaveDialog(win, dialogOptions) : await dialog.showSaveDialog(dialogOptions);
      if (r.canceled || !r.filePath) return null;
      return save(withProjectSuffix(r.filePath), text);
    },
    recentList: () => serial(() => listRecent(options.userDataDir)),
    recentClear: () =>
      serial(async () => {
        const files = await clearRecent(options.userDataDir);
        recentChanged(files);
        return files;
      }),
    recoveryRead: () => readRecovery(options.userDataDir),
    async recoveryWrite(copy) {
      const savedAt = now().toISOString();
      await writeRecovery(options.userDataDir, { ...copy, savedAt }, steps);
      return { savedAt };
    },
    async recoveryDiscard() {
      await discardRecovery(options.userDataDir, steps);
      return null;
    },
    documentState: (state) =>
      serial(async () => {
        const before = doc;
        // Only a file this service opened or saved may be named: the page cannot slip a path of
        // its own into the recent list (and so into open-by-path).
        if (state.path !== null && !granted.has(state.path)) {
          throw new HostFailure('REFUSED', `"${basename(state.path)}" was not opened or saved in this window.`);
        }
        doc = state;
        const win = options.window();
        if (win && !win.isDestroyed()) {
          win.setDocumentEdited(state.dirty);
          if (state.path) win.setRepresentedFilename(state.path);
        }
        // A file is "recent" once it opened or saved cleanly: list it when the document's file or name changes.
        if (state.path && !state.dirty && (state.path !== before.path || state.projectName !== before.projectName || before.dirty)) {
          recentChanged(await addRecent(options.userDataDir, state.path, state.projectName, now().toISOString()));
        }
        return null;
      }),
    async reportSavePdf({ html, suggestedName }) {
      const win = options.window();
      const stem = suggestedName.replace(/[\\/:*?"<>|]+/g, '-').trim() || 'report';
      const defaultPath = join(lastDir ?? (doc.path ? dirname(doc.path) : options.documentsDir), /\.pdf$/i.test(stem) ? stem : `${stem}.pdf`);
      const dialogOptions = { title: 'Save report as PDF', defaultPath, filters: [{ name: 'PDF (*.pdf)', extensions: ['pdf'] }] };
      const r = win ? await dialog.showSaveDialog(win, dialogOptions) : await dialog.showSaveDialog(dialogOptions);
      if (r.canceled || !r.filePath) return null;
      const path = /\.pdf$/i.test(r.filePath) ? r.filePath : `${r.filePath}.pdf`;
      const pdf = await (options.printPdf ?? printHtmlToPdf)(html);
      try {
        await writeFileAtomic(path, pdf, { steps, backup: false });
      } catch (e) {
        throw hostErrorOf(e, 'save', path);
      }
      lastDir = dirname(path);
      return { path, fileName: basename(path), savedAt: now().toISOString(), backupFileName: null };
    },
    async windowClose() {
      const win = options.window();
      allowClose = true;
      if (win && !win.isDestroyed()) win.close();
      return null;
    },
  };

  for (const method of HOST_METHODS) {
    ipcMain.handle(method, async (event: IpcMainInvokeEvent, request: unknown): Promise<HostOutcome<unknown>> => {
      if (!options.isTrusted(event.sender)) return { ok: false, error: { name: 'HostError', code: 'REFUSED', message: 'Request refused: unknown sender.' } };
      const parsed = hostRequestSchemas[method].safeParse(request);
      if (!parsed.success) {
        const message = parsed.error.issues.map((i) => `${formatPath(i.path)}: ${i.message}`).join('\n');
        return { ok: false, error: { name: 'HostError', code: 'INVALID_INPUT', message } };
      }
      try {
        const value = await (run[method] as (r: unknown, s: WebContents) => Promise<unknown>)(parsed.data, event.sender);
        return { ok: true, value };
      } catch (e) {
        const failure =
          e instanceof HostFailure ? e : new HostFailure('UNAVAILABLE', `Could not ${TASK[method]}: ${e instanceof Error ? e.message : String(e)}`);
        return { ok: false, error: failure.shape() };
      }
    });
  }

  // The drop channel: called by the preload only, with the path Electron gives for a dropped File.
  ipcMain.handle(HOST_OPEN_DROPPED, async (event: IpcMainInvokeEvent, request: unknown): Promise<HostOutcome<unknown>> => {
    if (!options.isTrusted(event.sender)) return { ok: false, error: { name: 'HostError', code: 'REFUSED', message: 'Request refused: unknown sender.' } };
    const parsed = dropRequestSchema.safeParse(request);
    if (!parsed.success)
      return {
        ok: false,
        error: { name: 'HostError', code: 'INVALID_INPUT', message: parsed.error.issues.map((i) => `${formatPath(i.path)}: ${i.message}`).join('\n') },
      };
    try {
      checkOpenable(parsed.data.path);
      return { ok: true, value: await readOpened(parsed.data.path) };
    } catch (e) {
      const failure = e instanceof HostFailure ? e : new HostFailure('UNAVAILABLE', `Could not open the file: ${e instanceof Error ? e.message : String(e)}`);
      return { ok: false, error: failure.shape() };
    }
  });

  // At start: leftovers of saves that died with the last session (recovery copy, recent files).
  const cleaned: Promise<void> = (async () => {
    await removeStaleTemps(recoveryPathOf(options.userDataDir), steps);
    for (const f of await listRecent(options.userDataDir).catch(() => [])) await removeStaleTemps(f.path, steps);
  })().catch(() => undefined);

  function send(command: HostCommand): void {
    const win = options.window();
    if (win && !win.isDestroyed()) win.webContents.send(COMMAND, command);
  }

  return {
    command: send,
    openPath: (path) => {
      offered.add(path);
      send({ command: 'open-path', path });
    },
    offer: (path) => void offered.add(path),
    recent: () => serial(() => listRecent(options.userDataDir)),
    cleaned: () => cleaned,
    guardClose(win) {
      win.on('close', (event) => {
        if (allowClose || !doc.dirty) return;
        event.preventDefault();
        if (asking) return;
        asking = true;
        const name = doc.fileName ?? doc.projectName ?? 'this project';
        void dialog
          .showMessageBox(win, {
            type: 'warning',
            buttons: ['Save', "Don't save", 'Cancel'],
            defaultId: 0,
            cancelId: 2,
            noLink: true,
            title: 'Unsaved changes',
            message: `Save the changes to "${name}" before closing?`,
            detail: 'If you do not save, the changes since the last save are lost.',
          })
          .then(async ({ response }) => {
            asking = false;
            if (response === 0) send({ command: 'save-and-close' });
            else if (response === 1) {
              await discardRecovery(options.userDataDir, steps).catch(() => undefined);
              allowClose = true;
              win.close();
            }
          });
      });
    },
  };
}

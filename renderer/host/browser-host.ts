/**
 * The browser preview's host: the same file calls served in the page. Opening reads a
 * file the user picks (File System Access API where the browser has it, else an upload);
 * saving writes back through that API, or downloads the file. The recovery copy and the
 * recent list (with a copy of each file's text, since a page cannot reopen files by path)
 * live in `localStorage`. Leaving the page with unsaved changes asks first.
 */
import { PROJECT_FILE_SUFFIX } from '../../shared-types';
import type { DocumentState, HostCommand, HostMethod, HostRequest, HostResponse, OpenedFile, RecentFile, RecoveryCopy, SavedFile } from '../../shared-types';
import { HostCallError } from './host-client';
import type { HostClient } from './host-client';

/** The parts of the File System Access API used here (not yet in TypeScript's DOM types). */
interface WritableFile {
  write(data: string): Promise<void>;
  close(): Promise<void>;
}
interface PickedFile {
  name: string;
  getFile(): Promise<File>;
  createWritable(): Promise<WritableFile>;
}
interface PickerWindow {
  showOpenFilePicker?(options: unknown): Promise<PickedFile[]>;
  showSaveFilePicker?(options: unknown): Promise<PickedFile>;
}

/** `localStorage` keys. */
export const RECOVERY_KEY = 'droopline.recovery';
export const RECENT_KEY = 'droopline.recent';
/** Recent copies kept by the browser. */
const MAX_RECENT = 5;
const PICKER_TYPES = [{ description: 'Droopline project or plant', accept: { 'application/json': ['.json'] } }];
const HANDLE_PREFIX = 'picked:';
const RECENT_PREFIX = 'recent-copy:';

type StoredRecent = Omit<RecentFile, 'missing'> & { text: string };

const fail = (code: 'NOT_FOUND' | 'READ_FAILED' | 'WRITE_FAILED' | 'UNAVAILABLE', message: string): never => {
  throw new HostCallError({ name: 'HostError', code, message });
};
const isAbort = (e: unknown) => e instanceof DOMException && e.name === 'AbortError';

/** A file name for a download or the save picker. */
function fileNameFor(projectName: string): string {
  const safe =
    projectName
      .replace(/[\\/:*?"<>|]+/g, ' ')
      .replace(/\s+/g, ' ')
      .trim()
      .slice(0, 120) || 'Untitled project';
  return safe.toLowerCase().endsWith('.json') ? safe : `${safe}${PROJECT_FILE_SUFFIX}`;
}

/** Creates the browser host over `win` (the page's window) and its `localStorage`. */
export function createBrowserHost(win: Window & typeof globalThis = window): HostClient {
  const picker = win as unknown as PickerWindow;
  const storage = win.localStorage;
  const handles = new Map<string, PickedFile>();
  let nextHandle = 1;
  /** The text last opened or saved: copied into the recent list when the document is clean. */
  let lastText: { fileName: string; text: string } | null = null;
  let doc: DocumentState = { projectName: '', fileName: null, path: null, dirty: false };

  win.addEventListener('beforeunload', (e) => {
    if (!doc.dirty) return;
    // The browser shows its own "leave page?" question; the recovery copy is kept either way.
    e.preventDefault();
    e.returnValue = '';
  });

  const readJson = <T>(key: string, fallback: T): T => {
    try {
      const raw = storage.getItem(key);
      return raw === null ? fallback : (JSON.parse(raw) as T);
    } catch {
      return fallback;
    }
  };
  const storedRecent = (): StoredRecent[] => {
    const list = readJson<unknown>(RECENT_KEY, []);
    return Array.isArray(list) ? (list as StoredRecent[]).filter((r) => typeof r?.path === 'string' && typeof r.text === 'string') : [];
  };
  const writeRecent = (list: StoredRecent[]): void => {
    // A full storage drops the oldest copies rather than failing the save that triggered it.
    for (let n = list.length; n >= 0; n--) {
      try {
        storage.setItem(RECENT_KEY, JSON.stringify(list.slice(0, n)));
        return;
      } catch {
        continue;
      }
    }
  };
  const publicRecent = (list: StoredRecent[]): RecentFile[] => list.map(({ text: _text, ...r }) => ({ ...r, missing: false }));

  async function opened(file: File, path: string | null): Promise<OpenedFile> {
    let text: string;
    try {
      text = await file.text();
    } catch {
      return fail('READ_FAILED', `Could not read "${file.name}".`);
    }
    lastText = { fileName: file.name, text };
    return { path, fileName: file.name, text, backupPath: null };
  }

  function upload(): Promise<File | null> {
    return new Promise((resolve) => {
      const input = win.document.createElement('input');
      input.type = 'file';
      input.accept = '.json,application/json';
      input.addEventListener('change', () => resolve(input.files?.[0] ?? null), { once: true });
      input.addEventListener('cancel', () => resolve(null), { once: true });
      input.click();
    });
  }

  function download(fileName: string, text: string): void {
    const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
    const a = win.document.createElement('a');
    a.href = url;
    a.download = fileName;
    a.rel = 'noopener';
    a.style.display = 'none';
    win.document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }

  async function writeTo(handle: PickedFile, text: string): Promise<void> {
    // The browser writes to a temporary file and swaps it in on close(): the same promise as an atomic save.
    try {
      const w = await handle.createWritable();
      await w.write(text);
      await w.close();
    } catch (e) {
      fail('WRITE_FAILED', `Could not save "${handle.name}": ${e instanceof Error ? e.message : String(e)}. The file was not changed.`);
    }
  }

  const saved = (path: string | null, fileName: string, text: string): SavedFile => {
    lastText = { fileName, text };
    return { path, fileName, savedAt: new Date().toISOString(), backupFileName: null };
  };

  const run: { [K in HostMethod]: (r: HostRequest<K>) => Promise<HostResponse<K>> } = {
    async fileOpenDialog() {
      if (picker.showOpenFilePicker) {
        try {
          const [handle] = await picker.showOpenFilePicker({ types: PICKER_TYPES, multiple: false });
          if (!handle) return null;
          const key = `${HANDLE_PREFIX}${nextHandle++}`;
          handles.set(key, handle);
          return opened(await handle.getFile(), key);
        } catch (e) {
          if (isAbort(e)) return null;
          throw e;
        }
      }
      const file = await upload();
      return file ? opened(file, null) : null;
    },
    async fileOpenPath({ path }) {
      const handle = handles.get(path);
      if (handle) return opened(await handle.getFile(), path);
      const copy = storedRecent().find((r) => r.path === path);
      if (!copy) return fail('NOT_FOUND', 'That file is not available in the browser preview any more.');
      lastText = { fileName: copy.fileName, text: copy.text };
      // A copy, not the file: saving must go through Save As.
      return { path: null, fileName: copy.fileName, text: copy.text, backupPath: null };
    },
    async fileSave({ path, text }) {
      const handle = handles.get(path);
      if (!handle) return fail('UNAVAILABLE', 'The browser preview cannot save to that file; use Save As.');
      await writeTo(handle, text);
      return saved(path, handle.name, text);
    },
    async fileSaveAs({ suggestedName, text }) {
      const name = fileNameFor(suggestedName);
      if (picker.showSaveFilePicker) {
        let handle: PickedFile;
        try {
          handle = await picker.showSaveFilePicker({ suggestedName: name, types: PICKER_TYPES });
        } catch (e) {
          if (isAbort(e)) return null;
          throw e;
        }
        await writeTo(handle, text);
        const key = `${HANDLE_PREFIX}${nextHandle++}`;
        handles.set(key, handle);
        return saved(key, handle.name, text);
      }
      download(name, text);
      return saved(null, name, text);
    },
    recentList: async () => publicRecent(storedRecent()),
    async recentClear() {
      storage.removeItem(RECENT_KEY);
      return [];
    },
    async recoveryRead() {
      const r = readJson<Partial<RecoveryCopy> | null>(RECOVERY_KEY, null);
      if (!r || typeof r.text !== 'string' || typeof r.savedAt !== 'string') return null;
      return { savedAt: r.savedAt, projectName: r.projectName ?? 'Untitled project', path: r.path ?? null, fileName: r.fileName ?? null, text: r.text };
    },
    async recoveryWrite(copy) {
      const savedAt = new Date().toISOString();
      try {
        storage.setItem(RECOVERY_KEY, JSON.stringify({ ...copy, savedAt }));
      } catch {
        fail('WRITE_FAILED', 'The browser refused to keep a recovery copy (storage full or disabled).');
      }
      return { savedAt };
    },
    async recoveryDiscard() {
      storage.removeItem(RECOVERY_KEY);
      return null;
    },
    async documentState(state) {
      doc = state;
      if (!state.dirty && lastText && state.fileName === lastText.fileName) {
        const entry: StoredRecent = {
          path: `${RECENT_PREFIX}${state.fileName}`,
          fileName: state.fileName,
          projectName: state.projectName,
          usedAt: new Date().toISOString(),
          text: lastText.text,
        };
        writeRecent([entry, ...storedRecent().filter((r) => r.path !== entry.path)].slice(0, MAX_RECENT));
        lastText = null;
      }
      return null;
    },
    // A page cannot close its own tab; the store's "save and close" ends after the save.
    windowClose: async () => null,
    reportSavePdf: async () => fail('UNAVAILABLE', 'The browser preview makes a PDF through Print… (choose "Save as PDF" in the print dialog).'),
  };

  return {
    kind: 'browser',
    savesInPlace: typeof picker.showSaveFilePicker === 'function',
    call: <K extends HostMethod>(method: K, request: HostRequest<K>) => run[method](request),
    onCommand(listener: (command: HostCommand) => void) {
      // No application menu in a page: the usual shortcuts stand in for it.
      const onKey = (e: KeyboardEvent) => {
        if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
        const key = e.key.toLowerCase();
        const command: HostCommand | null =
          key === 's' ? { command: e.shiftKey ? 'save-as' : 'save' } : key === 'o' && !e.shiftKey ? { command: 'open' } : null;
        if (!command) return;
        e.preventDefault();
        listener(command);
      };
      win.addEventListener('keydown', onKey);
      return () => win.removeEventListener('keydown', onKey);
    },
    openDropped: () => Promise.resolve(null),
  };
}

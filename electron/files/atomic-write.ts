/**
 * Atomic save: the new text goes to a temporary file in the same folder, is flushed to
 * disk, and only then renamed over the target (a rename within one folder replaces the
 * target in one step on every desktop file system). The previous file is first copied to
 * `<file>.bak` the same way. If the process dies at any point, the target is either the
 * complete old file or the complete new one; a leftover temporary file is removed by the
 * next save, and at start and on open (`removeStaleTemps`).
 */
import { randomBytes } from 'node:crypto';
import { open, readdir, readFile, rename, rm, stat } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

/** The file-system steps of a save; tests replace single steps to interrupt the write path. */
export interface SaveSteps {
  /** Create `path` (must not exist), write `data`, flush it to disk and close it. */
  writeNew(path: string, data: string | Uint8Array): Promise<void>;
  readBytes(path: string): Promise<Uint8Array>;
  rename(from: string, to: string): Promise<void>;
  remove(path: string): Promise<void>;
  exists(path: string): Promise<boolean>;
  /** Names in a folder, with their age in ms. */
  list(dir: string): Promise<{ name: string; ageMs: number }[]>;
  /** Flush a folder's entries (the renames) to disk; a no-op where folders cannot be opened. */
  syncDir(dir: string): Promise<void>;
}

/** The real steps over `node:fs`. */
export const nodeSaveSteps: SaveSteps = {
  async writeNew(path, data) {
    const handle = await open(path, 'wx', 0o644);
    try {
      await handle.writeFile(data);
      await handle.sync();
    } finally {
      await handle.close();
    }
  },
  readBytes: (path) => readFile(path),
  rename: (from, to) => rename(from, to),
  remove: (path) => rm(path, { force: true }),
  async exists(path) {
    try {
      await stat(path);
      return true;
    } catch {
      return false;
    }
  },
  async list(dir) {
    const now = Date.now();
    const names = await readdir(dir);
    const out: { name: string; ageMs: number }[] = [];
    for (const name of names) {
      try {
        out.push({ name, ageMs: now - (await stat(join(dir, name))).mtimeMs });
      } catch {
        // Gone between readdir and stat: nothing to clean.
      }
    }
    return out;
  },
  async syncDir(dir) {
    if (process.platform === 'win32') return;
    let handle;
    try {
      handle = await open(dir, 'r');
      await handle.sync();
    } catch {
      // Some file systems refuse to open or flush folders; the rename itself stays atomic.
    } finally {
      await handle?.close();
    }
  },
};

/** Name of the backup kept beside `path`. */
export function backupPathOf(path: string): string {
  return `${path}.bak`;
}

const TEMP_SUFFIX = '.tmp';
/** Temporary files of a save start with this prefix (hidden on Unix-like systems). */
function tempPrefix(path: string): string {
  return `.${basename(path)}.`;
}
/** Leftovers older than this are from a save that died; younger ones may be another save running. */
const STALE_TEMP_MS = 10 * 60 * 1000;

/** Options of `writeFileAtomic`. */
export interface AtomicWriteOptions {
  /** Keep the previous file as `<file>.bak` (default true). */
  backup?: boolean;
  /** The file-system steps (tests inject failures). */
  steps?: SaveSteps;
}

/**
 * Writes `text` to `path` atomically, keeping the previous file as `<path>.bak`.
 * @returns the backup's path, or null when there was no previous file (or `backup` is false).
 * @throws the file system's error; the target and its backup are then as they were.
 */
export async function writeFileAtomic(path: string, text: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<{ backupPath: string | null }> {
  const steps = options.steps ?? nodeSaveSteps;
  const dir = dirname(path);
  const token = `${process.pid}-${randomBytes(4).toString('hex')}`;
  const temp = join(dir, `${tempPrefix(path)}${token}${TEMP_SUFFIX}`);
  const backupTemp = join(dir, `${tempPrefix(path)}${token}.bak${TEMP_SUFFIX}`);
  let backupPath: string | null = null;
  try {
    await steps.writeNew(temp, text);
    if (options.backup !== false && (await steps.exists(path))) {
      // Copy, not rename: the target must exist at every instant.
      await steps.writeNew(backupTemp, await steps.readBytes(path));
      await steps.rename(backupTemp, backupPathOf(path));
      backupPath = backupPathOf(path);
    }
    await steps.rename(temp, path);
    await steps.syncDir(dir);
  } catch (e) {
    await steps.remove(temp).catch(() => undefined);
    await steps.remove(backupTemp).catch(() => undefined);
    throw e;
  }
  await removeStaleTemps(path, steps);
  return { backupPath };
}

/**
 * Removes the temporary files that saves of `path` left behind when they died (older than
 * ten minutes, so a save running in another window is never disturbed). Never throws.
 */
export async function removeStaleTemps(path: string, steps: SaveSteps = nodeSaveSteps): Promise<void> {
  const prefix = tempPrefix(path);
  try {
    for (const f of await steps.list(dirname(path))) {
      if (f.name.startsWith(prefix) && f.name.endsWith(TEMP_SUFFIX) && f.ageMs > STALE_TEMP_MS) {
        await steps.remove(join(dirname(path), f.name));
      }
    }
  } catch {
    // Cleaning up is a courtesy; the save itself succeeded.
  }
}

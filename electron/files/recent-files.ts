/**
 * The recent-files list, kept as JSON in the user-data folder (newest first, at most
 * `MAX_RECENT`). Files that have gone missing stay listed, marked, until the user opens
 * something else or clears the list.
 */
import { mkdir, readFile, stat } from 'node:fs/promises';
import { basename, join } from 'node:path';
import type { RecentFile } from '../../shared-types';
import { writeFileAtomic } from './atomic-write';

/** Longest recent-files list. */
export const MAX_RECENT = 10;
const RECENT_FORMAT = 'droopline.recent';

/** Where the list lives under `userDataDir`. */
export function recentPathOf(userDataDir: string): string {
  return join(userDataDir, 'recent-files.json');
}

type Stored = Omit<RecentFile, 'missing'>;

async function readStored(userDataDir: string): Promise<Stored[]> {
  try {
    const raw = JSON.parse(await readFile(recentPathOf(userDataDir), 'utf8')) as { format?: unknown; files?: unknown };
    if (raw.format !== RECENT_FORMAT || !Array.isArray(raw.files)) return [];
    return (raw.files as Partial<Stored>[])
      .filter(
        (f): f is Stored => typeof f.path === 'string' && typeof f.fileName === 'string' && typeof f.projectName === 'string' && typeof f.usedAt === 'string',
      )
      .slice(0, MAX_RECENT);
  } catch {
    // No list yet, or a damaged one: start a new list rather than fail.
    return [];
  }
}

async function exists(path: string): Promise<boolean> {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}

async function withMissing(files: Stored[]): Promise<RecentFile[]> {
  return Promise.all(files.map(async (f) => ({ ...f, missing: !(await exists(f.path)) })));
}

async function store(userDataDir: string, files: Stored[]): Promise<void> {
  await mkdir(userDataDir, { recursive: true });
  await writeFileAtomic(recentPathOf(userDataDir), `${JSON.stringify({ format: RECENT_FORMAT, version: 1, files }, null, 2)}\n`, { backup: false });
}

/** The list, newest first, each marked when its file is missing. */
export async function listRecent(userDataDir: string): Promise<RecentFile[]> {
  return withMissing(await readStored(userDataDir));
}

/** Puts `path` at the top of the list (once) and returns the new list. */
export async function addRecent(userDataDir: string, path: string, projectName: string, usedAt: string): Promise<RecentFile[]> {
  const files = [{ path, fileName: basename(path), projectName, usedAt }, ...(await readStored(userDataDir)).filter((f) => f.path !== path)].slice(
    0,
    MAX_RECENT,
  );
  await store(userDataDir, files);
  return withMissing(files);
}

/** Empties the list. */
export async function clearRecent(userDataDir: string): Promise<RecentFile[]> {
  await store(userDataDir, []);
  return [];
}

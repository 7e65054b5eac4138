/**
 * The recovery copy: while a project has unsaved changes, the renderer sends its text
 * here a moment after each edit, and it is written atomically to the user-data folder.
 * A clean close or a save removes it, so finding one at start means the last session
 * ended (crash, kill, power loss) with work that was never saved.
 */
import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { RecoveryCopy } from '../../shared-types';
import { nodeSaveSteps, writeFileAtomic } from './atomic-write';
import type { SaveSteps } from './atomic-write';

const RECOVERY_FORMAT = 'droopline.recovery';
const RECOVERY_FILE = 'recovery.json';

/** Where the recovery copy lives under `userDataDir`. */
export function recoveryPathOf(userDataDir: string): string {
  return join(userDataDir, 'recovery', RECOVERY_FILE);
}

/** Writes the recovery copy (replacing the last one) and returns its time stamp. */
export async function writeRecovery(userDataDir: string, copy: RecoveryCopy, steps: SaveSteps = nodeSaveSteps): Promise<void> {
  const path = recoveryPathOf(userDataDir);
  await mkdir(join(userDataDir, 'recovery'), { recursive: true });
  await writeFileAtomic(path, JSON.stringify({ format: RECOVERY_FORMAT, version: 1, ...copy }), { backup: false, steps });
}

const isText = (v: unknown): v is string => typeof v === 'string';

/**
 * Reads the recovery copy, or null when there is none. A damaged copy (it is written
 * atomically, so this means outside interference) also reads as null.
 */
export async function readRecovery(userDataDir: string): Promise<RecoveryCopy | null> {
  let raw: unknown;
  try {
    raw = JSON.parse(await readFile(recoveryPathOf(userDataDir), 'utf8')) as unknown;
  } catch {
    return null;
  }
  const r = raw as Partial<Record<keyof RecoveryCopy | 'format', unknown>> | null;
  if (!r || r.format !== RECOVERY_FORMAT || !isText(r.text) || !isText(r.savedAt) || !isText(r.projectName)) return null;
  return {
    savedAt: r.savedAt,
    projectName: r.projectName,
    path: isText(r.path) ? r.path : null,
    fileName: isText(r.fileName) ? r.fileName : null,
    text: r.text,
  };
}

/** Removes the recovery copy (after a save, a restore or the user's "discard"). */
export async function discardRecovery(userDataDir: string, steps: SaveSteps = nodeSaveSteps): Promise<void> {
  await steps.remove(recoveryPathOf(userDataDir));
}

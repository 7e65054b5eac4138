/** The CLI's IO on Node: text reads that refuse folders, huge and binary files; atomic writes. */
import { readFile, stat } from 'node:fs/promises';
import { writeFileAtomic } from '../files/atomic-write';
import { MAX_CLI_READ_BYTES, NOT_REGULAR, NOT_TEXT, TOO_LARGE } from './file-errors';
import type { CliIO } from './io';

const failure = (code: string) => Object.assign(new Error(code), { code });

/** Reads a text file: a folder, an oversized or a binary file fails with a code, not a hang or a terminal full of bytes. */
async function readText(path: string): Promise<string> {
  const s = await stat(path);
  if (s.isDirectory()) throw failure('EISDIR');
  // A device or pipe (/dev/zero, a FIFO) could stream without end: only regular files are read.
  if (!s.isFile()) throw failure(NOT_REGULAR);
  if (s.size > MAX_CLI_READ_BYTES) throw failure(TOO_LARGE);
  const bytes = await readFile(path);
  if (bytes.length > MAX_CLI_READ_BYTES) throw failure(TOO_LARGE); // grew while read
  if (bytes.includes(0)) throw failure(NOT_TEXT);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw failure(NOT_TEXT);
  }
}

/** Same existing file (device and inode), so `--out` never replaces an input. */
async function sameFile(a: string, b: string): Promise<boolean> {
  try {
    const [x, y] = await Promise.all([stat(a), stat(b)]);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    return false;
  }
}

/** The command line's file and stream access on Node. */
export const nodeIO: CliIO = {
  out: (t) => void process.stdout.write(t),
  err: (t) => void process.stderr.write(t),
  readFile: readText,
  writeFile: async (p, d) => void (await writeFileAtomic(p, d, { backup: false })),
  sameFile,
};

/**
 * File problems of the command line in words: what went wrong with which file, never a raw
 * system message or the file's bytes. Every one exits 2 (invalid input).
 */
import { CliInputError } from './io';

/** Largest file the command line reads, bytes (a plant or project is far smaller). */
export const MAX_CLI_READ_BYTES = 50 * 1024 * 1024;

/** Error codes our own file reader adds to the system's. */
export const NOT_TEXT = 'E_NOT_TEXT';
export const TOO_LARGE = 'E_TOO_LARGE';
export const NOT_REGULAR = 'E_NOT_REGULAR';

function codeOf(e: unknown): string {
  return e !== null && typeof e === 'object' && typeof (e as { code?: unknown }).code === 'string' ? (e as { code: string }).code : '';
}

/** A sentence for a failed read or write of `path`. */
export function fileProblem(path: string, e: unknown, action: 'read' | 'write'): string {
  const code = codeOf(e);
  const verb = action === 'read' ? 'cannot read' : 'cannot write';
  switch (code) {
    case 'ENOENT':
      return action === 'read' ? `${path}: no such file` : `${path}: ${verb} it: its folder does not exist`;
    case 'EISDIR':
      return `${path}: is a folder, not a file`;
    case 'ENOTDIR':
      return `${path}: a part of this path is a file, not a folder`;
    case 'EACCES':
    case 'EPERM':
      return `${path}: ${verb} it: permission denied`;
    case 'ENOSPC':
      return `${path}: ${verb} it: the disk is full (nothing was changed)`;
    case 'EROFS':
      return `${path}: ${verb} it: the file system is read-only`;
    case TOO_LARGE:
      return `${path}: is too large to be a Droopline file (over ${MAX_CLI_READ_BYTES / 1024 / 1024} MB)`;
    case NOT_REGULAR:
      return `${path}: is not a regular file (a device or a pipe); Droopline reads JSON files`;
    case NOT_TEXT:
      return `${path}: is not a text file (binary bytes); Droopline reads JSON files`;
    default:
      return `${path}: ${verb} it${code ? ` (${code})` : ''}`;
  }
}

/** Reads `path` as text through `read`, turning any failure into a `CliInputError` in words. */
export async function readTextOrExplain(read: (path: string) => Promise<string>, path: string): Promise<string> {
  try {
    return await read(path);
  } catch (e) {
    throw new CliInputError(fileProblem(path, e, 'read'));
  }
}

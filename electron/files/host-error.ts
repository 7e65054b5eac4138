/** Host failures: a code and a sentence naming the file and what to do, never a stack trace. */
import { basename } from 'node:path';
import type { HostErrorCode, HostErrorShape } from '../../shared-types';

/** A failure a host method reports to the renderer. */
export class HostFailure extends Error {
  constructor(
    readonly code: HostErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'HostFailure';
  }

  /** The plain object that crosses the process boundary. */
  shape(): HostErrorShape {
    return { name: 'HostError', code: this.code, message: this.message };
  }
}

/**
 * Turns anything thrown while working on `path` into a `HostFailure` with a sentence for
 * the user (`action` is "open" or "save"). Saves say the file on disk was not changed,
 * which the atomic write guarantees.
 */
export function hostErrorOf(err: unknown, action: string, path: string | null): HostFailure {
  if (err instanceof HostFailure) return err;
  const name = path ? `"${basename(path)}"` : 'the file';
  const code = (err as { code?: unknown } | null)?.code;
  const unchanged = action === 'save' ? ' The file on disk was not changed.' : '';
  const failed = action === 'save' ? 'WRITE_FAILED' : 'READ_FAILED';
  switch (code) {
    case 'ENOENT':
      return new HostFailure(
        action === 'save' ? 'WRITE_FAILED' : 'NOT_FOUND',
        action === 'save' ? `Could not save ${name}: its folder does not exist.` : `${name} was not found. It may have been moved or deleted.`,
      );
    case 'EACCES':
    case 'EPERM':
      return new HostFailure(failed, `Droopline is not allowed to ${action} ${name} (permission denied).${unchanged}`);
    case 'ENOSPC':
    case 'EDQUOT':
      return new HostFailure(failed, `The disk is full: ${name} was not saved.${unchanged}`);
    case 'EROFS':
      return new HostFailure(failed, `${name} is on a read-only disk.${unchanged}`);
    case 'EISDIR':
      return new HostFailure(failed, `${name} is a folder, not a file.`);
    case 'EBUSY':
      return new HostFailure(failed, `${name} is in use by another program; try again in a moment.${unchanged}`);
    default: {
      const detail = err instanceof Error ? err.message : String(err);
      return new HostFailure(failed, `Could not ${action} ${name}: ${detail}.${unchanged}`);
    }
  }
}

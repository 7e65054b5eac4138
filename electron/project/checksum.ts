/**
 * The content checksum of a saved project: SHA-256 (FIPS 180-4, through @noble/hashes, an
 * audited pure-JS implementation that runs in Node and the browser alike) of the project's
 * canonical text — JSON with two-space indent, keys in the file's own order, without the
 * checksum itself. Reformatting a file keeps it valid; changing any value (a flipped byte in a
 * string or a number) does not.
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';

/** The field of a saved project that holds its checksum. */
export const INTEGRITY_KEY = 'integrity';

/** What `INTEGRITY_KEY` holds. */
export interface ProjectIntegrity {
  sha256: string;
}

/** SHA-256 (hex) of the canonical text of `content` (a project without its `integrity`). */
export function contentChecksum(content: unknown): string {
  return bytesToHex(sha256(utf8ToBytes(JSON.stringify(content, null, 2))));
}

/** What reading a file's checksum found. */
export type ChecksumCheck = 'none' | 'match' | 'mismatch';

/**
 * Takes the checksum off a parsed file (`json` is not changed) and checks it against the rest.
 * A file without one (written by hand, or by an older Droopline) is `none`, never a problem.
 */
export function checkAndStrip(json: unknown): { content: unknown; check: ChecksumCheck } {
  if (json === null || typeof json !== 'object' || Array.isArray(json) || !(INTEGRITY_KEY in json)) return { content: json, check: 'none' };
  const { [INTEGRITY_KEY]: integrity, ...content } = json as Record<string, unknown>;
  const stated = integrity !== null && typeof integrity === 'object' ? (integrity as { sha256?: unknown }).sha256 : undefined;
  return { content, check: typeof stated === 'string' && stated.toLowerCase() === contentChecksum(content) ? 'match' : 'mismatch' };
}

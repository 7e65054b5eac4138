/** An in-memory CliIO: files from a map, output captured. */
import type { CliIO } from '../../electron/cli/io';

export interface MemoryIO extends CliIO {
  stdout(): string;
  stderr(): string;
  files: Map<string, string | Uint8Array>;
}

export function memoryIO(files: Record<string, string> = {}): MemoryIO {
  let out = '';
  let err = '';
  const map = new Map<string, string | Uint8Array>(Object.entries(files));
  return {
    files: map,
    out: (t) => void (out += t),
    err: (t) => void (err += t),
    stdout: () => out,
    stderr: () => err,
    readFile: (p) => {
      const v = map.get(p);
      return v === undefined
        ? Promise.reject(Object.assign(new Error('ENOENT'), { code: 'ENOENT' }))
        : Promise.resolve(typeof v === 'string' ? v : new TextDecoder().decode(v));
    },
    sameFile: (a, b) => Promise.resolve(a === b && map.has(a)),
    writeFile: (p, d) => {
      map.set(p, d);
      return Promise.resolve();
    },
  };
}

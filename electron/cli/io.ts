import type { ChunkPool } from '../handlers';
/** What a CLI command may touch: output streams and files. Injected so tests run in-process. */
export interface CliIO {
  /** Workers for long jobs (the Node entry gives one; tests in-process run without). */
  pool?: ChunkPool;
  out(text: string): void;
  err(text: string): void;
  /** Reads a text file; failures carry a `code` (`ENOENT`, `EISDIR`, … or those of `file-errors.ts`). */
  readFile(path: string): Promise<string>;
  /** Writes a file atomically (the old file stays whole if the write fails). */
  writeFile(path: string, data: string | Uint8Array): Promise<void>;
  /** Whether two paths name the same existing file (so an output never replaces an input). */
  sameFile(a: string, b: string): Promise<boolean>;
}

/** Parsed command line: positional arguments and `--flag [value]` options. */
export interface CliArgs {
  positional: string[];
  flags: Map<string, string | true>;
}

/** A CLI sub-command. Returns the process exit code. */
export interface CliCommand {
  name: string;
  summary: string;
  usage: string;
  /** An example input file shipped in the repository, named by `--help`. */
  example?: string;
  /** Flags that take a value (others are booleans). */
  valueFlags?: string[];
  run(args: CliArgs, io: CliIO): Promise<number>;
}

/** Thrown for usage mistakes and unreadable files; exits 2 with the message. */
export class CliInputError extends Error {}

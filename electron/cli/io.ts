/** What a CLI command may touch: output streams and files. Injected so tests run in-process. */
export interface CliIO {
  out(text: string): void;
  err(text: string): void;
  readFile(path: string): Promise<string>;
  writeFile(path: string, data: string | Uint8Array): Promise<void>;
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

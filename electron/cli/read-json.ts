import { CliInputError } from './io';
import type { CliIO } from './io';

/** Reads and parses a JSON file, with a one-line message naming the file when it cannot. */
export async function readJson(io: CliIO, path: string | undefined, what: string): Promise<unknown> {
  if (!path) throw new CliInputError(`missing ${what} file argument`);
  let text: string;
  try {
    text = await io.readFile(path);
  } catch {
    throw new CliInputError(`${path}: cannot read the file (does it exist?)`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (e) {
    throw new CliInputError(`${path}: not valid JSON (${e instanceof Error ? e.message : String(e)})`);
  }
}

import { findJsonSyntaxProblem } from '../project';
import { readTextOrExplain } from './file-errors';
import { CliInputError } from './io';
import type { CliIO } from './io';

/**
 * Reads and parses a JSON file, with a one-line message naming the file when it cannot: the
 * reason in words and, for bad JSON, the line and column — never the file's content.
 */
export async function readJson(io: CliIO, path: string | undefined, what: string): Promise<unknown> {
  if (!path) throw new CliInputError(`missing ${what} file argument`);
  const text = await readTextOrExplain((p) => io.readFile(p), path);
  try {
    return JSON.parse(text) as unknown;
  } catch {
    const p = findJsonSyntaxProblem(text);
    const where = p ? ` at line ${p.line}, column ${p.column}: ${p.truncated ? 'the file ends too early' : `expected ${p.expected}`}` : '';
    throw new CliInputError(`${path}: not valid JSON${where}`);
  }
}

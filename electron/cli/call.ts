import { EXIT_CODES } from '../../shared-types';
import type { EngineMethod, EngineResponse } from '../../shared-types';
import { dispatch } from '../handlers';
import type { CliIO } from './io';

/** Calls an engine method; on error prints the message and returns the exit code. */
export async function callEngine<K extends EngineMethod>(
  io: CliIO,
  method: K,
  request: unknown,
): Promise<{ ok: true; value: EngineResponse<K> } | { ok: false; exitCode: number }> {
  const r = await dispatch(method, request, { progress: () => undefined, signal: new AbortController().signal, ...(io.pool ? { pool: io.pool } : {}) });
  if (r.ok) return { ok: true, value: r.value };
  const head = r.error.code === 'INVALID_INPUT' ? 'invalid input' : r.error.code === 'NO_STEADY_STATE' ? 'no steady state' : 'error';
  io.err(
    `droopline: ${head}:\n${r.error.message
      .split('\n')
      .map((l) => `  ${l}`)
      .join('\n')}\n`,
  );
  return { ok: false, exitCode: EXIT_CODES[r.error.code] };
}

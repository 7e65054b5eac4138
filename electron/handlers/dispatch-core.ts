/**
 * The one way a call is run against a handler table, whatever the table holds: check the method, validate the
 * request against its schema, run it, and turn anything thrown into a plain error with a readable sentence. The full
 * table's `dispatch` (`dispatch.ts`) and the browser preview's worker (which answers the plant's methods before the
 * rest of the table has loaded) both call it.
 */
import { ENGINE_METHODS } from '../../shared-types';
import type { EngineErrorShape, EngineMethod, EngineOutcome, EngineResponse } from '../../shared-types';
import { EngineError } from '../engine';
import type { Handler, HandlerContext } from './handler';
import { parseOrThrow, ValidationError } from '../schemas/validate';

/** The outcome of a call, as it crosses a process or worker boundary. */
export type DispatchResult<T> = EngineOutcome<T>;

/** Converts anything thrown into a plain error object with a readable sentence (no stack). */
export function toErrorShape(err: unknown): EngineErrorShape {
  if (err instanceof ValidationError) return { name: 'EngineError', code: err.code, message: err.message, issues: err.issues };
  if (err instanceof EngineError) return { name: 'EngineError', code: err.code, message: err.message };
  const detail = err instanceof Error ? err.message : String(err);
  return { name: 'EngineError', code: 'INTERNAL', message: `Internal error in the engine: ${detail}` };
}

/** True when `name` is a method of the contract. */
export function isMethod(name: string): name is EngineMethod {
  return (ENGINE_METHODS as readonly string[]).includes(name);
}

const noop: HandlerContext = { progress: () => undefined, signal: new AbortController().signal };

/** Validates `payload` against the schema of `method` in `table` and runs it. Never throws. */
export async function runHandler<K extends EngineMethod>(
  table: Partial<{ [M in EngineMethod]: Handler<M> }>,
  method: K | string,
  payload: unknown,
  ctx: HandlerContext = noop,
): Promise<DispatchResult<EngineResponse<K>>> {
  const handler = isMethod(method) ? (table[method] as unknown as Handler<K> | undefined) : undefined;
  if (!handler) {
    return { ok: false, error: { name: 'EngineError', code: 'UNKNOWN_METHOD', message: `Unknown engine method "${method}".` } };
  }
  try {
    const request = parseOrThrow(handler.schema, payload);
    const value = await handler.run(request, ctx);
    return { ok: true, value };
  } catch (err) {
    return { ok: false, error: toErrorShape(err) };
  }
}

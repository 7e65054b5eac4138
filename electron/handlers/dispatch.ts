/**
 * The handler table and its one entry point. Both transports (Electron IPC and the
 * browser preview's Web Worker) and the CLI call `dispatch`: validate, then compute.
 */
import { ENGINE_METHODS } from '../../shared-types';
import type { EngineErrorShape, EngineMethod, EngineOutcome, EngineResponse } from '../../shared-types';
import { EngineError } from '../engine';
import type { Handler, HandlerContext, HandlerTable } from './handler';
import { plantHandlers } from './plant-handlers';
import { sharingHandlers } from './sharing-handlers';
import { syncHandlers } from './sync-handlers';
import { simulationHandlers } from './simulation-handlers';
import { trainerHandlers } from './trainer-handlers';
import { projectHandlers } from './project-handlers';
import { reportHandlers } from './report-handlers';
import { plannerHandlers } from './planner-handlers';
import { commissioningHandlers } from './commissioning-handlers';
import { parseOrThrow, ValidationError } from '../schemas/validate';

/** Every contract method mapped to its schema and engine call. */
export const handlers: HandlerTable = {
  ...plantHandlers,
  ...sharingHandlers,
  ...syncHandlers,
  ...simulationHandlers,
  ...trainerHandlers,
  ...projectHandlers,
  ...reportHandlers,
  ...plannerHandlers,
  ...commissioningHandlers,
};

/** The outcome of a call, as it crosses a process or worker boundary. */
export type DispatchResult<T> = EngineOutcome<T>;

/** Converts anything thrown into a plain error object with a readable sentence (no stack). */
export function toErrorShape(err: unknown): EngineErrorShape {
  if (err instanceof ValidationError) return { name: 'EngineError', code: err.code, message: err.message, issues: err.issues };
  if (err instanceof EngineError) return { name: 'EngineError', code: err.code, message: err.message };
  const detail = err instanceof Error ? err.message : String(err);
  return { name: 'EngineError', code: 'INTERNAL', message: `Internal error in the engine: ${detail}` };
}

function isMethod(name: string): name is EngineMethod {
  return (ENGINE_METHODS as readonly string[]).includes(name);
}

const noop: HandlerContext = { progress: () => undefined, signal: new AbortController().signal };

/** Validates `payload` against the method's schema and runs it. Never throws. */
export async function dispatch<K extends EngineMethod>(
  method: K | string,
  payload: unknown,
  ctx: HandlerContext = noop,
): Promise<DispatchResult<EngineResponse<K>>> {
  if (!isMethod(method)) {
    return { ok: false, error: { name: 'EngineError', code: 'UNKNOWN_METHOD', message: `Unknown engine method "${method}".` } };
  }
  try {
    const handler = handlers[method] as unknown as Handler<K>;
    const request = parseOrThrow(handler.schema, payload);
    const value = await handler.run(request, ctx);
    return { ok: true, value };
  } catch (err) {
    return { ok: false, error: toErrorShape(err) };
  }
}

/**
 * The handler table and its one entry point. Both transports (Electron IPC and the
 * browser preview's Web Worker) and the CLI call `dispatch`: validate, then compute.
 */
import type { EngineMethod, EngineResponse } from '../../shared-types';
import type { HandlerContext, HandlerTable } from './handler';
import { runHandler } from './dispatch-core';
import type { DispatchResult } from './dispatch-core';
import { plantHandlers } from './plant-handlers';
import { sharingHandlers } from './sharing-handlers';
import { syncHandlers } from './sync-handlers';
import { simulationHandlers } from './simulation-handlers';
import { trainerHandlers } from './trainer-handlers';
import { projectHandlers } from './project-handlers';
import { reportHandlers } from './report-handlers';
import { plannerHandlers } from './planner-handlers';
import { commissioningHandlers } from './commissioning-handlers';

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

export { toErrorShape } from './dispatch-core';
export type { DispatchResult } from './dispatch-core';

/** Validates `payload` against the method's schema and runs it. Never throws. */
export function dispatch<K extends EngineMethod>(method: K | string, payload: unknown, ctx?: HandlerContext): Promise<DispatchResult<EngineResponse<K>>> {
  return runHandler(handlers, method, payload, ctx);
}

/** Public face of the handler layer, shared by IPC, the Web Worker and the CLI. */
export { dispatch, handlers, toErrorShape } from './dispatch';
export type { DispatchResult } from './dispatch';
export type { HandlerContext, Handler, HandlerTable } from './handler';
export { engineErrorFromWorker, poolTasks, runChunks } from './pool';
export type { ChunkPlan, ChunkPool, PoolTaskName, PoolTasks } from './pool';
export { plantSchema } from '../schemas/plant-schema';
/** The power factor a load given only in kW takes (the CLI's `--load-kw` alone). */
export { impliedPowerFactor } from '../engine';
export { projectSchema } from '../schemas/project-schema';
export { formatPath, parseOrThrow, ValidationError } from '../schemas/validate';

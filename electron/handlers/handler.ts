/** Types of the handler table: one validating handler per `EngineApi` method. */
import type { z } from 'zod';
import type { EngineApi, EngineMethod, EngineRequest, EngineResponse } from '../../shared-types';
import type { ChunkPool } from './pool-tasks';

/** What a handler gets besides its request: progress reporting and cancellation. */
export interface HandlerContext {
  /** Report progress of a long job, 0..1. */
  progress(fraction: number, label?: string): void;
  /** Aborted when the caller cancels. */
  signal: AbortSignal;
  /** Workers for long jobs, when the host has them (see `pool.ts`); without, chunks run on this thread. */
  pool?: ChunkPool;
}

/** One method: the schema its request must pass, and the engine call. */
export interface Handler<K extends EngineMethod> {
  schema: z.ZodType<EngineRequest<K>>;
  run(request: EngineRequest<K>, ctx: HandlerContext): EngineResponse<K> | Promise<EngineResponse<K>>;
}

/** Handlers for a subset of the contract. */
export type HandlerGroup<K extends EngineMethod> = { [M in K]: Handler<M> };

/** Every method of the contract has a handler. */
export type HandlerTable = HandlerGroup<keyof EngineApi>;

/** Lets the event loop breathe (messages, cancellation) between chunks of a long job. */
export function breathe(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * The renderer's one way to reach the engine, typed from the contract. Stores call it;
 * components never do. Picks Electron IPC when the preload bridge exists, else a Web Worker.
 */
import type { EngineErrorCode, EngineErrorShape, EngineMethod, EngineRequest, EngineResponse, FieldIssue } from '../../shared-types';

/** Options of one call. */
export interface CallOptions {
  onProgress?: (fraction: number, label?: string) => void;
  signal?: AbortSignal;
}

/** A typed engine client. */
export interface EngineClient {
  call<K extends EngineMethod>(method: K, request: EngineRequest<K>, options?: CallOptions): Promise<EngineResponse<K>>;
}

/** An engine error revived on the renderer side. */
export class EngineCallError extends Error {
  readonly code: EngineErrorCode;
  readonly issues: FieldIssue[];
  constructor(shape: EngineErrorShape) {
    super(shape.message);
    this.name = 'EngineCallError';
    this.code = shape.code;
    this.issues = shape.issues ?? [];
  }
}

/** A readable one-paragraph message for anything a call may throw. */
export function messageOf(err: unknown): string {
  if (err instanceof EngineCallError) return err.message;
  if (err instanceof Error) return `Unexpected problem: ${err.message}`;
  return String(err);
}

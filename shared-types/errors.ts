/**
 * Errors that cross the engine boundary as plain objects (never class instances,
 * never stack traces). Revived on the other side by the transport.
 */

/** Machine-readable error kinds. `INVALID_INPUT` maps to CLI exit 2, `NO_STEADY_STATE` to exit 3. */
export type EngineErrorCode = 'INVALID_INPUT' | 'NO_STEADY_STATE' | 'DIVERGED' | 'CANCELLED' | 'UNKNOWN_METHOD' | 'INTERNAL';

/** A validation problem: the field path (`sets[1].governor.droopPct`) and the rule it breaks. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** The serialised form of an engine error. */
export interface EngineErrorShape {
  name: 'EngineError';
  code: EngineErrorCode;
  /** A sentence a user understands. */
  message: string;
  /** For `INVALID_INPUT`: every field problem found. */
  issues?: FieldIssue[];
}

/** CLI exit code for each error kind. */
export const EXIT_CODES: Readonly<Record<EngineErrorCode, number>> = {
  INVALID_INPUT: 2,
  NO_STEADY_STATE: 3,
  DIVERGED: 3,
  CANCELLED: 130,
  UNKNOWN_METHOD: 2,
  INTERNAL: 1,
};

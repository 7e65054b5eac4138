/**
 * Typed engine errors. Each carries a sentence a user understands; the handler
 * layer turns them into plain `EngineErrorShape` objects.
 */
import type { EngineErrorCode } from '../../shared-types';

/** Base of every error the engine throws on purpose. */
export class EngineError extends Error {
  readonly code: EngineErrorCode;
  constructor(code: EngineErrorCode, message: string) {
    super(message);
    this.name = 'EngineError';
    this.code = code;
  }
}

/** The plant has no operating point (overload, undefined split, no frequency reference). */
export class NoSteadyState extends EngineError {
  constructor(message: string) {
    super('NO_STEADY_STATE', message);
  }
}

/** An iteration or integration failed to converge. */
export class Diverged extends EngineError {
  constructor(message: string) {
    super('DIVERGED', message);
  }
}

/** A long job was cancelled by the caller. */
export class Cancelled extends EngineError {
  constructor(message = 'Cancelled.') {
    super('CANCELLED', message);
  }
}

/** Input the schema accepts but the engine cannot use (e.g. an unknown set id). */
export class InvalidInput extends EngineError {
  constructor(message: string) {
    super('INVALID_INPUT', message);
  }
}

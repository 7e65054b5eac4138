/** The engine's public face: pure computations over plain data. */
export { describePlant, ratedSpeedRpm, ratedCurrentA, kVARBase } from './describe-plant';
export { solveSharing, sweepLoad } from './sharing';
export * from './planner';
export * from './sync';
export * from './simulation';
export { EngineError, NoSteadyState, Diverged, Cancelled, InvalidInput } from './errors';

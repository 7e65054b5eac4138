/** The engine's public face: pure computations over plain data. */
export { describePlant, ratedSpeedRpm, ratedCurrentA, kVARBase } from './describe-plant';
export { solveSharing, sweepLoad } from './sharing';
export { setCapability, fieldLimitKVAR, leadingLimitKVAR, ratedFieldEmfPU } from './capability';
export { overloadLimitKW, motoringKW, reverseTripKW, lowerLimitKW } from './sharing/set-limits';
export * from './sync';
export * from './simulation';
export { EngineError, NoSteadyState, Diverged, Cancelled, InvalidInput } from './errors';

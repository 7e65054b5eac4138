/** The engine's public face: pure computations over plain data. */
export { describePlant } from './describe-plant';
export { solveSharing, solveSharingAtMost, solveSharingFigures, createSharingFigures, sweepLoad, impliedPowerFactor } from './sharing';
export type { SharingFigures } from './sharing';
export type { ImpliedPowerFactor } from './sharing';
export { settingWarnings, SETPOINT_BAND_PCT, DROOP_USUAL_MIN_PCT, DROOP_USUAL_MAX_PCT } from './setting-checks';
export { setCapability, fieldLimitKVAR, leadingLimitKVAR, ratedFieldEmfPU } from './capability';
export { setCharacteristics, speedDroopLine, reactiveDroopLine, reactiveSpanKVAR } from './characteristics';
export { overloadLimitKW, motoringKW, reverseTripKW, lowerLimitKW } from './sharing/set-limits';
export * from './planner';
export * from './sync';
export * from './simulation';
export { EngineError, NoSteadyState, Diverged, Cancelled, InvalidInput } from './errors';
export * from './commissioning';

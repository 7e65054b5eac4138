/** The engine's public face: pure computations over plain data. */
export { describePlant, ratedSpeedRpm, ratedCurrentA, kVARBase } from './describe-plant';
export { EngineError, NoSteadyState, Diverged, Cancelled, InvalidInput } from './errors';

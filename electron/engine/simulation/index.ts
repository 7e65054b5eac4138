/** The time-domain simulator's public face. */
export { simulate, MIN_CHUNK_STEPS } from './simulate';
export type { SimulationHooks } from './simulate';
export { createSimulation, DEFAULT_STEP_MS, DEFAULT_OUTPUT_POINTS, MAX_STEP_MS } from './simulation';
export type { Simulation, SteppedSimulation } from './simulation';
export { ISO_8528_5_LIMITS, PERFORMANCE_CLASSES, recoveryBandPct } from './iso-8528-5';
export type { ClassLimit, ClassLimitKey } from './iso-8528-5';
export { fieldCeiling, ratedLoadFieldPU } from './excitation';
export type { FieldCeiling } from './excitation';

import { computeMetrics, recoveryTime } from './metrics';
/** Internals for tests only. */
export const simulationTesting = { recoveryTime, computeMetrics };

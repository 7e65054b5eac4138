/** The droop planner, sensitivity matrix and tolerance analysis. */
export { planDroop } from './plan-droop';
export { PLAN_LIMITS } from './plan-limits';
export { PLAN_CHECK_FRACTIONS } from './load-points';
export { sharingSensitivity, finiteDifferenceSensitivity, SPEED_STEP_HZ, VOLTAGE_STEP_PCT } from './sensitivity';
export { createToleranceRun, mergeToleranceChunks, toleranceAnalysis, toleranceSampleCount, toleranceSamples, TOLERANCE_DEFAULTS } from './tolerance-run';
export type { ToleranceChunk, ToleranceRun } from './tolerance-run';

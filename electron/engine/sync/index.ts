/** The synchronizing engine: sync-check verdict, presets, closing surge, bus equivalent and closing map. */
export { evaluateSync } from './evaluate-sync';
export { listSyncPresets, syncPreset, ieee1547PresetForRating } from './presets';
export { syncCheck, sideState, DEFAULT_DEAD_PERMISSIVES } from './permissives';
export type { SyncCheckInput, SyncCheckOutcome, SideState } from './permissives';
export {
  closingSurge,
  closingSurgeForCase,
  surgeCircuit,
  surgeCurrentPU,
  powerStepPU,
  torqueStepPU,
  peakTorquePU,
  peakTorqueFactor,
  iecPeakFactor,
  noSurge,
} from './closing-surge';
export type { SurgeCircuit } from './closing-surge';
export { busEquivalent, incomingBranch, fictitiousROverX } from './bus-equivalent';
export type { ImpedancePU } from './bus-equivalent';
export { closingMap, closingMapJob, closingMapJobFor, putRows, takeRows } from './closing-map';
export { timeDomainClosingMapJob, TIME_DOMAIN_MAX_CELLS, TIME_DOMAIN_STEP_MS, PEAK_PAST_MARGIN } from './closing-map-time-domain';
export type { ClosingMapJob, ClosingMapRows } from './closing-map';
export { syncBasis } from './sync-basis';
export type { SyncBasis } from './sync-basis';
export { incomingFromSet, plantBus } from './plant-case';
export { phasorDifference, deltaVMagnitude, wrapAngleDeg, angleAfterDeg } from './phasor';
export type { PhasorDifference } from './phasor';
export { slipPeriodS, advanceAngleDeg, windowOpenS, windowTiming, timeToAngleS, closeCommandAngleDeg, angleAtContactDeg } from './slip-timing';
export type { WindowTiming } from './slip-timing';

/**
 * The one contract between the renderer and the engine: method name → request and
 * response. Channel names are these keys; nothing else names a channel.
 */
import type { Plant } from './plant';
import type { PlantDescription } from './describe';
import type { CheckedPlant, CheckPlantRequest, LoadSweep, SharingResult, SolveSharingRequest, SweepLoadRequest } from './sharing';
import type { ClosingMap, ClosingMapRequest, SyncCase, SyncPreset, SyncResult } from './sync';
import type { Scenario, SimulationResult } from './simulation';
import type { ProgressEvent } from './progress';
import type { TrainerCloseRequest, TrainerExercise, TrainerLevel, TrainerStartRequest, TrainerState, TrainerStepRequest, TrainerVerdict } from './trainer';
import type { ParsedProject, Project } from './project';
import type { BuildReportRequest, ReportResult } from './report';
import type {
  CommissioningRecord,
  CommissioningRecordRequest,
  FitRequest,
  FitResult,
  InspectRecordRequest,
  ParseRecordRequest,
  ParsedTestRecord,
  RecordInspection,
} from './commissioning';
import type { PlanRequest, PlanResult, SensitivityRequest, SensitivityResult, ToleranceRequest, ToleranceResult } from './planner';

/** A method's request and response types. */
export interface Method<Req, Res> {
  request: Req;
  response: Res;
}

/** Every engine method. Long-running ones report progress and can be cancelled. */
export interface EngineApi {
  /** Rated figures of a plant (speeds, currents, totals). */
  describePlant: Method<{ plant: Plant }, PlantDescription>;
  /** Validate a plant file and return it with defaults filled in. */
  validatePlant: Method<{ plant: unknown }, Plant>;
  /**
   * An edit in one round trip: validate the plant (parsed once) and solve where it settles,
   * at the load slider's position when given.
   */
  checkPlant: Method<CheckPlantRequest, CheckedPlant>;
  /** Steady-state kW/kVAR split, bus frequency and voltage. */
  solveSharing: Method<SolveSharingRequest, SharingResult>;
  /** The operating point over a range of load. */
  sweepLoad: Method<SweepLoadRequest, LoadSweep>;
  /** Sync-check verdict, advance angle and closing surge for a case. */
  evaluateSync: Method<SyncCase, SyncResult>;
  /** Limit presets from published standards and common practice. */
  listSyncPresets: Method<Record<string, never>, SyncPreset[]>;
  /** Surge current and torque over angle × slip (long; progress). */
  closingMap: Method<ClosingMapRequest, ClosingMap>;
  /** Time-domain simulation of a scenario (long; progress). */
  simulate: Method<Scenario, SimulationResult>;
  /** Trainer difficulty levels. */
  trainerLevels: Method<Record<string, never>, TrainerLevel[]>;
  /** Start a seeded synchronizing exercise. */
  trainerStart: Method<TrainerStartRequest, TrainerState>;
  /** Advance the exercise one frame under the held controls (state in, state out). */
  trainerStep: Method<TrainerStepRequest, TrainerState>;
  /** Verdict, score and after-close traces of a closed exercise. */
  trainerClose: Method<TrainerCloseRequest, TrainerVerdict>;
  /** Checks an instructor's exercise (level, seed, faults, pass criteria) by the rules the project file uses; refusals name the field. */
  checkTrainerExercise: Method<{ exercise: TrainerExercise }, { ok: true }>;
  /** Read a project file's text: migrate older files forward, validate, fill defaults. */
  parseProject: Method<{ text: string }, ParsedProject>;
  /** The file text of a project (validated), ending with its content checksum. */
  serializeProject: Method<{ project: Project }, { text: string }>;
  /** The printable plant report (HTML with inline SVG) and its tables and charts (long; progress). */
  buildReport: Method<BuildReportRequest, ReportResult>;
  /** Droop and no-load settings for proportional sharing inside the bands, checked through the solver. */
  planDroop: Method<PlanRequest, PlanResult>;
  /** kW and kVAR per 0.1 Hz and per 1 % of setpoint error on each set, at the operating point. */
  sharingSensitivity: Method<SensitivityRequest, SensitivityResult>;
  /** Seeded Monte-Carlo of setpoint and droop tolerances (long; progress). */
  toleranceAnalysis: Method<ToleranceRequest, ToleranceResult>;
  /** The header of a load-bank test record, a preview and a guess at its columns and units. */
  inspectTestRecord: Method<InspectRecordRequest, RecordInspection>;
  /** A test record read with the chosen columns and units (a malformed file refused with the line). */
  parseTestRecord: Method<ParseRecordRequest, ParsedTestRecord>;
  /** Least-squares fit of chosen set parameters to a test record on the simulator's response (long; progress). */
  fitTestRecord: Method<FitRequest, FitResult>;
  /** The commissioning record of a set: settings, measured beside model, sign-off (rows, CSV, HTML). */
  buildCommissioningRecord: Method<CommissioningRecordRequest, CommissioningRecord>;
}

/** The keys of a method record, typed (the one way the run-time method lists are derived). */
export function keysOf<K extends string>(record: Readonly<Record<K, true>>): K[] {
  return Object.keys(record) as K[];
}

/** A method name, which is also its channel name. */
export type EngineMethod = keyof EngineApi;
export type EngineRequest<K extends EngineMethod> = EngineApi[K]['request'];
export type EngineResponse<K extends EngineMethod> = EngineApi[K]['response'];

/**
 * Every contract method, once: `satisfies Record<EngineMethod, true>` makes a missing or an unknown key a type error,
 * so the run-time list below cannot drift from the contract.
 */
const ENGINE_METHODS_LISTED = {
  describePlant: true,
  validatePlant: true,
  solveSharing: true,
  sweepLoad: true,
  evaluateSync: true,
  listSyncPresets: true,
  closingMap: true,
  simulate: true,
  trainerLevels: true,
  trainerStart: true,
  trainerStep: true,
  trainerClose: true,
  parseProject: true,
  serializeProject: true,
  buildReport: true,
  planDroop: true,
  sharingSensitivity: true,
  toleranceAnalysis: true,
  checkPlant: true,
  checkTrainerExercise: true,
  inspectTestRecord: true,
  parseTestRecord: true,
  fitTestRecord: true,
  buildCommissioningRecord: true,
} as const satisfies Record<EngineMethod, true>;
/** Every method name at run time, derived from the record above. */
export const ENGINE_METHODS: readonly EngineMethod[] = keysOf(ENGINE_METHODS_LISTED);

/** Events the host pushes to the renderer; keys are channel names. */
export interface EngineEvents {
  engineProgress: ProgressEvent;
}

/** Channel for cancelling a running request (payload: request id). */
export interface EngineControl {
  engineCancel: { id: number };
}

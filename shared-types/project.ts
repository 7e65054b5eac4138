/**
 * A Droopline project file: the plant plus everything the user set up around it.
 * Saved as JSON (`format: "droopline.project"`); older versions migrate forward.
 */
import type { FitParameterKey, FitResult, RecordColumns, RecordUnits, SignOff, TestDescription } from './commissioning';
import type { Plant } from './plant';
import type { ScenarioEvent } from './simulation';
import type { DeadPermissives, SyncLimits } from './sync';
import type { TrainerAttempt, TrainerExerciseSet } from './trainer';

export const PROJECT_FORMAT = 'droopline.project' as const;
export const PROJECT_VERSION = 1 as const;

/** A transient scenario kept in a project (the plant comes from the project). */
export interface ProjectScenario {
  id: string;
  name: string;
  durationS: number;
  stepMs: number;
  events: ScenarioEvent[];
}

/** Sync-check settings kept in a project. */
export interface ProjectSyncSettings {
  /** Preset the limits came from, or null for custom limits. */
  presetId: string | null;
  limits: SyncLimits;
  breakerClosingMs: number;
  dead: DeadPermissives;
  /** Set being synchronized onto the bus. */
  incomingSetId: string | null;
}

/** A number the user has left blank is kept as null. */
export type Blankable<T> = { [K in keyof T]: T[K] extends number ? number | null : T[K] };

/**
 * The Commissioning view's work kept in a project. Every part may be missing (a new view's starting state);
 * the project reader checks each part on its own and leaves a damaged one out with a note naming the field.
 */
export interface ProjectCommissioning {
  /** The accepted test record: the file's name and text and the column and unit choice it was read with. */
  record?: { fileName: string; text: string; columns: RecordColumns; units: RecordUnits } | null;
  /** The test description as entered. */
  test?: Blankable<TestDescription>;
  /** The parameter choice: which to fit and each one's range. */
  params?: { key: FitParameterKey; chosen: boolean; min: number | null; max: number | null }[];
  maxIterations?: number | null;
  /** The last fit, the test it ran with, and whether its values were applied to the plant. */
  fit?: { result: FitResult; test: TestDescription; applied: boolean } | null;
  signOff?: SignOff;
  /** The set the commissioning record is of. */
  recordSetId?: string;
}

/** The whole project file. */
export interface Project {
  format: typeof PROJECT_FORMAT;
  version: typeof PROJECT_VERSION;
  name: string;
  plant: Plant;
  scenarios: ProjectScenario[];
  sync: ProjectSyncSettings | null;
  trainerLog: TrainerAttempt[];
  /** An instructor's exercise sets (levels, seeds, faults, pass criteria), run as sessions in the Trainer. */
  trainerExercises: TrainerExerciseSet[];
  /** The Commissioning view's record, test, fit and sign-off (absent in files saved before it was kept). */
  commissioning?: ProjectCommissioning | null;
  /** View settings (current view, slider positions, chart choices). */
  view: Record<string, unknown>;
}

/** A project file read by `parseProject`: the project and what reading it changed. */
export interface ParsedProject {
  project: Project;
  /** What the file was before migration (e.g. "a plant file, version 1"), or null for a current project file. */
  migratedFrom: string | null;
  /** Sentences for the user about the migration (empty when nothing changed). */
  notes: string[];
}

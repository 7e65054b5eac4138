/**
 * Moves older files forward to the current project version. Each step takes the raw
 * object of one version and returns the raw object of the next; steps never mutate
 * their input. A bare plant file (`droopline.plant`) or scenario file
 * (`droopline.scenario`) becomes a new project around it.
 */
import { PLANT_FORMAT, PLANT_VERSION, PROJECT_FORMAT, PROJECT_VERSION, SCENARIO_FORMAT, SYNC_FORMAT } from '../../shared-types';
import { ProjectFileError } from './project-file-error';

/** A raw (not yet validated) JSON object. */
export type RawObject = Record<string, unknown>;

/** One migration step: version `from` of the project format to version `from + 1`. */
export interface MigrationStep {
  from: number;
  /** One sentence for the user: what changed. */
  note: string;
  run(old: Readonly<RawObject>): RawObject;
}

/**
 * Steps between project versions, oldest first. Version 1 is the first project format, so
 * there is none yet; a change of format adds `{ from: 1, note, run }` here and bumps
 * `PROJECT_VERSION`.
 */
export const PROJECT_MIGRATIONS: readonly MigrationStep[] = [];

/** Result of bringing a raw file to the current version. */
export interface Migrated {
  raw: RawObject;
  migratedFrom: string | null;
  notes: string[];
}

const isObject = (v: unknown): v is RawObject => typeof v === 'object' && v !== null && !Array.isArray(v);

function fileVersion(raw: RawObject, kind: string): number {
  const v = raw.version;
  if (v === undefined) return 1;
  if (typeof v !== 'number' || !Number.isInteger(v) || v < 1) {
    throw new ProjectFileError('invalid', `version: must be a whole number of 1 or more (this ${kind} has ${JSON.stringify(v)}).`, [
      { path: 'version', message: 'must be a whole number of 1 or more' },
    ]);
  }
  return v;
}

function refuseNewer(kind: string, version: number, current: number): never {
  throw new ProjectFileError(
    'newer',
    `This ${kind} was saved by a newer version of Droopline (file version ${version}; this version reads up to ${current}). ` +
      'Open it with a newer Droopline. The file was not changed.',
  );
}

/**
 * Applies `steps` to a project of `version` until it reaches `target`. Pure: the input is
 * not changed. Throws when a step is missing (a gap in the chain).
 */
export function runMigrations(raw: Readonly<RawObject>, version: number, target: number, steps: readonly MigrationStep[]): Migrated {
  let current: RawObject = raw;
  const notes: string[] = [];
  for (let v = version; v < target; v++) {
    const step = steps.find((s) => s.from === v);
    if (!step) throw new ProjectFileError('invalid', `Project files of version ${v} cannot be read by this version of Droopline.`);
    current = { ...step.run(current), version: v + 1 };
    notes.push(step.note);
  }
  return { raw: current, migratedFrom: version < target ? `a project file, version ${version}` : null, notes };
}

function projectAround(name: unknown, plant: unknown, rest: Partial<RawObject> = {}): RawObject {
  return {
    format: PROJECT_FORMAT,
    version: PROJECT_VERSION,
    name: typeof name === 'string' && name.length > 0 ? name : undefined,
    plant,
    scenarios: [],
    sync: null,
    trainerLog: [],
    trainerExercises: [],
    view: {},
    ...rest,
  };
}

function fromPlantFile(raw: RawObject): Migrated {
  const v = fileVersion(raw, 'plant file');
  if (v > PLANT_VERSION) refuseNewer('plant file', v, PLANT_VERSION);
  return {
    raw: projectAround(raw.name, raw),
    migratedFrom: `a plant file, version ${v}`,
    notes: ['This was a plant file: it opens as a new project around that plant. Saving writes a project file; the plant file is not changed.'],
  };
}

function fromScenarioFile(raw: RawObject): Migrated {
  const v = fileVersion(raw, 'scenario file');
  if (v > 1) refuseNewer('scenario file', v, 1);
  const name = typeof raw.name === 'string' && raw.name.length > 0 ? raw.name : 'Scenario 1';
  const scenario: RawObject = { id: 'S1', name, durationS: raw.durationS, stepMs: raw.stepMs ?? 1, events: raw.events };
  for (const [k, val] of Object.entries(raw)) {
    if (!['format', 'version', 'name', 'plant', 'durationS', 'stepMs', 'events'].includes(k)) scenario[k] = val;
  }
  const plantName = isObject(raw.plant) ? raw.plant.name : undefined;
  return {
    raw: projectAround(plantName, raw.plant, { scenarios: [scenario] }),
    migratedFrom: `a scenario file, version ${v}`,
    notes: [`This was a scenario file: it opens as a new project with its plant and the scenario "${name}". The scenario file is not changed.`],
  };
}

function fromSyncFile(raw: RawObject): Migrated {
  const v = fileVersion(raw, 'sync-check case file');
  if (v > 1) refuseNewer('sync-check case file', v, 1);
  if (raw.plant === undefined) {
    throw new ProjectFileError(
      'foreign',
      'This is a sync-check case without a plant: it cannot become a project. Open a plant or project file, or add a "plant" to the case.',
    );
  }
  const sync: RawObject = {
    presetId: null,
    limits: raw.limits,
    breakerClosingMs: raw.breakerClosingMs,
    dead: raw.dead ?? { deadBus: false, deadLine: false, livePct: 80, deadPct: 20 },
    incomingSetId: raw.incomingSetId ?? null,
  };
  const plantName = isObject(raw.plant) ? raw.plant.name : undefined;
  return {
    raw: projectAround(plantName, raw.plant, { sync }),
    migratedFrom: `a sync-check case file, version ${v}`,
    notes: ['This was a sync-check case: it opens as a new project with its plant and sync-check settings. The case file is not changed.'],
  };
}

/**
 * Brings any Droopline file this version understands to a raw current-version project.
 * Throws `ProjectFileError` for foreign files (`foreign`, `not-a-project`) and newer
 * versions (`newer`), with a sentence naming what the file is.
 */
export function migrateToCurrent(value: unknown): Migrated {
  if (!isObject(value)) {
    const what = Array.isArray(value) ? 'a list' : value === null ? 'null' : `a ${typeof value}`;
    throw new ProjectFileError(
      'not-a-project',
      `This file holds JSON (${what}) but not a Droopline project: a project is an object with "format": "${PROJECT_FORMAT}".`,
    );
  }
  const format = value.format;
  if (format === undefined) {
    throw new ProjectFileError(
      'not-a-project',
      `This JSON file is not a Droopline project: it has no "format" field (a project has "format": "${PROJECT_FORMAT}").`,
    );
  }
  if (format === PLANT_FORMAT) return fromPlantFile(value);
  if (format === SCENARIO_FORMAT) return fromScenarioFile(value);
  if (format === SYNC_FORMAT) return fromSyncFile(value);
  if (format !== PROJECT_FORMAT) {
    throw new ProjectFileError(
      'foreign',
      `This is a ${JSON.stringify(format)} file, not a Droopline project (expected "format": "${PROJECT_FORMAT}"). The file was not changed.`,
    );
  }
  const version = fileVersion(value, 'project');
  if (version > PROJECT_VERSION) refuseNewer('project', version, PROJECT_VERSION);
  return runMigrations(value, version, PROJECT_VERSION, PROJECT_MIGRATIONS);
}

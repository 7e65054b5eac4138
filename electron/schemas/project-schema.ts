/**
 * The project-file schema: the plant (checked by `plantSchema`, the plant-file definition)
 * plus the parts kept around it. Parts owned by other views (scenarios, sync settings,
 * trainer log, commissioning work, view settings) are checked for shape and keep any field this version does
 * not know, so a project never loses data on its way through open and save.
 */
import { z } from 'zod';
import { PROJECT_FORMAT, PROJECT_VERSION } from '../../shared-types';
import type { Project, ProjectScenario, ProjectSyncSettings, TrainerAttempt, TrainerExerciseSet } from '../../shared-types';
import { projectCommissioningSchema } from './commissioning-schema';
import { plantSchema } from './plant-schema';
import { projectEventSchema } from './scenario-events';
import { trainerExerciseShape } from './trainer-schema';

import { breakerClosingMs, deadFields, id, num, positive, syncLimitsFields, text } from './schema-kit';

const scenarioShape = z.looseObject({
  id: id(),
  name: text(),
  durationS: positive('s'),
  stepMs: positive('ms'),
  // Each event by its type, with the same rules as a scenario file (`projectEventSchema`).
  events: z.array(projectEventSchema, { error: 'must be a list of events' }),
});

/**
 * A project's scenario (`ProjectScenario`): the one schema, used by the project reader and the report request. Event
 * fields beyond time and kind are checked by `simulate` when the scenario runs, hence the type's assertion here.
 */
export const projectScenarioSchema = scenarioShape as unknown as z.ZodType<ProjectScenario>;

/**
 * A project's sync-check settings (`ProjectSyncSettings`): the one schema, used by the project reader and the report
 * request. The limits and dead-bus thresholds follow the sync-check's own rules (`schema-kit.ts`); unknown fields are
 * kept, so a newer file loses nothing.
 */
export const projectSyncSettingsSchema = z.looseObject({
  presetId: text().nullable(),
  limits: z.looseObject(syncLimitsFields),
  breakerClosingMs: breakerClosingMs(),
  dead: z.looseObject(deadFields),
  incomingSetId: text().nullable(),
});

const trainerAttemptSchema = z.looseObject({
  at: text(),
  seed: num('seed'),
  level: text(),
  angleAtContactDeg: num('°'),
  slipAtContactHz: num('Hz'),
  voltageDifferencePct: num('%'),
  surgeCurrentPU: num('pu'),
  torqueStepPU: num('pu'),
  score: num('points').gte(0, 'must be 0 or more').lte(100, 'must be 100 or less'),
  verdict: text(),
});

const trainerExerciseSetSchema = z.looseObject({
  id: text().min(1, 'must not be empty'),
  name: text(),
  exercises: z.array(z.looseObject(trainerExerciseShape), { error: 'must be a list of exercises' }),
});

/**
 * Zod schema of a current-version project file. `name` defaults to the plant's name;
 * the parts around the plant default to empty.
 */
export const projectSchema = z
  .object({
    format: z.literal(PROJECT_FORMAT, { error: `must be "${PROJECT_FORMAT}"` }),
    version: z.literal(PROJECT_VERSION, { error: `must be ${PROJECT_VERSION}` }),
    name: text().min(1, 'must not be empty').optional(),
    plant: plantSchema,
    scenarios: z.array(projectScenarioSchema, { error: 'must be a list of scenarios' }).default([]),
    sync: projectSyncSettingsSchema.nullable().default(null),
    trainerLog: z.array(trainerAttemptSchema, { error: 'must be a list of attempts' }).default([]),
    // Files saved before exercise sets existed have none.
    trainerExercises: z.array(trainerExerciseSetSchema, { error: 'must be a list of exercise sets' }).default([]),
    // The Commissioning view's work (files saved before it was kept have none; null is the same as none).
    commissioning: projectCommissioningSchema.nullable().optional(),
    view: z.record(z.string(), z.unknown(), { error: 'must be an object' }).default({}),
  })
  .strict()
  .superRefine((p, ctx) => {
    const ids = new Set<string>();
    p.scenarios.forEach((s, i) => {
      if (ids.has(s.id)) ctx.addIssue({ code: 'custom', path: ['scenarios', i, 'id'], message: `must be unique ("${s.id}" is used twice)` });
      ids.add(s.id);
    });
  })
  .transform((p): Project => ({
    format: p.format,
    version: p.version,
    name: p.name ?? p.plant.name,
    plant: p.plant,
    scenarios: p.scenarios as unknown as ProjectScenario[],
    sync: p.sync as ProjectSyncSettings | null,
    trainerLog: p.trainerLog as TrainerAttempt[],
    trainerExercises: p.trainerExercises as TrainerExerciseSet[],
    ...(p.commissioning ? { commissioning: p.commissioning } : {}),
    view: p.view,
  }));

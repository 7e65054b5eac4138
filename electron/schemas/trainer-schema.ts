/**
 * Schemas of the Trainer's instructor data: scripted faults, pass criteria and an exercise. The project file keeps
 * exercises with these rules (`project-schema.ts`) and the Trainer's handlers check them with the same ones.
 */
import { z } from 'zod';
import { TRAINER_LEVELS } from '../engine/trainer';
import type { TrainerExercise, TrainerFaults, TrainerPassCriteria } from '../../shared-types';
import { nonNegative, num, syncLimitsSchema as limitsSchema, whole } from './schema-kit';

/** Faults an instructor scripts: each within a range a real plant could show. */
export const trainerFaultsSchema: z.ZodType<TrainerFaults> = z
  .object({
    breakerSlowMs: nonNegative('ms').lte(1000, 'must be 1000 ms or less'),
    wrongWindow: limitsSchema,
    busDriftHz: nonNegative('Hz').lte(1, 'must be 1 Hz or less'),
    deadBus: z.boolean({ error: 'must be true or false' }),
    voltageMismatchPct: num('%').gte(-15, 'must be −15 % or more').lte(15, 'must be 15 % or less'),
  })
  .partial()
  .strict();

/** Pass criteria of an instructor's exercise. */
export const trainerPassSchema: z.ZodType<TrainerPassCriteria> = z
  .object({
    minScore: num('points').gte(0, 'must be 0 or more').lte(100, 'must be 100 or less'),
    insideWindow: z.boolean({ error: 'must be true or false' }),
    withinMachineLimits: z.boolean({ error: 'must be true or false' }),
  })
  .strict();

/** The fields of an instructor's exercise: the project file keeps it with these rules and the Trainer checks it with them. */
export const trainerExerciseShape = {
  id: z.string({ error: 'must be text' }).min(1, 'must not be empty'),
  name: z.string({ error: 'must be text' }),
  levelId: z.string({ error: 'must be text' }).refine((id) => TRAINER_LEVELS.some((l) => l.id === id), 'must be one of the trainer levels'),
  seed: whole().gte(0, 'must be 0 or more').lte(0xffffffff, 'must be below 2^32'),
  faults: trainerFaultsSchema,
  pass: trainerPassSchema,
};

/** An instructor's exercise as the Trainer checks it (nothing extra). */
export const trainerExerciseSchema: z.ZodType<TrainerExercise> = z.object(trainerExerciseShape).strict();

/** Handlers for plant-level methods: validation, an edit's check-and-solve, and rated figures. */
import { z } from 'zod';
import { EngineError, describePlant, solveSharing, solveSharingAtMost } from '../engine';
import { loadAtPct } from '../../shared-types';
import type { CheckedPlant, Plant, PlantDescription } from '../../shared-types';
import { plantSchema } from '../schemas/plant-schema';
import { num } from '../schemas/schema-kit';
import type { HandlerGroup } from './handler';
import { parseOrThrow } from '../schemas/validate';

/**
 * `checkPlant`: the plant is parsed once, then solved (and described, when asked) from that parse (the sharing solver takes
 * a validated plant; no second schema pass). A plant without an operating point is still a valid
 * plant: the reason comes back in `sharingError`.
 */
export function checkPlant(raw: unknown, loadPct: number | undefined, describe = false): CheckedPlant {
  const plant: Plant = parseOrThrow(plantSchema, raw);
  const load = loadPct === undefined ? null : loadAtPct(plant, loadPct);
  // Asked for by an edit: the rated figures come in the same answer, so the editor redraws once.
  let description: PlantDescription | null = null;
  let descriptionError: string | null = null;
  if (describe) {
    try {
      description = describePlant(plant);
    } catch (e) {
      descriptionError = e instanceof Error ? e.message : String(e);
    }
  }
  try {
    const sharing = load ? solveSharingAtMost(plant, load) : solveSharing(plant);
    return { plant, load, sharing, sharingError: null, description, descriptionError };
  } catch (e) {
    if (e instanceof EngineError) return { plant, load, sharing: null, sharingError: e.message, description, descriptionError };
    throw e;
  }
}

export const plantHandlers: HandlerGroup<'describePlant' | 'validatePlant' | 'checkPlant'> = {
  describePlant: {
    schema: z.object({ plant: plantSchema }),
    run: ({ plant }) => describePlant(plant),
  },
  validatePlant: {
    schema: z.object({ plant: z.unknown() }),
    run: ({ plant }) => parseOrThrow(plantSchema, plant),
  },
  checkPlant: {
    schema: z
      .object({
        plant: z.unknown(),
        loadPct: num('%')
          .refine((v) => v >= 0 && v <= 500, 'must be from 0 to 500 %')
          .optional(),
        describe: z.boolean().optional(),
      })
      .strict(),
    run: ({ plant, loadPct, describe }) => checkPlant(plant, loadPct, describe),
  },
};

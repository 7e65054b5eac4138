/** Handlers for plant-level methods: validation and rated figures. */
import { z } from 'zod';
import { describePlant } from '../engine';
import { plantSchema } from '../schemas/plant-schema';
import type { HandlerGroup } from './handler';
import { parseOrThrow } from '../schemas/validate';

export const plantHandlers: HandlerGroup<'describePlant' | 'validatePlant'> = {
  describePlant: {
    schema: z.object({ plant: plantSchema }),
    run: ({ plant }) => describePlant(plant),
  },
  validatePlant: {
    schema: z.object({ plant: z.unknown() }),
    run: ({ plant }) => parseOrThrow(plantSchema, plant),
  },
};

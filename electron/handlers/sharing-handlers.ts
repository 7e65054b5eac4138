/** Handlers for steady-state sharing: the operating point and the load sweep. */
import { z } from 'zod';
import { solveSharing, solveSharingAtMost, sweepLoad } from '../engine';
import { plantSchema } from '../schemas/plant-schema';
import type { HandlerGroup } from './handler';

import { flag, num, powerFactor, whole } from '../schemas/schema-kit';

/** The `load` override: one constant-power load replacing the plant's loads. */
export const loadOverrideSchema = z
  .object({
    kW: num('kW').refine((v) => v >= 0, 'must be 0 or more'),
    kVAR: num('kVAR'),
  })
  .strict();

/** Request of `solveSharing`. */
export const solveSharingSchema = z
  .object({ plant: plantSchema, load: loadOverrideSchema.optional(), atMost: flag().optional() })
  .strict()
  .superRefine((r, ctx) => {
    if (r.atMost && !r.load) ctx.addIssue({ code: 'custom', path: ['atMost'], message: 'needs a load (atMost applies to a load override)' });
  });

/** Most set operating points (sweep steps × sets) in one sweep. */
export const MAX_SWEEP_SET_POINTS = 100_000;

/** Request of `sweepLoad`. */
export const sweepLoadSchema = z
  .object({
    plant: plantSchema,
    steps: whole().gte(2, 'must be 2 or more').lte(2000, 'must be 2000 or fewer'),
    fromPct: num('%')
      .refine((v) => v >= 0, 'must be 0 or more')
      .optional(),
    toPct: num('%')
      .refine((v) => v <= 500, 'must be 500 % or less')
      .optional(),
    pf: powerFactor().optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    const work = r.steps * r.plant.sets.length;
    if (work > MAX_SWEEP_SET_POINTS)
      ctx.addIssue({
        code: 'custom',
        path: ['steps'],
        message: `${r.steps} steps × ${r.plant.sets.length} sets is more than ${MAX_SWEEP_SET_POINTS} solved set points: give ${Math.floor(MAX_SWEEP_SET_POINTS / r.plant.sets.length)} steps or fewer for this plant`,
      });
    if ((r.fromPct ?? 0) > (r.toPct ?? 110)) ctx.addIssue({ code: 'custom', path: ['toPct'], message: 'must not be below fromPct' });
  });

export const sharingHandlers: HandlerGroup<'solveSharing' | 'sweepLoad'> = {
  solveSharing: {
    schema: solveSharingSchema,
    run: ({ plant, load, atMost }) => (atMost && load ? solveSharingAtMost(plant, load) : solveSharing(plant, load)),
  },
  sweepLoad: {
    schema: sweepLoadSchema,
    run: (req) => sweepLoad(req),
  },
};

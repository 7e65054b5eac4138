/**
 * Schema of the `simulate` request: the `droopline.scenario` file (plant inline, every event checked by its type,
 * ids checked against the plant), with the bounds on the work of one run; the report request uses it too.
 */
import { z } from 'zod';
import { SCENARIO_FORMAT, SCENARIO_VERSION } from '../../shared-types';
import type { Scenario } from '../../shared-types';
import { MAX_STEP_MS } from '../engine';
import { plantSchema } from './plant-schema';
import { id, num, positive, text } from './schema-kit';
import { checkEvents, eventSchema } from './scenario-events';

/** Longest simulated time accepted, s. */
export const MAX_DURATION_S = 3600;
/** Most integration steps in one run. */
export const MAX_STEPS = 20_000_000;
/** Most set-steps (integration steps × sets in the plant) in one run: bounds the work of a large plant. */
export const MAX_SET_STEPS = 40_000_000;
/** Most output values per series kind (output points × sets): bounds the size of the result. */
export const MAX_OUTPUT_SET_POINTS = 2_000_000;
const fmt = (n: number) => Math.round(n).toLocaleString('en').replace(/,/g, ' ');

/**
 * Schema of a scenario (`droopline.scenario`, version 1). The plant is inline
 * (`plantFile` is resolved by the command line before this schema sees the scenario).
 */
export const scenarioSchema: z.ZodType<Scenario> = z
  .object({
    format: z.literal(SCENARIO_FORMAT, { error: `must be "${SCENARIO_FORMAT}"` }).optional(),
    version: z
      .literal(SCENARIO_VERSION, { error: `must be ${SCENARIO_VERSION} (this version of Droopline reads scenarios of version ${SCENARIO_VERSION})` })
      .optional(),
    name: text().optional(),
    plant: plantSchema.optional(),
    plantFile: text().optional(),
    durationS: positive('s').lte(MAX_DURATION_S, `must be ${MAX_DURATION_S} s or less`),
    stepMs: positive('ms').gte(0.01, 'must be 0.01 ms or more').lte(MAX_STEP_MS, `must be ${MAX_STEP_MS} ms or less`).default(1),
    outputPoints: num('points').int('must be a whole number').gte(10, 'must be 10 or more').lte(100_000, 'must be 100 000 or less').default(2000),
    startDeExcited: z.array(id(), { error: 'must be a list of set ids' }).optional(),
    events: z.array(eventSchema, { error: 'must be a list of events' }).default([]),
  })
  .strict()
  .superRefine((s, ctx) => {
    if (!s.plant) {
      ctx.addIssue({
        code: 'custom',
        path: ['plant'],
        message: s.plantFile !== undefined ? `is required here: plantFile ("${s.plantFile}") is read by the command line only` : 'is required',
      });
      return;
    }
    const plant = s.plant;
    const steps = (s.durationS * 1000) / s.stepMs;
    if (steps > MAX_STEPS)
      ctx.addIssue({
        code: 'custom',
        path: ['stepMs'],
        message: `too small for ${s.durationS} s: the run would take more than ${MAX_STEPS.toLocaleString('en')} steps`,
      });
    const sets = plant.sets.length;
    if (steps <= MAX_STEPS && steps * sets > MAX_SET_STEPS)
      ctx.addIssue({
        code: 'custom',
        path: ['durationS'],
        message: `the run would take ${fmt(steps * sets)} set-steps (${fmt(steps)} steps × ${sets} sets); the limit is ${fmt(MAX_SET_STEPS)}: shorten durationS to ${fmt(((MAX_SET_STEPS / sets) * s.stepMs) / 1000)} s or less, or lengthen stepMs`,
      });
    if (s.outputPoints * sets > MAX_OUTPUT_SET_POINTS)
      ctx.addIssue({
        code: 'custom',
        path: ['outputPoints'],
        message: `${fmt(s.outputPoints)} points × ${sets} sets is more than ${fmt(MAX_OUTPUT_SET_POINTS)}: give ${fmt(Math.floor(MAX_OUTPUT_SET_POINTS / sets))} points or fewer for this plant`,
      });
    (s.startDeExcited ?? []).forEach((sid, i) => {
      const set = plant.sets.find((x) => x.id === sid);
      if (!set) ctx.addIssue({ code: 'custom', path: ['startDeExcited', i], message: `no set "${sid}" in the plant` });
      else if (set.online)
        ctx.addIssue({ code: 'custom', path: ['startDeExcited', i], message: `set "${sid}" is on line; only an off-line set can start de-excited` });
    });
    checkEvents(s.events, s.durationS, plant, (path, message) => ctx.addIssue({ code: 'custom', path, message }));
  }) as unknown as z.ZodType<Scenario>;

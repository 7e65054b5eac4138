/**
 * Handlers for the time-domain simulator: the `droopline.scenario` schema (plant inline,
 * every event checked by its type, ids checked against the plant) and `simulate`, run
 * in chunks with progress and cancelling.
 */
import { z } from 'zod';
import { LOAD_MODELS, SCENARIO_FORMAT, SCENARIO_VERSION } from '../../shared-types';
import type { Scenario, SimulationResult } from '../../shared-types';
import { Cancelled, createSimulation, MAX_STEP_MS, MIN_CHUNK_STEPS } from '../engine';
import { breathe } from './handler';
import type { HandlerContext, HandlerGroup } from './handler';
import { plantSchema } from '../schemas/plant-schema';

import { flag, id, nonNegative, num, oneOf, positive, text } from '../schemas/schema-kit';

/** Longest simulated time accepted, s. */
export const MAX_DURATION_S = 3600;
/** Most integration steps in one run. */
export const MAX_STEPS = 20_000_000;
/** Most set-steps (integration steps × sets in the plant) in one run: bounds the work of a large plant. */
export const MAX_SET_STEPS = 40_000_000;
/** Most output values per series kind (output points × sets): bounds the size of the result. */
export const MAX_OUTPUT_SET_POINTS = 2_000_000;
const fmt = (n: number) => Math.round(n).toLocaleString('en').replace(/,/g, ' ');

const atS = () => nonNegative('s');

const loadStep = z
  .object({
    atS: atS(),
    type: z.literal('load-step'),
    loadId: id().optional(),
    online: flag().optional(),
    kW: num('kW').optional(),
    kVAR: num('kVAR').optional(),
    model: oneOf(LOAD_MODELS).optional(),
  })
  .strict();

const trip = z
  .object({
    atS: atS(),
    type: z.literal('trip'),
    setId: id(),
    shutdown: flag().optional(),
    openBreaker: flag().optional(),
  })
  .strict();

const close = z
  .object({
    atS: atS(),
    type: z.literal('close'),
    setId: id(),
    frequencyHz: positive('Hz').optional(),
    voltageV: nonNegative('V').optional(),
    angleDeg: num('°').gte(-360, 'must be −360° or more').lte(360, 'must be 360° or less').optional(),
  })
  .strict();

const setpoint = z
  .object({
    atS: atS(),
    type: z.literal('setpoint'),
    setId: id(),
    frequencyHz: positive('Hz').optional(),
    voltageV: positive('V').optional(),
    kW: num('kW').optional(),
  })
  .strict();

const ramp = z.object({ atS: atS(), type: z.literal('ramp'), setId: id(), toKW: num('kW'), durationS: nonNegative('s') }).strict();

const motorStart = z
  .object({
    atS: atS(),
    type: z.literal('motor-start'),
    kVA: positive('kVA'),
    pf: num('').gt(0, 'must be greater than 0').lte(1, 'must be 1 or less'),
    durationS: positive('s'),
    runningKW: num('kW').optional(),
    runningKVAR: num('kVAR').optional(),
  })
  .strict();

const EVENT_TYPES = '"load-step", "trip", "close", "setpoint", "ramp" or "motor-start"';

const eventSchema = z.discriminatedUnion('type', [loadStep, trip, close, setpoint, ramp, motorStart], {
  error: (iss) => (iss.code === 'invalid_union' ? `must be ${EVENT_TYPES}` : undefined),
});

/**
 * Schema of a scenario (`droopline.scenario`, version 1). The plant is inline
 * (`plantFile` is resolved by the command line before this schema sees the scenario).
 */
export const scenarioSchema: z.ZodType<Scenario> = z
  .object({
    format: z.literal(SCENARIO_FORMAT, { error: `must be "${SCENARIO_FORMAT}"` }).optional(),
    version: z.literal(SCENARIO_VERSION, { error: `must be ${SCENARIO_VERSION} (this version of Droopline reads scenarios of version ${SCENARIO_VERSION})` }).optional(),
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
    const setIds = new Set(plant.sets.map((x) => x.id));
    const loadIds = new Set(plant.loads.map((x) => x.id));
    const steps = (s.durationS * 1000) / s.stepMs;
    if (steps > MAX_STEPS)
      ctx.addIssue({ code: 'custom', path: ['stepMs'], message: `too small for ${s.durationS} s: the run would take more than ${MAX_STEPS.toLocaleString('en')} steps` });
    const sets = plant.sets.length;
    if (steps <= MAX_STEPS && steps * sets > MAX_SET_STEPS)
      ctx.addIssue({
        code: 'custom',
        path: ['durationS'],
        message: `the run would take ${fmt(steps * sets)} set-steps (${fmt(steps)} steps × ${sets} sets); the limit is ${fmt(MAX_SET_STEPS)}: shorten durationS to ${fmt((MAX_SET_STEPS / sets) * s.stepMs / 1000)} s or less, or lengthen stepMs`,
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
      else if (set.online) ctx.addIssue({ code: 'custom', path: ['startDeExcited', i], message: `set "${sid}" is on line; only an off-line set can start de-excited` });
    });
    s.events.forEach((e, i) => {
      const at = (field: string, message: string) => ctx.addIssue({ code: 'custom', path: ['events', i, field], message });
      if (e.atS > s.durationS) at('atS', `must be within the run (0 to ${s.durationS} s)`);
      if ('setId' in e && !setIds.has(e.setId)) at('setId', `no set "${e.setId}" in the plant`);
      if (e.type === 'load-step') {
        if (e.loadId !== undefined) {
          if (!loadIds.has(e.loadId)) at('loadId', `no load "${e.loadId}" in the plant`);
          if (e.kW !== undefined || e.kVAR !== undefined) at('kW', 'give either loadId or kW/kVAR, not both');
        } else if (e.kW === undefined && e.kVAR === undefined) at('kW', 'is required (or name a plant load with loadId)');
      }
      if (e.type === 'trip' && e.openBreaker === false && e.shutdown === false) at('shutdown', 'must be true when openBreaker is false (otherwise nothing trips)');
      if (e.type === 'setpoint' && e.frequencyHz === undefined && e.voltageV === undefined && e.kW === undefined)
        at('frequencyHz', 'give frequencyHz, voltageV or kW');
    });
  }) as unknown as z.ZodType<Scenario>;

/** Runs the scenario in chunks, reporting progress and stopping when cancelled. */
async function runScenario(scenario: Scenario, ctx: HandlerContext): Promise<SimulationResult> {
  const sim = createSimulation(scenario);
  const total = Math.round(scenario.durationS / sim.stepS);
  const chunk = Math.max(MIN_CHUNK_STEPS, Math.ceil(total / 50));
  while (sim.stepCount < total) {
    if (ctx.signal.aborted) throw new Cancelled('The simulation was cancelled.');
    sim.steps(Math.min(chunk, total - sim.stepCount));
    ctx.progress(sim.stepCount / total, 'simulating');
    await breathe();
  }
  if (ctx.signal.aborted) throw new Cancelled('The simulation was cancelled.');
  return sim.result();
}

export const simulationHandlers: HandlerGroup<'simulate'> = {
  simulate: {
    schema: scenarioSchema,
    run: (request, ctx) => runScenario(request, ctx),
  },
};

/** Handlers for the synchronizing trainer: levels, start, a frame step, and the verdict of a close. */
import { z } from 'zod';
import { judgeClose, MAX_FRAME_S, startExercise, stepTrainer, TRAINER_LEVELS } from '../engine/trainer';
import type { TrainerBus, TrainerInputs, TrainerLevel, TrainerMachine, TrainerState } from '../../shared-types';
import { TRAINER_PHASES } from '../../shared-types';
import type { HandlerGroup } from './handler';
import { trainerExerciseSchema, trainerFaultsSchema, trainerPassSchema } from '../schemas/trainer-schema';
import { MAX_DAMPING_PU, MAX_SET_RATING, plantSchema } from '../schemas/plant-schema';
import { between as range, flag, oneOf, nonNegative, num, positive, syncLimitsSchema as limitsSchema, text, whole } from '../schemas/schema-kit';

const machineSchema: z.ZodType<TrainerMachine> = z
  .object({
    label: text(),
    ratedKVA: positive('kVA').lte(MAX_SET_RATING, 'must be 2 000 000 kVA or less'),
    ratedKW: positive('kW').lte(MAX_SET_RATING, 'must be 2 000 000 kW or less'),
    ratedVoltageV: range('V', 100, 35000),
    ratedFrequencyHz: z.union([z.literal(50), z.literal(60)], { error: 'must be 50 or 60 (Hz)' }),
    poles: whole().gte(2, 'must be 2 or more').lte(64, 'must be 64 or fewer'),
    xddpPU: range('pu', 0.01, 2),
    xdpPU: range('pu', 0.01, 5),
    tdopS: range('s', 0.01, 60),
    inertiaS: range('s', 0.01, 60),
    dampingPU: range('pu', 0, MAX_DAMPING_PU),
    raPU: range('pu', 0, 1),
    droopPct: range('%', 0, 20),
    actuatorLagS: range('s', 0, 10),
    engineLagS: range('s', 0, 30),
    regulatorGainPU: range('pu', 0.01, 10000),
    exciterLagS: range('s', 0, 10),
    ceilingPU: range('pu', 0.01, 20),
  })
  .strict();

const busSchema: z.ZodType<TrainerBus> = z
  .object({
    ratedKVA: positive('kVA').lte(10 * MAX_SET_RATING, 'must be 20 000 000 kVA or less'),
    xPU: range('pu', 0.001, 10),
    inertiaS: range('s', 0.01, 600),
  })
  .strict();

const levelSchema: z.ZodType<TrainerLevel> = z
  .object({
    id: text(),
    label: text(),
    description: text(),
    breakerClosingMs: nonNegative('ms').lte(2000, 'must be 2000 ms or less'),
    busDriftHz: nonNegative('Hz').lte(5, 'must be 5 Hz or less'),
    mustSetWindow: flag(),
  })
  .strict();

const contactSchema = z
  .object({
    atS: num('s'),
    angleDeg: num('°'),
    slipHz: num('Hz'),
    voltageDifferencePct: num('%'),
    deltaVPU: num('pu'),
    commandAngleDeg: num('°'),
  })
  .strict();

/** The live state as it comes back from the renderer: every number finite, nothing extra. */
const stateSchema: z.ZodType<TrainerState> = z
  .object({
    seed: whole(),
    levelId: text(),
    level: levelSchema,
    machine: machineSchema,
    bus: busSchema,
    window: limitsSchema.nullable(),
    referenceWindow: limitsSchema,
    phase: oneOf(TRAINER_PHASES),
    tS: nonNegative('s'),
    busFrequencyHz: positive('Hz'),
    // 0 V: a dead bus (an instructor's fault).
    busVoltageV: nonNegative('V'),
    busBaseFrequencyHz: positive('Hz'),
    drift: z.object({ phase1: num('rad'), phase2: num('rad'), period1S: positive('s'), period2S: positive('s') }).strict(),
    incomingFrequencyHz: positive('Hz'),
    incomingVoltageV: nonNegative('V'),
    angleDeg: num('°'),
    speedReferenceHz: positive('Hz'),
    voltageReferenceV: nonNegative('V'),
    actuatorPU: num('pu'),
    mechanicalPU: num('pu'),
    fieldPU: num('pu'),
    emfPU: num('pu'),
    closeCommandAtS: num('s').nullable(),
    closeCommandAngleDeg: num('°').nullable(),
    incomingSetId: text().nullable(),
    contact: contactSchema.nullable(),
    faults: trainerFaultsSchema.optional(),
  })
  .strict()
  .superRefine((st, ctx) => {
    // The live state's frequencies and voltages stay near the machine's rating (a returned state is far inside).
    const fr = st.machine.ratedFrequencyHz;
    const vr = st.machine.ratedVoltageV;
    for (const k of ['busFrequencyHz', 'busBaseFrequencyHz', 'incomingFrequencyHz', 'speedReferenceHz'] as const) {
      if (st[k] < fr / 2 || st[k] > fr * 1.5)
        ctx.addIssue({ code: 'custom', path: [k], message: `must be within 50 % of the rated ${fr} Hz (${fr / 2}–${fr * 1.5} Hz)` });
    }
    for (const k of ['busVoltageV', 'incomingVoltageV', 'voltageReferenceV'] as const) {
      if (st[k] > vr * 2) ctx.addIssue({ code: 'custom', path: [k], message: `must be ${vr * 2} V (twice rated) or less` });
    }
    for (const k of ['actuatorPU', 'mechanicalPU', 'fieldPU', 'emfPU'] as const) {
      if (Math.abs(st[k]) > 100) ctx.addIssue({ code: 'custom', path: [k], message: 'must be within ±100 pu' });
    }
    if (st.drift.period1S > 1e6 || st.drift.period2S > 1e6) ctx.addIssue({ code: 'custom', path: ['drift'], message: 'periods must be 1 000 000 s or less' });
  }) as unknown as z.ZodType<TrainerState>;

const direction = z.union([z.literal(-1), z.literal(0), z.literal(1)], { error: 'must be -1, 0 or 1' });
const inputsSchema: z.ZodType<TrainerInputs> = z
  .object({ speed: direction, voltage: direction, close: flag().optional(), window: limitsSchema.optional() })
  .strict();

export const trainerHandlers: HandlerGroup<'trainerLevels' | 'trainerStart' | 'trainerStep' | 'trainerClose' | 'checkTrainerExercise'> = {
  trainerLevels: {
    schema: z.object({}).strict(),
    run: () => TRAINER_LEVELS.map((l) => ({ ...l })),
  },
  trainerStart: {
    schema: z
      .object({
        seed: whole().gte(0, 'must be 0 or more').lte(0xffffffff, 'must be below 2^32'),
        levelId: text(),
        machine: machineSchema.optional(),
        bus: busSchema.optional(),
        plant: plantSchema.optional(),
        incomingSetId: text().optional(),
        window: limitsSchema.optional(),
        faults: trainerFaultsSchema.optional(),
      })
      .strict(),
    run: (request) => startExercise(request),
  },
  trainerStep: {
    schema: z
      .object({
        state: stateSchema,
        inputs: inputsSchema,
        dtS: nonNegative('s').lte(MAX_FRAME_S, `must be ${MAX_FRAME_S} s or less`),
      })
      .strict(),
    run: ({ state, inputs, dtS }) => stepTrainer(state, inputs, dtS),
  },
  trainerClose: {
    schema: z.object({ state: stateSchema, plant: plantSchema.optional(), pass: trainerPassSchema.optional() }).strict(),
    run: ({ state, plant, pass }) => judgeClose(state, {}, plant, pass),
  },
  checkTrainerExercise: {
    schema: z.object({ exercise: trainerExerciseSchema }).strict(),
    run: () => ({ ok: true as const }),
  },
};

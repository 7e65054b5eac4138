/**
 * Schemas of the synchronizing requests: the `droopline.sync` case (with the plant + incomingSetId alternative and
 * limit presets), used by `evaluateSync`, and the closing-map request, used by `closingMap`; the report request uses
 * both.
 */
import { z } from 'zod';
import { CLOSING_MAP_ANGLE_AXES, CLOSING_MAP_METHODS, SYNC_FORMAT } from '../../shared-types';
import type { ClosingMapRequest, SyncCase } from '../../shared-types';
import { incomingFromSet, listSyncPresets, plantBus, TIME_DOMAIN_MAX_CELLS } from '../engine';
import { plantSchema } from './plant-schema';
import { breakerClosingMs, deadFields, id, nonNegative, num, oneOf, positive, syncLimitsSchema as limitsSchema, text } from './schema-kit';

const deadSchema = z
  .object({
    deadBus: deadFields.deadBus.default(false),
    deadLine: deadFields.deadLine.default(false),
    livePct: deadFields.livePct.default(80),
    deadPct: deadFields.deadPct.default(25),
  })
  .strict()
  .refine((d) => d.deadPct < d.livePct, { message: 'must be below the live threshold', path: ['deadPct'] });

const busSchema = z
  .object({
    frequencyHz: nonNegative('Hz').lte(1000, 'must be 1000 Hz or less'),
    voltageV: nonNegative('V').lte(50000, 'must be 50 000 V or less'),
    angleDeg: num('°').optional(),
  })
  .strict();

const incomingSchema = z
  .object({
    frequencyHz: nonNegative('Hz').lte(1000, 'must be 1000 Hz or less'),
    voltageV: nonNegative('V').lte(50000, 'must be 50 000 V or less'),
    angleDeg: num('°'),
    ratedKVA: positive('kVA').optional(),
    xddpPU: positive('pu').lte(2, 'must be 2 pu or less').optional(),
    rOverX: nonNegative('').lte(20, 'must be 20 or less').optional(),
    inertiaS: positive('s').lte(30, 'must be 30 s or less').optional(),
    poles: num('poles').int('must be a whole number').gte(2, 'must be 2 or more').multipleOf(2, 'must be even').optional(),
  })
  .strict();

const busSourceSchema = z
  .object({
    ratedKVA: positive('kVA'),
    xPU: positive('pu').lte(10, 'must be 10 pu or less'),
    rPU: nonNegative('pu').lte(10, 'must be 10 pu or less').optional(),
  })
  .strict();

const presetIds = (): string[] => listSyncPresets().map((p) => p.id);

/** How far a live side's frequency may be from rated before it is refused as implausible (±15 %). */
export const PLAUSIBLE_FREQUENCY_FRACTION = 0.15;

/** The plausible band for a live side, Hz: ±15 % of rated, or of 50 or 60 Hz when no rated frequency is given. */
export function plausibleFrequencyRangeHz(ratedHz: number | undefined): [number, number] {
  const k = PLAUSIBLE_FREQUENCY_FRACTION;
  const round = (x: number) => Math.round(x * 100) / 100;
  return ratedHz === undefined ? [round(50 * (1 - k)), round(60 * (1 + k))] : [round(ratedHz * (1 - k)), round(ratedHz * (1 + k))];
}

/**
 * Schema of a sync-check case (`droopline.sync`, version 1). Either `bus` + `incoming` with `ratedKVA` and
 * `xddpPU`, or a `plant` and `incomingSetId` (the set's machine data fill what `incoming` leaves out; the bus
 * defaults to the plant's solved operating point with the incoming set off line, or dead when no other set is
 * online; `busFrom` says which). Limits come from
 * `limits`, or from the preset `presetId` when `limits` is absent.
 */
export const syncCaseSchema: z.ZodType<SyncCase> = z
  .object({
    format: z.literal(SYNC_FORMAT, { error: `must be "${SYNC_FORMAT}"` }).optional(),
    version: z.literal(1, { error: 'must be 1 (this version of Droopline reads sync cases of version 1)' }).optional(),
    name: text().optional(),
    bus: busSchema.optional(),
    incoming: incomingSchema,
    busSource: busSourceSchema.optional(),
    plant: plantSchema.optional(),
    incomingSetId: id().optional(),
    breakerClosingMs: breakerClosingMs(),
    limits: limitsSchema.optional(),
    presetId: text().optional(),
    dead: deadSchema.optional(),
    ratedVoltageV: positive('V').lte(50000, 'must be 50 000 V or less').optional(),
    ratedFrequencyHz: positive('Hz').lte(1000, 'must be 1000 Hz or less').optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    if (c.plant) {
      if (c.incomingSetId === undefined) issue(['incomingSetId'], 'is required when a plant is given (which set is coming on?)');
      else if (!c.plant.sets.some((s) => s.id === c.incomingSetId)) {
        issue(['incomingSetId'], `must name a set of the plant (${c.plant.sets.map((s) => s.id).join(', ')})`);
      }
    } else {
      if (c.incomingSetId !== undefined) issue(['plant'], 'is required when incomingSetId is given');
      if (!c.bus) issue(['bus'], 'is required (or give a plant and incomingSetId)');
      if (c.incoming.ratedKVA === undefined) issue(['incoming', 'ratedKVA'], 'is required (or give a plant and incomingSetId)');
      if (c.incoming.xddpPU === undefined) issue(['incoming', 'xddpPU'], 'is required (or give a plant and incomingSetId)');
    }
    // A live side far from the rated frequency is a typing error (500 Hz for 50 Hz), not a case to evaluate.
    const rated = c.plant?.ratedFrequencyHz ?? c.ratedFrequencyHz;
    for (const side of ['bus', 'incoming'] as const) {
      const f = c[side]?.frequencyHz;
      if (f === undefined || f === 0) continue;
      const [lo, hi] = plausibleFrequencyRangeHz(rated);
      if (f < lo || f > hi) {
        issue(
          [side, 'frequencyHz'],
          rated === undefined
            ? `must be within ${PLAUSIBLE_FREQUENCY_FRACTION * 100} % of 50 or 60 Hz (${lo}–${hi} Hz), or 0 for a dead side`
            : `must be within ${PLAUSIBLE_FREQUENCY_FRACTION * 100} % of the rated ${rated} Hz (${lo}–${hi} Hz), or 0 for a dead side`,
        );
      }
    }
    if (!c.limits) {
      if (c.presetId === undefined) issue(['limits'], 'is required (or give presetId)');
      else if (!presetIds().includes(c.presetId)) issue(['presetId'], `must be one of: ${presetIds().join(', ')}`);
    }
  })
  .transform((c): SyncCase => {
    const { bus, incoming, limits, plant, incomingSetId, ...rest } = c;
    const fromSet = plant && incomingSetId ? incomingFromSet(plant, incomingSetId) : undefined;
    // No bus in the file: the plant's own operating point with the incoming set off line (said in the result).
    const solved = bus ? null : plantBus(plant!, incomingSetId!);
    return {
      ...rest,
      ...(plant ? { plant } : {}),
      ...(incomingSetId !== undefined ? { incomingSetId } : {}),
      bus: bus ?? solved!.bus,
      busFrom: solved ? solved.note : 'given in the case',
      incoming: {
        ...incoming,
        ratedKVA: incoming.ratedKVA ?? fromSet!.ratedKVA,
        xddpPU: incoming.xddpPU ?? fromSet!.xddpPU,
        ...((incoming.inertiaS ?? fromSet?.inertiaS) ? { inertiaS: incoming.inertiaS ?? fromSet!.inertiaS } : {}),
        ...((incoming.poles ?? fromSet?.poles) ? { poles: incoming.poles ?? fromSet!.poles } : {}),
      },
      limits: limits ?? listSyncPresets().find((p) => p.id === c.presetId)!.limits,
    };
  });

/** Schema of a closing-map request (grid defaults: 181 angles × 101 slips over ±0.5 Hz, closed form). */
export const closingMapRequestSchema: z.ZodType<ClosingMapRequest> = z
  .object({
    case: syncCaseSchema,
    angleSteps: num('steps').int('must be a whole number').gte(2, 'must be 2 or more').lte(1441, 'must be 1441 or less').default(181),
    slipSteps: num('steps').int('must be a whole number').gte(2, 'must be 2 or more').lte(1001, 'must be 1001 or less').default(101),
    slipRangeHz: positive('Hz').lte(5, 'must be 5 Hz or less').default(0.5),
    method: oneOf(CLOSING_MAP_METHODS).default('closed-form'),
    angleAxis: oneOf(CLOSING_MAP_ANGLE_AXES).optional(),
    voltageDifferencePct: num('%').gte(-50, 'must be −50 % or more').lte(50, 'must be 50 % or less').optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    // Each time-domain cell is a whole simulation of the plant: bound the cells (the closed form is bounded by the axes).
    const cells = r.angleSteps * r.slipSteps;
    if (r.method === 'time-domain' && cells > TIME_DOMAIN_MAX_CELLS)
      ctx.addIssue({
        code: 'custom',
        path: ['angleSteps'],
        message: `${r.angleSteps} × ${r.slipSteps} = ${cells} cells is more than the ${TIME_DOMAIN_MAX_CELLS} a time-domain map may hold (each cell is a simulation): use fewer angle or slip steps, or the closed form`,
      });
  }) as unknown as z.ZodType<ClosingMapRequest>;

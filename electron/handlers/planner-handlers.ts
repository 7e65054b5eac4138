/**
 * Handlers for the droop planner, the sensitivity matrix and the setpoint-tolerance analysis.
 * The tolerance run goes in chunks of samples, on the host's worker pool when it has one, with
 * progress and cancel.
 */
import { z } from 'zod';
import { mergeToleranceChunks, planDroop, sharingSensitivity, TOLERANCE_DEFAULTS, toleranceSampleCount, toleranceSamples } from '../engine';
import type { ToleranceChunk } from '../engine';
import type { ToleranceRequest } from '../../shared-types';
import type { HandlerContext, HandlerGroup } from './handler';
import { runChunks } from './pool';
import { plantSchema } from '../schemas/plant-schema';
import { loadOverrideSchema } from './sharing-handlers';

import { PLAN_FIELDS, TOLERANCE_DISTRIBUTIONS } from '../../shared-types';
import { id, num, oneOf, powerFactor, whole } from '../schemas/schema-kit';

/** A min–max band whose min is below its max. */
const band = (unit: string) =>
  z
    .object({ min: num(unit), max: num(unit) })
    .strict()
    .refine((b) => b.min < b.max, { message: 'min must be below max', path: ['max'] });

const pfSchema = powerFactor();

const loadRangeSchema = band('%').refine((b) => b.min >= 0 && b.max <= 200, { message: 'must lie within 0–200 %', path: ['max'] });

/** Request of `planDroop`. */
export const planRequestSchema = z
  .object({
    plant: plantSchema,
    frequencyBandHz: band('Hz').refine((b) => b.min > 0, { message: 'must be above 0 Hz', path: ['min'] }),
    voltageBandV: band('V').refine((b) => b.min > 0, { message: 'must be above 0 V', path: ['min'] }),
    loadRangePct: loadRangeSchema.optional(),
    pf: pfSchema.optional(),
    fixed: z.array(z.object({ setId: id(), fields: z.array(oneOf(PLAN_FIELDS, { quoted: false })) }).strict()).optional(),
    limits: z
      .object({
        speedDroopPct: band('%')
          .refine((b) => b.min > 0, { message: 'must be above 0 %', path: ['min'] })
          .optional(),
        reactiveDroopPct: band('%')
          .refine((b) => b.min > 0, { message: 'must be above 0 %', path: ['min'] })
          .optional(),
        noLoadHzPct: band('%').optional(),
        noLoadVPct: band('%').optional(),
      })
      .strict()
      .optional(),
  })
  .strict();

/** Request of `sharingSensitivity`. */
export const sensitivityRequestSchema = z.object({ plant: plantSchema, load: loadOverrideSchema.optional() }).strict();

/** Most set solutions (tolerance samples × sets) in one tolerance analysis. */
export const MAX_TOLERANCE_SET_SAMPLES = 4_000_000;

/** Request of `toleranceAnalysis`. */
export const toleranceRequestSchema = z
  .object({
    plant: plantSchema,
    samples: whole().gte(10, 'must be 10 or more').lte(1_000_000, 'must be 1 000 000 or fewer').optional(),
    seed: whole()
      .gte(0, 'must be 0 or more')
      .lte(2 ** 31 - 1, 'must be below 2³¹')
      .optional(),
    speedTolHz: num('Hz')
      .refine((v) => v >= 0 && v <= 5, 'must be 0–5 Hz')
      .optional(),
    voltageTolPct: num('%')
      .refine((v) => v >= 0 && v <= 20, 'must be 0–20 %')
      .optional(),
    droopTolPct: num('%')
      .refine((v) => v >= 0 && v < 50, 'must be 0 % or more and below 50 %')
      .optional(),
    distribution: oneOf(TOLERANCE_DISTRIBUTIONS, { quoted: false }).optional(),
    load: loadOverrideSchema.optional(),
    loadRangePct: loadRangeSchema.optional(),
    pf: pfSchema.optional(),
    bins: whole().gte(2, 'must be 2 or more').lte(200, 'must be 200 or fewer').optional(),
  })
  .strict()
  .refine((r) => !(r.load && r.loadRangePct), { message: 'give either load or loadRangePct, not both', path: ['loadRangePct'] })
  .superRefine((r, ctx) => {
    const n = r.plant.sets.length;
    const samples = r.samples ?? TOLERANCE_DEFAULTS.samples;
    if (samples * n > MAX_TOLERANCE_SET_SAMPLES)
      ctx.addIssue({
        code: 'custom',
        path: ['samples'],
        message: `${samples} samples × ${n} sets is more than ${MAX_TOLERANCE_SET_SAMPLES.toLocaleString('en').replace(/,/g, ' ')} set solutions: give ${Math.floor(MAX_TOLERANCE_SET_SAMPLES / n)} samples or fewer for this plant`,
      });
  });

/**
 * Samples per chunk: the unit of progress, of cancel and of a pool worker's task. At about 25 µs a sample a chunk
 * is some 10 ms of work, long beside a worker round trip (well under a millisecond) and short beside a cancel.
 */
export const SAMPLES_PER_CHUNK = 500;

/** The tolerance analysis: chunks of samples (on the pool when there is one), merged in sample order. */
export async function runTolerance(req: ToleranceRequest, ctx: HandlerContext, samplesPerChunk = SAMPLES_PER_CHUNK) {
  const chunks: ToleranceChunk[] = [];
  await runChunks<ToleranceChunk>(
    {
      total: toleranceSampleCount(req),
      chunk: samplesPerChunk,
      label: 'tolerance samples',
      cancelled: 'The tolerance analysis was cancelled.',
      run: (from, to, pool, signal) => (pool ? pool.run('toleranceSamples', [req, from, to], signal) : toleranceSamples(req, from, to)),
      take: (c) => chunks.push(c),
    },
    ctx,
  );
  return mergeToleranceChunks(req, chunks);
}

export const plannerHandlers: HandlerGroup<'planDroop' | 'sharingSensitivity' | 'toleranceAnalysis'> = {
  planDroop: { schema: planRequestSchema, run: (r) => planDroop(r) },
  sharingSensitivity: { schema: sensitivityRequestSchema, run: ({ plant, load }) => sharingSensitivity(plant, load) },
  toleranceAnalysis: { schema: toleranceRequestSchema, run: (r, ctx) => runTolerance(r, ctx) },
};

/**
 * Handlers for commissioning: reading a load-bank test record, fitting the model to it (in
 * rounds, with progress and cancel), and the commissioning record of a set (the engine's rows, then the report
 * renderer's CSV and HTML).
 */
import { z } from 'zod';
import { formatNumber } from '../../shared-types';
import { Cancelled, commissioningRecordData, fitTestRecord, inspectTestRecord, MAX_FIT_ITERATIONS, MAX_RECORD_ROWS, parseTestRecord } from '../engine';
import type { CommissioningRecordRequest, FitRequest, FitResult, ParseRecordRequest } from '../../shared-types';
import type { HandlerContext, HandlerGroup } from './handler';
import { renderCommissioningRecord } from '../report';
import { plantSchema } from '../schemas/plant-schema';
import { FIT_KEYS, fitResultPrintedSchema, recordColumnFields, recordText, recordUnitFields, testDescriptionFields } from '../schemas/commissioning-schema';
import { nonNegative, num, text } from '../schemas/schema-kit';

const columnsSchema = z.object(recordColumnFields).strict();
const unitsSchema = z.object(recordUnitFields).strict();

export const parseRecordSchema: z.ZodType<ParseRecordRequest> = z
  .object({
    text: recordText(),
    columns: columnsSchema,
    units: unitsSchema,
    ratedFrequencyHz: num('Hz').gt(0, 'must be greater than 0').lte(1000, 'must be 1000 Hz or less'),
    ratedVoltageV: num('V').gt(0, 'must be greater than 0').lte(1_000_000, 'must be 1 000 000 V or less'),
  })
  .strict();

const series = (unit: string) =>
  z.array(num(unit), { error: 'must be a list of numbers' }).max(MAX_RECORD_ROWS, `must have at most ${MAX_RECORD_ROWS} samples`);

const recordSchema = z
  .object({
    tS: series('s'),
    frequencyHz: series('Hz'),
    voltageV: series('V'),
    kW: series('kW').optional(),
    kVAR: series('kVAR').optional(),
    currentA: series('A').optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.tS.length < 3) ctx.addIssue({ code: 'custom', path: ['tS'], message: 'must have at least 3 samples' });
    for (const k of ['frequencyHz', 'voltageV', 'kW', 'kVAR', 'currentA'] as const) {
      const x = r[k];
      if (x && x.length !== r.tS.length) ctx.addIssue({ code: 'custom', path: [k], message: `must have as many samples as tS (${r.tS.length})` });
    }
    for (let i = 1; i < r.tS.length; i++)
      if (!(r.tS[i]! > r.tS[i - 1]!)) {
        ctx.addIssue({ code: 'custom', path: ['tS', i], message: 'must increase' });
        break;
      }
  });

const testSchema = z.object(testDescriptionFields).strict();

const KEYS = FIT_KEYS;

const paramSchema = z
  .object({
    key: z.enum(KEYS, { error: `must be one of ${KEYS.join(', ')}` }),
    min: num(''),
    max: num(''),
    start: num('').optional(),
  })
  .strict();

export const fitRequestSchema: z.ZodType<FitRequest> = z
  .object({
    plant: plantSchema,
    record: recordSchema,
    test: testSchema,
    params: z
      .array(paramSchema, { error: 'must be a list of parameters' })
      .min(1, 'choose at least one parameter')
      .max(KEYS.length, `at most ${KEYS.length} parameters`),
    maxIterations: num('')
      .int('must be a whole number')
      .gte(1, 'must be 1 or more')
      .lte(MAX_FIT_ITERATIONS, `must be ${MAX_FIT_ITERATIONS} or less`)
      .optional(),
    stepMs: num('ms').gte(0.5, 'must be 0.5 ms or more').lte(10, 'must be 10 ms or less').optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    const span = r.record.tS.length ? r.record.tS[r.record.tS.length - 1]! - r.record.tS[0]! : 0;
    const steps = (span * 1000) / (r.stepMs ?? 2);
    // Bounded work: one simulation of the record, times the plant's sets, at most 2 000 000 set-steps.
    const sets = r.test.onlineSetIds.length;
    if (steps * sets > 2_000_000)
      ctx.addIssue({
        code: 'custom',
        path: ['record', 'tS'],
        message: `the record (${formatNumber(span, 1)} s at ${r.stepMs ?? 2} ms with ${sets} sets) is beyond the 2 000 000 set-steps one fit simulation may take; shorten the record or use a longer stepMs`,
      });
  }) as unknown as z.ZodType<FitRequest>;

const syncLimits = z
  .object({
    slipHz: nonNegative('Hz'),
    angleDeg: nonNegative('°'),
    voltagePct: nonNegative('%'),
    incomingFaster: z.boolean().optional(),
    incomingHigher: z.boolean().optional(),
  })
  .strip();

/** The parts of a fit result the commissioning record prints (a result of `fitTestRecord`, passed back). */
const fitResultSchema = fitResultPrintedSchema as unknown as z.ZodType<FitResult>;

export const commissioningRecordSchema: z.ZodType<CommissioningRecordRequest> = z
  .object({
    plant: plantSchema,
    setId: text().min(1, 'must not be empty'),
    fit: fitResultSchema.optional(),
    test: testSchema.optional(),
    syncCheck: z
      .object({ limits: syncLimits, breakerClosingMs: nonNegative('ms') })
      .strict()
      .optional(),
    signOff: z
      .object({
        by: text().max(200, 'must be 200 characters or fewer'),
        date: text().max(100, 'must be 100 characters or fewer'),
        remarks: text().max(5000, 'must be 5000 characters or fewer'),
      })
      .strict(),
    date: text().max(100, 'must be 100 characters or fewer'),
  })
  .strict() as unknown as z.ZodType<CommissioningRecordRequest>;

function fit(request: FitRequest, ctx: HandlerContext): FitResult {
  return fitTestRecord(request, { progress: (x) => ctx.progress(x, 'fitting'), isCancelled: () => ctx.signal.aborted });
}

export const commissioningHandlers: HandlerGroup<'inspectTestRecord' | 'parseTestRecord' | 'fitTestRecord' | 'buildCommissioningRecord'> = {
  inspectTestRecord: {
    schema: z.object({ text: recordText() }).strict(),
    run: (r) => inspectTestRecord(r.text),
  },
  parseTestRecord: {
    schema: parseRecordSchema,
    run: (r) => parseTestRecord(r),
  },
  fitTestRecord: {
    schema: fitRequestSchema,
    run: (r, ctx) => {
      if (ctx.signal.aborted) throw new Cancelled('The fit was cancelled.');
      return fit(r, ctx);
    },
  },
  buildCommissioningRecord: {
    schema: commissioningRecordSchema,
    run: (r) => renderCommissioningRecord(r, commissioningRecordData(r)),
  },
};

/**
 * Commissioning schemas shared by the commissioning handlers and the project file: a record's column and unit
 * choice, the test description, a fit result passed back, and the project's `commissioning` section (the Commissioning
 * view's work: the accepted record with its choices, the test, the parameter choice, the fit and the sign-off).
 *
 * The project section is read part by part (`COMMISSIONING_PARTS`): the reader checks each part on its own, so a
 * damaged part is named by its field path and left out while the rest of the section (and of the project) opens.
 */
import { z } from 'zod';
import { FIT_PARAMETERS } from '../../shared-types';
import type { ProjectCommissioning } from '../../shared-types';
import { flag, num, text } from './schema-kit';

/** Largest record text accepted, characters (about 50 MB, the CLI's file limit). */
export const MAX_RECORD_TEXT = 50_000_000;
export const recordText = () => text().max(MAX_RECORD_TEXT, `must be at most ${MAX_RECORD_TEXT.toLocaleString('en')} characters`);

/** A column: its header name or its 1-based number. */
export const recordColumn = () =>
  z.union([text().min(1, 'must not be empty'), z.number().int('must be a whole number').gte(1, 'must be 1 or more')], {
    error: 'must be a column name or a column number (1, 2, …)',
  });

/** Which column holds each quantity (`RecordColumns`). */
export const recordColumnFields = {
  time: recordColumn(),
  frequency: recordColumn(),
  voltage: recordColumn(),
  kW: recordColumn().optional(),
  kVAR: recordColumn().optional(),
  current: recordColumn().optional(),
};

/** The units of a record's columns (`RecordUnits`). */
export const recordUnitFields = {
  time: z.enum(['s', 'ms'], { error: 'must be "s" or "ms"' }),
  frequency: z.enum(['Hz', 'pu', '%'], { error: 'must be "Hz", "pu" or "%"' }),
  voltage: z.enum(['V', 'kV', 'pu', '%'], { error: 'must be "V", "kV", "pu" or "%"' }),
  kW: z.enum(['kW', 'MW'], { error: 'must be "kW" or "MW"' }).optional(),
  kVAR: z.enum(['kVAR', 'MVAR'], { error: 'must be "kVAR" or "MVAR"' }).optional(),
  current: z.enum(['A', 'kA'], { error: 'must be "A" or "kA"' }).optional(),
};

const BIG = 10_000_000;
/** The test a record was taken in (`TestDescription`). */
export const testDescriptionFields = {
  setId: text().min(1, 'must not be empty'),
  onlineSetIds: z.array(text(), { error: 'must be a list of set ids' }).min(1, 'must name at least one set'),
  startKW: num('kW').gte(0, 'must be 0 or more').lte(BIG, 'must be 10 000 000 kW or less'),
  startKVAR: num('kVAR').gte(-BIG, 'must be −10 000 000 kVAR or more').lte(BIG, 'must be 10 000 000 kVAR or less'),
  stepKW: num('kW').gte(-BIG, 'must be −10 000 000 kW or more').lte(BIG, 'must be 10 000 000 kW or less'),
  stepKVAR: num('kVAR').gte(-BIG, 'must be −10 000 000 kVAR or more').lte(BIG, 'must be 10 000 000 kVAR or less'),
  stepAtS: num('s'),
  measuredAt: z.enum(['set', 'bus'], { error: 'must be "set" or "bus"' }).optional(),
};

/** The fittable parameters' keys. */
export const FIT_KEYS = FIT_PARAMETERS.map((p) => p.key) as [string, ...string[]];
const fitKey = () => z.enum(FIT_KEYS, { error: `must be one of ${FIT_KEYS.join(', ')}` });

const nullableNumber = () => z.union([num(), z.null()], { error: 'must be a number or null' });
const passMark = () => z.union([flag(), z.null()], { error: 'must be true, false or null' });
const classRow = z.looseObject({
  quantity: text(),
  unit: text(),
  measured: nullableNumber(),
  measuredByClass: z.looseObject({ G1: nullableNumber(), G2: nullableNumber(), G3: nullableNumber() }).optional(),
  limits: z.looseObject({ G1: num(), G2: num(), G3: num() }),
  pass: z.looseObject({ G1: passMark(), G2: passMark(), G3: passMark() }),
});

/** An ISO 8528-5 verdict of a record (`RecordVerdict`); `notes` is left to the caller (the record does not print them). */
export const verdictFields = {
  initialFrequencyHz: num(),
  initialVoltageV: num(),
  frequencyNadirHz: num(),
  frequencyPeakHz: num(),
  voltageMinV: num(),
  voltageMaxV: num(),
  settledFrequencyHz: num(),
  settledVoltageV: num(),
  frequencyRecoveryS: nullableNumber(),
  voltageRecoveryS: nullableNumber(),
  classes: z.array(classRow, { error: 'must be a list of rows' }).max(20, 'must have at most 20 rows'),
};

/** The parts of a fit result the commissioning record prints (a result of `fitTestRecord`, passed back). */
export const fitResultPrintedSchema = z.looseObject({
  setId: text(),
  parameters: z
    .array(z.looseObject({ key: fitKey(), unit: text(), start: num(), value: num(), confidence: text() }), { error: 'must be a list of parameters' })
    .max(FIT_KEYS.length, `at most ${FIT_KEYS.length} parameters`),
  residual: z.looseObject({ frequencyPct: num(), voltagePct: num(), totalPct: num() }),
  measuredVerdict: z.looseObject(verdictFields),
  modelVerdict: z.looseObject(verdictFields),
});

// ---- The project's commissioning section ----

const words = () => z.array(text(), { error: 'must be a list of sentences' });
const series = () => z.array(num(), { error: 'must be a list of numbers' });
const trace = z.looseObject({ tS: series(), frequencyHz: series(), voltageV: series() }).superRefine((t, ctx) => {
  for (const k of ['frequencyHz', 'voltageV'] as const)
    if (t[k].length !== t.tS.length) ctx.addIssue({ code: 'custom', path: [k], message: `must have as many values as tS (${t.tS.length})` });
});
const residual = z.looseObject({ frequencyPct: num(), voltagePct: num(), totalPct: num() });
const verdict = z.looseObject({ ...verdictFields, notes: words() });

/** A whole fit result as the view shows it (`FitResult`); the fitted plant is kept as it was written. */
const fitResultSchema = z.looseObject({
  setId: text().min(1, 'must not be empty'),
  parameters: z
    .array(
      z.looseObject({
        key: fitKey(),
        unit: text(),
        start: num(),
        value: num(),
        min: num(),
        max: num(),
        atBound: flag(),
        // A perfect fit (zero RMS error) has no finite rise; JSON writes it as null.
        sensitivityPct: nullableNumber(),
        confidence: text(),
      }),
      { error: 'must be a list of parameters' },
    )
    .max(FIT_KEYS.length, `at most ${FIT_KEYS.length} parameters`),
  residual,
  startResidual: residual,
  iterations: num(),
  maxIterations: num(),
  simulations: num(),
  stoppedAtCap: flag(),
  fitted: trace,
  startTrace: trace,
  measured: trace,
  measuredVerdict: verdict,
  modelVerdict: verdict,
  fittedPlant: z.record(z.string(), z.unknown(), { error: 'must be an object' }),
  notes: words(),
  warnings: words(),
});

/** A test description as the view holds it: a number the user has left blank is null. */
const blank = <T extends z.ZodType>(s: T) => z.union([s, z.null()], { error: 'must be a number or null (blank)' });
const heldTest = z.looseObject({
  setId: text(),
  onlineSetIds: z.array(text(), { error: 'must be a list of set ids' }),
  startKW: blank(num('kW')),
  startKVAR: blank(num('kVAR')),
  stepKW: blank(num('kW')),
  stepKVAR: blank(num('kVAR')),
  stepAtS: blank(num('s')),
  measuredAt: testDescriptionFields.measuredAt,
});

/**
 * The parts of the section, each checked on its own by the project reader. Every part may be left out (it then
 * starts as a new Commissioning view has it).
 */
export const COMMISSIONING_PARTS = {
  /** The accepted record: its file name, its text and the column and unit choice it was read with. */
  record: z
    .looseObject({
      fileName: text(),
      text: recordText(),
      columns: z.looseObject(recordColumnFields),
      units: z.looseObject(recordUnitFields),
    })
    .nullable(),
  test: heldTest,
  params: z
    .array(z.looseObject({ key: fitKey(), chosen: flag(), min: blank(num()), max: blank(num()) }), { error: 'must be a list of parameters' })
    .max(FIT_KEYS.length, `at most ${FIT_KEYS.length} parameters`),
  maxIterations: blank(num()),
  /** The last fit, the test it was run with (whole) and whether its values were applied to the plant. */
  fit: z
    .looseObject({
      result: fitResultSchema,
      test: z.looseObject(testDescriptionFields),
      applied: flag(),
    })
    .nullable(),
  signOff: z.looseObject({
    by: text().max(200, 'must be 200 characters or fewer'),
    date: text().max(100, 'must be 100 characters or fewer'),
    remarks: text().max(5000, 'must be 5000 characters or fewer'),
  }),
  recordSetId: text(),
} as const;

/** Words for each part in the reader's notes. */
export const COMMISSIONING_PART_WORDS: Record<keyof typeof COMMISSIONING_PARTS, string> = {
  record: 'the test record',
  test: 'the test description',
  params: 'the parameter choice',
  maxIterations: 'the iteration cap',
  fit: 'the fit result',
  signOff: 'the sign-off',
  recordSetId: 'the set of the commissioning record',
};

/** The section as a whole (the project schema's `commissioning`); unknown fields are kept. */
export const projectCommissioningSchema = z.looseObject(
  Object.fromEntries(Object.entries(COMMISSIONING_PARTS).map(([k, s]) => [k, s.optional()])) as {
    [K in keyof typeof COMMISSIONING_PARTS]: z.ZodOptional<(typeof COMMISSIONING_PARTS)[K]>;
  },
) as unknown as z.ZodType<ProjectCommissioning>;

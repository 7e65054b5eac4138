/**
 * Fuzz suite over every contract method: valid requests (the demo plant, small scenarios, started trainer
 * exercises) mutated at random leaves to extremes, NaN-like text, negatives, huge values, wrong types and
 * missing fields, sent through `dispatch`. It must never throw; a refusal is a typed error, every
 * INVALID_INPUT names a field path, and no successful result holds NaN or ±Infinity.
 * `FUZZ_RUNS` (npm run test:fuzz) sets the cases per fast method; slow methods run a tenth of that.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dispatch } from '../../electron/handlers';
import { ENGINE_METHODS } from '../../shared-types';
import type { EngineMethod, TrainerState } from '../../shared-types';
import { demoPlantJson } from '../helpers/plants';
import { rawProject } from '../helpers/projects';

const RUNS = Number(process.env.FUZZ_RUNS ?? 120);
const SLOW = new Set<EngineMethod>(['simulate', 'closingMap', 'buildReport', 'toleranceAnalysis', 'trainerClose', 'planDroop', 'fitTestRecord']);
const runsFor = (m: EngineMethod) => (SLOW.has(m) ? Math.max(5, Math.round(RUNS / 10)) : RUNS);

type Json = unknown;
const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

/** Replacement values: extremes, NaN-like text, wrong types, and "missing". */
const MISSING = Symbol('missing');
const replacement = fc.oneof(
  fc.constantFrom<unknown>(
    0,
    -0,
    -1,
    1e308,
    -1e308,
    5e-324,
    -5e-324,
    1e-300,
    2 ** 53,
    -(2 ** 31),
    0.5,
    1e6,
    1e9,
    'NaN',
    'Infinity',
    '-1',
    '',
    null,
    true,
    [],
    {},
    MISSING,
  ),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer({ min: -1_000_000, max: 1_000_000 }),
  fc.string({ maxLength: 6 }),
);

/** Every path to a leaf (number, string, boolean, null) of a JSON value. */
function leafPaths(v: Json, at: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  if (Array.isArray(v)) v.forEach((x, i) => leafPaths(x, [...at, i], out));
  else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) leafPaths(x, [...at, k], out);
  else out.push(at);
  return out;
}

function setAt(root: Json, path: (string | number)[], value: unknown): void {
  let o = root as Record<string | number, unknown>;
  for (const k of path.slice(0, -1)) o = o[k] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  if (value === MISSING) delete o[last];
  else o[last] = value;
}

/** Keeps the slow methods' work small whatever the mutation did (the bounds themselves are tested elsewhere). */
function shrinkWork(method: EngineMethod, p: Record<string, unknown>): void {
  const cap = (k: string, max: number) => typeof p[k] === 'number' && (p[k] as number) > max && (p[k] = max);
  if (method === 'simulate') {
    cap('durationS', 0.3);
    if (typeof p.stepMs === 'number' && p.stepMs < 1) p.stepMs = 1;
    cap('outputPoints', 50);
  }
  if (method === 'closingMap') {
    cap('angleSteps', 7);
    cap('slipSteps', 5);
    if (p.method === 'time-domain') p.method = 'closed-form';
  }
  if (method === 'toleranceAnalysis') cap('samples', 20);
  if (method === 'fitTestRecord') cap('maxIterations', 1);
  if (method === 'sweepLoad') cap('steps', 12);
}

/** Finds a NaN or ±Infinity anywhere in a result; returns its path or null. */
function nonFiniteAt(v: unknown, at = 'value'): string | null {
  if (typeof v === 'number') return Number.isFinite(v) ? null : at;
  if (Array.isArray(v) || ArrayBuffer.isView(v)) {
    const a = v as ArrayLike<unknown>;
    for (let i = 0; i < a.length; i++) {
      const r = nonFiniteAt(a[i], `${at}[${i}]`);
      if (r) return r;
    }
    return null;
  }
  if (v !== null && typeof v === 'object') {
    for (const [k, x] of Object.entries(v)) {
      const r = nonFiniteAt(x, `${at}.${k}`);
      if (r) return r;
    }
  }
  return null;
}

const ALLOWED = new Set(['INVALID_INPUT', 'NO_STEADY_STATE', 'DIVERGED']);
/** A field path at the start of a message: `sets[1].machine.xdPU: …`, `(root): …`. */
const FIELD_PATH = /^(\(root\)|[A-Za-z_][\w]*(\[\d+\]|\.[A-Za-z_]\w*)*)(, [\w.[\]]+)*( × [\w.[\]]+)?:/;

const seeds = {} as Record<EngineMethod, Record<string, unknown>>;
/** Counts per method and outcome, printed at the end. */
const tally: Record<string, Record<string, number>> = {};

beforeAll(async () => {
  const plant = demoPlantJson();
  const trainer = await dispatch('trainerStart', { seed: 3, levelId: 'steady' });
  if (!trainer.ok) throw new Error(trainer.error.message);
  const cmd = await dispatch('trainerStep', { state: trainer.value, inputs: { speed: 0, voltage: 0, close: true }, dtS: 0.05 });
  if (!cmd.ok) throw new Error(cmd.error.message);
  const closed = await dispatch('trainerStep', { state: cmd.value, inputs: { speed: 0, voltage: 0 }, dtS: 0.05 });
  if (!closed.ok) throw new Error(closed.error.message);
  const syncCase = {
    plant,
    incomingSetId: 'G3',
    incoming: { frequencyHz: 50.1, voltageV: 405, angleDeg: -8 },
    bus: { frequencyHz: 50, voltageV: 400 },
    breakerClosingMs: 80,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
  // A short load-bank record (0.6 s at 20 ms) for the commissioning methods.
  const recordText = [
    'time_s,frequency_Hz,voltage_V',
    ...Array.from({ length: 31 }, (_, k) => `${(k * 0.02).toFixed(2)},${k < 10 ? 50 : 49.8 + 0.005 * (k - 10)},${k < 10 ? 400 : 392 + 0.3 * (k - 10)}`),
  ].join('\n');
  const recordRequest = {
    text: recordText,
    columns: { time: 'time_s', frequency: 'frequency_Hz', voltage: 'voltage_V' },
    units: { time: 's', frequency: 'Hz', voltage: 'V' },
    ratedFrequencyHz: 50,
    ratedVoltageV: 400,
  };
  const parsed = await dispatch('parseTestRecord', recordRequest);
  if (!parsed.ok) throw new Error(parsed.error.message);
  const loadBankTest = { setId: 'G1', onlineSetIds: ['G1'], startKW: 250, startKVAR: 150, stepKW: 300, stepKVAR: 200, stepAtS: 0.2 };
  Object.assign(seeds, {
    checkPlant: { plant, loadPct: 60 },
    checkTrainerExercise: {
      exercise: {
        id: 'x1',
        name: 'Slow breaker',
        levelId: 'steady',
        seed: 4,
        faults: { breakerSlowMs: 60, voltageMismatchPct: 3 },
        pass: { minScore: 60, insideWindow: true, withinMachineLimits: true },
      },
    },
    inspectTestRecord: { text: recordText },
    parseTestRecord: recordRequest,
    fitTestRecord: { plant, record: parsed.value.record, test: loadBankTest, params: [{ key: 'machine.inertiaS', min: 0.5, max: 3 }], maxIterations: 1 },
    buildCommissioningRecord: {
      plant,
      setId: 'G2',
      syncCheck: { limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 }, breakerClosingMs: 80 },
      signOff: { by: 'A. Fitter', date: '2026-12-02', remarks: '' },
      date: '2026-12-02',
    },
    describePlant: { plant },
    validatePlant: { plant },
    solveSharing: { plant, load: { kW: 900, kVAR: 500 }, atMost: false },
    sweepLoad: { plant, steps: 8, fromPct: 10, toPct: 100, pf: 0.8 },
    evaluateSync: syncCase,
    listSyncPresets: {},
    closingMap: { case: syncCase, angleSteps: 7, slipSteps: 5, slipRangeHz: 0.5, method: 'closed-form', voltageDifferencePct: 1 },
    simulate: {
      plant,
      durationS: 0.3,
      stepMs: 1,
      outputPoints: 50,
      events: [
        { atS: 0.1, type: 'load-step', kW: 200, kVAR: 100 },
        { atS: 0.2, type: 'setpoint', setId: 'G1', frequencyHz: 50.2 },
      ],
    },
    trainerLevels: {},
    trainerStart: { seed: 5, levelId: 'drifting-bus', window: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 } },
    trainerStep: { state: trainer.value, inputs: { speed: 1, voltage: -1 }, dtS: 0.05 },
    trainerClose: { state: closed.value as TrainerState },
    parseProject: { text: rawProject() },
    serializeProject: { project: rawProject() },
    buildReport: { project: { plant }, date: '2026-12-02', loadsPct: [50, 100], pf: 0.8 },
    planDroop: { plant, frequencyBandHz: { min: 49.5, max: 50.5 }, voltageBandV: { min: 390, max: 410 }, loadRangePct: { min: 10, max: 100 } },
    sharingSensitivity: { plant, load: { kW: 900, kVAR: 400 } },
    toleranceAnalysis: { plant, samples: 20, seed: 2, speedTolHz: 0.1, voltageTolPct: 1, droopTolPct: 5, bins: 5 },
  });
});

describe('fuzz: every contract method', () => {
  it.each(ENGINE_METHODS.map((m) => [m]))('%s: never throws, refuses with a typed error naming the field, never returns NaN', async (method) => {
    const counts: Record<string, number> = {};
    tally[method] = counts;
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(fc.nat(), replacement), { minLength: 0, maxLength: 3 }), async (mutations) => {
        const payload = clone(seeds[method]);
        for (const [pick, value] of mutations) {
          const paths = leafPaths(payload);
          if (paths.length === 0) {
            if (value !== MISSING) (payload as Record<string, unknown>).extra = value;
            continue;
          }
          setAt(payload, paths[pick % paths.length]!, value);
        }
        shrinkWork(method, payload);
        // parseProject reads text: the mutated project goes in as its JSON.
        const request = method === 'parseProject' ? { text: typeof payload.text === 'object' ? JSON.stringify(payload.text) : payload.text } : payload;
        let outcome;
        try {
          outcome = await dispatch(method, request);
        } catch (err) {
          throw new Error(`dispatch threw: ${String(err)}`, { cause: err });
        }
        const key = outcome.ok ? 'ok' : outcome.error.code;
        counts[key] = (counts[key] ?? 0) + 1;
        if (outcome.ok) {
          const bad = nonFiniteAt(outcome.value);
          if (bad) throw new Error(`non-finite number at ${bad} for ${JSON.stringify(request).slice(0, 400)}`);
          return;
        }
        const e = outcome.error;
        if (!ALLOWED.has(e.code)) throw new Error(`unexpected code ${e.code}: ${e.message} for ${JSON.stringify(request).slice(0, 400)}`);
        if (e.code === 'INVALID_INPUT') {
          // A project text that is not a project at all (not JSON, another format) is refused as a whole file.
          const wholeFile = method === 'parseProject' && /file|line \d+/i.test(e.message);
          // A test record's text is refused by the line it breaks on (the CLI adds the file's name).
          const recordLine = (method === 'inspectTestRecord' || method === 'parseTestRecord' || method === 'fitTestRecord') && /^line \d+: /.test(e.message);
          const named = e.issues ? e.issues.length > 0 && e.issues.every((i) => i.path.length > 0) : FIELD_PATH.test(e.message) || wholeFile || recordLine;
          if (!named) throw new Error(`refusal names no field: ${e.message}`);
        }
      }),
      { numRuns: runsFor(method), seed: Number(process.env.FUZZ_SEED ?? 20261202) },
    );
    expect(Object.values(counts).reduce((a, b) => a + b, 0)).toBe(runsFor(method));
  });

  it('prints the tally', () => {
    const total = Object.values(tally).reduce((s, c) => s + Object.values(c).reduce((a, b) => a + b, 0), 0);
    console.log(`fuzz: ${total} cases`, JSON.stringify(tally));
    expect(total).toBeGreaterThan(0);
  });
});

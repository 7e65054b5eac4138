/**
 * The Commissioning view's store: the test record (text, column and unit choice, the parsed
 * record), the test description, the parameters to fit with their bounds, the fit (progress,
 * cancel), applying the fitted values to the plant as one undoable edit, and the
 * commissioning record (sign-off, CSV and HTML). The work is part of the project (`snapshot()` /
 * `restore()`, wired in `project-parts.ts`): the accepted record with its column and unit choice, the
 * test, the parameter choice, the last fit and the sign-off.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { FIT_PARAMETERS, fitParameterLabel } from '../../shared-types';
import type {
  CommissioningRecord,
  FitParameterKey,
  FitResult,
  ParsedTestRecord,
  ProjectCommissioning,
  RecordColumns,
  RecordInspection,
  RecordUnits,
  SignOff,
  TestDescription,
} from '../../shared-types';
import exampleRecord from '../demo/example.load-bank.csv?raw';
import { EngineCallError, engine, messageOf } from '../transport';
import { anyNumber, from, numberFields, whole } from './number-fields';
import type { NumberFieldAccess, NumberRule } from './number-fields';
import type { PlantDraft } from './plant-draft';
import { usePlantStore } from './plant';
import { useSyncStore } from './sync';

export type RunState = 'idle' | 'running' | 'done' | 'error' | 'cancelled';

/** One row of the parameter choice. */
export interface ParamChoice {
  key: FitParameterKey;
  unit: string;
  chosen: boolean;
  min: number;
  max: number;
}

/** The example record's test (it says so in its own comment lines). */
export const EXAMPLE_TEST: TestDescription = {
  setId: 'G1',
  onlineSetIds: ['G1'],
  startKW: 250,
  startKVAR: 150,
  stepKW: 500,
  stepKVAR: 300,
  stepAtS: 2.01,
  measuredAt: 'set',
};

/** Parameters chosen at first: the ones a load step shows best. */
const FIRST_CHOICE: FitParameterKey[] = ['machine.inertiaS', 'governor.engineLagS', 'regulator.gainPU', 'regulator.exciterLagS'];

/** A new view's test, parameter choice and iteration cap. */
const blankTest = (): TestDescription => ({ setId: '', onlineSetIds: [], startKW: 0, startKVAR: 0, stepKW: 0, stepKVAR: 0, stepAtS: 0, measuredAt: 'set' });
const firstParams = (): ParamChoice[] =>
  FIT_PARAMETERS.map((p) => ({ key: p.key, unit: p.unit, chosen: FIRST_CHOICE.includes(p.key), min: p.defaultMin, max: p.defaultMax }));
const FIRST_ITERATIONS = 30;

/** The test's number fields a view takes through `take`. */
export type TestNumberField = 'startKW' | 'startKVAR' | 'stepKW' | 'stepKVAR' | 'stepAtS';
/** The commissioning number fields: the test's, a parameter's bounds (`params.<key>.min` / `.max`) and the iteration cap. */
export type CommissioningField = `test.${TestNumberField}` | `params.${FitParameterKey}.${'min' | 'max'}` | 'maxIterations';

/** Each test field's name in words and its own rule (the step time's place inside the record is checked before a fit). */
const TEST_FIELDS: Readonly<Record<TestNumberField, { name: string; rule: NumberRule }>> = {
  startKW: { name: 'load before the step', rule: from(0, undefined, 'kW') },
  startKVAR: { name: 'reactive load before the step', rule: anyNumber },
  stepKW: { name: 'load step', rule: anyNumber },
  stepKVAR: { name: 'reactive load step', rule: anyNumber },
  stepAtS: { name: 'step time', rule: anyNumber },
};
/** The iteration cap's rule: the fit's own limit. */
const ITERATION_CAP = { name: 'iteration cap', rule: whole(1, 200) };

/** The record in use as it came: file name, text, and the column and unit choice it was read with. */
type AcceptedRecord = NonNullable<ProjectCommissioning['record']>;

/** A number as the file keeps it: a blank (or unreadable) entry is null. */
const kept = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
/** A kept number back in an entry: null is a blank entry. */
const entry = (v: number | null | undefined, fallback: number): number => (v === undefined ? fallback : v === null ? Number.NaN : v);

/**
 * A guess at the test from a record with a kW column: the step is where kW jumps most between
 * samples, taken halfway between the last sample before the jump and the first after it (a
 * record does not show when, between two samples, the load bank closed); the load before and
 * after are the means of kW (and kVAR) on either side.
 */
export function guessTest(p: ParsedTestRecord): Partial<TestDescription> {
  const r = p.record;
  if (!r.kW || r.kW.length < 3) return {};
  let k = 1;
  let jump = 0;
  for (let i = 1; i < r.kW.length; i++) {
    const d = Math.abs(r.kW[i]! - r.kW[i - 1]!);
    if (d > jump) {
      jump = d;
      k = i;
    }
  }
  const mean = (x: number[], a: number, b: number) => x.slice(a, b).reduce((s, v) => s + v, 0) / Math.max(1, b - a);
  const n = r.kW.length;
  const startKW = mean(r.kW, 0, k);
  const stepAtS = Math.round(((r.tS[k - 1]! + r.tS[k]!) / 2) * 1e6) / 1e6;
  const guess: Partial<TestDescription> = { stepAtS, startKW: Math.round(startKW), stepKW: Math.round(mean(r.kW, k, n) - startKW) };
  if (r.kVAR) {
    const q0 = mean(r.kVAR, 0, k);
    guess.startKVAR = Math.round(q0);
    guess.stepKVAR = Math.round(mean(r.kVAR, k, n) - q0);
  }
  return guess;
}

/** The section of a new view (what `snapshot()` compares with). */
const NEW_SECTION = {
  test: blankTest(),
  params: firstParams().map((p) => ({ key: p.key, chosen: p.chosen, min: p.min, max: p.max })),
  maxIterations: FIRST_ITERATIONS,
};

export const useCommissioningStore = defineStore('commissioning', () => {
  const plantStore = usePlantStore();

  // The record.
  const fileName = ref<string | null>(null);
  const text = ref<string | null>(null);
  const inspection = shallowRef<RecordInspection | null>(null);
  const columns = ref<Partial<RecordColumns>>({});
  const units = ref<RecordUnits>({ time: 's', frequency: 'Hz', voltage: 'V' });
  /** The record as the dialog reads it now (preview), and the one in use. */
  const preview = shallowRef<ParsedTestRecord | null>(null);
  const parsed = shallowRef<ParsedTestRecord | null>(null);
  const importError = ref<string | null>(null);
  const dialogOpen = ref(false);

  // The test.
  const test = ref<TestDescription>(blankTest());
  /** The record in use as it came (kept in the project; `parsed` is read from it). */
  const accepted = shallowRef<AcceptedRecord | null>(null);
  /** Why a record kept in the project could not be read again on opening it (null when it could). */
  const restoreError = ref<string | null>(null);

  // The parameters.
  const params = ref<ParamChoice[]>(firstParams());
  const maxIterations = ref(FIRST_ITERATIONS);

  // The fit.
  const fitState = ref<RunState>('idle');
  const fitProgress = ref(0);
  const fit = shallowRef<FitResult | null>(null);
  const fitTest = shallowRef<TestDescription | null>(null);
  const fitError = ref<string | null>(null);
  const applied = ref(false);
  let abort: AbortController | null = null;
  /** The test a record comes with (the example's), used instead of a guess when it is accepted. */
  let knownTest: TestDescription | null = null;

  // The commissioning record.
  const signOff = ref<SignOff>({ by: '', date: '', remarks: '' });
  const recordSetId = ref('');
  const record = shallowRef<CommissioningRecord | null>(null);
  const recordError = ref<string | null>(null);

  /** The number fields' entries from the screen: a refused one keeps the last good value and its reason. */
  const fields = numberFields<CommissioningField>((key): NumberFieldAccess | null => {
    if (key === 'maxIterations') return { ...ITERATION_CAP, get: () => maxIterations.value, set: (v) => (maxIterations.value = v) };
    const t = /^test\.(\w+)$/.exec(key);
    if (t) {
      const k = t[1] as TestNumberField;
      return { ...TEST_FIELDS[k], get: () => test.value[k], set: (v) => (test.value[k] = v) };
    }
    const m = /^params\.(.+)\.(min|max)$/.exec(key);
    const info = m && FIT_PARAMETERS.find((x) => x.key === m[1]);
    if (!m || !info) return null;
    const edge = m[2] as 'min' | 'max';
    const row = () => params.value.find((x) => x.key === info.key);
    return {
      name: `${edge === 'min' ? 'lowest' : 'highest'} ${fitParameterLabel(info.key)}`,
      rule: from(info.lowest, info.highest, info.unit),
      get: () => row()?.[edge] ?? Number.NaN,
      set: (v) => {
        const r = row();
        if (r) r[edge] = v;
      },
    };
  });

  const setIds = computed(() => plantStore.plant?.sets.map((s) => s.id) ?? []);

  /** Sentences naming what stops a fit (empty when it may run). */
  const fitProblems = computed(() => {
    const out: string[] = fields.sentences().map((r) => `Correct the marked field first: ${r}.`);
    const plant = plantStore.plant;
    if (!parsed.value) out.push('Import a test record first.');
    if (!plant) out.push('The plant has a refused field; correct it in the Plant view.');
    const t = test.value;
    if (plant && !plant.sets.some((s) => s.id === t.setId)) out.push('Test: choose the set the record is of.');
    if (!t.onlineSetIds.includes(t.setId)) out.push('Test: the set the record is of must be among the sets on line.');
    for (const [name, v] of [
      ['load before the step, kW', t.startKW],
      ['load before the step, kVAR', t.startKVAR],
      ['load step, kW', t.stepKW],
      ['load step, kVAR', t.stepKVAR],
      ['step time', t.stepAtS],
    ] as const)
      if (!Number.isFinite(v)) out.push(`Test: ${name} must be a number.`);
    if (t.startKW < 0) out.push('Test: load before the step, kW, must be 0 or more.');
    const rec = parsed.value?.record;
    if (rec && !(t.stepAtS >= rec.tS[0]! && t.stepAtS < rec.tS[rec.tS.length - 1]!))
      out.push(`Test: the step time must lie inside the record (${rec.tS[0]} s to ${rec.tS[rec.tS.length - 1]} s).`);
    const chosen = params.value.filter((p) => p.chosen);
    if (chosen.length === 0) out.push('Parameters: choose at least one to fit.');
    for (const p of chosen) {
      const info = FIT_PARAMETERS.find((x) => x.key === p.key)!;
      if (!Number.isFinite(p.min) || !Number.isFinite(p.max)) out.push(`Parameters: the bounds of ${info.label} must be numbers.`);
      else if (!(p.max > p.min)) out.push(`Parameters: the highest ${info.label} must be above its lowest.`);
      else if (p.min < info.lowest || p.max > info.highest)
        out.push(`Parameters: the bounds of ${info.label} must lie within ${info.lowest} to ${info.highest} ${info.unit}.`);
    }
    if (!(Number.isInteger(maxIterations.value) && maxIterations.value >= 1 && maxIterations.value <= 200))
      out.push('Iteration cap: a whole number from 1 to 200.');
    return out;
  });

  /** Opens the import dialog on a file's text: header, guessed columns and units, preview. */
  async function openText(name: string, content: string, withTest: TestDescription | null = null): Promise<void> {
    knownTest = withTest;
    fileName.value = name;
    text.value = content;
    importError.value = null;
    preview.value = null;
    inspection.value = null;
    dialogOpen.value = true;
    try {
      const i = await engine().call('inspectTestRecord', { text: content });
      inspection.value = i;
      columns.value = { ...i.guess.columns };
      units.value = { ...i.guess.units };
      await reread();
    } catch (e) {
      importError.value = messageOf(e);
    }
  }

  /** Reads the record again with the dialog's columns and units (the preview). */
  async function reread(): Promise<void> {
    const plant = plantStore.plant;
    if (text.value === null) return;
    const c = columns.value;
    if (c.time === undefined || c.frequency === undefined || c.voltage === undefined) {
      preview.value = null;
      importError.value = 'Choose the time, frequency and voltage columns.';
      return;
    }
    const u: RecordUnits = { time: units.value.time, frequency: units.value.frequency, voltage: units.value.voltage };
    if (c.kW !== undefined) u.kW = units.value.kW ?? 'kW';
    if (c.kVAR !== undefined) u.kVAR = units.value.kVAR ?? 'kVAR';
    if (c.current !== undefined) u.current = units.value.current ?? 'A';
    try {
      preview.value = await engine().call('parseTestRecord', {
        text: text.value,
        columns: c as RecordColumns,
        units: u,
        ratedFrequencyHz: plant?.ratedFrequencyHz ?? 50,
        ratedVoltageV: plant?.ratedVoltageV ?? 400,
      });
      importError.value = null;
    } catch (e) {
      preview.value = null;
      importError.value = messageOf(e);
    }
  }

  function setColumn(field: keyof RecordColumns, value: string): Promise<void> {
    const next = { ...columns.value };
    if (value === '') delete next[field];
    else next[field] = value;
    columns.value = next;
    return reread();
  }

  function setUnit<K extends keyof RecordUnits>(field: K, value: RecordUnits[K]): Promise<void> {
    units.value = { ...units.value, [field]: value };
    return reread();
  }

  /** Takes the previewed record into use; the test is guessed from its kW column where it has one. */
  function acceptImport(): void {
    if (!preview.value || text.value === null) return;
    parsed.value = preview.value;
    accepted.value = { fileName: fileName.value ?? '', text: text.value, columns: { ...columns.value } as RecordColumns, units: { ...units.value } };
    restoreError.value = null;
    dialogOpen.value = false;
    fit.value = null;
    fitState.value = 'idle';
    applied.value = false;
    const first = setIds.value[0] ?? '';
    const setId = setIds.value.includes(test.value.setId) ? test.value.setId : first;
    if (knownTest) test.value = { ...knownTest, onlineSetIds: [...knownTest.onlineSetIds] };
    else
      test.value = {
        ...test.value,
        setId,
        onlineSetIds: test.value.onlineSetIds.includes(setId) ? test.value.onlineSetIds : [setId],
        ...guessTest(preview.value),
      };
  }

  function cancelImport(): void {
    dialogOpen.value = false;
  }

  /** The example record shipped with the demo (invented data) and its test. */
  async function openExample(): Promise<void> {
    await openText('example.load-bank.csv', exampleRecord, EXAMPLE_TEST);
  }

  async function runFit(): Promise<void> {
    const plant = plantStore.plant;
    const rec = parsed.value;
    if (fitProblems.value.length || !plant || !rec) {
      fitState.value = 'error';
      fitError.value = fitProblems.value.join(' ');
      return;
    }
    abort?.abort();
    abort = new AbortController();
    const t = { ...test.value, onlineSetIds: [...test.value.onlineSetIds] };
    fitState.value = 'running';
    fitProgress.value = 0;
    fitError.value = null;
    applied.value = false;
    try {
      const r = await engine().call(
        'fitTestRecord',
        {
          plant,
          record: rec.record,
          test: t,
          params: params.value.filter((p) => p.chosen).map((p) => ({ key: p.key, min: p.min, max: p.max })),
          maxIterations: maxIterations.value,
        },
        { signal: abort.signal, onProgress: (f) => (fitProgress.value = f) },
      );
      fit.value = r;
      fitTest.value = t;
      fitState.value = 'done';
      recordSetId.value = r.setId;
    } catch (e) {
      if (e instanceof EngineCallError && e.code === 'CANCELLED') fitState.value = 'cancelled';
      else {
        fitState.value = 'error';
        fitError.value = messageOf(e);
      }
    } finally {
      abort = null;
    }
  }

  function cancelFit(): void {
    abort?.abort();
  }

  /** Writes the fitted values into the set: one undoable edit of the plant. */
  async function applyFit(): Promise<void> {
    const r = fit.value;
    if (!r) return;
    await plantStore.change((d: PlantDraft) => ({
      ...d,
      sets: d.sets.map((s) => {
        if (s.id !== r.setId) return s;
        const next = { ...s, governor: { ...s.governor }, regulator: { ...s.regulator }, machine: { ...s.machine } } as typeof s;
        for (const q of r.parameters) {
          const [part, field] = q.key.split('.') as ['governor' | 'regulator' | 'machine', string];
          (next[part] as unknown as Record<string, number>)[field] = Number(q.value.toPrecision(6));
        }
        return next;
      }),
    }));
    applied.value = true;
  }

  /** The commissioning record of the chosen set (with the fit when it is of that set). */
  async function buildRecord(date: string): Promise<void> {
    const plant = plantStore.plant;
    if (!plant) {
      recordError.value = 'The plant has a refused field; correct it in the Plant view.';
      return;
    }
    const setId = recordSetId.value || plant.sets[0]?.id || '';
    const sync = useSyncStore().snapshot();
    const withFit = fit.value && fit.value.setId === setId && fitTest.value;
    try {
      record.value = await engine().call('buildCommissioningRecord', {
        plant,
        setId,
        ...(withFit ? { fit: fit.value!, test: fitTest.value! } : {}),
        ...(sync
          ? {
              syncCheck: {
                limits: { slipHz: sync.limits.slipHz, angleDeg: sync.limits.angleDeg, voltagePct: sync.limits.voltagePct },
                breakerClosingMs: sync.breakerClosingMs,
              },
            }
          : {}),
        signOff: { ...signOff.value },
        date,
      });
      recordError.value = null;
    } catch (e) {
      record.value = null;
      recordError.value = messageOf(e);
    }
  }

  /**
   * The work as the project keeps it, or null while there is none: no record, no fit, no name or remark in the
   * sign-off, and the test and parameter choice as a new view has them (the date and the record's set the view fills
   * in on its own are not work, so opening the view leaves the project unchanged).
   */
  function snapshot(): ProjectCommissioning | null {
    const t = test.value;
    const section: Required<ProjectCommissioning> = {
      record: accepted.value ? structuredClone(accepted.value) : null,
      test: {
        setId: t.setId,
        onlineSetIds: [...t.onlineSetIds],
        startKW: kept(t.startKW),
        startKVAR: kept(t.startKVAR),
        stepKW: kept(t.stepKW),
        stepKVAR: kept(t.stepKVAR),
        stepAtS: kept(t.stepAtS),
        ...(t.measuredAt ? { measuredAt: t.measuredAt } : {}),
      },
      params: params.value.map((p) => ({ key: p.key, chosen: !!p.chosen, min: kept(p.min), max: kept(p.max) })),
      maxIterations: kept(maxIterations.value),
      // Through JSON: what the file holds (a figure that is not finite becomes null, as the file would have it).
      fit:
        fit.value && fitTest.value
          ? { result: JSON.parse(JSON.stringify(fit.value)) as FitResult, test: structuredClone(fitTest.value), applied: applied.value }
          : null,
      signOff: { ...signOff.value },
      recordSetId: recordSetId.value,
    };
    const untouched =
      !section.record &&
      !section.fit &&
      !signOff.value.by &&
      !signOff.value.remarks &&
      JSON.stringify(section.test) === JSON.stringify(NEW_SECTION.test) &&
      JSON.stringify(section.params) === JSON.stringify(NEW_SECTION.params) &&
      section.maxIterations === NEW_SECTION.maxIterations;
    return untouched ? null : section;
  }

  /** Puts a project's work in place (null: a new view's state); the record is read again with its choices. */
  function restore(value: ProjectCommissioning | null | undefined): void {
    abort?.abort();
    abort = null;
    const c = value ?? {};
    dialogOpen.value = false;
    preview.value = null;
    inspection.value = null;
    importError.value = null;
    knownTest = null;
    const rec = c.record ?? null;
    accepted.value = rec ? structuredClone(rec) : null;
    fileName.value = rec?.fileName ?? null;
    text.value = rec?.text ?? null;
    columns.value = rec ? { ...rec.columns } : {};
    units.value = rec ? { ...rec.units } : { time: 's', frequency: 'Hz', voltage: 'V' };
    parsed.value = null;
    restoreError.value = null;
    const t = c.test;
    const base = blankTest();
    test.value = t
      ? {
          setId: t.setId,
          onlineSetIds: [...t.onlineSetIds],
          startKW: entry(t.startKW, base.startKW),
          startKVAR: entry(t.startKVAR, base.startKVAR),
          stepKW: entry(t.stepKW, base.stepKW),
          stepKVAR: entry(t.stepKVAR, base.stepKVAR),
          stepAtS: entry(t.stepAtS, base.stepAtS),
          ...(t.measuredAt ? { measuredAt: t.measuredAt } : {}),
        }
      : base;
    params.value = firstParams().map((p) => {
      const saved = c.params?.find((q) => q.key === p.key);
      return saved ? { ...p, chosen: saved.chosen, min: entry(saved.min, p.min), max: entry(saved.max, p.max) } : p;
    });
    maxIterations.value = entry(c.maxIterations, FIRST_ITERATIONS);
    fit.value = c.fit ? structuredClone(c.fit.result) : null;
    fitTest.value = c.fit ? structuredClone(c.fit.test) : null;
    applied.value = c.fit?.applied ?? false;
    fitState.value = c.fit ? 'done' : 'idle';
    fitProgress.value = 0;
    fitError.value = null;
    signOff.value = c.signOff ? { ...c.signOff } : { by: '', date: '', remarks: '' };
    recordSetId.value = c.recordSetId ?? '';
    record.value = null;
    recordError.value = null;
    if (rec) void rereadAccepted(rec);
  }

  /** Reads a kept record again (on opening a project): the fit needs it as numbers. */
  async function rereadAccepted(rec: AcceptedRecord): Promise<void> {
    const plant = plantStore.plant;
    try {
      const p = await engine().call('parseTestRecord', {
        text: rec.text,
        columns: rec.columns,
        units: rec.units,
        ratedFrequencyHz: plant?.ratedFrequencyHz ?? 50,
        ratedVoltageV: plant?.ratedVoltageV ?? 400,
      });
      // A newer restore or import took over meanwhile.
      if (accepted.value?.text === rec.text) parsed.value = p;
    } catch (e) {
      if (accepted.value?.text === rec.text)
        restoreError.value = `The test record kept in the project ("${rec.fileName}") could not be read again: ${messageOf(e)}`;
    }
  }

  return {
    fileName,
    text,
    inspection,
    columns,
    units,
    preview,
    parsed,
    importError,
    dialogOpen,
    test,
    params,
    maxIterations,
    fitState,
    fitProgress,
    fit,
    fitTest,
    fitError,
    applied,
    signOff,
    recordSetId,
    record,
    recordError,
    accepted,
    restoreError,
    setIds,
    fitProblems,
    fieldIssues: fields.issues,
    take: fields.take,
    openText,
    reread,
    setColumn,
    setUnit,
    acceptImport,
    cancelImport,
    openExample,
    runFit,
    cancelFit,
    applyFit,
    buildRecord,
    snapshot,
    restore,
  };
});

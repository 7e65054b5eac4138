/**
 * The planner store: the bands and load range the user asks for, the proposal (`planDroop`)
 * and its one-step apply to the plant, the sensitivity matrix of the current plant
 * (`sharingSensitivity`), and the tolerance analysis (`toleranceAnalysis`, off the UI thread with
 * progress and cancel).
 */
import { defineStore } from 'pinia';
import { ref, shallowRef, watch } from 'vue';
import type { Band, PlanField, PlanResult, Plant, SensitivityResult, ToleranceDistribution, ToleranceResult } from '../../shared-types';
import { engine, messageOf } from '../transport';
import { usePlantStore } from './plant';
import { above, from, fromBelow, numberFields, whole } from './number-fields';
import type { NumberFieldAccess, NumberRule } from './number-fields';
import type { PlantDraft } from './plant-draft';

/**
 * Default bands around the plant's ratings: frequency ±1 % (common practice for a droop plant's
 * steady-state swing), voltage ±2.5 % (ISO 8528-5 class G2 steady-state voltage deviation).
 */
export function defaultBands(plant: Plant): { hz: Band; v: Band } {
  const f = plant.ratedFrequencyHz;
  const v = plant.ratedVoltageV;
  // Rounded to what a user would type (no 409.99999… in an input box).
  const r = (x: number) => Number(x.toFixed(6));
  return { hz: { min: r(f * 0.99), max: r(f * 1.01) }, v: { min: r(v * 0.975), max: r(v * 1.025) } };
}

/** The planned settings of `result` written into `draft` (only the sets and fields the planner chose). */
export function applyPlanTo(draft: PlantDraft, result: PlanResult): PlantDraft {
  return {
    ...draft,
    sets: draft.sets.map((s, i) => {
      const p = result.settings[i];
      if (!p || p.id !== s.id) return s;
      return {
        ...s,
        governor: p.governorPlanned ? { ...s.governor, droopPct: p.droopPct, noLoadHz: p.noLoadHz } : s.governor,
        regulator: p.regulatorPlanned ? { ...s.regulator, droopPct: p.reactiveDroopPct, noLoadV: p.noLoadV } : s.regulator,
      };
    }),
  };
}

/** A sentence for the first input that cannot be used (words, not field names), or null. */
export function planInputProblem(hz: Band, v: Band, load: Band, pf: number): string | null {
  const ok = (b: Band) => Number.isFinite(b.min) && Number.isFinite(b.max);
  if (!ok(hz) || hz.min <= 0) return 'Frequency band: enter both edges in Hz, above 0.';
  if (hz.min >= hz.max) return 'Frequency band: the lower edge must be below the upper edge.';
  if (!ok(v) || v.min <= 0) return 'Voltage band: enter both edges in volts, above 0.';
  if (v.min >= v.max) return 'Voltage band: the lower edge must be below the upper edge.';
  if (!ok(load) || load.min < 0 || load.max > 200) return 'Load range: enter both ends between 0 and 200 % of the online rated kW.';
  if (load.min >= load.max) return 'Load range: the lighter end must be below the heavier end.';
  if (!(pf > 0 && pf <= 1)) return 'Load power factor: enter a value above 0 and up to 1.';
  return null;
}

/** The rule each edge of the bus frequency band breaks (`min`, `max` → rule), empty when both can be used. */
export function hzBandIssues(hz: Band): Partial<Record<'min' | 'max', string>> {
  const out: Partial<Record<'min' | 'max', string>> = {};
  if (!Number.isFinite(hz.min)) out.min = 'must be a number';
  else if (hz.min <= 0) out.min = 'must be above 0 Hz';
  if (!Number.isFinite(hz.max)) out.max = 'must be a number';
  else if (!out.min && hz.max <= hz.min) out.max = 'must be above the lowest edge';
  return out;
}

/** A sentence for the first tolerance input that cannot be used, or null. */
export function toleranceInputProblem(t: { speedTolHz: number; voltageTolPct: number; droopTolPct: number; samples: number; seed: number }): string | null {
  if (!(t.speedTolHz >= 0 && t.speedTolHz <= 5)) return 'Speed-setpoint tolerance: enter 0 to 5 Hz.';
  if (!(t.voltageTolPct >= 0 && t.voltageTolPct <= 20)) return 'Voltage-setpoint tolerance: enter 0 to 20 % of rated voltage.';
  if (!(t.droopTolPct >= 0 && t.droopTolPct < 50)) return 'Droop tolerance: enter 0 % or more and below 50 % of the setting.';
  if (!(Number.isInteger(t.samples) && t.samples >= 10 && t.samples <= 1_000_000)) return 'Samples: enter a whole number from 10 to 1 000 000.';
  if (!(Number.isInteger(t.seed) && t.seed >= 0 && t.seed < 2 ** 31)) return 'Seed: enter a whole number from 0 to 2 147 483 647.';
  return null;
}

/** The planner's number fields a view takes through `take` (the frequency band keeps its own edge rules, `hzBandIssues`). */
export type PlannerField =
  | 'vBand.min'
  | 'vBand.max'
  | 'loadRange.min'
  | 'loadRange.max'
  | 'pf'
  | 'tolerance.speedTolHz'
  | 'tolerance.voltageTolPct'
  | 'tolerance.droopTolPct'
  | 'tolerance.samples'
  | 'tolerance.seed';

/** Each field's name in words and its own rule (the same limits `planInputProblem` and `toleranceInputProblem` hold). */
export const PLANNER_FIELDS: Readonly<Record<PlannerField, { name: string; rule: NumberRule }>> = {
  'vBand.min': { name: 'lowest bus voltage', rule: above(0, 'V') },
  'vBand.max': { name: 'highest bus voltage', rule: above(0, 'V') },
  'loadRange.min': { name: 'lightest load', rule: from(0, 200, '%') },
  'loadRange.max': { name: 'heaviest load', rule: from(0, 200, '%') },
  pf: { name: 'load power factor', rule: above(0, '', 1) },
  'tolerance.speedTolHz': { name: 'speed-setpoint tolerance', rule: from(0, 5, 'Hz') },
  'tolerance.voltageTolPct': { name: 'voltage-setpoint tolerance', rule: from(0, 20, '%') },
  'tolerance.droopTolPct': { name: 'droop tolerance', rule: fromBelow(0, 50, '%') },
  'tolerance.samples': { name: 'samples', rule: whole(10, 1_000_000) },
  'tolerance.seed': { name: 'seed', rule: whole(0, 2 ** 31 - 1) },
};
const PLAN_FIELDS: readonly PlannerField[] = ['vBand.min', 'vBand.max', 'loadRange.min', 'loadRange.max', 'pf'];
const TOLERANCE_FIELDS: readonly PlannerField[] = [
  'tolerance.speedTolHz',
  'tolerance.voltageTolPct',
  'tolerance.droopTolPct',
  'tolerance.samples',
  'tolerance.seed',
];

/** One sentence for refused entries that stop a run ("Correct the marked field first: load power factor must be …"). */
function refusedSentence(sentences: string[]): string | null {
  return sentences.length ? `Correct the marked field${sentences.length > 1 ? 's' : ''} first: ${sentences.join('; ')}.` : null;
}

export type TaskState = 'idle' | 'running' | 'done' | 'error' | 'cancelled';

export const usePlannerStore = defineStore('planner', () => {
  const plantStore = usePlantStore();

  const hzBand = ref<Band>({ min: 49.5, max: 50.5 });
  const vBand = ref<Band>({ min: 390, max: 410 });
  const loadRange = ref<Band>({ min: 0, max: 100 });
  const pf = ref(0.8);
  /** Settings to keep as they are, by set id. */
  const fixed = ref<Record<string, PlanField[]>>({});
  /** Tolerance samples at the plant's own loads, or each drawn over the load range above. */
  const toleranceOver = ref<'plant' | 'range'>('plant');
  /** The plant the bands were last defaulted for (ratings change → new defaults). */
  let bandsFor: string | null = null;

  const plan = shallowRef<PlanResult | null>(null);
  const planFor = shallowRef<Plant | null>(null);
  const planState = ref<TaskState>('idle');
  const planError = ref<string | null>(null);
  const applied = ref(false);

  const sensitivity = shallowRef<SensitivityResult | null>(null);
  const sensitivityState = ref<TaskState>('idle');
  const sensitivityError = ref<string | null>(null);

  const tolerance = ref({ speedTolHz: 0.1, voltageTolPct: 0.5, droopTolPct: 5, distribution: 'uniform' as ToleranceDistribution, samples: 10_000, seed: 1 });
  const toleranceResult = shallowRef<ToleranceResult | null>(null);
  const toleranceState = ref<TaskState>('idle');
  const toleranceProgress = ref(0);
  const toleranceError = ref<string | null>(null);
  let toleranceAbort: AbortController | null = null;

  /** The number fields' entries from the screen: a refused one keeps the last good value and its reason. */
  const fields = numberFields<PlannerField>((key): NumberFieldAccess => {
    const [part, sub] = key.split('.') as [string, string | undefined];
    const target = (): Record<string, number> =>
      part === 'vBand' ? vBand.value : part === 'loadRange' ? loadRange.value : (tolerance.value as unknown as Record<string, number>);
    return {
      ...PLANNER_FIELDS[key],
      get: () => (sub === undefined ? pf.value : target()[sub]!),
      set: (v) => {
        if (sub === undefined) pf.value = v;
        else target()[sub] = v;
      },
    };
  });

  watch(
    () => plantStore.plant,
    (p) => {
      if (!p) return;
      const key = `${p.ratedFrequencyHz}/${p.ratedVoltageV}`;
      if (key !== bandsFor) {
        bandsFor = key;
        const d = defaultBands(p);
        hzBand.value = d.hz;
        vBand.value = d.v;
      }
    },
    { immediate: true },
  );

  /** Asks the engine for a proposal for the current plant. */
  async function runPlan(): Promise<void> {
    const p = plantStore.plant;
    if (!p) return;
    const problem = refusedSentence(fields.sentences(PLAN_FIELDS)) ?? planInputProblem(hzBand.value, vBand.value, loadRange.value, pf.value);
    if (problem) {
      planError.value = problem;
      planState.value = 'error';
      return;
    }
    planState.value = 'running';
    planError.value = null;
    applied.value = false;
    try {
      const keep = Object.entries(fixed.value)
        .filter(([id, fields]) => fields.length > 0 && p.sets.some((s) => s.id === id))
        .map(([setId, fields]) => ({ setId, fields: [...fields] }));
      plan.value = await engine().call('planDroop', {
        plant: p,
        frequencyBandHz: { ...hzBand.value },
        voltageBandV: { ...vBand.value },
        loadRangePct: { ...loadRange.value },
        pf: pf.value,
        ...(keep.length ? { fixed: keep } : {}),
      });
      planFor.value = p;
      planState.value = 'done';
    } catch (e) {
      plan.value = null;
      planError.value = messageOf(e);
      planState.value = 'error';
    }
  }

  /** Writes the proposal into the plant as one undoable edit. */
  async function applyPlan(): Promise<void> {
    const r = plan.value;
    if (!r) return;
    await plantStore.change((d) => applyPlanTo(d, r));
    applied.value = true;
  }

  /** The sensitivity matrix of the current plant at its own loads. */
  async function runSensitivity(): Promise<void> {
    const p = plantStore.plant;
    if (!p) return;
    sensitivityState.value = 'running';
    sensitivityError.value = null;
    try {
      sensitivity.value = await engine().call('sharingSensitivity', { plant: p });
      sensitivityState.value = 'done';
    } catch (e) {
      sensitivity.value = null;
      sensitivityError.value = messageOf(e);
      sensitivityState.value = 'error';
    }
  }

  /** Runs the tolerance analysis on the current plant at its own loads; a new run cancels the old. */
  async function runTolerance(): Promise<void> {
    const p = plantStore.plant;
    if (!p) return;
    const problem =
      refusedSentence(fields.sentences(toleranceOver.value === 'range' ? [...TOLERANCE_FIELDS, ...PLAN_FIELDS] : TOLERANCE_FIELDS)) ??
      toleranceInputProblem(tolerance.value) ??
      (toleranceOver.value === 'range' ? planInputProblem(hzBand.value, vBand.value, loadRange.value, pf.value) : null);
    if (problem) {
      toleranceError.value = problem;
      toleranceState.value = 'error';
      return;
    }
    toleranceAbort?.abort();
    const abort = new AbortController();
    toleranceAbort = abort;
    toleranceState.value = 'running';
    toleranceProgress.value = 0;
    toleranceError.value = null;
    try {
      const over = toleranceOver.value === 'range' ? { loadRangePct: { ...loadRange.value }, pf: pf.value } : {};
      const r = await engine().call(
        'toleranceAnalysis',
        { plant: p, ...tolerance.value, ...over },
        { signal: abort.signal, onProgress: (f) => (toleranceProgress.value = f) },
      );
      if (toleranceAbort !== abort) return;
      toleranceResult.value = r;
      toleranceState.value = 'done';
    } catch (e) {
      if (toleranceAbort !== abort) return;
      if (abort.signal.aborted) toleranceState.value = 'cancelled';
      else {
        toleranceError.value = messageOf(e);
        toleranceState.value = 'error';
      }
    } finally {
      if (toleranceAbort === abort) toleranceAbort = null;
    }
  }

  function cancelTolerance(): void {
    toleranceAbort?.abort();
  }

  return {
    hzBand,
    vBand,
    loadRange,
    pf,
    fixed,
    toleranceOver,
    plan,
    planFor,
    planState,
    planError,
    applied,
    runPlan,
    applyPlan,
    sensitivity,
    sensitivityState,
    sensitivityError,
    runSensitivity,
    tolerance,
    toleranceResult,
    toleranceState,
    toleranceProgress,
    toleranceError,
    runTolerance,
    cancelTolerance,
    fieldIssues: fields.issues,
    take: fields.take,
  };
});

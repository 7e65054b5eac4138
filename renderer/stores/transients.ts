/**
 * The transients store: the project's scenarios (edited here, kept with the project through
 * `snapshot()` / `restore()`), running one with progress and cancel, the last runs kept for
 * comparison, and the plots' shared zoom window and cursor.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import type { FieldIssue, Plant, ProjectScenario, ScenarioEvent, ScenarioEventType, SimulationResult } from '../../shared-types';
import { EngineCallError, engine, messageOf } from '../transport';
import { usePlantStore } from './plant';
import { newEvent, scenarioIssues, starterScenarios } from './transients-rules';

/** How many finished runs are kept for overlay and comparison. */
export const KEPT_RUNS = 6;
/** Points per series the simulator keeps for plotting. */
export const PLOT_POINTS = 2000;

/** One finished run and what it was run with. */
export interface TransientRun {
  id: number;
  /** "Run 3 · Block load step". */
  label: string;
  scenario: ProjectScenario;
  plantName: string;
  /** The governor and regulator settings of the online sets, in words, for comparing runs. */
  settings: string;
  /** Wall-clock time the run finished (for the user, HH:MM:SS). */
  finishedAt: string;
  result: SimulationResult;
}

/** A short description of each set's settings, so two runs can be told apart. */
export function settingsSummary(plant: Plant): string {
  return plant.sets
    .map((s) => {
      const g = s.governor;
      const r = s.regulator;
      const gov =
        g.mode === 'droop'
          ? `droop ${g.droopPct} % from ${g.noLoadHz} Hz`
          : g.mode === 'isochronous'
            ? `isochronous ${g.setpointHz} Hz`
            : `base load ${g.baseKW} kW`;
      const reg =
        r.mode === 'reactive-droop'
          ? `reactive droop ${r.droopPct} % from ${r.noLoadV} V`
          : r.mode === 'power-factor'
            ? `PF ${r.pf}`
            : `${r.mode} ${r.setpointV} V`;
      return `${s.id}${s.online ? '' : ' (off)'}: ${gov}, ${reg}`;
    })
    .join('; ');
}

const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

export const useTransientsStore = defineStore('transients', () => {
  const plantStore = usePlantStore();
  const scenarios = ref<ProjectScenario[]>([]);
  const selectedId = ref<string | null>(null);
  const running = ref(false);
  const progress = ref(0);
  const progressLabel = ref('');
  /** A sentence about the last failed run, or null. */
  const error = ref<string | null>(null);
  /** Field problems the engine reported for the last run. */
  const engineIssues = ref<FieldIssue[]>([]);
  const runs = shallowRef<TransientRun[]>([]);
  const currentRunId = ref<number | null>(null);
  /** The run drawn dashed over the current one, or null. */
  const compareRunId = ref<number | null>(null);
  /** Shared x window of the plots, s; null shows the whole run. */
  const xWindow = ref<{ min: number; max: number } | null>(null);
  /** Time under the pointer in any plot, s; null when the pointer is away. */
  const cursorS = ref<number | null>(null);
  let controller: AbortController | null = null;
  let nextRun = 1;

  const selected = computed(() => scenarios.value.find((s) => s.id === selectedId.value) ?? null);
  /** Field problems of the selected scenario on the current plant. */
  const issues = computed<FieldIssue[]>(() => (selected.value ? scenarioIssues(selected.value, plantStore.plant) : []));
  const current = computed(() => runs.value.find((r) => r.id === currentRunId.value) ?? null);
  const compare = computed(() => (compareRunId.value === currentRunId.value ? null : (runs.value.find((r) => r.id === compareRunId.value) ?? null)));
  const canRun = computed(() => !running.value && !!selected.value && !!plantStore.plant && issues.value.length === 0);

  /** Starter scenarios for the current plant when there are none yet (an edit: the user asks for them). */
  function ensureScenarios(): void {
    if (scenarios.value.length === 0) scenarios.value = starterScenarios(plantStore.plant);
    selectFirst();
  }

  /** Selects the first scenario when none is selected (a view setting, not a change of the project). */
  function selectFirst(): void {
    if (!selected.value) selectedId.value = scenarios.value[0]?.id ?? null;
  }

  function uniqueId(base: string): string {
    let id = base;
    for (let n = 2; scenarios.value.some((s) => s.id === id); n++) id = `${base}-${n}`;
    return id;
  }

  function addScenario(): void {
    const s: ProjectScenario = {
      id: uniqueId('scenario'),
      name: `Scenario ${scenarios.value.length + 1}`,
      durationS: 10,
      stepMs: 1,
      events: [newEvent('load-step', 1, plantStore.plant)],
    };
    scenarios.value = [...scenarios.value, s];
    selectedId.value = s.id;
  }

  function duplicateScenario(): void {
    if (!selected.value) return;
    const s = { ...clone(selected.value), id: uniqueId(`${selected.value.id}-copy`), name: `${selected.value.name} (copy)` };
    scenarios.value = [...scenarios.value, s];
    selectedId.value = s.id;
  }

  function removeScenario(id: string): void {
    scenarios.value = scenarios.value.filter((s) => s.id !== id);
    if (selectedId.value === id) selectedId.value = scenarios.value[0]?.id ?? null;
  }

  function select(id: string): void {
    selectedId.value = id;
  }

  /** Replaces fields of the selected scenario (name, durationS, stepMs). */
  function updateScenario(patch: Partial<Pick<ProjectScenario, 'name' | 'durationS' | 'stepMs'>>): void {
    const s = selected.value;
    if (!s) return;
    Object.assign(s, patch);
  }

  /** Adds an event of `type`, after the last one (or at 1 s). Events stay sorted by time. */
  function addEvent(type: ScenarioEventType): void {
    const s = selected.value;
    if (!s) return;
    const last = s.events.reduce((m, e) => Math.max(m, Number.isFinite(e.atS) ? e.atS : 0), 0);
    const atS = s.events.length ? Math.min(last + 1, Math.max(0, s.durationS - 1)) : Math.min(1, s.durationS / 2);
    s.events.push(newEvent(type, atS, plantStore.plant));
    sortEvents();
  }

  /** Replaces event `index` of the selected scenario. */
  function updateEvent(index: number, event: ScenarioEvent): void {
    const s = selected.value;
    if (!s || !s.events[index]) return;
    s.events[index] = event;
  }

  /** Changes event `index` to another type, keeping its time. */
  function changeEventType(index: number, type: ScenarioEventType): void {
    const s = selected.value;
    const e = s?.events[index];
    if (!s || !e || e.type === type) return;
    s.events[index] = newEvent(type, e.atS, plantStore.plant);
  }

  function removeEvent(index: number): void {
    selected.value?.events.splice(index, 1);
  }

  /** Orders the selected scenario's events by time (the editor calls it when a time is committed). */
  function sortEvents(): void {
    selected.value?.events.sort((a, b) => (Number.isFinite(a.atS) ? a.atS : 0) - (Number.isFinite(b.atS) ? b.atS : 0));
  }

  /** Runs the selected scenario on the current plant. Resolves false when refused, failed or cancelled. */
  async function run(): Promise<boolean> {
    const s = selected.value;
    const plant = plantStore.plant;
    if (!s || !plant || running.value) return false;
    if (issues.value.length) {
      error.value = 'The scenario has problems: fix the fields listed before running.';
      return false;
    }
    running.value = true;
    progress.value = 0;
    progressLabel.value = 'starting';
    error.value = null;
    engineIssues.value = [];
    controller = new AbortController();
    const scenario = clone(s);
    try {
      const result = await engine().call(
        'simulate',
        { name: scenario.name, plant, durationS: scenario.durationS, stepMs: scenario.stepMs, outputPoints: PLOT_POINTS, events: scenario.events },
        {
          signal: controller.signal,
          onProgress: (f, label) => {
            progress.value = f;
            progressLabel.value = label ?? '';
          },
        },
      );
      const id = nextRun++;
      const record: TransientRun = {
        id,
        label: `Run ${id} · ${scenario.name}`,
        scenario,
        plantName: plant.name,
        settings: settingsSummary(plant),
        finishedAt: new Date().toLocaleTimeString([], { hour12: false }),
        result,
      };
      const previous = currentRunId.value;
      runs.value = [...runs.value, record].slice(-KEPT_RUNS);
      currentRunId.value = id;
      // Offer the run before as the comparison, as long as the user has not picked one.
      if (compareRunId.value === null || !runs.value.some((r) => r.id === compareRunId.value)) compareRunId.value = previous;
      xWindow.value = null;
      progress.value = 1;
      return true;
    } catch (e) {
      if (e instanceof EngineCallError && e.code === 'CANCELLED') error.value = 'Run cancelled: the plots still show the last finished run.';
      else {
        error.value = messageOf(e);
        engineIssues.value = e instanceof EngineCallError ? e.issues : [];
      }
      return false;
    } finally {
      running.value = false;
      controller = null;
    }
  }

  /** Cancels the running simulation (the engine stops at its next check). */
  function cancel(): void {
    controller?.abort();
  }

  function setCompare(id: number | null): void {
    compareRunId.value = id;
  }

  function showRun(id: number): void {
    if (runs.value.some((r) => r.id === id)) currentRunId.value = id;
  }

  /** Sets the plots' x window (clamped to be at least 1 ms wide); null shows everything. */
  function setWindow(w: { min: number; max: number } | null): void {
    xWindow.value = w && w.max - w.min > 1e-3 ? { min: w.min, max: w.max } : null;
  }

  function setCursor(t: number | null): void {
    cursorS.value = t;
  }

  /** The scenarios as plain data, for the project file. */
  function snapshot(): ProjectScenario[] {
    return clone(scenarios.value);
  }

  /** Replaces the scenarios (opening a project); runs of the old project are dropped. */
  function restore(list: ProjectScenario[]): void {
    scenarios.value = clone(list);
    selectedId.value = scenarios.value[0]?.id ?? null;
    runs.value = [];
    currentRunId.value = null;
    compareRunId.value = null;
    xWindow.value = null;
    error.value = null;
  }

  return {
    scenarios,
    selectedId,
    selected,
    issues,
    engineIssues,
    running,
    progress,
    progressLabel,
    error,
    runs,
    currentRunId,
    compareRunId,
    current,
    compare,
    canRun,
    xWindow,
    cursorS,
    ensureScenarios,
    selectFirst,
    addScenario,
    duplicateScenario,
    removeScenario,
    select,
    updateScenario,
    addEvent,
    updateEvent,
    changeEventType,
    removeEvent,
    sortEvents,
    run,
    cancel,
    setCompare,
    showRun,
    setWindow,
    setCursor,
    snapshot,
    restore,
  };
});

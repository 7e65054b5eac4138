/**
 * The plant store: the current (last valid) plant and its rated figures, the draft the
 * editor shows (which may be invalid while the user types), the field problems of the
 * draft, and undo/redo. A refused plant never replaces the current one: results keep
 * coming from the last valid plant until the draft is valid again.
 *
 * Other views read `plant`; project files call `load(plant, 'project')` and save
 * `snapshot()`, watching `revision` and `dirty`.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import type { CheckedPlant, FieldIssue, Plant, PlantDescription } from '../../shared-types';
import demoPlant from '../demo/water-works.plant.json';
import { EngineCallError, engine, messageOf, takeDemoCheck } from '../transport';
import { latestOnly } from './latest-only';
import { clonePlain, draftOf, getIn, keepSame, setIn } from './plant-draft';
import type { PlantDraft } from './plant-draft';

/** How many steps undo keeps. */
export const UNDO_DEPTH = 200;

/**
 * Where an edit's operating point goes (the sharing store): `checkPlant` validates the draft and
 * solves it in one request, at the slider position `loadPct()` gives (null: the plant's own loads).
 */
export interface PlantSolver {
  loadPct(): number | null;
  take(checked: CheckedPlant, loadPct: number | null): void;
}

export const usePlantStore = defineStore('plant', () => {
  let solver: PlantSolver | null = null;
  /** The sharing store registers itself here (once). */
  function attachSolver(s: PlantSolver): void {
    solver = s;
  }

  /** The last valid plant (defaults filled in by the schema). */
  const plant = shallowRef<Plant | null>(null);
  const description = shallowRef<PlantDescription | null>(null);
  /** Field problems of the last refused candidate (a loaded file or the edited draft). */
  const issues = ref<FieldIssue[]>([]);
  /** Where `issues` came from: the editor's draft, or a file that was refused. */
  const issuesFrom = ref<'edit' | 'load' | null>(null);
  /** A sentence about the last failure, or null. */
  const error = ref<string | null>(null);
  const source = ref('');

  /** The plant as edited; equals `plant` whenever the draft is valid. */
  const draft = shallowRef<PlantDraft | null>(null);
  /** Field problems of the draft, for the editor to show beside each field. */
  const draftIssues = ref<FieldIssue[]>([]);
  /** The last draft whose check has come back (accepted or refused). */
  const checkedDraft = shallowRef<PlantDraft | null>(null);
  /** True while the newest draft is still being checked (its results are on their way). */
  const checking = computed(() => draft.value !== null && checkedDraft.value !== draft.value);
  /** Increments whenever `plant` changes (accepted edit, undo, redo or load). */
  const revision = ref(0);
  /** True after an accepted edit, undo or redo, until `load()` or `markSaved()`. */
  const dirty = ref(false);

  const past = shallowRef<PlantDraft[]>([]);
  const future = shallowRef<PlantDraft[]>([]);
  /** The field the last edit touched: typing into one field is one undo step. */
  let lastEditKey: string | null = null;

  const canUndo = computed(() => past.value.length > 0);
  const canRedo = computed(() => future.value.length > 0);
  /** True when the draft has problems (results come from the last valid plant). */
  const draftInvalid = computed(() => draftIssues.value.length > 0);

  /**
   * Takes rated figures that came with a check. Parts equal to the ones shown keep the shown
   * objects, so an edit that changes no rating (a droop, a setpoint) redraws nothing that depends
   * on them (rated table, capability limits), though the set's droop lines change.
   */
  function takeDescription(checked: CheckedPlant): void {
    if (checked.description) {
      const next = keepSame(description.value, checked.description);
      if (next !== description.value) description.value = next;
    } else error.value = `rated figures: ${checked.descriptionError ?? 'not available'}`;
  }

  async function describe(valid: Plant): Promise<void> {
    if (plant.value !== valid) return; // a newer plant is on its way
    try {
      const d = await engine().call('describePlant', { plant: valid });
      if (plant.value === valid) description.value = d;
    } catch (e) {
      error.value = `rated figures: ${messageOf(e)}`;
    }
  }

  /** Validates `candidate`; on success it becomes the plant and the draft, and undo history restarts. */
  async function load(candidate: unknown, from: string, asked: Promise<CheckedPlant> | null = null): Promise<boolean> {
    try {
      // With the sharing store attached, the same request solves the plant (one round trip).
      let valid: Plant;
      if (solver) {
        const pct = solver.loadPct();
        const checked = await (pct === null && asked
          ? asked
          : engine().call('checkPlant', pct === null ? { plant: candidate } : { plant: candidate, loadPct: pct }));
        valid = checked.plant;
        solver.take(checked, pct);
      } else valid = await engine().call('validatePlant', { plant: candidate });
      error.value = null;
      plant.value = valid;
      draft.value = draftOf(valid);
      checkedDraft.value = draft.value;
      source.value = from;
      issues.value = [];
      issuesFrom.value = null;
      draftIssues.value = [];
      past.value = [];
      future.value = [];
      lastEditKey = null;
      revision.value++;
      dirty.value = false;
      // The rated figures follow (the first figures on screen need not wait for them).
      await describe(valid);
      return true;
    } catch (e) {
      issues.value = e instanceof EngineCallError ? e.issues : [];
      issuesFrom.value = 'load';
      error.value = `${from}: ${messageOf(e)}`;
      return false;
    }
  }

  /** Loads the shipped demo plant (with the check the page asked for as it started, when there is one). */
  function loadDemo(): Promise<boolean> {
    return load(structuredClone(demoPlant), 'demo plant', takeDemoCheck());
  }

  const describer = latestOnly(describe);

  // Validation of the draft: one request at a time, always for the newest draft. With the sharing
  // store attached, the same request solves and describes the plant (`checkPlant`): one round trip
  // per edit, one redraw.
  const validator = latestOnly(async (candidate: PlantDraft) => {
    if (candidate !== draft.value) return; // an older draft: a newer one is queued or done
    try {
      let valid: Plant;
      if (solver) {
        const pct = solver.loadPct();
        const checked = await engine().call(
          'checkPlant',
          pct === null ? { plant: candidate, describe: true } : { plant: candidate, loadPct: pct, describe: true },
        );
        if (candidate !== draft.value) return;
        valid = checked.plant;
        checkedDraft.value = candidate;
        solver.take(checked, pct);
        error.value = null;
        takeDescription(checked);
      } else {
        valid = await engine().call('validatePlant', { plant: candidate });
        if (candidate !== draft.value) return;
        error.value = null;
      }
      plant.value = valid;
      checkedDraft.value = candidate;
      // Replaced only when there were some: every field watches this list.
      if (draftIssues.value.length) draftIssues.value = [];
      if (issuesFrom.value === 'edit') {
        issues.value = [];
        issuesFrom.value = null;
      }
      revision.value++;
      dirty.value = true;
      // Without the sharing store, rated figures follow on their own queue, so the next edit's check need not wait.
      if (!solver) void describer.push(valid);
    } catch (e) {
      if (candidate !== draft.value) return;
      checkedDraft.value = candidate;
      const found = e instanceof EngineCallError ? e.issues : [];
      draftIssues.value = found;
      issues.value = found;
      issuesFrom.value = 'edit';
      error.value = found.length
        ? `The edited plant has ${found.length === 1 ? 'a problem' : `${found.length} problems`}; results are from the last valid plant.`
        : `edit: ${messageOf(e)}`;
    }
  });

  function commit(next: PlantDraft, key: string | null): Promise<void> {
    const current = draft.value;
    if (!current || next === current) return Promise.resolve();
    if (key === null || key !== lastEditKey) {
      past.value = [...past.value.slice(-(UNDO_DEPTH - 1)), current];
    }
    future.value = [];
    lastEditKey = key;
    draft.value = next;
    return validator.push(next);
  }

  /**
   * Sets one field of the draft (`path` as the engine names it, e.g.
   * `sets[1].governor.droopPct`). Successive edits of the same field are one undo step.
   */
  function edit(path: string, value: unknown): Promise<void> {
    if (!draft.value || Object.is(getIn(draft.value, path), value)) return Promise.resolve();
    return commit(setIn(draft.value, path, value), path);
  }

  /**
   * Sets several fields at once (e.g. kW and kVAR from a kVA and PF entry); successive
   * calls with the same `key` are one undo step.
   */
  function editFields(key: string, values: readonly (readonly [string, unknown])[]): Promise<void> {
    if (!draft.value) return Promise.resolve();
    let next = draft.value;
    for (const [path, value] of values) if (!Object.is(getIn(next, path), value)) next = setIn(next, path, value);
    return commit(next, key);
  }

  /** Applies a whole-draft change (add, remove, move, duplicate…) as one undo step. */
  function change(recipe: (d: PlantDraft) => PlantDraft): Promise<void> {
    if (!draft.value) return Promise.resolve();
    return commit(recipe(draft.value), null);
  }

  /** Steps back one edit. */
  function undo(): Promise<void> {
    const prev = past.value[past.value.length - 1];
    if (!prev || !draft.value) return Promise.resolve();
    future.value = [...future.value, draft.value];
    past.value = past.value.slice(0, -1);
    lastEditKey = null;
    draft.value = prev;
    return validator.push(prev);
  }

  /** Re-applies the last undone edit. */
  function redo(): Promise<void> {
    const next = future.value[future.value.length - 1];
    if (!next || !draft.value) return Promise.resolve();
    past.value = [...past.value, draft.value];
    future.value = future.value.slice(0, -1);
    lastEditKey = null;
    draft.value = next;
    return validator.push(next);
  }

  /** Ends the current undo step, so the next keystroke in the same field starts a new one. */
  function closeStep(): void {
    lastEditKey = null;
  }

  /** The problem of the draft at `path`, if any. */
  /** The draft's value at a field path (`sets[1].governor.droopPct`), for the editor's fields. */
  function valueAt(path: string): unknown {
    return getIn(draft.value, path);
  }

  function issueAt(path: string): string | undefined {
    return draftIssues.value.find((i) => i.path === path)?.message;
  }

  /** A deep copy of the last valid plant, for saving. */
  function snapshot(): Plant | null {
    return plant.value ? clonePlain(plant.value) : null;
  }

  /** Marks the current plant as saved (`dirty` becomes false). */
  function markSaved(): void {
    dirty.value = false;
  }

  /** Resolves when the draft's validation (and the rated figures) are up to date. */
  async function settled(): Promise<void> {
    await validator.settled();
    await describer.settled();
  }

  return {
    plant,
    description,
    issues,
    issuesFrom,
    error,
    source,
    draft,
    draftIssues,
    draftInvalid,
    checking,
    revision,
    dirty,
    canUndo,
    canRedo,
    load,
    loadDemo,
    edit,
    editFields,
    change,
    undo,
    redo,
    closeStep,
    attachSolver,
    valueAt,
    issueAt,
    snapshot,
    markSaved,
    settled,
  };
});

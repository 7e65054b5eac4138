/**
 * The sharing store: where the current plant settles (`solveSharing`) and the load sweep
 * (`sweepLoad`), recomputed whenever the plant changes. A load slider replaces the plant's
 * loads by one constant-power load at a % of the online sets' kW rating; while it is
 * dragged, only the newest position is ever sent (older ones are dropped, never queued).
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import { connectedLoad, loadAtPct, onlineRatedKW } from '../../shared-types';
import type { CheckedPlant, LoadOverride, LoadSweep, Plant, SharingResult } from '../../shared-types';
import { engine, messageOf } from '../transport';
import { latestOnly } from './latest-only';
import { usePlantStore } from './plant';

/** Points of the load sweep (0 to 110 % in 2.5 % steps). */
export const SWEEP_STEPS = 45;
/** The slider's range, % of the online sets' kW rating. */
export const LOAD_PCT_MAX = 110;
/** Below this total kVA, % of the online kVA rating, the total PF is shown as "—". */
export const PF_SHOWN_ABOVE_PCT = 0.5;
// The slider's arithmetic is shared with the engine's `checkPlant` handler.
export { connectedLoad, loadAtPct, onlineRatedKW };

interface SolveInput {
  plant: Plant;
  loadPct: number | null;
}

export const useSharingStore = defineStore('sharing', () => {
  const plantStore = usePlantStore();

  /** The operating point of `resultPlant`, or null (see `error`). */
  const result = shallowRef<SharingResult | null>(null);
  /** The plant `result` belongs to. */
  const resultPlant = shallowRef<Plant | null>(null);
  /** The load override `result` was solved with (null: the plant's own loads). */
  const resultLoad = shallowRef<LoadOverride | null>(null);
  /** The slider position `result` was solved for (null: the plant's own loads). */
  const resultLoadPct = ref<number | null>(null);
  /** Why there is no operating point (no steady state, engine unavailable…). */
  const error = ref<string | null>(null);

  const sweep = shallowRef<LoadSweep | null>(null);
  const sweepPlant = shallowRef<Plant | null>(null);
  const sweepError = ref<string | null>(null);

  /** How many views show the sweep; it is computed only while one does. */
  const sweepViewers = ref(0);

  /** The slider: total load as % of the online kW rating; null = the plant's own loads. */
  const loadPct = ref<number | null>(null);

  /** Solve requests answered (for the status line and tests). */
  const solves = ref(0);

  const solver = latestOnly(async ({ plant, loadPct: pct }: SolveInput) => {
    const load = pct === null ? undefined : loadAtPct(plant, pct);
    try {
      // The slider goes up to the overload limit; a load the sets cannot carry (feeder losses on top, a
      // set that saturates early) is answered at the most they can carry, and the result says so.
      const r = await engine().call('solveSharing', load ? { plant, load, atMost: true } : { plant });
      // A newer plant came while this one was solving: its own answer is (or will be) the one shown.
      if (plant !== plantStore.plant) return;
      result.value = r;
      error.value = null;
    } catch (e) {
      if (plant !== plantStore.plant) return;
      result.value = null;
      error.value = messageOf(e);
    }
    resultPlant.value = plant;
    resultLoad.value = load ?? null;
    resultLoadPct.value = pct;
    solves.value++;
  });

  const sweeper = latestOnly(async (plant: Plant) => {
    try {
      sweep.value = await engine().call('sweepLoad', { plant, steps: SWEEP_STEPS, fromPct: 0, toPct: LOAD_PCT_MAX });
      sweepError.value = null;
    } catch (e) {
      sweep.value = null;
      sweepError.value = messageOf(e);
    }
    sweepPlant.value = plant;
  });

  function solveNow(): Promise<void> {
    const plant = plantStore.plant;
    if (!plant) return Promise.resolve();
    return solver.push({ plant, loadPct: loadPct.value });
  }

  let sweepAsked: Plant | null = null;
  function sweepIfShown(): void {
    const plant = plantStore.plant;
    if (!plant || sweepViewers.value === 0 || sweepAsked === plant) return;
    sweepAsked = plant;
    void sweeper.push(plant);
  }

  /**
   * An edit's check brings the operating point with it (`checkPlant`, one round trip): the plant
   * store asks here for the slider position to solve at, and hands the answer over just before
   * the plant changes, so the watcher below finds it already solved.
   */
  plantStore.attachSolver({
    loadPct: () => loadPct.value,
    take(checked: CheckedPlant, pct: number | null) {
      result.value = checked.sharing;
      error.value = checked.sharingError;
      resultPlant.value = checked.plant;
      resultLoad.value = checked.load;
      resultLoadPct.value = pct;
      solves.value++;
    },
  });

  watch(
    () => plantStore.plant,
    (plant) => {
      if (!plant) return;
      // Solved in the same request as the edit's check (unless the slider has moved since).
      if (resultPlant.value !== plant || resultLoadPct.value !== loadPct.value) void solver.push({ plant, loadPct: loadPct.value });
      sweepIfShown();
    },
    // Synchronous: the request leaves in the same tick as the edit that changed the plant.
    { immediate: true, flush: 'sync' },
  );

  /**
   * A view that shows the load sweep calls this on mount and the returned function on
   * unmount; the sweep (the costliest call) is then kept up to date only while shown.
   */
  function showSweep(): () => void {
    sweepViewers.value++;
    sweepIfShown();
    return () => {
      sweepViewers.value = Math.max(0, sweepViewers.value - 1);
    };
  }

  /** Moves the load slider (null returns to the plant's own loads) and recomputes. */
  function setLoadPct(pct: number | null): Promise<void> {
    loadPct.value = pct === null ? null : Math.min(LOAD_PCT_MAX, Math.max(0, pct));
    return solveNow();
  }

  /** The online kW rating of the current plant. */
  const ratedKW = computed(() => (plantStore.plant ? onlineRatedKW(plantStore.plant) : 0));
  /** The plant's own connected load. */
  const ownLoad = computed(() => (plantStore.plant ? connectedLoad(plantStore.plant) : { kW: 0, kVAR: 0 }));
  /** The plant's own load as % of the online kW rating (where the slider rests). */
  const ownLoadPct = computed(() => (ratedKW.value > 0 ? (100 * ownLoad.value.kW) / ratedKW.value : 0));
  /** The slider position shown: the override, or the plant's own load. */
  const shownLoadPct = computed(() => loadPct.value ?? ownLoadPct.value);
  /** The load the result is for (override or the plant's own), kW and kVAR. */
  const shownLoad = computed<LoadOverride>(() => resultLoad.value ?? (resultPlant.value ? connectedLoad(resultPlant.value) : ownLoad.value));

  /** Power factor of the sets' total output, or null at (near) zero output, where it means nothing. */
  const totalPF = computed(() => {
    const t = result.value?.totals;
    const p = resultPlant.value;
    if (!t || !p) return null;
    let kva = 0;
    for (const s of p.sets) if (s.online) kva += s.ratedKVA;
    return t.kVA > (PF_SHOWN_ABOVE_PCT / 100) * kva ? Math.abs(t.kW) / t.kVA : null;
  });
  /** The plant warnings not already said in a set's row of the table. */
  const plantWarnings = computed(() => {
    const r = result.value;
    if (!r) return [];
    const inRows = new Set(r.sets.flatMap((s) => s.notes));
    // The capped-load sentence (the engine's first warning) is shown on its own above the table.
    return r.warnings.filter((w, i) => !inRows.has(w) && !(r.capped && i === 0));
  });
  /** Total kW as % of the online kW rating of the plant the result is for. */
  const totalLoadingPct = computed(() => {
    const r = result.value;
    const p = resultPlant.value;
    if (!r || !p) return null;
    const rated = onlineRatedKW(p);
    return rated > 0 ? (100 * r.totals.kW) / rated : null;
  });

  /**
   * True when the shown result (or error) answers the current plant and slider position:
   * no edit is being checked and no newer input is waiting. Views expose it (`data-state`) so tests and users can tell a
   * settled figure from one on its way.
   */
  const upToDate = computed(
    () => !plantStore.checking && resultPlant.value !== null && resultPlant.value === plantStore.plant && resultLoadPct.value === loadPct.value,
  );

  /** Resolves when the solve and the sweep are up to date. */
  async function settled(): Promise<void> {
    await plantStore.settled();
    await Promise.all([solver.settled(), sweeper.settled()]);
  }

  return {
    result,
    resultPlant,
    resultLoad,
    resultLoadPct,
    upToDate,
    error,
    sweep,
    sweepPlant,
    sweepError,
    loadPct,
    solves,
    ratedKW,
    ownLoad,
    ownLoadPct,
    shownLoadPct,
    shownLoad,
    totalPF,
    plantWarnings,
    totalLoadingPct,
    setLoadPct,
    solveNow,
    showSweep,
    settled,
  };
});

/**
 * The synchronizing store: sync-check window settings (kept with the project), the live
 * case on the scope (bus and incoming frequency, voltage and angle), the engine's verdict,
 * and the closing map. The scope turns in real time: between engine evaluations the
 * displayed angle runs on from the engine's last angle at the engine's slip, by the shared
 * law `angleAfterDeg` (shared-types/angle.ts) — the store computes no figure of its own.
 *
 * Every input goes to the engine as typed; the engine's schema is the one set of rules. A
 * refused field keeps its typed value with the rule beside it (`fieldErrors`), the verdict
 * is withdrawn (the view says "settings invalid", never a permissive), and the project keeps
 * the last accepted settings (`snapshot()`).
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import { angleAfterDeg, wrapAngleDeg } from '../../shared-types';
import type { ClosingMap, DeadPermissives, ProjectSyncSettings, SyncCase, SyncLimits, SyncPreset, SyncResult } from '../../shared-types';
import { EngineCallError, engine, messageOf } from '../transport';
import { keepRecent } from '../components/sync/window-plane';
import type { PlaneSample } from '../components/sync/window-plane';
import { usePlantStore } from './plant';

/** Default window: the trade's common practice for generating sets (the preset of the same id). */
export const DEFAULT_SYNC_SETTINGS: ProjectSyncSettings = {
  presetId: 'practice-generating-sets',
  limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true },
  breakerClosingMs: 100,
  dead: { deadBus: false, deadLine: false, livePct: 80, deadPct: 20 },
  incomingSetId: null,
};

/** The live quantities the user sets on the scope. */
export interface SyncLive {
  busFrequencyHz: number;
  busVoltageV: number;
  incomingFrequencyHz: number;
  incomingVoltageV: number;
  /** Incoming angle relative to the bus when the case was last set, degrees. */
  angleDeg: number;
}

/** Seconds between engine evaluations while the scope turns (the angle is interpolated in between). */
export const EVALUATE_EVERY_S = 0.2;
/** Seconds of the operating point's trace kept for the window plane. */
export const TRACE_SECONDS = 6;

/** The case's fields a user types, by their path in the sync case (the engine names refused fields by it). */
export const SYNC_FIELDS = [
  'limits.slipHz',
  'limits.angleDeg',
  'limits.voltagePct',
  'breakerClosingMs',
  'dead.livePct',
  'dead.deadPct',
  'bus.frequencyHz',
  'bus.voltageV',
  'incoming.frequencyHz',
  'incoming.voltageV',
  'incoming.angleDeg',
] as const;
export type SyncField = (typeof SYNC_FIELDS)[number];
const isSyncField = (p: string): p is SyncField => (SYNC_FIELDS as readonly string[]).includes(p);

/** A plain copy of settings (reactive proxies included). */
function copySettings(s: ProjectSyncSettings): ProjectSyncSettings {
  return { ...s, limits: { ...s.limits }, dead: { ...s.dead } };
}

export const useSyncStore = defineStore('sync', () => {
  const plantStore = usePlantStore();
  const presets = shallowRef<SyncPreset[]>([]);
  const settings = ref<ProjectSyncSettings>(structuredClone(DEFAULT_SYNC_SETTINGS));
  const live = ref<SyncLive>({ busFrequencyHz: 50, busVoltageV: 400, incomingFrequencyHz: 50.1, incomingVoltageV: 404, angleDeg: -120 });
  const result = shallowRef<SyncResult | null>(null);
  /** Wall time (ms) the last result's `angleNowDeg` belongs to. */
  const resultAtMs = ref(0);
  const error = ref<string | null>(null);
  /** The engine's operating points (angle, slip) over the last `TRACE_SECONDS`, oldest first (time in s of wall clock). */
  const trace = shallowRef<PlaneSample[]>([]);
  /** Fields the engine refused, with its rule in words ("must be greater than 0"); empty when all are accepted. */
  const fieldErrors = ref<Partial<Record<SyncField, string>>>({});
  /** A field is refused: there is no verdict until it is put right. */
  const invalid = computed(() => Object.keys(fieldErrors.value).length > 0);
  /** The last settings the engine accepted (what the project keeps while a field is refused). */
  let goodSettings: ProjectSyncSettings = structuredClone(DEFAULT_SYNC_SETTINGS);
  /** The scope turns in real time when true; frozen (and the angle editable) when false. */
  const turning = ref(true);

  const map = shallowRef<ClosingMap | null>(null);
  const mapBusy = ref(false);
  const mapProgress = ref(0);
  const mapError = ref<string | null>(null);
  let mapAbort: AbortController | null = null;

  let evaluating = false;
  /** A request that arrived while one was in flight (wall time), run when it returns. */
  let again: number | null = null;

  const preset = computed(() => presets.value.find((p) => p.id === settings.value.presetId) ?? null);
  const incomingSet = computed(() => {
    const p = plantStore.plant;
    if (!p) return null;
    return p.sets.find((s) => s.id === settings.value.incomingSetId) ?? p.sets[p.sets.length - 1] ?? null;
  });

  /** The case for the engine at wall time `nowMs` (the angle moved on at the slip since it was set). */
  function buildCase(angleDeg: number): SyncCase {
    const p = plantStore.plant;
    const set = incomingSet.value;
    const c: SyncCase = {
      bus: { frequencyHz: live.value.busFrequencyHz, voltageV: live.value.busVoltageV },
      incoming: {
        frequencyHz: live.value.incomingFrequencyHz,
        voltageV: live.value.incomingVoltageV,
        angleDeg,
        ratedKVA: set?.ratedKVA ?? 500,
        xddpPU: set?.machine.xddpPU ?? 0.15,
        ...(set ? { inertiaS: set.machine.inertiaS, poles: set.poles } : {}),
      },
      breakerClosingMs: settings.value.breakerClosingMs,
      limits: { ...settings.value.limits },
      dead: { ...settings.value.dead },
      ...(settings.value.presetId ? { presetId: settings.value.presetId } : {}),
    };
    if (p && set) {
      c.plant = p;
      c.incomingSetId = set.id;
    } else {
      c.busSource = { ratedKVA: 2000, xPU: 0.15 };
    }
    return c;
  }

  /** Wall time (ms) at which `live.angleDeg` held; changes of the case bump `liveRev`. */
  let liveAtMs = 0;
  let liveRev = 0;
  let resultRev = -1;

  /** The case's angle at `nowMs`: the angle last set, run on at the case's slip while the scope turns. */
  function caseAngleDeg(nowMs: number): number {
    if (!turning.value) return live.value.angleDeg;
    const slip = live.value.incomingFrequencyHz - live.value.busFrequencyHz;
    // A refused (unreadable) frequency leaves the angle where it was set rather than making it unreadable too.
    if (!Number.isFinite(slip)) return live.value.angleDeg;
    return angleAfterDeg(live.value.angleDeg, slip, (nowMs - liveAtMs) / 1000);
  }

  /** The angle the scope should draw at wall time `nowMs`: the engine's last angle run on at the engine's slip. */
  function displayAngleDeg(nowMs: number): number {
    const r = result.value;
    if (!r || resultRev !== liveRev) return caseAngleDeg(nowMs);
    if (!turning.value) return r.angleNowDeg;
    return angleAfterDeg(r.angleNowDeg, r.slipHz, (nowMs - resultAtMs.value) / 1000);
  }

  /**
   * Where contact would land if the command went at `nowMs`: the engine's own contact angle for a command at its
   * verdict, run on at the engine's slip like the displayed angle (null without a verdict for this case).
   */
  function displayContactAngleDeg(nowMs: number): number | null {
    const r = result.value;
    if (!r || resultRev !== liveRev || r.deadBusClose || r.deadLineClose) return null;
    if (!turning.value) return r.closeNow.angleAtContactDeg;
    return angleAfterDeg(r.closeNow.angleAtContactDeg, r.slipHz, (nowMs - resultAtMs.value) / 1000);
  }

  /** The trace for the window plane at `nowMs`: the engine's points of the last seconds and the point drawn now. */
  function traceAt(nowMs: number): PlaneSample[] {
    const r = result.value;
    const kept = keepRecent(trace.value, nowMs / 1000, TRACE_SECONDS);
    if (!r || resultRev !== liveRev || !turning.value) return kept;
    return [...kept, { tS: nowMs / 1000, angleDeg: displayAngleDeg(nowMs), slipHz: r.slipHz }];
  }

  /** Asks the engine for the verdict at the angle the case has at `nowMs`. */
  async function evaluate(nowMs: number): Promise<void> {
    if (evaluating) {
      again = nowMs;
      return;
    }
    evaluating = true;
    const rev = liveRev;
    const asked = settings.value;
    try {
      const r = await engine().call('evaluateSync', buildCase(caseAngleDeg(nowMs)));
      // A result for a case that has since changed is dropped (the queued evaluation follows).
      if (rev === liveRev) {
        result.value = r;
        resultAtMs.value = nowMs;
        const last = trace.value.at(-1);
        const sample = { tS: nowMs / 1000, angleDeg: r.angleNowDeg, slipHz: r.slipHz };
        // A frozen scope or a late result adds nothing new to the trace.
        if (!last || sample.tS > last.tS + 1e-6) trace.value = keepRecent([...trace.value, sample], sample.tS, TRACE_SECONDS);
        resultRev = rev;
        error.value = null;
        fieldErrors.value = {};
        goodSettings = copySettings(asked);
      }
    } catch (e) {
      if (rev === liveRev) refused(e);
    } finally {
      evaluating = false;
    }
    if (again !== null) {
      const t = again;
      again = null;
      await evaluate(t);
    }
  }

  /** The engine refused the case: its field issues go beside the fields, and the verdict is withdrawn. */
  function refused(e: unknown): void {
    result.value = null;
    const issues = e instanceof EngineCallError ? e.issues : [];
    const byField: Partial<Record<SyncField, string>> = {};
    const other: string[] = [];
    for (const i of issues) {
      if (isSyncField(i.path)) byField[i.path] ??= i.message;
      else other.push(`${i.path}: ${i.message}`);
    }
    fieldErrors.value = byField;
    error.value = other.length ? other.join('\n') : issues.length ? null : messageOf(e);
  }

  /** Called every animation frame by the view: re-evaluates every `EVALUATE_EVERY_S` while turning. */
  function tick(nowMs: number): void {
    // A refused case is evaluated again only when a field changes.
    if (!turning.value || invalid.value) return;
    if (!result.value || resultRev !== liveRev || nowMs - resultAtMs.value >= EVALUATE_EVERY_S * 1000) void evaluate(nowMs);
  }

  /** Marks the case changed at `nowMs` with its angle then. */
  function rebase(angleDeg: number, nowMs: number): void {
    live.value = { ...live.value, angleDeg: wrapAngleDeg(angleDeg) };
    liveAtMs = nowMs;
    liveRev++;
  }

  /** Stops or starts the rotation; stopping keeps the current angle so the user can edit it. */
  function setTurning(on: boolean, nowMs: number): void {
    rebase(displayAngleDeg(nowMs), nowMs);
    turning.value = on;
    void evaluate(nowMs);
  }

  /** Changes the live case (frequencies, voltages, angle) and re-evaluates. */
  function setLive(patch: Partial<SyncLive>, nowMs: number): void {
    const angle = patch.angleDeg ?? displayAngleDeg(nowMs);
    live.value = { ...live.value, ...patch };
    rebase(angle, nowMs);
    void evaluate(nowMs);
  }

  async function loadPresets(): Promise<void> {
    try {
      presets.value = await engine().call('listSyncPresets', {});
    } catch (e) {
      error.value = messageOf(e);
    }
  }

  /** Takes a preset's limits (its source stays on screen). */
  function choosePreset(id: string | null): void {
    const p = presets.value.find((x) => x.id === id);
    settings.value = { ...settings.value, presetId: p ? p.id : null, limits: p ? { ...p.limits } : { ...settings.value.limits } };
  }

  /** Custom limits: the preset no longer applies. */
  function setLimits(patch: Partial<SyncLimits>): void {
    settings.value = { ...settings.value, presetId: null, limits: { ...settings.value.limits, ...patch } };
  }

  function setBreakerClosingMs(ms: number): void {
    settings.value = { ...settings.value, breakerClosingMs: ms };
  }

  function setDead(patch: Partial<DeadPermissives>): void {
    settings.value = { ...settings.value, dead: { ...settings.value.dead, ...patch } };
  }

  function setIncomingSet(id: string | null): void {
    settings.value = { ...settings.value, incomingSetId: id };
  }

  // Any change of the window or the plant invalidates the verdict and the map. Both are replaced,
  // never changed in place (the setters above and `restore` build new settings; every accepted plant
  // is a new object), so the watch compares references and never walks the plant.
  let viewers = 0;
  // The verdict is asked again only while a view shows it: with the Synchronizing view closed, a plant edit costs
  // no second round trip (the view asks for a fresh verdict when it opens).
  watch([settings, () => plantStore.plant], () => {
    map.value = null;
    const t = typeof performance === 'undefined' ? Date.now() : performance.now();
    rebase(displayAngleDeg(t), t);
    if (viewers > 0) void evaluate(t);
  });

  /** A view that shows the verdict opened (it asks for a verdict itself as it opens). */
  function viewOpened(): void {
    viewers++;
  }
  /** That view closed. */
  function viewClosed(): void {
    viewers = Math.max(0, viewers - 1);
  }

  /**
   * Computes the closing map off the UI thread, with progress; a new request cancels the old. `method`
   * 'time-domain' simulates the plant for every cell (on the engine's pool of workers, one per core).
   */
  async function computeMap(voltageDifferencePct?: number, angleSteps = 181, slipSteps = 101, method: ClosingMap['method'] = 'closed-form'): Promise<void> {
    mapAbort?.abort();
    const abort = new AbortController();
    mapAbort = abort;
    mapBusy.value = true;
    mapProgress.value = 0;
    mapError.value = null;
    const range = Math.max(0.5, 2.5 * settings.value.limits.slipHz);
    try {
      const m = await engine().call(
        'closingMap',
        {
          case: buildCase(0),
          angleSteps,
          slipSteps,
          slipRangeHz: Number(range.toFixed(3)),
          method,
          ...(voltageDifferencePct === undefined ? {} : { voltageDifferencePct }),
        },
        { signal: abort.signal, onProgress: (f) => (mapProgress.value = f) },
      );
      if (mapAbort === abort) map.value = m;
    } catch (e) {
      if (mapAbort === abort) mapError.value = abort.signal.aborted ? 'Closing map cancelled.' : messageOf(e);
    } finally {
      if (mapAbort === abort) {
        mapBusy.value = false;
        mapAbort = null;
      }
    }
  }

  function cancelMap(): void {
    mapAbort?.abort();
  }

  /** The settings to keep with a project: the last the engine accepted (a refused field is not saved). */
  function snapshot(): ProjectSyncSettings {
    return copySettings(invalid.value ? goodSettings : settings.value);
  }

  /** Restores settings from a project (null: the defaults). */
  function restore(s: ProjectSyncSettings | null): void {
    settings.value = structuredClone(s ?? DEFAULT_SYNC_SETTINGS);
    goodSettings = structuredClone(s ?? DEFAULT_SYNC_SETTINGS);
  }

  return {
    presets,
    settings,
    live,
    result,
    resultAtMs,
    trace,
    error,
    fieldErrors,
    invalid,
    turning,
    map,
    mapBusy,
    mapProgress,
    mapError,
    preset,
    incomingSet,
    buildCase,
    displayAngleDeg,
    displayContactAngleDeg,
    traceAt,
    evaluate,
    tick,
    setTurning,
    setLive,
    viewOpened,
    viewClosed,
    loadPresets,
    choosePreset,
    setLimits,
    setBreakerClosingMs,
    setDead,
    setIncomingSet,
    computeMap,
    cancelMap,
    snapshot,
    restore,
  };
});

/**
 * The trainer store: the exercise in progress (its state lives in the engine's terms and
 * goes round the engine once a frame), the controls the trainee holds, the verdict of the
 * last close and the log of attempts (kept with the project).
 *
 * Frames: the view calls `frame(nowMs)` from requestAnimationFrame. One `trainerStep` is
 * in flight at a time, advancing the model by the wall time since the last step; the scope
 * draws the model's angle run on at its slip since that step, so it turns smoothly at
 * 60 frames a second even when a round trip takes longer than a frame.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { angleAfterDeg } from '../../shared-types';
import type { SyncLimits, TrainerAttempt, TrainerInputs, TrainerLevel, TrainerState, TrainerVerdict } from '../../shared-types';
import { engine, messageOf } from '../transport';
import type { PlaneSample } from '../components/sync/window-plane';
import { usePlantStore } from './plant';

/** Longest wall time one step may cover, s (the engine refuses more than 0.25 s). */
const MAX_STEP_S = 0.2;
/** The trainee's path on the window plane: a sample every this many seconds of exercise time, at most `PATH_MAX` kept. */
const PATH_EVERY_S = 0.05;
const PATH_MAX = 4000;


/** Keyboard bindings: key → control (shown on the buttons too). */
export const TRAINER_KEYS = {
  ArrowUp: { control: 'speed', direction: 1 },
  ArrowDown: { control: 'speed', direction: -1 },
  ArrowRight: { control: 'voltage', direction: 1 },
  ArrowLeft: { control: 'voltage', direction: -1 },
} as const;
/** Key that gives the close command. */
export const CLOSE_KEY = ' ';

export const useTrainerStore = defineStore('trainer', () => {
  const plantStore = usePlantStore();
  const levels = shallowRef<TrainerLevel[]>([]);
  const levelId = ref('steady');
  const seed = ref(1);
  /** The trainee's name, written on each attempt of the log. */
  const trainee = ref('');
  /** Plant set used as the incoming machine (null: the standard 500 kVA set). */
  const incomingSetId = ref<string | null>(null);
  const state = shallowRef<TrainerState | null>(null);
  /** Wall time (ms) of the last step's state. */
  const stateAtMs = ref(0);
  const verdict = shallowRef<TrainerVerdict | null>(null);
  /** The trainee's path in angle and slip since the exercise started (exercise time), up to the contact. */
  const path = shallowRef<PlaneSample[]>([]);
  const attempts = ref<TrainerAttempt[]>([]);
  const error = ref<string | null>(null);
  /** Controls held now (keys or buttons). */
  const held = ref<{ speed: -1 | 0 | 1; voltage: -1 | 0 | 1 }>({ speed: 0, voltage: 0 });
  /** Nudges: a click on a button holds it for this many seconds of model time. */
  const nudge = { speed: 0, voltage: 0, speedDir: 0 as -1 | 0 | 1, voltageDir: 0 as -1 | 0 | 1 };
  let closeRequested = false;
  let windowRequested: SyncLimits | null = null;
  let inFlight = false;
  let lastStepMs: number | null = null;
  let generation = 0;

  const level = computed(() => state.value?.level ?? levels.value.find((l) => l.id === levelId.value) ?? null);
  const slipHz = computed(() => (state.value ? state.value.incomingFrequencyHz - state.value.busFrequencyHz : 0));
  const voltageDifferencePct = computed(() => (state.value ? 100 * (state.value.incomingVoltageV / state.value.busVoltageV - 1) : 0));
  const canClose = computed(() => state.value?.phase === 'running' && state.value.window !== null);
  /** Best and mean score of the log. */
  const summary = computed(() => {
    const n = attempts.value.length;
    if (!n) return null;
    const scores = attempts.value.map((a) => a.score);
    return { count: n, best: Math.max(...scores), mean: scores.reduce((a, b) => a + b, 0) / n };
  });

  async function loadLevels(): Promise<void> {
    try {
      levels.value = await engine().call('trainerLevels', {});
    } catch (e) {
      error.value = messageOf(e);
    }
  }

  /** Changes the level and restarts the exercise at once on the same seed, so the limits shown are the level's. */
  async function chooseLevel(id: string): Promise<void> {
    levelId.value = id;
    await start(seed.value);
  }

  /** Starts an exercise (a new random seed unless one is given). */
  async function start(withSeed?: number): Promise<void> {
    const g = ++generation;
    seed.value = withSeed ?? Math.floor(Math.random() * 1_000_000);
    verdict.value = null;
    closeRequested = false;
    windowRequested = null;
    held.value = { speed: 0, voltage: 0 };
    lastStepMs = null;
    const p = plantStore.plant;
    const useSet = p && incomingSetId.value && p.sets.some((s) => s.id === incomingSetId.value);
    try {
      const s = await engine().call('trainerStart', {
        seed: seed.value,
        levelId: levelId.value,
        ...(useSet && p ? { plant: p, incomingSetId: incomingSetId.value ?? undefined } : {}),
      });
      if (g !== generation) return;
      state.value = s;
      path.value = [{ tS: s.tS, angleDeg: s.angleDeg, slipHz: s.incomingFrequencyHz - s.busFrequencyHz }];
      error.value = null;
    } catch (e) {
      error.value = messageOf(e);
    }
  }

  /** Presses not yet seen by a step: a press released before the next step still nudges. */
  const unseen = { speed: false, voltage: false };

  /** Holds (or releases, direction 0) a raise/lower control. */
  function hold(control: 'speed' | 'voltage', direction: -1 | 0 | 1): void {
    const was = held.value[control];
    if (direction === 0 && was !== 0 && unseen[control]) tap(control, was);
    unseen[control] = direction !== 0;
    held.value = { ...held.value, [control]: direction };
  }

  /** A single click on raise/lower: holds it for 0.25 s of model time. */
  function tap(control: 'speed' | 'voltage', direction: -1 | 1): void {
    if (control === 'speed') {
      nudge.speed = 0.25;
      nudge.speedDir = direction;
    } else {
      nudge.voltage = 0.25;
      nudge.voltageDir = direction;
    }
  }

  /** Gives the close command with the next step. */
  function close(): void {
    if (state.value?.phase === 'running') closeRequested = true;
  }

  /** Sets the sync-check window (levels that ask for it) with the next step. */
  function setWindow(limits: SyncLimits): void {
    windowRequested = { ...limits };
    if (state.value) state.value = { ...state.value, window: { ...limits } };
  }

  function inputs(dtS: number): TrainerInputs {
    const speed = held.value.speed !== 0 ? held.value.speed : nudge.speed > 1e-9 ? nudge.speedDir : 0;
    const voltage = held.value.voltage !== 0 ? held.value.voltage : nudge.voltage > 1e-9 ? nudge.voltageDir : 0;
    unseen.speed = false;
    unseen.voltage = false;
    nudge.speed = Math.max(0, nudge.speed - dtS);
    nudge.voltage = Math.max(0, nudge.voltage - dtS);
    const i: TrainerInputs = { speed, voltage };
    if (windowRequested) i.window = windowRequested;
    if (closeRequested) i.close = true;
    return i;
  }

  /**
   * Advances the model by `dtS` seconds (one engine round trip). After contact it asks for
   * the verdict and logs the attempt.
   */
  async function advance(dtS: number, nowMs = 0): Promise<void> {
    const s = state.value;
    if (!s || s.phase === 'closed') return;
    const g = generation;
    const i = inputs(dtS);
    closeRequested = false;
    windowRequested = null;
    try {
      const next = await engine().call('trainerStep', { state: s, inputs: i, dtS: Math.min(MAX_STEP_S, Math.max(0, dtS)) });
      if (g !== generation) return;
      state.value = next;
      stateAtMs.value = nowMs;
      record(next);
      if (next.phase === 'closed') await judge(next);
    } catch (e) {
      error.value = messageOf(e);
    }
  }

  /** Adds the state to the path (every `PATH_EVERY_S`, and always the contact). */
  function record(st: TrainerState): void {
    const last = path.value.at(-1);
    const atContact = st.phase === 'closed' && st.contact;
    if (last && !atContact && st.tS - last.tS < PATH_EVERY_S) return;
    const sample = atContact
      ? { tS: st.contact!.atS, angleDeg: st.contact!.angleDeg, slipHz: st.contact!.slipHz }
      : { tS: st.tS, angleDeg: st.angleDeg, slipHz: st.incomingFrequencyHz - st.busFrequencyHz };
    const next = [...path.value, sample];
    path.value = next.length > PATH_MAX ? next.slice(next.length - PATH_MAX) : next;
  }

  async function judge(s: TrainerState): Promise<void> {
    const p = plantStore.plant;
    const v = await engine().call('trainerClose', { state: s, ...(s.incomingSetId && p ? { plant: p } : {}) });
    verdict.value = v;
    const name = trainee.value.trim();
    attempts.value = [{ at: new Date().toISOString(), ...(name ? { trainee: name } : {}), ...v.attempt }, ...attempts.value];
  }

  /** Called every animation frame: starts a step when none is in flight. */
  function frame(nowMs: number): void {
    if (!state.value || state.value.phase === 'closed' || inFlight) return;
    const dt = lastStepMs === null ? 0 : (nowMs - lastStepMs) / 1000;
    lastStepMs = nowMs;
    inFlight = true;
    void advance(Math.min(MAX_STEP_S, dt), nowMs).finally(() => {
      inFlight = false;
    });
  }

  /** Stops the frame clock (view hidden): the next frame resumes without a jump. */
  function pause(): void {
    lastStepMs = null;
  }

  /** The angle to draw at `nowMs`: the model's angle run on at its slip since the last step. */
  function displayAngleDeg(nowMs: number): number {
    const s = state.value;
    if (!s) return 0;
    if (s.phase === 'closed') return s.contact?.angleDeg ?? s.angleDeg;
    const ahead = Math.min(MAX_STEP_S, Math.max(0, (nowMs - stateAtMs.value) / 1000));
    return angleAfterDeg(s.angleDeg, s.incomingFrequencyHz - s.busFrequencyHz, ahead);
  }

  function clearLog(): void {
    attempts.value = [];
  }

  /** The log to keep with a project. */
  function snapshot(): TrainerAttempt[] {
    return attempts.value.map((a) => ({ ...a }));
  }

  /** Restores the log from a project (every attempt: the log is the user's record, never trimmed). */
  function restore(list: TrainerAttempt[]): void {
    attempts.value = list.map((a) => ({ ...a }));
  }

  return {
    levels,
    levelId,
    seed,
    trainee,
    chooseLevel,
    incomingSetId,
    state,
    stateAtMs,
    verdict,
    path,
    attempts,
    error,
    held,
    level,
    slipHz,
    voltageDifferencePct,
    canClose,
    summary,
    loadLevels,
    start,
    hold,
    tap,
    close,
    setWindow,
    advance,
    frame,
    pause,
    displayAngleDeg,
    clearLog,
    snapshot,
    restore,
  };
});

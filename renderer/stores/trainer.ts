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
import { angleAfterDeg, angleAtContactDeg, closeCommandAngleDeg } from '../../shared-types';
import { faultWords } from '../../shared-types';
import type {
  SyncLimits,
  TrainerAttempt,
  TrainerExercise,
  TrainerExerciseSet,
  TrainerFaults,
  TrainerInputs,
  TrainerLevel,
  TrainerState,
  TrainerVerdict,
} from '../../shared-types';
import { EngineCallError, engine, messageOf } from '../transport';
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

/** Pass criteria of a new exercise: a score of 70, inside the window and within the machine's limits (our own default). */
export const DEFAULT_PASS = { minScore: 70, insideWindow: true, withinMachineLimits: true } as const;

/** A session: one run of an exercise set, exercise by exercise. */
export interface TrainerSession {
  setId: string;
  setName: string;
  /** ISO time the session started (its name in the log). */
  startedAt: string;
  exercises: TrainerExercise[];
  /** Index of the exercise on the scope. */
  index: number;
  /** Every exercise has been closed once. */
  finished: boolean;
}

const copyExercise = (e: TrainerExercise): TrainerExercise => structuredClone({ ...e, faults: { ...e.faults }, pass: { ...e.pass } });
const copySet = (x: TrainerExerciseSet): TrainerExerciseSet => ({ id: x.id, name: x.name, exercises: x.exercises.map(copyExercise) });
let idCounter = 0;
const newId = (prefix: string): string => `${prefix}-${Date.now().toString(36)}-${(idCounter++).toString(36)}`;

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
  /** The instructor's exercise sets (kept with the project). */
  const exerciseSets = ref<TrainerExerciseSet[]>([]);
  /** Refused fields of an exercise, by exercise id, then field path (`faults.breakerSlowMs`) → rule in words. */
  const exerciseErrors = ref<Record<string, Record<string, string>>>({});
  /** The last accepted copy of each exercise (what the project keeps while a field is refused). */
  const goodExercises = new Map<string, TrainerExercise>();
  const session = ref<TrainerSession | null>(null);
  /** Faults of the exercise on the scope (a session's; none otherwise). */
  let faults: TrainerFaults | undefined;
  const error = ref<string | null>(null);
  /** Controls held now (keys or buttons). */
  const held = ref<{ speed: -1 | 0 | 1; voltage: -1 | 0 | 1 }>({ speed: 0, voltage: 0 });
  /** Nudges: a click on a button holds it for this many seconds of model time. */
  const nudge = { speed: 0, voltage: 0, speedDir: 0 as -1 | 0 | 1, voltageDir: 0 as -1 | 0 | 1 };
  let closeRequested = false;
  let windowRequested: SyncLimits | null = null;
  let inFlight = false;
  /** A start is on its way: no step may begin (it would step the old exercise and land after the new one). */
  let starting = 0;
  let lastStepMs: number | null = null;
  let generation = 0;

  const level = computed(() => state.value?.level ?? levels.value.find((l) => l.id === levelId.value) ?? null);
  const slipHz = computed(() => (state.value ? state.value.incomingFrequencyHz - state.value.busFrequencyHz : 0));
  /** A dead bus (an instructor's fault) is energised, not synchronized: slip and voltage then read against rated. */
  const deadBus = computed(() => state.value?.faults?.deadBus === true);
  const voltageDifferencePct = computed(() => {
    const st = state.value;
    if (!st) return 0;
    return 100 * (st.incomingVoltageV / (deadBus.value ? st.machine.ratedVoltageV : st.busVoltageV) - 1);
  });
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
  async function start(withSeed?: number, withFaults?: TrainerFaults): Promise<void> {
    faults = withFaults;
    const g = ++generation;
    starting++;
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
        ...(faults && Object.keys(faults).length ? { faults } : {}),
      });
      if (g !== generation) return;
      state.value = s;
      path.value = [{ tS: s.tS, angleDeg: s.angleDeg, slipHz: s.incomingFrequencyHz - s.busFrequencyHz }];
      error.value = null;
    } catch (e) {
      error.value = messageOf(e);
    } finally {
      starting--;
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
    if (!s || s.phase === 'closed' || starting > 0) return;
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
    if (last && !atContact && st.tS - last.tS < PATH_EVERY_S - 1e-9) return;
    const sample = atContact
      ? { tS: st.contact!.atS, angleDeg: st.contact!.angleDeg, slipHz: st.contact!.slipHz }
      : { tS: st.tS, angleDeg: st.angleDeg, slipHz: st.incomingFrequencyHz - st.busFrequencyHz };
    const next = [...path.value, sample];
    path.value = next.length > PATH_MAX ? next.slice(next.length - PATH_MAX) : next;
  }

  async function judge(s: TrainerState): Promise<void> {
    const p = plantStore.plant;
    const ses = session.value;
    const ex = ses && !ses.finished ? ses.exercises[ses.index] : undefined;
    const v = await engine().call('trainerClose', { state: s, ...(s.incomingSetId && p ? { plant: p } : {}), ...(ex ? { pass: ex.pass } : {}) });
    verdict.value = v;
    const name = trainee.value.trim();
    const words = faultWords(s.faults);
    const inSession: Partial<TrainerAttempt> =
      ses && ex
        ? {
            exerciseSetId: ses.setId,
            exerciseId: ex.id,
            exerciseName: ex.name,
            session: ses.startedAt,
            passed: v.pass?.passed ?? false,
            ...(words ? { faults: words } : {}),
          }
        : {};
    attempts.value = [{ at: new Date().toISOString(), ...(name ? { trainee: name } : {}), ...v.attempt, ...inSession }, ...attempts.value];
    if (ses && ex && ses.index === ses.exercises.length - 1) session.value = { ...ses, finished: true };
  }

  // ---- Instructor: exercise sets and sessions ----

  /** Adds an exercise set with one exercise (the current level and seed, no faults); returns its id. */
  function addExerciseSet(name = `Exercise set ${exerciseSets.value.length + 1}`): string {
    const id = newId('set');
    exerciseSets.value = [...exerciseSets.value, { id, name, exercises: [] }];
    addExercise(id);
    return id;
  }

  function removeExerciseSet(id: string): void {
    exerciseSets.value = exerciseSets.value.filter((x) => x.id !== id);
  }

  function renameExerciseSet(id: string, name: string): void {
    exerciseSets.value = exerciseSets.value.map((x) => (x.id === id ? { ...x, name } : x));
  }

  /** Adds an exercise to a set; returns its id. */
  function addExercise(setId: string): string {
    const id = newId('ex');
    const set = exerciseSets.value.find((x) => x.id === setId);
    const ex: TrainerExercise = {
      id,
      name: `Exercise ${(set?.exercises.length ?? 0) + 1}`,
      levelId: levelId.value,
      seed: seed.value,
      faults: {},
      pass: { ...DEFAULT_PASS },
    };
    goodExercises.set(id, copyExercise(ex));
    exerciseSets.value = exerciseSets.value.map((x) => (x.id === setId ? { ...x, exercises: [...x.exercises, ex] } : x));
    return id;
  }

  function removeExercise(setId: string, id: string): void {
    goodExercises.delete(id);
    const { [id]: _gone, ...rest } = exerciseErrors.value;
    void _gone;
    exerciseErrors.value = rest;
    exerciseSets.value = exerciseSets.value.map((x) => (x.id === setId ? { ...x, exercises: x.exercises.filter((e) => e.id !== id) } : x));
  }

  /**
   * Changes an exercise as typed (a blank number is NaN) and has the engine check it by the project file's rules:
   * a refused field keeps its value with the rule beside it, and the project keeps the last accepted exercise.
   */
  async function editExercise(setId: string, id: string, recipe: (e: TrainerExercise) => TrainerExercise): Promise<void> {
    let edited: TrainerExercise | null = null;
    exerciseSets.value = exerciseSets.value.map((x) =>
      x.id === setId ? { ...x, exercises: x.exercises.map((e) => (e.id === id ? (edited = recipe(copyExercise(e))) : e)) } : x,
    );
    if (edited) await checkExercise(edited);
  }

  async function checkExercise(ex: TrainerExercise): Promise<void> {
    const errors: Record<string, string> = {};
    try {
      await engine().call('checkTrainerExercise', { exercise: ex });
      goodExercises.set(ex.id, copyExercise(ex));
    } catch (e) {
      const issues = e instanceof EngineCallError ? e.issues : [];
      for (const i of issues) errors[i.path.replace(/^exercise\./, '')] ??= i.message;
      if (!issues.length) errors[''] = messageOf(e);
    }
    const { [ex.id]: _old, ...rest } = exerciseErrors.value;
    void _old;
    exerciseErrors.value = Object.keys(errors).length ? { ...rest, [ex.id]: errors } : rest;
  }

  /** Why a set cannot run as a session (null: it can). */
  function setProblem(setId: string): string | null {
    const set = exerciseSets.value.find((x) => x.id === setId);
    if (!set) return 'No such exercise set.';
    if (!set.exercises.length) return 'The set has no exercises.';
    const bad = set.exercises.filter((e) => exerciseErrors.value[e.id]);
    if (bad.length) return `Put right the refused fields of ${bad.map((e) => `"${e.name}"`).join(', ')} first.`;
    return null;
  }

  /** Runs a set as a session from its first exercise (its level, seed and faults). */
  async function startSession(setId: string): Promise<void> {
    const set = exerciseSets.value.find((x) => x.id === setId);
    if (!set || setProblem(setId)) return;
    session.value = { setId, setName: set.name, startedAt: new Date().toISOString(), exercises: set.exercises.map(copyExercise), index: 0, finished: false };
    await startSessionExercise();
  }

  async function startSessionExercise(): Promise<void> {
    const ses = session.value;
    const ex = ses?.exercises[ses.index];
    if (!ex) return;
    levelId.value = ex.levelId;
    await start(ex.seed, ex.faults);
  }

  /** The next exercise of the session (after a close). */
  async function nextInSession(): Promise<void> {
    const ses = session.value;
    if (!ses || ses.index >= ses.exercises.length - 1) return;
    session.value = { ...ses, index: ses.index + 1 };
    await startSessionExercise();
  }

  /** Ends the session; the exercise on the scope stays, without faults from then on. */
  function endSession(): void {
    session.value = null;
    faults = undefined;
  }

  /** The attempts of the session on the scope (oldest first). */
  const sessionAttempts = computed(() => {
    const ses = session.value;
    if (!ses) return [];
    return attempts.value
      .filter((a) => a.session === ses.startedAt && a.exerciseSetId === ses.setId)
      .slice()
      .reverse();
  });

  /** The sets to keep with a project: every exercise as last accepted. */
  function snapshotExercises(): TrainerExerciseSet[] {
    return exerciseSets.value.map((x) => ({ id: x.id, name: x.name, exercises: x.exercises.map((e) => copyExercise(goodExercises.get(e.id) ?? e)) }));
  }

  function restoreExercises(sets: TrainerExerciseSet[]): void {
    exerciseSets.value = sets.map(copySet);
    goodExercises.clear();
    for (const x of sets) for (const e of x.exercises) goodExercises.set(e.id, copyExercise(e));
    exerciseErrors.value = {};
    session.value = null;
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

  /**
   * Where to give the close command so contact lands in phase, by the breaker time the trainee is told (the level's
   * setting): −360° × slip × t (`closeCommandAngleDeg`, the sync engine's own law); null when not running or without slip.
   */
  function commandAngleDeg(): number | null {
    const s = state.value;
    if (!s || s.phase !== 'running' || Math.abs(slipHz.value) <= 1e-4) return null;
    return closeCommandAngleDeg(slipHz.value, s.level.breakerClosingMs);
  }

  /** Where contact would land if the command went at `nowMs` (by the told breaker time); null when not running. */
  function displayContactAngleDeg(nowMs: number): number | null {
    const s = state.value;
    if (!s || s.phase !== 'running') return null;
    return angleAtContactDeg(displayAngleDeg(nowMs), slipHz.value, s.level.breakerClosingMs);
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
    exerciseSets,
    exerciseErrors,
    session,
    sessionAttempts,
    addExerciseSet,
    removeExerciseSet,
    renameExerciseSet,
    addExercise,
    removeExercise,
    editExercise,
    setProblem,
    startSession,
    nextInSession,
    endSession,
    snapshotExercises,
    restoreExercises,
    error,
    held,
    level,
    slipHz,
    deadBus,
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
    commandAngleDeg,
    displayContactAngleDeg,
    clearLog,
    snapshot,
    restore,
  };
});

/** Operator trainer: exercises, the live model's state, verdicts and the log of attempts (kept with the project). */
import type { Plant } from './plant';
import type { SyncLimits } from './sync';

/** One synchronizing attempt, as kept in the project's trainer log. */
export interface TrainerAttempt {
  /** ISO 8601 time of the close. */
  at: string;
  /** Who made the attempt, as typed in the Trainer (absent when no name was given). */
  trainee?: string;
  /** Exercise seed (repeatable start). */
  seed: number;
  level: string;
  angleAtContactDeg: number;
  slipAtContactHz: number;
  voltageDifferencePct: number;
  surgeCurrentPU: number;
  torqueStepPU: number;
  /** 0..100 */
  score: number;
  verdict: string;
  /** Exercise of an instructor's set this attempt ran (absent outside a session). */
  exerciseSetId?: string;
  exerciseId?: string;
  exerciseName?: string;
  /** Session the attempt belongs to (ISO time the session started). */
  session?: string;
  /** Judged against the exercise's pass criteria (absent outside a session). */
  passed?: boolean;
  /** Faults the exercise scripted, in words (absent when none). */
  faults?: string;
}

/**
 * Faults an instructor scripts into an exercise. The trainee is told the settings as they are meant to be;
 * the model runs with the fault.
 */
export interface TrainerFaults {
  /** The breaker closes this many ms slower than its setting (the level's breaker time, which the trainee is told). */
  breakerSlowMs?: number;
  /** The sync-check window the trainee is shown is this wrong one; the close is graded to the exercise's window. */
  wrongWindow?: SyncLimits;
  /** The droop bus wanders by up to this much, Hz (in place of the level's drift). */
  busDriftHz?: number;
  /** The bus is dead: the trainee energises it with a dead-bus close (no synchronizing). */
  deadBus?: boolean;
  /** The incoming set starts this far from the bus voltage, % (in place of the seeded 2–8 %). */
  voltageMismatchPct?: number;
}

/** What an exercise of a set must reach to pass. */
export interface TrainerPassCriteria {
  /** Lowest score that passes, 0..100. */
  minScore: number;
  /** The contact must be inside the graded window (for a dead bus: the dead-bus checks). */
  insideWindow: boolean;
  /** Surge, torques and swing within the machine's limits. */
  withinMachineLimits: boolean;
}

/** One exercise of an instructor's set. */
export interface TrainerExercise {
  id: string;
  name: string;
  levelId: string;
  seed: number;
  faults: TrainerFaults;
  pass: TrainerPassCriteria;
}

/** An instructor's exercise set, kept with the project and run as a session. */
export interface TrainerExerciseSet {
  id: string;
  name: string;
  exercises: TrainerExercise[];
}

/** An attempt judged against pass criteria. */
export interface TrainerPassResult {
  passed: boolean;
  /** A sentence for every criterion not met (empty when passed). */
  reasons: string[];
}

/** A difficulty level: what makes the exercise harder. */
export interface TrainerLevel {
  id: string;
  label: string;
  /** One sentence shown to the trainee. */
  description: string;
  /** Breaker closing time (command to contact), ms. */
  breakerClosingMs: number;
  /** Peak wander of the bus frequency, Hz (0 = steady bus). */
  busDriftHz: number;
  /** The sync-check window is blank until the trainee sets it. */
  mustSetWindow: boolean;
}

/** The incoming set's data the live model uses (per unit on its own base). */
export interface TrainerMachine {
  /** Label shown, e.g. the plant set's id and name. */
  label: string;
  ratedKVA: number;
  ratedKW: number;
  ratedVoltageV: number;
  ratedFrequencyHz: number;
  poles: number;
  /** Subtransient reactance X''d, pu (closing surge). */
  xddpPU: number;
  /** Transient reactance X'd, pu (the swing after closing). */
  xdpPU: number;
  /** Open-circuit transient time constant T'd0, s. */
  tdopS: number;
  /** Inertia constant H, s. */
  inertiaS: number;
  /** Damping, pu power per pu speed. */
  dampingPU: number;
  /** Armature resistance, pu (peak factor). */
  raPU: number;
  /** Governor speed droop, %. */
  droopPct: number;
  actuatorLagS: number;
  engineLagS: number;
  /** Regulator gain, pu field voltage per pu voltage error. */
  regulatorGainPU: number;
  exciterLagS: number;
  /** Field-voltage ceiling, pu. */
  ceilingPU: number;
}

/** The running bus as the incoming set sees it (Thevenin equivalent on the incoming set's base). */
export interface TrainerBus {
  /** Rated kVA of the running sets. */
  ratedKVA: number;
  /** Equivalent reactance of the running bus, pu on `ratedKVA`. */
  xPU: number;
  /** Inertia of the running sets, s on `ratedKVA` (the bus swings back a little after a close). */
  inertiaS: number;
}

/** Request of `trainerStart`. */
export interface TrainerStartRequest {
  /** Seed of the exercise: the same seed and level give the same start. */
  seed: number;
  levelId: string;
  /** The incoming set (defaults to a 500 kVA, 400 V, 50 Hz set of common data). */
  machine?: TrainerMachine;
  /** Take the incoming set from this plant (`incomingSetId`) and the bus from its other online sets. */
  plant?: Plant;
  incomingSetId?: string;
  bus?: TrainerBus;
  /** Window given to the trainee (ignored when the level asks them to set it). Default ±10°, 0.1 Hz, 5 %. */
  window?: SyncLimits;
  /** Faults an instructor scripted (none by default). */
  faults?: TrainerFaults;
}

/** Where an exercise is. */
export const TRAINER_PHASES = ['running', 'closing', 'closed'] as const;
export type TrainerPhase = (typeof TRAINER_PHASES)[number];

/** Held controls for one step: −1 lower, 0 none, +1 raise. */
export interface TrainerInputs {
  speed: -1 | 0 | 1;
  voltage: -1 | 0 | 1;
  /** Give the close command on this step. */
  close?: boolean;
  /** Set the sync-check window (levels where the trainee must set it). */
  window?: SyncLimits;
}

/** What the breaker saw at the moment its contacts touched. */
export interface TrainerContact {
  atS: number;
  angleDeg: number;
  slipHz: number;
  /** Incoming minus bus voltage, % of the bus. */
  voltageDifferencePct: number;
  /** |ΔV| across the breaker as a phasor, pu of the bus. */
  deltaVPU: number;
  /** Angle when the command was given, degrees. */
  commandAngleDeg: number;
}

/** The live model's whole state: plain data, passed in and out of every step. */
export interface TrainerState {
  seed: number;
  levelId: string;
  level: TrainerLevel;
  machine: TrainerMachine;
  bus: TrainerBus;
  /** The window the trainee works to (null while they still have to set it). */
  window: SyncLimits | null;
  /** The window the exercise grades against. */
  referenceWindow: SyncLimits;
  phase: TrainerPhase;
  /** Exercise time, s. */
  tS: number;
  busFrequencyHz: number;
  busVoltageV: number;
  /** Bus frequency the drift wanders about, Hz. */
  busBaseFrequencyHz: number;
  /** Bus drift: phases (rad) and periods (s) of its two slow components. */
  drift: { phase1: number; phase2: number; period1S: number; period2S: number };
  incomingFrequencyHz: number;
  incomingVoltageV: number;
  /** Incoming phase angle relative to the bus, degrees in (−180, 180]. */
  angleDeg: number;
  /** Governor speed reference, Hz, moved by raise/lower. */
  speedReferenceHz: number;
  /** Regulator voltage reference, V, moved by raise/lower. */
  voltageReferenceV: number;
  /** Internal lags: actuator and engine power (pu), field voltage and internal EMF (pu). */
  actuatorPU: number;
  mechanicalPU: number;
  fieldPU: number;
  emfPU: number;
  /** Close command time, s (null before the command). */
  closeCommandAtS: number | null;
  /** Phase angle when the command was given, degrees (null before). */
  closeCommandAngleDeg: number | null;
  /** Plant set the exercise was built from (null: the standard set). */
  incomingSetId: string | null;
  contact: TrainerContact | null;
  /** Faults scripted into this exercise (absent: none). */
  faults?: TrainerFaults;
}

/** Request of `trainerStep`. */
export interface TrainerStepRequest {
  state: TrainerState;
  inputs: TrainerInputs;
  /** Wall time to advance, s (a frame is about 1/60 s; at most 0.25). */
  dtS: number;
}

/** Traces of the first seconds after contact. */
export interface TrainerTraces {
  tS: number[];
  /** Rotor angle of the incoming set against the bus, degrees. */
  angleDeg: number[];
  /** Stator current, pu of rated (rms envelope). */
  currentPU: number[];
  /** Electrical power delivered, pu of rated kVA (negative = motoring). */
  powerPU: number[];
  /** Shaft speed as electrical frequency, Hz. */
  speedHz: number[];
  /** Which model made them: the plant's simulator (all sets, full machine models) or the trainer's two-machine swing. */
  source: 'plant-simulator' | 'two-machine';
}

/** One line of the verdict table: a quantity against its limit. */
export interface TrainerCheck {
  quantity: string;
  unit: string;
  value: number;
  limit: number;
  /** Where the limit comes from. */
  source: string;
  within: boolean;
}

/** Request of `trainerClose`. */
export interface TrainerCloseRequest {
  state: TrainerState;
  /** The plant the exercise came from: the traces then come from its simulator. */
  plant?: Plant;
  /** Judge the attempt against these criteria too (an instructor's exercise). */
  pass?: TrainerPassCriteria;
}

/** Result of `trainerClose`. */
export interface TrainerVerdict {
  contact: TrainerContact;
  surgeCurrentPU: number;
  surgeCurrentA: number;
  peakCurrentA: number;
  torqueStepPU: number;
  torqueStepKNm: number;
  /** First-cycle peak air-gap torque with the stator's DC offset (see `ClosingSurge.peakTorquePU`), pu and kN·m. */
  peakTorquePU: number;
  peakTorqueKNm: number;
  /**
   * Machine limits: surge, torque step and first-cycle peak torque of a close at the edge of the machine
   * standard's window, and the peak current and power of the same model's swing after such a close.
   */
  machineLimits: { surgeCurrentPU: number; torqueStepPU: number; peakTorquePU: number; peakCurrentPU: number; peakPowerPU: number; source: string };
  checks: TrainerCheck[];
  insideWindow: boolean;
  withinMachineLimits: boolean;
  /** 0..100 */
  score: number;
  /** A short grade word: good, fair, rough, harmful. */
  grade: 'good' | 'fair' | 'rough' | 'harmful';
  /** Plain-language verdict, a few sentences. */
  verdict: string;
  /** Against the exercise's pass criteria, when the request gave them. */
  pass?: TrainerPassResult;
  /** A dead bus was energised: no synchronizing surge or swing (the checks are the dead-bus ones). */
  deadBusClose?: boolean;
  traces: TrainerTraces;
  /** Why the traces fell back to the two-machine model, when they did. */
  tracesNote: string | null;
  /** The log line of this attempt (time stamp filled by the caller). */
  attempt: Omit<TrainerAttempt, 'at'>;
}

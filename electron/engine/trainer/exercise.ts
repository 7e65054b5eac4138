/**
 * Starts a synchronizing exercise: the incoming set runs on its own at a seeded random
 * speed, voltage and phase angle, off the bus. The same seed and level always give the
 * same start, so a class can repeat an exercise or compare attempts. An instructor's
 * faults (`TrainerFaults`) change the start: a drifting bus, a dead bus, a voltage
 * mismatch, a wrong window shown to the trainee; a slow breaker acts at the close. The
 * seeded draws are made in the same order with or without faults.
 */
import type { TrainerFaults, TrainerStartRequest, TrainerState } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { DEFAULT_TRAINER_BUS, DEFAULT_TRAINER_MACHINE, DEFAULT_TRAINER_WINDOW, findLevel, TRAINER_LEVELS } from './levels';
import { trainerMachineFromPlant } from './from-plant';
import { governorDroopPU } from './live-model';
import { randomSign, seededRandom, uniform } from './random';

/**
 * The initial state of an exercise.
 * @throws InvalidInput when the level id is unknown.
 */
export function startExercise(request: TrainerStartRequest): TrainerState {
  const found = findLevel(request.levelId);
  if (!found) {
    const known = TRAINER_LEVELS.map((l) => `"${l.id}"`).join(', ');
    throw new InvalidInput(`levelId: unknown level "${request.levelId}"; choose one of ${known}.`);
  }
  const fromPlant = request.plant && request.incomingSetId ? trainerMachineFromPlant(request.plant, request.incomingSetId) : null;
  const machine = { ...(fromPlant?.machine ?? request.machine ?? DEFAULT_TRAINER_MACHINE) };
  const bus = { ...(fromPlant?.bus ?? request.bus ?? DEFAULT_TRAINER_BUS) };
  const referenceWindow = { ...(request.window ?? DEFAULT_TRAINER_WINDOW) };
  const faults = faultsOf(request.faults);
  const dead = faults.deadBus === true;
  // A dead bus does not drift; a drift fault replaces the level's.
  const busDriftHz = dead ? 0 : (faults.busDriftHz ?? found.busDriftHz);
  const level = { ...found, busDriftHz };
  const rand = seededRandom(request.seed);
  const fr = machine.ratedFrequencyHz;
  const vr = machine.ratedVoltageV;

  // The bus sits a little off rated, as a droop plant under load does.
  const liveBusFrequencyHz = fr + uniform(rand, -0.1, 0.1);
  const liveBusVoltageV = vr * (1 + uniform(rand, -0.02, 0.02));
  // The incoming set starts clearly off: 0.3–1.5 Hz and 2–8 % away, either side, any angle.
  const incomingFrequencyHz = liveBusFrequencyHz + randomSign(rand) * uniform(rand, 0.3, 1.5);
  const seededVoltageV = liveBusVoltageV * (1 + randomSign(rand) * uniform(rand, 0.02, 0.08));
  const incomingVoltageV = faults.voltageMismatchPct === undefined ? seededVoltageV : liveBusVoltageV * (1 + faults.voltageMismatchPct / 100);
  const angleDeg = uniform(rand, -180, 180);
  // A dead bus has no voltage; its frequency is taken as rated (the slip then reads the incoming set's distance from rated).
  const busFrequencyHz = dead ? fr : liveBusFrequencyHz;
  const busVoltageV = dead ? 0 : liveBusVoltageV;
  const drift = {
    phase1: uniform(rand, 0, 2 * Math.PI),
    phase2: uniform(rand, 0, 2 * Math.PI),
    period1S: uniform(rand, 20, 35),
    period2S: uniform(rand, 7, 12),
  };

  const speedPU = incomingFrequencyHz / fr;
  // Running light: the engine supplies only the damping (friction and windage) power.
  const mechanicalPU = machine.dampingPU * (speedPU - 1);
  const emfPU = incomingVoltageV / vr;
  return {
    seed: request.seed,
    levelId: level.id,
    level: { ...level },
    machine,
    bus,
    // A wrong-window fault shows the trainee that window; the close is still graded to the reference window.
    window: level.mustSetWindow ? null : { ...(faults.wrongWindow ?? referenceWindow) },
    referenceWindow,
    phase: 'running',
    tS: 0,
    busFrequencyHz,
    busVoltageV,
    busBaseFrequencyHz: busFrequencyHz,
    drift,
    incomingFrequencyHz,
    incomingVoltageV,
    angleDeg,
    speedReferenceHz: incomingFrequencyHz + mechanicalPU * governorDroopPU(machine) * fr,
    voltageReferenceV: incomingVoltageV,
    actuatorPU: mechanicalPU,
    mechanicalPU,
    fieldPU: emfPU,
    emfPU,
    closeCommandAtS: null,
    closeCommandAngleDeg: null,
    incomingSetId: fromPlant ? (request.incomingSetId ?? null) : null,
    contact: null,
    ...(Object.keys(faults).length ? { faults } : {}),
  };
}

/** A copy of the faults that are actually set (zero slow-down and absent fields dropped). */
function faultsOf(f: TrainerFaults | undefined): TrainerFaults {
  const out: TrainerFaults = {};
  if (!f) return out;
  if (f.breakerSlowMs !== undefined && f.breakerSlowMs > 0) out.breakerSlowMs = f.breakerSlowMs;
  if (f.wrongWindow) out.wrongWindow = { ...f.wrongWindow };
  if (f.busDriftHz !== undefined) out.busDriftHz = f.busDriftHz;
  if (f.deadBus) out.deadBus = true;
  if (f.voltageMismatchPct !== undefined) out.voltageMismatchPct = f.voltageMismatchPct;
  return out;
}

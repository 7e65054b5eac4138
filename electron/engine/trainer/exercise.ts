/**
 * Starts a synchronizing exercise: the incoming set runs on its own at a seeded random
 * speed, voltage and phase angle, off the bus. The same seed and level always give the
 * same start, so a class can repeat an exercise or compare attempts.
 */
import type { TrainerStartRequest, TrainerState } from '../../../shared-types';
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
  const level = findLevel(request.levelId);
  if (!level) {
    const known = TRAINER_LEVELS.map((l) => `"${l.id}"`).join(', ');
    throw new InvalidInput(`levelId: unknown level "${request.levelId}"; choose one of ${known}.`);
  }
  const fromPlant = request.plant && request.incomingSetId ? trainerMachineFromPlant(request.plant, request.incomingSetId) : null;
  const machine = { ...(fromPlant?.machine ?? request.machine ?? DEFAULT_TRAINER_MACHINE) };
  const bus = { ...(fromPlant?.bus ?? request.bus ?? DEFAULT_TRAINER_BUS) };
  const referenceWindow = { ...(request.window ?? DEFAULT_TRAINER_WINDOW) };
  const rand = seededRandom(request.seed);
  const fr = machine.ratedFrequencyHz;
  const vr = machine.ratedVoltageV;

  // The bus sits a little off rated, as a droop plant under load does.
  const busFrequencyHz = fr + uniform(rand, -0.1, 0.1);
  const busVoltageV = vr * (1 + uniform(rand, -0.02, 0.02));
  // The incoming set starts clearly off: 0.3–1.5 Hz and 2–8 % away, either side, any angle.
  const incomingFrequencyHz = busFrequencyHz + randomSign(rand) * uniform(rand, 0.3, 1.5);
  const incomingVoltageV = busVoltageV * (1 + randomSign(rand) * uniform(rand, 0.02, 0.08));
  const angleDeg = uniform(rand, -180, 180);
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
    window: level.mustSetWindow ? null : { ...referenceWindow },
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
  };
}

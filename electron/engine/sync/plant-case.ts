/** Filling a sync-check case from a plant: the incoming set's machine data and the running bus's state. */
import type { Plant, SyncCase } from '../../../shared-types';
import { InvalidInput } from '../errors';

/**
 * Machine data of plant set `setId` as a case's incoming fields (`ratedKVA`, `xddpPU` on its own base,
 * `inertiaS`, `poles`).
 * @throws InvalidInput naming the plant's set ids when `setId` is unknown.
 */
export function incomingFromSet(plant: Plant, setId: string): Pick<SyncCase['incoming'], 'ratedKVA' | 'xddpPU' | 'inertiaS' | 'poles'> {
  const set = plant.sets.find((s) => s.id === setId);
  if (!set) throw new InvalidInput(`incomingSetId: "${setId}" is not a set of the plant (sets: ${plant.sets.map((s) => s.id).join(', ')}).`);
  return { ratedKVA: set.ratedKVA, xddpPU: set.machine.xddpPU, inertiaS: set.machine.inertiaS, poles: set.poles };
}

/**
 * The bus a plant presents to set `setId` when nothing else is known: rated frequency and voltage when another
 * set is online, else a dead bus (0 Hz, 0 V).
 */
export function defaultPlantBus(plant: Plant, setId: string): SyncCase['bus'] {
  const running = plant.sets.some((s) => s.online && s.id !== setId);
  return running ? { frequencyHz: plant.ratedFrequencyHz, voltageV: plant.ratedVoltageV, angleDeg: 0 } : { frequencyHz: 0, voltageV: 0, angleDeg: 0 };
}

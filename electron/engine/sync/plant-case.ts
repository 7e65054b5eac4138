/** Filling a sync-check case from a plant: the incoming set's machine data and the running bus's state. */
import type { Plant, SyncCase } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { solveSharing } from '../sharing';

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
 * The bus a plant presents to set `setId` when the case gives none: the plant's own operating point with that set
 * off line (its steady state solved with the other online sets carrying the connected loads), or a dead bus
 * (0 Hz, 0 V) when no other set is online. `note` says which, in words.
 * @throws NoSteadyState when the running sets have no operating point for the loads.
 */
export function plantBus(plant: Plant, setId: string): { bus: SyncCase['bus']; note: string } {
  const running = plant.sets.filter((s) => s.online && s.id !== setId);
  if (running.length === 0) return { bus: { frequencyHz: 0, voltageV: 0, angleDeg: 0 }, note: `dead bus: no set other than ${setId} is online` };
  const offLine: Plant = { ...plant, sets: plant.sets.map((s) => (s.id === setId ? { ...s, online: false } : s)) };
  const r = solveSharing(offLine);
  return {
    bus: { frequencyHz: r.bus.frequencyHz, voltageV: r.bus.voltageV, angleDeg: 0 },
    note: `the plant's steady state with ${setId} off line (${running.map((s) => s.id).join(', ')} carrying the connected loads)`,
  };
}

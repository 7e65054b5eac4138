/** Builds the trainer's machine and bus from a plant: one set incoming, the other online sets as the bus. */
import type { Plant, TrainerBus, TrainerMachine } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { fieldCeiling } from '../simulation/excitation';

/**
 * The incoming machine `setId` of `plant` and the running bus made of its other online sets
 * (their X''d in parallel, their inertia summed on their kVA).
 * @throws InvalidInput when the set is unknown or no other set is online to form a bus.
 */
export function trainerMachineFromPlant(plant: Plant, setId: string): { machine: TrainerMachine; bus: TrainerBus } {
  const set = plant.sets.find((s) => s.id === setId);
  if (!set) throw new InvalidInput(`incomingSetId: no set "${setId}" in the plant.`);
  const others = plant.sets.filter((s) => s.id !== setId && s.online);
  if (others.length === 0) throw new InvalidInput(`incomingSetId: no other set of the plant is online to form the running bus for "${setId}".`);
  const busKVA = others.reduce((a, s) => a + s.ratedKVA, 0);
  // Parallel subtransient reactances, each referred to the bus base: 1/X = Σ (S_i / S_bus) / X''d_i.
  const busAdmittance = others.reduce((a, s) => a + s.ratedKVA / busKVA / s.machine.xddpPU, 0);
  const busInertiaS = others.reduce((a, s) => a + s.machine.inertiaS * s.ratedKVA, 0) / busKVA;
  return {
    machine: {
      label: `${set.id} ${set.name}`.trim(),
      ratedKVA: set.ratedKVA,
      ratedKW: set.ratedKW,
      ratedVoltageV: plant.ratedVoltageV,
      ratedFrequencyHz: plant.ratedFrequencyHz,
      poles: set.poles,
      xddpPU: set.machine.xddpPU,
      xdpPU: set.machine.xdpPU,
      tdopS: set.machine.tdopS,
      inertiaS: set.machine.inertiaS,
      dampingPU: set.machine.dampingPU,
      raPU: set.machine.raPU,
      droopPct: set.governor.droopPct,
      actuatorLagS: set.governor.actuatorLagS,
      engineLagS: set.governor.engineLagS,
      regulatorGainPU: set.regulator.gainPU,
      exciterLagS: set.regulator.exciterLagS,
      ceilingPU: fieldCeiling(set).ceilingPU,
    },
    bus: { ratedKVA: busKVA, xPU: 1 / busAdmittance, inertiaS: busInertiaS },
  };
}

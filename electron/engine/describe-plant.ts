import type { Plant, PlantDescription, SetDescription } from '../../shared-types';
import { kVARBase, ratedCurrentA, ratedSpeedRpm } from '../../shared-types';
import { setCapability } from './capability';
import { setCharacteristics } from './characteristics';
import { settingWarnings } from './setting-checks';
import { fieldCeiling } from './simulation/excitation';

/** Rated figures of every set and the plant totals. Pure; does not touch `plant`. */
export function describePlant(plant: Plant): PlantDescription {
  const sets: SetDescription[] = plant.sets.map((s) => {
    const fc = fieldCeiling(s);
    return {
      id: s.id,
      name: s.name,
      online: s.online,
      ratedSpeedRpm: ratedSpeedRpm(plant.ratedFrequencyHz, s.poles),
      ratedCurrentA: ratedCurrentA(s.ratedKVA, plant.ratedVoltageV),
      ratedKW: s.ratedKW,
      ratedKVA: s.ratedKVA,
      kVARBase: kVARBase(s.ratedKVA, s.ratedPF),
      capability: setCapability(s),
      characteristics: setCharacteristics(s, plant),
      ratedFieldPU: fc.ratedFieldPU,
      fieldCeilingPU: fc.ceilingPU,
      fieldCeilingDerived: fc.derived,
      fieldCeilingReason: fc.reason,
      fieldCeilingWarning: fc.warning,
    };
  });
  const online = plant.sets.filter((s) => s.online);
  const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
  const loads = plant.loads.filter((l) => l.online);
  return {
    name: plant.name,
    ratedFrequencyHz: plant.ratedFrequencyHz,
    ratedVoltageV: plant.ratedVoltageV,
    sets,
    onlineKW: sum(online.map((s) => s.ratedKW)),
    onlineKVA: sum(online.map((s) => s.ratedKVA)),
    installedKW: sum(plant.sets.map((s) => s.ratedKW)),
    installedKVA: sum(plant.sets.map((s) => s.ratedKVA)),
    loadKW: sum(loads.map((l) => l.kW)),
    loadKVAR: sum(loads.map((l) => l.kVAR)),
    settingWarnings: settingWarnings(plant),
  };
}

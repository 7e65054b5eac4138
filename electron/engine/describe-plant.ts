import type { Plant, PlantDescription, SetDescription } from '../../shared-types';
import { setCapability } from './capability';
import { settingWarnings } from './setting-checks';
import { fieldCeiling } from './simulation/excitation';

/** Rated speed `n = 120 f / poles`, rpm. */
export function ratedSpeedRpm(frequencyHz: number, poles: number): number {
  return (120 * frequencyHz) / poles;
}

/** Rated line current of a three-phase set `I = S / (sqrt(3) V)`, A (kVA, V line-to-line). */
export function ratedCurrentA(ratedKVA: number, voltageV: number): number {
  return (ratedKVA * 1000) / (Math.sqrt(3) * voltageV);
}

/** Reactive base `Qbase = S sqrt(1 - pf^2)`, kVAR: the kVAR at rated current and rated PF. */
export function kVARBase(ratedKVA: number, ratedPF: number): number {
  return ratedKVA * Math.sqrt(1 - ratedPF * ratedPF);
}

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

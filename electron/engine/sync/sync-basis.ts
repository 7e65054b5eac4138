/**
 * Per-unit bases of a sync-check case: base voltage, the incoming set's rated current, rated speed and torque
 * base. Everything per-unit in the synchronizing engine is on the incoming set's kVA and this base voltage.
 */
import type { SyncCase } from '../../../shared-types';
import { ratedCurrentA, ratedSpeedRpm as ratedSpeedOf } from '../../../shared-types';
import { InvalidInput } from '../errors';

/** The bases of one case. */
export interface SyncBasis {
  /** Base line-to-line voltage, V. */
  voltageV: number;
  ratedFrequencyHz: number;
  poles: number;
  /** Incoming set's rated kVA (the power base). */
  incomingKVA: number;
  /** Incoming set's rated current S / (√3 V), A. */
  currentA: number;
  /** Rated speed 120 f / poles, rpm. */
  ratedSpeedRpm: number;
  /** Torque base: rated kVA at rated mechanical speed, S / ω_m, kN·m. */
  torqueKNm: number;
}

/** 50 or 60 Hz, whichever is nearer `frequencyHz`. */
function nearestSystemFrequencyHz(frequencyHz: number): number {
  return Math.abs(frequencyHz - 60) < Math.abs(frequencyHz - 50) ? 60 : 50;
}

/**
 * Bases for `c`. Base voltage: the plant's rated voltage, else `ratedVoltageV`, else the bus voltage (the
 * incoming voltage when the bus is dead). Rated frequency: the plant's, else `ratedFrequencyHz`, else 50 or 60
 * nearest the bus (or incoming) frequency. Poles: `incoming.poles`, else the plant set's, else 4.
 * @throws InvalidInput when no base voltage can be found (both sides at 0 V and no rated voltage).
 */
export function syncBasis(c: SyncCase): SyncBasis {
  const set = c.plant && c.incomingSetId ? c.plant.sets.find((s) => s.id === c.incomingSetId) : undefined;
  const voltageV = c.plant?.ratedVoltageV ?? c.ratedVoltageV ?? (c.bus.voltageV > 0 ? c.bus.voltageV : c.incoming.voltageV);
  if (!(voltageV > 0)) {
    throw new InvalidInput('ratedVoltageV: is required when both the bus and the incoming set are at 0 V (there is no voltage to take as base).');
  }
  const fRef = c.bus.frequencyHz > 0 ? c.bus.frequencyHz : c.incoming.frequencyHz;
  const ratedFrequencyHz = c.plant?.ratedFrequencyHz ?? c.ratedFrequencyHz ?? nearestSystemFrequencyHz(fRef);
  const poles = c.incoming.poles ?? set?.poles ?? 4;
  const incomingKVA = c.incoming.ratedKVA;
  const currentA = ratedCurrentA(incomingKVA, voltageV);
  const ratedSpeedRpm = ratedSpeedOf(ratedFrequencyHz, poles);
  const omegaMechRadS = (2 * Math.PI * ratedSpeedRpm) / 60;
  // T_base = S_base / ω_m (N·m from VA and rad/s), reported in kN·m.
  const torqueKNm = (incomingKVA * 1000) / omegaMechRadS / 1000;
  return { voltageV, ratedFrequencyHz, poles, incomingKVA, currentA, ratedSpeedRpm, torqueKNm };
}

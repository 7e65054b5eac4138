/**
 * Closed-form stress of a synchronizing close on the incoming set: subtransient surge
 * current, its peak, and the synchronizing power and torque step (DESIGN.md,
 * "Sync-check case and closing surge").
 */
import type { TrainerBus, TrainerMachine } from '../../../shared-types';

/** Stress of one close, per unit on the incoming set's base. */
export interface ContactStress {
  /** |ΔV| across the breaker, pu of rated voltage. */
  deltaVPU: number;
  surgeCurrentPU: number;
  surgeCurrentA: number;
  peakFactor: number;
  peakCurrentA: number;
  powerStepPU: number;
  torqueStepPU: number;
  torqueStepKNm: number;
}

/** Running bus reactance referred to the incoming set's base, pu: X_bus · S_incoming / S_bus. */
export function busReactanceOnMachineBasePU(machine: TrainerMachine, bus: TrainerBus): number {
  return (bus.xPU * machine.ratedKVA) / bus.ratedKVA;
}

/**
 * The stress of closing at `angleDeg` (incoming leading is positive) with the incoming
 * voltage `voltageRatio` times the bus, the bus at `busVoltagePU` of rated and `speedPU`
 * the incoming speed.
 *
 * - |ΔV| = V_bus sqrt(1 + k² − 2 k cos θ) (law of cosines on the two phasors);
 * - I'' = |ΔV| / (X''d + X_bus) (symmetrical subtransient current);
 * - peak i_p = κ √2 I'' with κ = 1.02 + 0.98 e^(−3 R/X) (IEC 60909-0:2016, eq. 55);
 * - P = k V_bus² sin θ / (X''d + X_bus) (synchronizing power, Kundur 1994 eq. 6.2 form), torque T = P / ω.
 */
export function contactStress(
  machine: TrainerMachine,
  bus: TrainerBus,
  angleDeg: number,
  voltageRatio: number,
  speedPU = 1,
  busVoltagePU = 1,
): ContactStress {
  const rad = (angleDeg * Math.PI) / 180;
  const k = voltageRatio;
  const xTotal = machine.xddpPU + busReactanceOnMachineBasePU(machine, bus);
  const deltaVPU = busVoltagePU * Math.sqrt(Math.max(0, 1 + k * k - 2 * k * Math.cos(rad)));
  const surgeCurrentPU = deltaVPU / xTotal;
  const ratedCurrentA = (machine.ratedKVA * 1000) / (Math.sqrt(3) * machine.ratedVoltageV);
  const rOverX = machine.raPU / xTotal;
  const peakFactor = 1.02 + 0.98 * Math.exp(-3 * rOverX);
  const powerStepPU = (k * busVoltagePU * busVoltagePU * Math.sin(rad)) / xTotal;
  const torqueStepPU = powerStepPU / speedPU;
  // Base torque = rated kVA / mechanical speed; mechanical speed = 2π f / (poles / 2).
  const omegaMechRad = (2 * Math.PI * machine.ratedFrequencyHz) / (machine.poles / 2);
  return {
    deltaVPU,
    surgeCurrentPU,
    surgeCurrentA: surgeCurrentPU * ratedCurrentA,
    peakFactor,
    peakCurrentA: peakFactor * Math.SQRT2 * surgeCurrentPU * ratedCurrentA,
    powerStepPU,
    torqueStepPU,
    torqueStepKNm: (torqueStepPU * machine.ratedKVA) / omegaMechRad,
  };
}

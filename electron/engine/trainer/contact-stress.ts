/**
 * Closed-form stress of a synchronizing close on the trainer's incoming set: subtransient
 * surge current, its peak, the synchronizing power and torque step and the first-cycle peak
 * air-gap torque, computed by the synchronizing engine's `closingSurge` on the trainer's
 * circuit (incoming X''d plus the running bus).
 */
import type { TrainerBus, TrainerMachine } from '../../../shared-types';
import { ratedCurrentA } from '../../../shared-types';
import { closingSurge } from '../sync/closing-surge';

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
  /** First-cycle peak air-gap torque with the DC offset, pu and kN·m (signed like the step). */
  peakTorquePU: number;
  peakTorqueKNm: number;
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
 * - P = k V_bus² sin θ / (X''d + X_bus) (synchronizing power, Kundur 1994 eq. 6.2 form), torque T = P / ω;
 * - first-cycle peak torque (E1 E2 / X)(sin θ + 2 sin(θ/2)) / ω (see `peakTorqueFactor`).
 */
export function contactStress(machine: TrainerMachine, bus: TrainerBus, angleDeg: number, voltageRatio: number, speedPU = 1, busVoltagePU = 1): ContactStress {
  const loopXPU = machine.xddpPU + busReactanceOnMachineBasePU(machine, bus);
  // Base torque = rated kVA / mechanical speed; mechanical speed = 2π f / (poles / 2).
  const omegaMechRad = (2 * Math.PI * machine.ratedFrequencyHz) / (machine.poles / 2);
  // The synchronizing engine's closing-surge formulas, on the trainer's circuit.
  const r = closingSurge(
    {
      busVoltagePU,
      incomingVoltagePU: busVoltagePU * voltageRatio,
      loopXPU,
      rOverX: machine.raPU / loopXPU,
      baseCurrentA: ratedCurrentA(machine.ratedKVA, machine.ratedVoltageV),
      incomingKVA: machine.ratedKVA,
      torqueBaseKNm: machine.ratedKVA / omegaMechRad,
      speedPU,
    },
    angleDeg,
  );
  return {
    deltaVPU: r.deltaVPU,
    surgeCurrentPU: r.surgeCurrentPU,
    surgeCurrentA: r.surgeCurrentA,
    peakFactor: r.peakFactor,
    peakCurrentA: r.peakCurrentA,
    powerStepPU: r.powerStepPU,
    torqueStepPU: r.torqueStepPU,
    torqueStepKNm: r.torqueStepKNm,
    peakTorquePU: r.peakTorquePU,
    peakTorqueKNm: r.peakTorqueKNm,
  };
}

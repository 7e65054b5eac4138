/**
 * Closing surge for a breaker closing at a given phase angle: the subtransient symmetrical current, its peak
 * with the IEC 60909 peak factor, the synchronizing power and torque step on the incoming shaft, and the
 * first-cycle peak of the air-gap torque with the stator's DC offset.
 *
 * Sources: the peak factor κ, IEC 60909-0:2016 (eq. 55); the synchronizing power (E1 E2 / X) sin θ, Kundur, Power
 * System Stability and Control (1994), eq. 6.2 form; the first-cycle torque of an out-of-phase close with R
 * neglected, T(t) = (E1 E2 / X)[sin θ − sin(ωt + θ) + sin ωt], the classical result for out-of-phase
 * synchronizing treated in the same book's chapter on subsynchronous oscillations and torsional effects
 * (chapter 15; location from memory).
 */
import type { BusEquivalent, ClosingSurge, SyncCase } from '../../../shared-types';
import { busEquivalent, incomingBranch } from './bus-equivalent';
import { deltaVMagnitude, wrapAngleDeg } from './phasor';
import { syncBasis } from './sync-basis';
import type { SyncBasis } from './sync-basis';

/** The closing loop: two EMFs behind the incoming X''d and the bus equivalent, all on the incoming set's base. */
export interface SurgeCircuit {
  /** Bus and incoming voltage, pu of the base voltage. */
  busVoltagePU: number;
  incomingVoltagePU: number;
  /** Loop reactance X''d incoming + X bus equivalent, pu on the incoming set's kVA base. */
  loopXPU: number;
  /** R/X of the loop, for the peak factor. */
  rOverX: number;
  /** Incoming set's rated current, A; its kVA; its torque base, kN·m. */
  baseCurrentA: number;
  incomingKVA: number;
  torqueBaseKNm: number;
  /** Incoming speed, pu of rated (f_incoming / f_rated): torque = power / speed. */
  speedPU: number;
}

/**
 * IEC 60909-0 peak factor `κ = 1.02 + 0.98 e^(−3 R/X)`: 2.0 for a purely reactive loop, 1.02 for a resistive one.
 */
export function iecPeakFactor(rOverX: number): number {
  return 1.02 + 0.98 * Math.exp(-3 * rOverX);
}

/**
 * Symmetrical subtransient current `|ΔV| / X`, pu of the incoming set's rated current (R is left out of the
 * magnitude as in the usual hand formula; it lowers I'' by under 1.2 % at R/X ≤ 0.15, and enters through κ).
 * Allocation-free for map loops.
 */
export function surgeCurrentPU(circuit: SurgeCircuit, angleAtContactDeg: number): number {
  return deltaVMagnitude(circuit.busVoltagePU, circuit.incomingVoltagePU, angleAtContactDeg) / circuit.loopXPU;
}

/** Synchronizing power step `(E1 E2 / X) sin θ`, pu on the incoming set's kVA; positive when the incoming set leads. */
export function powerStepPU(circuit: SurgeCircuit, angleAtContactDeg: number): number {
  return ((circuit.busVoltagePU * circuit.incomingVoltagePU) / circuit.loopXPU) * Math.sin((angleAtContactDeg * Math.PI) / 180);
}

/** Torque step on the incoming shaft, pu of its torque base: power step / speed (pu). Positive brakes the set. */
export function torqueStepPU(circuit: SurgeCircuit, angleAtContactDeg: number): number {
  return powerStepPU(circuit, angleAtContactDeg) / circuit.speedPU;
}

/**
 * First-cycle peak of the air-gap torque of a close at `angleDeg`, as a multiple of E1 E2 / X.
 *
 * With R neglected the stator's DC offset adds a torque at mains frequency to the synchronizing torque:
 * T(t) = (E1 E2 / X)[sin θ − sin(ωt + θ) + sin ωt]. dT/dt = 0 where cos ωt = cos(ωt + θ), i.e. ωt = π − θ/2,
 * which gives the peak (E1 E2 / X)(sin θ + 2 sin(θ/2)) = step × (1 + 1 / cos(θ/2)): twice the step at small
 * angles, three times at 120° (where the peak itself is largest, 3√3/2 ≈ 2.60 E1 E2 / X: d/dθ = 0 at
 * cos(θ/2) = 1/2), and 2 E1 E2 / X at 180°, where the step is zero. Odd in θ (θ wrapped to (−180°, 180°]), so its
 * sign is the step's.
 */
export function peakTorqueFactor(angleDeg: number): number {
  const th = (wrapAngleDeg(angleDeg) * Math.PI) / 180;
  return Math.sin(th) + 2 * Math.sin(th / 2);
}

/** First-cycle peak air-gap torque on the incoming shaft, pu of its torque base: (E1 E2 / X)(sin θ + 2 sin(θ/2)) / speed. */
export function peakTorquePU(circuit: SurgeCircuit, angleAtContactDeg: number): number {
  return (((circuit.busVoltagePU * circuit.incomingVoltagePU) / circuit.loopXPU) * peakTorqueFactor(angleAtContactDeg)) / circuit.speedPU;
}

/** Surge current, peak, power and torque step for contact at `angleAtContactDeg` (degrees, incoming leading positive). */
export function closingSurge(circuit: SurgeCircuit, angleAtContactDeg: number): ClosingSurge {
  const deltaVPU = deltaVMagnitude(circuit.busVoltagePU, circuit.incomingVoltagePU, angleAtContactDeg);
  const iPU = deltaVPU / circuit.loopXPU;
  const kappa = iecPeakFactor(circuit.rOverX);
  const peakPU = kappa * Math.SQRT2 * iPU;
  const pPU = powerStepPU(circuit, angleAtContactDeg);
  const tPU = pPU / circuit.speedPU;
  const peakTPU = peakTorquePU(circuit, angleAtContactDeg);
  return {
    angleAtContactDeg,
    deltaVPU,
    surgeCurrentPU: iPU,
    surgeCurrentA: iPU * circuit.baseCurrentA,
    peakFactor: kappa,
    rOverX: circuit.rOverX,
    peakCurrentPU: peakPU,
    peakCurrentA: peakPU * circuit.baseCurrentA,
    powerStepPU: pPU,
    powerStepKW: pPU * circuit.incomingKVA,
    torqueStepPU: tPU,
    torqueStepKNm: tPU * circuit.torqueBaseKNm,
    peakTorquePU: peakTPU,
    peakTorqueKNm: peakTPU * circuit.torqueBaseKNm,
  };
}

/** No synchronizing surge (closing onto a dead side: there is no second source). */
export function noSurge(circuit: SurgeCircuit, angleAtContactDeg: number): ClosingSurge {
  return {
    angleAtContactDeg,
    deltaVPU: 0,
    surgeCurrentPU: 0,
    surgeCurrentA: 0,
    peakFactor: iecPeakFactor(circuit.rOverX),
    rOverX: circuit.rOverX,
    peakCurrentPU: 0,
    peakCurrentA: 0,
    powerStepPU: 0,
    powerStepKW: 0,
    torqueStepPU: 0,
    torqueStepKNm: 0,
    peakTorquePU: 0,
    peakTorqueKNm: 0,
  };
}

/**
 * The closing loop of a case: voltages on the base voltage, loop X = incoming branch + bus equivalent, R/X from
 * `incoming.rOverX` when given, else from the branches (IEC 60909 fictitious generator resistance plus feeders).
 * Pass `basis` and `bus` when already computed.
 * @throws InvalidInput as `syncBasis` and `busEquivalent` do.
 */
export function surgeCircuit(c: SyncCase, basis: SyncBasis = syncBasis(c), bus: BusEquivalent = busEquivalent(c, basis)): SurgeCircuit {
  const inc = incomingBranch(c, basis);
  const loopXPU = inc.xPU + bus.xPU;
  const rOverX = c.incoming.rOverX ?? (inc.rPU + bus.rPU) / loopXPU;
  return {
    busVoltagePU: c.bus.voltageV / basis.voltageV,
    incomingVoltagePU: c.incoming.voltageV / basis.voltageV,
    loopXPU,
    rOverX,
    baseCurrentA: basis.currentA,
    incomingKVA: basis.incomingKVA,
    torqueBaseKNm: basis.torqueKNm,
    speedPU: c.incoming.frequencyHz > 0 ? c.incoming.frequencyHz / basis.ratedFrequencyHz : 1,
  };
}

/** The surge for a case closing with contact at `angleAtContactDeg` (the trainer's one-call form). */
export function closingSurgeForCase(c: SyncCase, angleAtContactDeg: number): ClosingSurge {
  return closingSurge(surgeCircuit(c), angleAtContactDeg);
}

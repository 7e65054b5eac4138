/**
 * The operating point of a plant without feeders: every set's terminals are the bus.
 * Active and reactive closed forms are coupled only through voltage-dependent loads
 * (P depends on V), frequency-dependent kVAR and power-factor sets (Q depends on P): a short fixed-point loop
 * settles that coupling; with the voltage held by a set it finishes in one pass.
 */
import { Diverged } from '../errors';
import { solveActive } from './active-sharing';
import { solveReactive } from './reactive-sharing';
import type { SharingModel } from './sharing-model';
import type { OperatingPoint } from './sharing-result';

const MAX_PASSES = 100;

/**
 * Solves `m` with the closed forms (feeder impedances ignored).
 * @throws NoSteadyState from the active or reactive solve; Diverged if the coupling loop does not settle.
 */
export function solveClosedForm(m: SharingModel): OperatingPoint {
  const p = new Float64Array(m.n);
  const q = new Float64Array(m.n);
  let v = m.voltageUnit.length > 0 ? m.voltageSetpointV : m.ratedVoltageV;
  let loadKVAR: number;
  let passes = 0;
  for (;;) {
    if (passes === MAX_PASSES)
      throw new Diverged(`The sharing solve did not settle in ${MAX_PASSES} passes (bus voltage still moving). Check for unusual load or setpoint values.`);
    passes++;
    const act = solveActive(m, v, p);
    const r = solveReactive(m, p, q, act.frequencyHz);
    loadKVAR = r.loadKVAR;
    const dv = Math.abs(r.voltageV - v);
    v = r.voltageV;
    if (dv <= 1e-13 * m.ratedVoltageV) break;
  }
  // Finish the active side at the final voltage (the loop's last pass used the previous one).
  const a = solveActive(m, v, p);
  const zeros = new Float64Array(m.n);
  return {
    frequencyHz: a.frequencyHz,
    busVoltageV: v,
    kW: p,
    kVAR: q,
    terminalV: new Float64Array(m.n).fill(v),
    lossKW: zeros,
    lossKVAR: zeros,
    loadKW: a.loadKW,
    loadKVAR,
    isoState: a.isoState,
    method: 'closed-form',
    iterations: passes,
  };
}

/**
 * Reactive-power sharing on a common bus without feeders (closed forms).
 *
 * Reactive droop: `V = V_nl − droop · V_rated · Q / Qbase`, so
 * `Q = Qbase (V_nl − V) / (droop · V_rated)` (reactive-droop definition, README "Definitions").
 * Power-factor control: `Q = P tan φ`. The voltage unit (one voltage-mode set, or the
 * cross-current group sharing in proportion to `ratedKVA`) holds its setpoint and takes
 * the remainder. Without a voltage unit the droop sets set the voltage: with loads of
 * constant power and constant impedance the balance is the quadratic
 * `c V² + A V − B = 0`, solved in the cancellation-free form `V = 2B / (A + √(A² + 4cB))`.
 */
import { NoSteadyState } from '../errors';
import { busLoadKVAR, busLoadKVARQuadratic } from './bus-loads';
import * as codes from './sharing-model';
import type { SharingModel } from './sharing-model';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const REG_DROOP = codes.REG_DROOP;
const REG_PF = codes.REG_PF;


/** kVAR of a reactive-droop set at terminal voltage `voltageV`. */
export function droopKVAR(m: SharingModel, i: number, voltageV: number): number {
  return m.slopeKVARPerV[i]! * (m.noLoadV[i]! - voltageV);
}

/**
 * Bus voltage and each set's kVAR (written to `q`) given each set's kW in `p`.
 * @throws NoSteadyState when the droop sets cannot meet the reactive load at any positive voltage.
 */
export function solveReactive(m: SharingModel, p: Float64Array, q: Float64Array): { voltageV: number; loadKVAR: number } {
  const vr = m.ratedVoltageV;
  let qPF = 0;
  for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_PF) qPF += (q[i] = p[i]! * m.tanPhi[i]!);

  if (m.voltageUnit.length > 0) {
    const v = m.voltageSetpointV;
    const loadKVAR = busLoadKVAR(m.loads, v, vr);
    let others = qPF;
    for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_DROOP) others += (q[i] = droopKVAR(m, i, v));
    const unitKVAR = loadKVAR - others;
    let kva = 0;
    for (const i of m.voltageUnit) kva += m.ratedKVA[i]!;
    for (const i of m.voltageUnit) q[i] = (unitKVAR * m.ratedKVA[i]!) / kva;
    return { voltageV: v, loadKVAR };
  }

  const { constant, perV2 } = busLoadKVARQuadratic(m.loads, vr);
  let a = 0;
  let b = qPF - constant;
  for (let i = 0; i < m.n; i++) {
    if (m.reg[i] !== REG_DROOP) continue;
    a += m.slopeKVARPerV[i]!;
    b += m.slopeKVARPerV[i]! * m.noLoadV[i]!;
  }
  const disc = a * a + 4 * perV2 * b;
  const v = disc >= 0 ? (2 * b) / (a + Math.sqrt(disc)) : NaN;
  if (!(v > 0) || !Number.isFinite(v)) {
    throw new NoSteadyState(
      `The reactive load (${Math.round(busLoadKVAR(m.loads, vr, vr))} kVAR at rated voltage) is more than the sets in reactive droop can supply at any voltage: the voltage would collapse. Raise the no-load voltages, add a set, or compensate the load.`,
    );
  }
  for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_DROOP) q[i] = droopKVAR(m, i, v);
  return { voltageV: v, loadKVAR: busLoadKVAR(m.loads, v, vr) };
}

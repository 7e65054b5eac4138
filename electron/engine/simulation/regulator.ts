/**
 * The voltage regulator and exciter: a PI regulator on terminal voltage feeding a
 * first-order exciter with a ceiling — a simplification of IEEE Std 421.5 type ST1A
 * (potential-source controlled rectifier): lead-lag (T_C = T_B = 0), rate feedback
 * (K_F = 0) and commutation (K_C = 0) left out, with integral action added so the
 * set sits exactly on its droop line in steady state, as engine-set AVRs do.
 *
 *   reference (pu of rated voltage)
 *     reactive droop:  V_ref = V_nl − droop · Q / Qbase         (Qbase = ratedKVA √(1 − ratedPF²))
 *     voltage:         V_ref = V_set
 *     cross-current:   V_ref = V_set − k (q − q̄), q = Q / ratedKVA, q̄ over the cross-current
 *                      sets on line, k = droop / (Qbase/ratedKVA) (the CT loop's burden); the
 *                      group's regulators compare V_ref with the group's ratedKVA-weighted mean
 *                      terminal voltage, so in steady state the mean sits on V_set and kVAR is
 *                      exactly in proportion to ratedKVA (the cross-current definition the
 *                      sharing solver uses, also with unequal feeders)
 *     power factor:    V_ref = V_set + trim,  T_pf d(trim)/dt = P tan φ − Q   (T_pf: `regulator.pfTrimS`)
 *   error e = V_ref − V_t;  u = K_A (e + z), T_I dz/dt = e;   T_E dE_fd/dt = u − E_fd   (T_I: `regulator.resetS`)
 *   0 ≤ u ≤ ceiling · (V_t when shunt-excited, else 1), or the over-excitation limit while it acts
 *   V/Hz roll-off: below the knee f_k the reference falls by the slope: V_ref − s (f_k − f)
 *
 * With shunt (self) excitation the ceiling follows terminal voltage (ST1A's V_t·V_Rmax),
 * so a set de-excited at start builds up from its residual voltage only if the loop
 * gain `ceilingPU` exceeds one, and not at all without residual magnetism.
 *
 * The derivatives are worked out in `controls.ts` (`controlDerivatives`), together with the governor's.
 */
import { OMEGA, VAR_TRIM } from './layout';
import { REG_CROSS, REG_DROOP, REG_VOLTAGE } from '../mode-codes';
import type { SimModel } from './sim-types';

/**
 * Under-frequency roll-off of the voltage reference, pu: below the knee the reference falls by
 * the slope per pu of speed (a V/Hz characteristic; 0 above the knee or with slope 0).
 */
export function rollOff(m: SimModel, i: number, speedPU: number): number {
  const below = m.vhzKneePU[i]! - speedPU;
  return below > 0 ? m.vhzSlopePU[i]! * below : 0;
}

/** Voltage reference of set `i`, pu, given its kW and kVAR (pu own base) and the cross-current mean q̄, after the V/Hz roll-off. */
export function voltageReference(m: SimModel, i: number, y: Float64Array, o: number, qOwn: number, qBarCross: number): number {
  return setpointReference(m, i, y, o, qOwn, qBarCross) - rollOff(m, i, y[o + OMEGA]!);
}

function setpointReference(m: SimModel, i: number, y: Float64Array, o: number, qOwn: number, qBarCross: number): number {
  const mode = m.regMode[i]!;
  if (mode === REG_DROOP) return m.noLoadVPU[i]! - m.regDroopPerQBase[i]! * qOwn;
  if (mode === REG_VOLTAGE) return m.setpointVPU[i]!;
  if (mode === REG_CROSS) {
    if (!m.online[i]) return m.setpointVPU[i]!;
    return m.setpointVPU[i]! - crossCurrentGain(m, i) * (qOwn - qBarCross);
  }
  return m.setpointVPU[i]! + y[o + VAR_TRIM]!;
}

/** Gain of the cross-current loop, pu voltage per pu (kVA base) of kVAR off the mean. */
export function crossCurrentGain(m: SimModel, i: number): number {
  return Math.max(m.regDroop[i]!, 0.01) / m.qBasePU[i]!;
}

/** Upper limit of the regulator output, pu: the ceiling, scaled by terminal voltage when shunt-excited. */
export function fieldCeiling(m: SimModel, i: number, vt: number): number {
  const c = m.shunt[i] ? m.ceilingPU[i]! * vt : m.ceilingPU[i]!;
  // The over-excitation limiter, while it acts, holds the field at its limit.
  return m.oelActive[i] && m.oelPU[i]! < c ? m.oelPU[i]! : c;
}

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
 */
import { AVR_INT, EFD, OMEGA, STATES_PER_SET, VAR_TRIM } from './layout';
import { REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from '../mode-codes';
import type { Outputs, SimModel } from './sim-types';
import {
  O_P_OWN,
  O_Q_OWN,
  O_VT,
  O_V_SENSED,
  P_CEILING_PU,
  P_CROSS_GAIN,
  P_GAIN_PU,
  P_INV_AVR_RESET_S,
  P_INV_EXCITER_S,
  P_INV_PF_TRIM_S,
  P_NO_LOAD_VPU,
  P_OEL_ACTIVE,
  P_OEL_PU,
  P_ONLINE,
  P_REG_DROOP_PER_QBASE,
  P_REG_MODE,
  P_SETPOINT_VPU,
  P_SHUNT,
  P_SHUTDOWN,
  P_TAN_PHI,
  P_VHZ_KNEE_PU,
  P_VHZ_SLOPE_PU,
} from './par-layout';

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

/**
 * Writes the regulator derivatives of every set, reading from `out` each set's terminal
 * voltage, the voltage its regulator senses (its own, or the cross-current group's mean), its
 * kW/kVAR at the terminals (pu own base) and the cross-current mean. One loop over the plant
 * reading `m.par` and `out.buf` at constant column offsets: the reference, ceiling and roll-off
 * are those of `voltageReference` and `fieldCeiling` above, written out so nothing is called per set.
 */
export function regulatorDerivatives(m: SimModel, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const n = m.n;
  const P = m.par;
  const O = out.buf;
  // Column offsets, in locals once per call.
  const oPOwn = O_P_OWN * n;
  const oQOwn = O_Q_OWN * n;
  const oVt = O_VT * n;
  const oVSensed = O_V_SENSED * n;
  const pCeilingPu = P_CEILING_PU * n;
  const pCrossGain = P_CROSS_GAIN * n;
  const pGainPu = P_GAIN_PU * n;
  const pInvAvrResetS = P_INV_AVR_RESET_S * n;
  const pInvExciterS = P_INV_EXCITER_S * n;
  const pInvPfTrimS = P_INV_PF_TRIM_S * n;
  const pNoLoadVpu = P_NO_LOAD_VPU * n;
  const pOelActive = P_OEL_ACTIVE * n;
  const pOelPu = P_OEL_PU * n;
  const pOnline = P_ONLINE * n;
  const pRegDroopPerQBase = P_REG_DROOP_PER_QBASE * n;
  const pRegMode = P_REG_MODE * n;
  const pSetpointVpu = P_SETPOINT_VPU * n;
  const pShunt = P_SHUNT * n;
  const pShutdown = P_SHUTDOWN * n;
  const pTanPhi = P_TAN_PHI * n;
  const pVhzKneePu = P_VHZ_KNEE_PU * n;
  const pVhzSlopePu = P_VHZ_SLOPE_PU * n;
  const qBarCross = out.qBarCross;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    let u = 0;
    let dz = 0;
    let dTrim = 0;
    if (!P[pShutdown + i]) {
      const qOwn = O[oQOwn + i]!;
      const mode = P[pRegMode + i]!;
      let ref: number;
      if (mode === REG_DROOP) ref = P[pNoLoadVpu + i]! - P[pRegDroopPerQBase + i]! * qOwn;
      else if (mode === REG_VOLTAGE) ref = P[pSetpointVpu + i]!;
      else if (mode === REG_CROSS) ref = P[pOnline + i] ? P[pSetpointVpu + i]! - P[pCrossGain + i]! * (qOwn - qBarCross) : P[pSetpointVpu + i]!;
      else ref = P[pSetpointVpu + i]! + y[o + VAR_TRIM]!;
      const below = P[pVhzKneePu + i]! - y[o + OMEGA]!;
      if (below > 0) ref -= P[pVhzSlopePu + i]! * below;
      const e = ref - O[oVSensed + i]!;
      const ceiling = P[pCeilingPu + i]!;
      let hi = P[pShunt + i] ? ceiling * O[oVt + i]! : ceiling;
      // The over-excitation limiter, while it acts, holds the field at its limit.
      if (P[pOelActive + i]) {
        const lim = P[pOelPu + i]!;
        if (lim < hi) hi = lim;
      }
      u = P[pGainPu + i]! * (e + y[o + AVR_INT]!);
      dz = e * P[pInvAvrResetS + i]!;
      if (u >= hi) {
        u = hi;
        if (dz > 0) dz = 0;
      } else if (u <= 0) {
        u = 0;
        if (dz < 0) dz = 0;
      }
      if (mode === REG_PF && P[pOnline + i]) dTrim = (O[oPOwn + i]! * P[pTanPhi + i]! - qOwn) * P[pInvPfTrimS + i]!;
    }
    dy[o + AVR_INT] = dz;
    dy[o + VAR_TRIM] = dTrim;
    dy[o + EFD] = (u - y[o + EFD]!) * P[pInvExciterS + i]!;
  }
}

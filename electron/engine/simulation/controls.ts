/**
 * The controls' derivatives: each set's governor (`governor.ts`) and voltage regulator (`regulator.ts`) in one
 * loop over the plant, run after the bus solve and the machines (`plant-dynamics.ts`). The models, their
 * equations and their sources are described in those two files; this is their hot loop, reading the one
 * parameter array `m.par` and the one output array `out.buf` at constant column offsets (no per-set call, no
 * per-field look-up), the speed and status of each set read once for both.
 */
import { ACTUATOR, AVR_INT, EFD, GOV_INT, OMEGA, PMECH, STATES_PER_SET, VAR_TRIM } from './layout';
import { GOV_BASE, GOV_DROOP, REG_CROSS, REG_DROOP, REG_PF, REG_VOLTAGE } from '../mode-codes';
import type { Outputs, SimModel } from './sim-types';
import { baseReference } from './governor';
import {
  O_P_OWN,
  O_Q_OWN,
  O_VT,
  O_V_SENSED,
  P_CEILING_PU,
  P_CROSS_GAIN,
  P_GAIN_PU,
  P_GOV_MODE,
  P_INV_ACTUATOR_S,
  P_INV_AVR_RESET_S,
  P_INV_DROOP,
  P_INV_ENGINE_S,
  P_INV_EXCITER_S,
  P_INV_PF_TRIM_S,
  P_INV_RESET_S,
  P_ISO_GAIN_PU,
  P_ISO_LINKED,
  P_KW_PU,
  P_MAX_PU,
  P_MIN_PU,
  P_MOTORING_PU,
  P_NO_LOAD_PU,
  P_NO_LOAD_VPU,
  P_OEL_ACTIVE,
  P_OEL_PU,
  P_ONLINE,
  P_REG_DROOP_PER_QBASE,
  P_REG_MODE,
  P_SETPOINT_PU,
  P_SETPOINT_VPU,
  P_SHUNT,
  P_SHUTDOWN,
  P_TAN_PHI,
  P_VHZ_KNEE_PU,
  P_VHZ_SLOPE_PU,
} from './par-layout';

/**
 * Writes the governor derivatives (actuator, mechanical power, isochronous integrator) and the regulator
 * derivatives (field voltage, regulator integrator, power-factor trim) of every set, reading from `out` the time,
 * each set's kW and kVAR (pu own base), terminal voltage and sensed voltage, the linked isochronous group's
 * loading and the cross-current group's mean kVAR. Lags are multiplications by the reciprocals `buildSimModel` keeps.
 */
export function controlDerivatives(m: SimModel, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const n = m.n;
  const t = out.t;
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
  const pGovMode = P_GOV_MODE * n;
  const pInvActuatorS = P_INV_ACTUATOR_S * n;
  const pInvAvrResetS = P_INV_AVR_RESET_S * n;
  const pInvDroop = P_INV_DROOP * n;
  const pInvEngineS = P_INV_ENGINE_S * n;
  const pInvExciterS = P_INV_EXCITER_S * n;
  const pInvPfTrimS = P_INV_PF_TRIM_S * n;
  const pInvResetS = P_INV_RESET_S * n;
  const pIsoGainPu = P_ISO_GAIN_PU * n;
  const pIsoLinked = P_ISO_LINKED * n;
  const pKwPu = P_KW_PU * n;
  const pMaxPu = P_MAX_PU * n;
  const pMinPu = P_MIN_PU * n;
  const pMotoringPu = P_MOTORING_PU * n;
  const pNoLoadPu = P_NO_LOAD_PU * n;
  const pNoLoadVpu = P_NO_LOAD_VPU * n;
  const pOelActive = P_OEL_ACTIVE * n;
  const pOelPu = P_OEL_PU * n;
  const pOnline = P_ONLINE * n;
  const pRegDroopPerQBase = P_REG_DROOP_PER_QBASE * n;
  const pRegMode = P_REG_MODE * n;
  const pSetpointPu = P_SETPOINT_PU * n;
  const pSetpointVpu = P_SETPOINT_VPU * n;
  const pShunt = P_SHUNT * n;
  const pShutdown = P_SHUTDOWN * n;
  const pTanPhi = P_TAN_PHI * n;
  const pVhzKneePu = P_VHZ_KNEE_PU * n;
  const pVhzSlopePu = P_VHZ_SLOPE_PU * n;
  const pBarIso = out.pBarIso;
  const qBarCross = out.qBarCross;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    const w = y[o + OMEGA]!;
    const on = P[pOnline + i]!;
    const down = P[pShutdown + i]!;

    // Governor: demand (pu of ratedKW) clamped to the set's limits, through the actuator and engine lags.
    const kw = P[pKwPu + i]!;
    let demand: number;
    let dzGov = 0;
    if (down) {
      demand = -P[pMotoringPu + i]! * kw * (w > 0 ? Math.min(1, w) : 0);
    } else {
      const mode = P[pGovMode + i]!;
      // Off line the governor may cut the fuel completely: the engine's own losses then
      // slow it down (net output −motoringPct of ratedKW, the plant's own figure). On line a droop
      // set goes down to the same zero fuel (it motors); isochronous and base-load sets keep to minKW.
      const lo = on ? P[pMinPu + i]! : -P[pMotoringPu + i]!;
      const hi = P[pMaxPu + i]!;
      let u: number;
      if (mode === GOV_DROOP) {
        u = (P[pNoLoadPu + i]! - w) * P[pInvDroop + i]!;
      } else if (mode === GOV_BASE && on) {
        u = baseReference(m, i, t);
      } else {
        const e = P[pSetpointPu + i]! - w;
        const z = y[o + GOV_INT]!;
        const kp = P[pIsoGainPu + i]!;
        u = kp * (e + z);
        const share = on && P[pIsoLinked + i] && mode !== GOV_BASE ? (pBarIso - O[oPOwn + i]! / kw) / kp : 0;
        dzGov = (e + share) * P[pInvResetS + i]!;
        if ((u >= hi && dzGov > 0) || (u <= lo && dzGov < 0)) dzGov = 0;
      }
      demand = (u > hi ? hi : u < lo ? lo : u) * kw;
    }
    dy[o + GOV_INT] = dzGov;
    const x = y[o + ACTUATOR]!;
    dy[o + ACTUATOR] = (demand - x) * P[pInvActuatorS + i]!;
    dy[o + PMECH] = (x - y[o + PMECH]!) * P[pInvEngineS + i]!;

    // Regulator: PI on the sensed voltage against the reference of its mode, output within 0 and the ceiling.
    let field = 0;
    let dzAvr = 0;
    let dTrim = 0;
    if (!down) {
      const qOwn = O[oQOwn + i]!;
      const mode = P[pRegMode + i]!;
      let ref: number;
      if (mode === REG_DROOP) ref = P[pNoLoadVpu + i]! - P[pRegDroopPerQBase + i]! * qOwn;
      else if (mode === REG_VOLTAGE) ref = P[pSetpointVpu + i]!;
      else if (mode === REG_CROSS) ref = on ? P[pSetpointVpu + i]! - P[pCrossGain + i]! * (qOwn - qBarCross) : P[pSetpointVpu + i]!;
      else ref = P[pSetpointVpu + i]! + y[o + VAR_TRIM]!;
      const below = P[pVhzKneePu + i]! - w;
      if (below > 0) ref -= P[pVhzSlopePu + i]! * below;
      const e = ref - O[oVSensed + i]!;
      const ceiling = P[pCeilingPu + i]!;
      let hi = P[pShunt + i] ? ceiling * O[oVt + i]! : ceiling;
      // The over-excitation limiter, while it acts, holds the field at its limit.
      if (P[pOelActive + i]) {
        const lim = P[pOelPu + i]!;
        if (lim < hi) hi = lim;
      }
      field = P[pGainPu + i]! * (e + y[o + AVR_INT]!);
      dzAvr = e * P[pInvAvrResetS + i]!;
      if (field >= hi) {
        field = hi;
        if (dzAvr > 0) dzAvr = 0;
      } else if (field <= 0) {
        field = 0;
        if (dzAvr < 0) dzAvr = 0;
      }
      if (mode === REG_PF && on) dTrim = (O[oPOwn + i]! * P[pTanPhi + i]! - qOwn) * P[pInvPfTrimS + i]!;
    }
    dy[o + AVR_INT] = dzAvr;
    dy[o + VAR_TRIM] = dTrim;
    dy[o + EFD] = (field - y[o + EFD]!) * P[pInvExciterS + i]!;
  }
}

/**
 * The governor: speed droop, isochronous PI with a load-sharing link, or base load
 * (load control, with ramps), acting through an actuator lag and an engine torque lag.
 *
 *   demand u (pu of ratedKW), clamped to the steady state's limits (`sharing/set-limits.ts`):
 *     above the overload (fuel) limit, below zero fuel (−motoring power) in droop or minKW
 *     for isochronous and base load
 *     droop:        u = (f_nl − f) / (droop · f_rated)      (the speed-droop definition of the README)
 *     isochronous:  u = K_p (e + z) (K_p: `governor.isoGainPU`),  T_reset dz/dt = e + (p̄ − p) / K_p,  e = (f_set − f) / f_rated
 *                   p̄ = Σ P / Σ ratedKW of the linked isochronous sets (load-sharing link)
 *     base load:    u = baseKW / ratedKW (moving along a ramp when one runs)
 *   T_act dx/dt = u · kW/kVA − x,   T_eng dPm/dt = x − Pm
 *
 * In steady state the droop set sits exactly on its droop line and the isochronous
 * sets hold their setpoint with kW in proportion to `ratedKW` — the definitions the
 * steady-state solver uses. The integrator stops while the demand is clamped
 * (conditional integration), so it does not wind up. Before its breaker closes an
 * isochronous or base-load set holds `setpointHz` (speed control before paralleling).
 */
import { ACTUATOR, GOV_INT, OMEGA, PMECH, STATES_PER_SET } from './layout';
import { GOV_BASE, GOV_DROOP } from '../mode-codes';
import type { Outputs, SimModel } from './sim-types';
import {
  O_P_OWN,
  P_GOV_MODE,
  P_INV_ACTUATOR_S,
  P_INV_DROOP,
  P_INV_ENGINE_S,
  P_INV_RESET_S,
  P_ISO_GAIN_PU,
  P_ISO_LINKED,
  P_KW_PU,
  P_MAX_PU,
  P_MIN_PU,
  P_MOTORING_PU,
  P_NO_LOAD_PU,
  P_ONLINE,
  P_SETPOINT_PU,
  P_SHUTDOWN,
} from './par-layout';

/** Base-load reference of set `i` at time `t`, pu of ratedKW, following a ramp if one runs. */
export function baseReference(m: SimModel, i: number, t: number): number {
  const t0 = m.rampT0[i]!;
  if (t < t0) return m.basePU[i]!;
  const t1 = m.rampT1[i]!;
  if (t >= t1) return m.rampTo[i]!;
  return m.rampFrom[i]! + ((m.rampTo[i]! - m.rampFrom[i]!) * (t - t0)) / (t1 - t0);
}

/**
 * Writes the governor derivatives of every set, reading from `out` the time, each set's
 * electrical power (pu own base) and the linked isochronous group's loading (pu of ratedKW).
 * One loop over the plant reading `m.par` and `out.buf` at constant column offsets; lags are
 * multiplications by the reciprocals `buildSimModel` keeps.
 */
export function governorDerivatives(m: SimModel, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const n = m.n;
  const t = out.t;
  const P = m.par;
  const O = out.buf;
  // Column offsets, in locals once per call.
  const oPOwn = O_P_OWN * n;
  const pGovMode = P_GOV_MODE * n;
  const pInvActuatorS = P_INV_ACTUATOR_S * n;
  const pInvDroop = P_INV_DROOP * n;
  const pInvEngineS = P_INV_ENGINE_S * n;
  const pInvResetS = P_INV_RESET_S * n;
  const pIsoGainPu = P_ISO_GAIN_PU * n;
  const pIsoLinked = P_ISO_LINKED * n;
  const pKwPu = P_KW_PU * n;
  const pMaxPu = P_MAX_PU * n;
  const pMinPu = P_MIN_PU * n;
  const pMotoringPu = P_MOTORING_PU * n;
  const pNoLoadPu = P_NO_LOAD_PU * n;
  const pOnline = P_ONLINE * n;
  const pSetpointPu = P_SETPOINT_PU * n;
  const pShutdown = P_SHUTDOWN * n;
  const pBarIso = out.pBarIso;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    const kw = P[pKwPu + i]!;
    const w = y[o + OMEGA]!;
    let demand: number;
    let dz = 0;
    if (P[pShutdown + i]) {
      demand = -P[pMotoringPu + i]! * kw * (w > 0 ? Math.min(1, w) : 0);
    } else {
      const mode = P[pGovMode + i]!;
      const on = P[pOnline + i]!;
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
        dz = (e + share) * P[pInvResetS + i]!;
        if ((u >= hi && dz > 0) || (u <= lo && dz < 0)) dz = 0;
      }
      demand = (u > hi ? hi : u < lo ? lo : u) * kw;
    }
    dy[o + GOV_INT] = dz;
    const x = y[o + ACTUATOR]!;
    dy[o + ACTUATOR] = (demand - x) * P[pInvActuatorS + i]!;
    dy[o + PMECH] = (x - y[o + PMECH]!) * P[pInvEngineS + i]!;
  }
}

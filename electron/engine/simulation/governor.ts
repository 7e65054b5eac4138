/**
 * The governor: speed droop, isochronous PI with a load-sharing link, or base load
 * (load control, with ramps), acting through an actuator lag and an engine torque lag.
 *
 *   demand u (pu of ratedKW), clamped to the steady state's limits (`sharing/set-limits.ts`):
 *     above the overload (fuel) limit, below zero fuel (−motoring power) in droop or minKW
 *     for isochronous and base load
 *     droop:        u = (f_nl − f) / (droop · f_rated)      (the speed-droop definition of the README)
 *     isochronous:  u = K_p (e + z),  T_reset dz/dt = e + (p̄ − p) / K_p,  e = (f_set − f) / f_rated
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
import { ACTUATOR, GOV_INT, OMEGA, PMECH } from './layout';
import { GOV_BASE, GOV_DROOP } from '../mode-codes';
import type { Outputs, SimModel } from './sim-types';

/**
 * Proportional gain of the isochronous governor, pu power per pu speed error: a 5 %
 * transient droop (common practice for engine governors; the plant file has no field for it).
 */
export const ISO_GAIN_PU = 20;

/** Base-load reference of set `i` at time `t`, pu of ratedKW, following a ramp if one runs. */
export function baseReference(m: SimModel, i: number, t: number): number {
  const t0 = m.rampT0[i]!;
  if (t < t0) return m.basePU[i]!;
  const t1 = m.rampT1[i]!;
  if (t >= t1) return m.rampTo[i]!;
  return m.rampFrom[i]! + ((m.rampTo[i]! - m.rampFrom[i]!) * (t - t0)) / (t1 - t0);
}

/**
 * Writes the governor derivatives of set `i` (state offset `o`), reading from `out` the
 * time, its electrical power (pu own base) and the linked isochronous group's loading
 * (pu of ratedKW).
 */
export function governorDerivatives(m: SimModel, i: number, o: number, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const t = out.t;
  const pOwn = out.pOwn[i]!;
  const pBarIso = out.pBarIso;
  const kw = m.kwPU[i]!;
  const w = y[o + OMEGA]!;
  let demand: number;
  let dz = 0;
  if (m.shutdown[i]) {
    demand = -m.motoringPU[i]! * kw * (w > 0 ? Math.min(1, w) : 0);
  } else {
    const mode = m.govMode[i]!;
    // Off line the governor may cut the fuel completely: the engine's own losses then
    // slow it down (net output −motoringPct of ratedKW, the plant's own figure). On line a droop
    // set goes down to the same zero fuel (it motors); isochronous and base-load sets keep to minKW.
    const lo = m.online[i] ? m.minPU[i]! : -m.motoringPU[i]!;
    const hi = m.maxPU[i]!;
    let u: number;
    if (mode === GOV_DROOP) {
      u = (m.noLoadPU[i]! - w) / m.droop[i]!;
    } else if (mode === GOV_BASE && m.online[i]) {
      u = baseReference(m, i, t);
    } else {
      const e = m.setpointPU[i]! - w;
      const z = y[o + GOV_INT]!;
      u = ISO_GAIN_PU * (e + z);
      const share = m.online[i] && m.isoLinked[i] && mode !== GOV_BASE ? (pBarIso - pOwn / kw) / ISO_GAIN_PU : 0;
      dz = (e + share) / m.resetS[i]!;
      if ((u >= hi && dz > 0) || (u <= lo && dz < 0)) dz = 0;
    }
    demand = (u > hi ? hi : u < lo ? lo : u) * kw;
  }
  dy[o + GOV_INT] = dz;
  const x = y[o + ACTUATOR]!;
  dy[o + ACTUATOR] = (demand - x) / m.actuatorS[i]!;
  dy[o + PMECH] = (x - y[o + PMECH]!) / m.engineS[i]!;
}

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
 *
 * The derivatives are worked out in `controls.ts` (`controlDerivatives`), together with the regulator's.
 */
import type { SimModel } from './sim-types';

/** Base-load reference of set `i` at time `t`, pu of ratedKW, following a ramp if one runs. */
export function baseReference(m: SimModel, i: number, t: number): number {
  const t0 = m.rampT0[i]!;
  if (t < t0) return m.basePU[i]!;
  const t1 = m.rampT1[i]!;
  if (t >= t1) return m.rampTo[i]!;
  return m.rampFrom[i]! + ((m.rampTo[i]! - m.rampFrom[i]!) * (t - t0)) / (t1 - t0);
}

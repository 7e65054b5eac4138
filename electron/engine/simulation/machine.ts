/**
 * The synchronous machine: swing equation and the d-axis flux dynamics.
 *
 * Model (per set, own base): the one-axis ("flux-decay") model of Sauer & Pai,
 * *Power System Dynamics and Stability* (1998), §6.6 — field flux E'q behind X'd —
 * with a damper-winding layer so the first cycles after a close or a fault see X''d:
 *
 *   dδ/dt    = ωs (ω − 1)
 *   2H dω/dt = (Pm − Pe) / ω − D (ω − ω_bus)              (torque form: Kundur 1994, eq. 3.9)
 *   T'd0 dE'q/dt  = E_fd + E_res − E'q − (Xd − X'd) I_d
 *   T''d0 dE''q/dt = E'q − E''q − (X'd − X''d) I_d
 *   T''d0 dE''d/dt = −E''d + (X'd − X''d) I_q
 *
 * Stator: V = E'' − j X''d I in the rotor frame (d + jq, Sauer & Pai's convention
 * `(V_d + jV_q) e^{j(δ − π/2)}` = network phasor). Documented simplifications:
 * - transient saliency is neglected, X_q = X'q = X'd, and the damper acts alike on both
 *   axes (X''q = X''d, T''q0 = T''d0), so the machine is a voltage E'' behind X''d to
 *   the network and, once the dampers settle, a voltage E' behind X'd;
 * - stator resistance and stator transients are neglected (standard for stability
 *   studies, Kundur 1994 §5.1), so the electrical power is Pe = Re(E'' I*), the same as
 *   at the terminals; `raPU` is not used here;
 * - residual magnetism is an EMF offset `E_res` in the field equation: with zero field
 *   voltage the open-circuit voltage is `residualPU`. The regulator's integrator removes
 *   its effect on every steady state.
 * Saturation is not modelled.
 */
import { DELTA, ED2, EFD, EQ1, EQ2, OMEGA, PMECH } from './layout';
import type { Outputs, SimModel } from './sim-types';

/** Speeds below this (pu) are taken as this when power is turned into torque. */
export const MIN_TORQUE_SPEED_PU = 0.1;

/**
 * Writes dδ, dω, dE'q, dE''d, dE''q of set `i` (state offset `o`), reading from `out` its
 * electrical power and d/q stator current (pu on its own base) and the bus speed (pu)
 * the damping acts against.
 */
export function machineDerivatives(m: SimModel, i: number, o: number, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const peOwn = out.pOwn[i]!;
  const idOwn = out.id[i]!;
  const iqOwn = out.iq[i]!;
  const omegaBus = out.omegaBus;
  const w = y[o + OMEGA]!;
  const wt = w > MIN_TORQUE_SPEED_PU ? w : MIN_TORQUE_SPEED_PU;
  dy[o + DELTA] = m.omegaS * (w - 1);
  const damping = m.online[i] ? m.dampingPU[i]! * (w - omegaBus) : 0;
  let dw = ((y[o + PMECH]! - peOwn) / wt - damping) / (2 * m.inertiaS[i]!);
  // A stopped engine does not run backwards.
  if (w <= 0 && dw < 0) dw = 0;
  dy[o + OMEGA] = dw;
  const xd1 = m.xd1PU[i]!;
  const x12 = xd1 - m.xd2PU[i]!;
  const eq1 = y[o + EQ1]!;
  dy[o + EQ1] = (y[o + EFD]! + m.residualPU[i]! - eq1 - (m.xdPU[i]! - xd1) * idOwn) / m.td0S[i]!;
  const t2 = m.td20S[i]!;
  dy[o + EQ2] = (eq1 - y[o + EQ2]! - x12 * idOwn) / t2;
  dy[o + ED2] = (-y[o + ED2]! + x12 * iqOwn) / t2;
}

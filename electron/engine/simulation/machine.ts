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
import { DELTA, ED2, EFD, EQ1, EQ2, OMEGA, PMECH, STATES_PER_SET } from './layout';
import type { Outputs, SimModel } from './sim-types';
import { O_ID, O_IQ, O_P_OWN, P_DAMPING_PU, P_INV2_H, P_INV_TD0, P_INV_TD20, P_ONLINE, P_RESIDUAL_PU, P_XD1_MINUS_XD2, P_XD_MINUS_XD1 } from './par-layout';

/** Speeds below this (pu) are taken as this when power is turned into torque. */
export const MIN_TORQUE_SPEED_PU = 0.1;

/**
 * Writes dδ, dω, dE'q, dE''d, dE''q of every set, reading from `out` each set's electrical
 * power and d/q stator current (pu on its own base) and the bus speed (pu) the damping acts
 * against. One loop over the plant reading the one parameter array `m.par` and the one output
 * array `out.buf` at constant column offsets (the simulator's hot loop: no per-set call, no
 * per-field look-up); divisions by time constants and inertia are multiplications by the
 * reciprocals `buildSimModel` keeps.
 */
export function machineDerivatives(m: SimModel, y: Float64Array, dy: Float64Array, out: Outputs): void {
  const n = m.n;
  const omegaS = m.omegaS;
  const P = m.par;
  const O = out.buf;
  // Column offsets, in locals once per call.
  const oId = O_ID * n;
  const oIq = O_IQ * n;
  const oPOwn = O_P_OWN * n;
  const pDampingPu = P_DAMPING_PU * n;
  const pInv2H = P_INV2_H * n;
  const pInvTd0 = P_INV_TD0 * n;
  const pInvTd20 = P_INV_TD20 * n;
  const pOnline = P_ONLINE * n;
  const pResidualPu = P_RESIDUAL_PU * n;
  const pXd1MinusXd2 = P_XD1_MINUS_XD2 * n;
  const pXdMinusXd1 = P_XD_MINUS_XD1 * n;
  const omegaBus = out.omegaBus;
  for (let i = 0, o = 0; i < n; i++, o += STATES_PER_SET) {
    const idOwn = O[oId + i]!;
    const w = y[o + OMEGA]!;
    // Math.max keeps the value unboxed (a conditional between w and the module constant makes V8 box it every set, every stage).
    const wt = Math.max(w, MIN_TORQUE_SPEED_PU);
    dy[o + DELTA] = omegaS * (w - 1);
    const d = P[pOnline + i] ? P[pDampingPu + i]! * (w - omegaBus) : 0;
    let dw = ((y[o + PMECH]! - O[oPOwn + i]!) / wt - d) * P[pInv2H + i]!;
    // A stopped engine does not run backwards.
    if (w <= 0 && dw < 0) dw = 0;
    dy[o + OMEGA] = dw;
    const eq1 = y[o + EQ1]!;
    dy[o + EQ1] = (y[o + EFD]! + P[pResidualPu + i]! - eq1 - P[pXdMinusXd1 + i]! * idOwn) * P[pInvTd0 + i]!;
    const t2 = P[pInvTd20 + i]!;
    const k = P[pXd1MinusXd2 + i]!;
    dy[o + EQ2] = (eq1 - y[o + EQ2]! - k * idOwn) * t2;
    dy[o + ED2] = (-y[o + ED2]! + k * O[oIq + i]!) * t2;
  }
}

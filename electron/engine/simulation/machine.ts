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
 *
 * The equations are evaluated in `plant-dynamics.ts` (`evaluatePlant`, pass 2), in the same loop that
 * works out each set's current and power: the machine needs nothing from the other sets.
 */

/** Speeds below this (pu) are taken as this when power is turned into torque. */
export const MIN_TORQUE_SPEED_PU = 0.1;

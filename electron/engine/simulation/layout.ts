/**
 * Where each set's states sit in the simulator's state vector (a `Float64Array` of
 * `STATES_PER_SET × sets`). One block per set, in plant order, on-line or not.
 */

/** Rotor angle δ, rad, in a frame turning at rated speed (Sauer & Pai 1998, §3). */
export const DELTA = 0;
/** Rotor speed ω, pu of rated. */
export const OMEGA = 1;
/** Transient EMF behind X'd on the q-axis, E'q, pu (field flux linkage). */
export const EQ1 = 2;
/** Subtransient EMF, d-axis component E''d, pu (damper flux). */
export const ED2 = 3;
/** Subtransient EMF, q-axis component E''q, pu (damper flux). */
export const EQ2 = 4;
/** Governor actuator (fuel rack) position, pu of the set's kVA. */
export const ACTUATOR = 5;
/** Mechanical power from the engine, pu of the set's kVA. */
export const PMECH = 6;
/** Isochronous governor's integrator, pu of the set's kW rating. */
export const GOV_INT = 7;
/** Field voltage E_fd, pu (1 pu gives rated voltage on open circuit). */
export const EFD = 8;
/** Voltage regulator's integrator, pu. */
export const AVR_INT = 9;
/** Power-factor controller's voltage-reference trim, pu. */
export const VAR_TRIM = 10;

/** States per set. */
export const STATES_PER_SET = 11;

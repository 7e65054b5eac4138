/**
 * A set's steady-state kW limits, one home for the steady state, the flags, the capability
 * chart and the simulator's governor.
 *
 * - Upper: the governor's fuel limit is the overload limit `ratedKW · overloadPct / 100` in
 *   every governor mode (ISO 8528-1 prime rating allows 10 % overload one hour in twelve;
 *   value from memory). Between `ratedKW` and that limit the set is flagged `overload-kW`.
 * - Lower, droop: a droop line below the bus frequency drives the fuel to zero; the engine
 *   is then turned by the alternator and absorbs its motoring power (friction and pumping,
 *   `ratedKW · motoringPct / 100`), so its output is −motoring power.
 * - Lower, isochronous and base load: the load controller's lower limit `minKW`, never below
 *   zero fuel (−motoring power; the plant schema refuses a lower `minKW`).
 */
import type { GenSet } from '../../../shared-types';

/** The governor's fuel (overload) limit, kW: `ratedKW · overloadPct / 100`. */
export function overloadLimitKW(set: GenSet): number {
  return (set.ratedKW * set.overloadPct) / 100;
}

/** Power the set absorbs from the bus at zero fuel, kW (positive number): `ratedKW · motoringPct / 100`. */
export function motoringKW(set: GenSet): number {
  return (set.ratedKW * set.motoringPct) / 100;
}

/** Reverse power at which the 32 relay picks up, kW (positive number): `ratedKW · reversePowerTripPct / 100`. */
export function reverseTripKW(set: GenSet): number {
  return (set.ratedKW * set.reversePowerTripPct) / 100;
}

/** Lowest steady output of an online set, kW: −motoring power in droop, else `minKW` (not below −motoring power). */
export function lowerLimitKW(set: GenSet): number {
  const zeroFuel = -motoringKW(set);
  if (set.governor.mode === 'droop') return zeroFuel;
  return Math.max(zeroFuel, set.minKW);
}

/**
 * Whether a set's output breaches its rating, its overload or its reverse-power trip, judged
 * from the numbers (kW, kVA) rather than the solver's flags, so the judgement does not change
 * when the solver's limits do. Rounding of the last digits is not a breach.
 */
import type { GenSet } from '../../../shared-types';

const EPS = 1e-9;

/** kW above rated kW, or kVA above rated kVA. */
export function exceedsRating(s: GenSet, kW: number, kVA: number): boolean {
  return kW > s.ratedKW * (1 + EPS) || kVA > s.ratedKVA * (1 + EPS);
}

/** kW above rated kW × overloadPct / 100. */
export function exceedsOverload(s: GenSet, kW: number): boolean {
  return kW > ((s.ratedKW * s.overloadPct) / 100) * (1 + EPS);
}

/** kW below −rated kW × reversePowerTripPct / 100 (the set motors past its device-32 setting). */
export function tripsReversePower(s: GenSet, kW: number): boolean {
  return kW < ((-s.ratedKW * s.reversePowerTripPct) / 100) * (1 + EPS);
}

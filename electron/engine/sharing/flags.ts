/**
 * Per-set conditions at the operating point, and the plain-language warnings that go
 * with them. Thresholds are relative to the set's ratings; a tiny tolerance keeps a
 * set that sits exactly on a limit from flickering between flagged and not.
 */
import type { GenSet, SetFlag } from '../../../shared-types';

const REL_TOL = 1e-9;

/** Figures of one online set the flags depend on. */
export interface SetOperatingFigures {
  kW: number;
  kVAR: number;
  kVA: number;
}

/**
 * Flags of an online set: kW and kVA overload, reverse power (motoring), at its kW
 * limit (max = ratedKW, min = minKW), under-excited beyond `leadingKVARLimitPct` of ratedKVA.
 */
export function setFlags(set: GenSet, x: SetOperatingFigures): SetFlag[] {
  const flags: SetFlag[] = [];
  const tolKW = REL_TOL * set.ratedKW;
  if (x.kW > set.ratedKW + tolKW) flags.push('overload-kW');
  if (x.kVA > set.ratedKVA * (1 + REL_TOL)) flags.push('overload-kVA');
  if (x.kW < -tolKW) flags.push('reverse-power');
  if (x.kW >= set.ratedKW - tolKW) flags.push('at-max-kW');
  else if (set.governor.mode !== 'baseload' && x.kW <= set.minKW + tolKW) flags.push('at-min-kW');
  if (x.kVAR < -(set.leadingKVARLimitPct / 100) * set.ratedKVA * (1 + REL_TOL)) flags.push('under-excited');
  return flags;
}

/** One sentence per flag that needs the user's attention (at-limit flags are reported by the solver's own notes). */
export function flagWarnings(set: GenSet, x: SetOperatingFigures, flags: readonly SetFlag[]): string[] {
  const out: string[] = [];
  const id = set.id;
  if (flags.includes('overload-kW')) out.push(`${id} is over its kW rating: ${x.kW.toFixed(0)} kW of ${set.ratedKW} kW.`);
  if (flags.includes('overload-kVA'))
    out.push(`${id} is over its kVA rating: ${x.kVA.toFixed(0)} kVA of ${set.ratedKVA} kVA (${((100 * x.kVA) / set.ratedKVA).toFixed(0)} %).`);
  if (flags.includes('reverse-power'))
    out.push(
      `${id} is motoring (reverse power ${(-x.kW).toFixed(0)} kW, ${((-100 * x.kW) / set.ratedKW).toFixed(1)} % of rating; trip setting ${set.reversePowerTripPct} %).`,
    );
  if (flags.includes('under-excited'))
    out.push(
      `${id} is under-excited: ${(-x.kVAR).toFixed(0)} kVAR leading, beyond its limit of ${set.leadingKVARLimitPct} % of ${set.ratedKVA} kVA.`,
    );
  return out;
}

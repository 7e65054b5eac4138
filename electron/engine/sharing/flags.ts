/**
 * Per-set conditions at the operating point, and the plain-language sentences that go
 * with them. Thresholds are relative to the set's ratings and limits (`set-limits.ts`,
 * `capability.ts`); a tiny tolerance keeps a set that sits exactly on a limit from
 * flickering between flagged and not.
 */
import type { GenSet, SetFlag } from '../../../shared-types';
import { fieldLimitKVAR, leadingLimitKVAR } from '../capability';
import { lowerLimitKW, motoringKW, overloadLimitKW, reverseTripKW } from './set-limits';
import { formatNumber } from '../../../shared-types';

const REL_TOL = 1e-9;

/** Figures of one online set the flags depend on. */
export interface SetOperatingFigures {
  kW: number;
  kVAR: number;
  kVA: number;
}

/**
 * Flags of an online set:
 * - `overload-kW`: above `ratedKW` (up to the overload limit); `at-max-kW`: at the overload (fuel) limit;
 * - `at-min-kW`: at its lowest output (droop: zero fuel; isochronous or base load: `minKW`);
 * - `motoring`: absorbing kW; `reverse-power`: absorbing more than the 32 setting;
 * - `overload-kVA`: stator current above rating; `field-limit`: at or beyond the field-heating
 *   limit; `under-excited`: at or beyond the leading limit.
 */
export function setFlags(set: GenSet, x: SetOperatingFigures): SetFlag[] {
  const flags: SetFlag[] = [];
  const tolKW = REL_TOL * set.ratedKW;
  const tolKVAR = REL_TOL * set.ratedKVA;
  if (x.kW > set.ratedKW + tolKW) flags.push('overload-kW');
  if (x.kVA > set.ratedKVA * (1 + REL_TOL)) flags.push('overload-kVA');
  if (x.kW < -tolKW) flags.push('motoring');
  if (-x.kW > reverseTripKW(set) + tolKW) flags.push('reverse-power');
  if (x.kW >= overloadLimitKW(set) - tolKW) flags.push('at-max-kW');
  else if (set.governor.mode !== 'baseload' && x.kW <= lowerLimitKW(set) + tolKW) flags.push('at-min-kW');
  if (x.kVAR >= fieldLimitKVAR(set, x.kW) - tolKVAR) flags.push('field-limit');
  if (x.kVAR < -tolKVAR && x.kVAR <= leadingLimitKVAR(set) + tolKVAR) flags.push('under-excited');
  return flags;
}

const kw0 = (v: number) => `${formatNumber(v, 0)} kW`;

/**
 * One sentence per flag that needs the user's attention, naming the set, the figure and the
 * limit; `held`: the set's regulator holds its kVAR at the limit (reactive droop, PF control).
 */
export function flagSentences(set: GenSet, x: SetOperatingFigures, flags: readonly SetFlag[], held: boolean): string[] {
  const out: string[] = [];
  const id = set.id;
  const over = overloadLimitKW(set);
  if (flags.includes('at-max-kW'))
    out.push(
      `${id} is at its governor's fuel limit, the overload limit of ${kw0(over)} (${set.overloadPct} % of ${set.ratedKW} kW): it no longer follows its droop line and the other sets take the rest.`,
    );
  else if (flags.includes('overload-kW'))
    out.push(
      `${id} is in its overload range: ${kw0(x.kW)} of ${set.ratedKW} kW rated (${formatNumber((100 * x.kW) / set.ratedKW, 0)} %; the overload allowance of a prime-rated set is ${set.overloadPct} % for one hour in twelve, ISO 8528-1, value from memory).`,
    );
  if (flags.includes('overload-kVA'))
    out.push(
      `${id} is over its kVA rating: ${formatNumber(x.kVA, 0)} kVA of ${set.ratedKVA} kVA (${formatNumber((100 * x.kVA) / set.ratedKVA, 0)} %): the stator current is above rating.`,
    );
  if (flags.includes('reverse-power'))
    out.push(
      `${id} is motoring: it absorbs ${kw0(-x.kW)} (${formatNumber((-100 * x.kW) / set.ratedKW, 1)} % of rating), beyond its reverse-power setting of ${set.reversePowerTripPct} % (${kw0(reverseTripKW(set))}): the 32 relay would trip it after ${set.reversePowerDelayS} s.`,
    );
  else if (flags.includes('motoring'))
    out.push(
      `${id} is motoring: it absorbs ${kw0(-x.kW)} from the bus${flags.includes('at-min-kW') && set.governor.mode === 'droop' ? ` at zero fuel (its motoring power, ${set.motoringPct} % of rating)` : ''}, within its reverse-power setting of ${set.reversePowerTripPct} % (${kw0(reverseTripKW(set))}), so the 32 relay does not trip it.`,
    );
  else if (flags.includes('at-min-kW') && set.governor.mode === 'droop' && motoringKW(set) === 0)
    out.push(`${id} is at zero fuel: its droop line lies below the bus frequency.`);
  if (flags.includes('field-limit'))
    out.push(
      held
        ? `${id} is held at its field-heating limit: ${formatNumber(x.kVAR, 0)} kVAR lagging at ${kw0(x.kW)} (its regulator's limiter holds it there; without it the set would take more).`
        : `${id} is beyond its field-heating limit: ${formatNumber(x.kVAR, 0)} kVAR lagging at ${kw0(x.kW)} (the limit there is ${formatNumber(fieldLimitKVAR(set, x.kW), 0)} kVAR).`,
    );
  if (flags.includes('under-excited'))
    out.push(
      held
        ? `${id} is held at its under-excitation limit: ${formatNumber(-x.kVAR, 0)} kVAR leading (${set.leadingKVARLimitPct} % of ${set.ratedKVA} kVA); it absorbs reactive power from the other sets.`
        : `${id} is under-excited: ${formatNumber(-x.kVAR, 0)} kVAR leading, beyond its limit of ${set.leadingKVARLimitPct} % of ${set.ratedKVA} kVA.`,
    );
  return out;
}

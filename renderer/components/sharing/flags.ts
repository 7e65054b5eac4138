/**
 * Words, icons and weight of each per-set flag. Flags are shown as an icon and words
 * together (colour is only a third cue), so no state depends on seeing colour.
 */
import type { SetFlag } from '../../../shared-types';
import type { IconName } from '../plant/icons';

/** How a flag is shown. */
export interface FlagInfo {
  /** An icon drawn beside the words (decorative; the words carry the meaning). */
  icon: IconName;
  /** Short words for the table. */
  words: string;
  /** A sentence for the tooltip. */
  explain: string;
  /** `bad`: act on it; `warn`: watch it; `info`: a state. */
  level: 'bad' | 'warn' | 'info';
}

export const FLAGS: Readonly<Record<SetFlag, FlagInfo>> = {
  'overload-kW': {
    icon: 'overload',
    words: 'kW overload',
    explain: 'Output above the set’s rated kW, inside its overload allowance (a prime-rated set: 110 % for one hour in twelve, ISO 8528-1, value from memory).',
    level: 'bad',
  },
  'overload-kVA': { icon: 'overload', words: 'kVA overload', explain: 'Apparent power above the set’s rated kVA: stator current above rating (alternator heating).', level: 'bad' },
  motoring: { icon: 'reverse', words: 'motoring', explain: 'The set absorbs kW from the bus: its engine is turned by the alternator.', level: 'warn' },
  'reverse-power': { icon: 'reverse', words: 'reverse power: 32 trips', explain: 'The set absorbs more kW than its reverse-power setting (device 32): the relay would trip it after its delay.', level: 'bad' },
  'at-max-kW': { icon: 'max', words: 'at fuel limit', explain: 'The governor is at the set’s fuel limit (its overload limit); it no longer follows its droop line.', level: 'warn' },
  'at-min-kW': { icon: 'min', words: 'at min kW', explain: 'The governor is at the set’s lowest output: zero fuel in droop, the minimum output in isochronous or base load.', level: 'warn' },
  'field-limit': { icon: 'max', words: 'field limit', explain: 'Lagging kVAR at (held by the regulator) or beyond the set’s field-heating limit.', level: 'warn' },
  'under-excited': { icon: 'under', words: 'under-excited', explain: 'Leading kVAR at (held by the regulator) or beyond the set’s under-excitation limit.', level: 'warn' },
  offline: { icon: 'offline', words: 'offline', explain: 'Breaker open: the set takes no share.', level: 'info' },
};

/** The display info of `flag` (unknown flags from a newer engine are shown by name). */
export function flagInfo(flag: string): FlagInfo {
  return (FLAGS as Record<string, FlagInfo | undefined>)[flag] ?? { icon: 'warn', words: flag, explain: flag, level: 'warn' };
}

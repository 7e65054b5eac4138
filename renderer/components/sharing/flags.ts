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
  'overload-kW': { icon: 'overload', words: 'kW overload', explain: 'Output above the set’s rated kW.', level: 'bad' },
  'overload-kVA': { icon: 'overload', words: 'kVA overload', explain: 'Apparent power above the set’s rated kVA (alternator heating).', level: 'bad' },
  'reverse-power': { icon: 'reverse', words: 'reverse power', explain: 'The set absorbs kW (motoring) beyond its reverse-power trip setting (device 32).', level: 'bad' },
  'at-max-kW': { icon: 'max', words: 'at max kW', explain: 'The governor is at the set’s kW limit; it no longer follows its droop line.', level: 'warn' },
  'at-min-kW': { icon: 'min', words: 'at min kW', explain: 'The governor is held at the set’s minimum kW.', level: 'warn' },
  'under-excited': { icon: 'under', words: 'under-excited', explain: 'Leading kVAR beyond the set’s under-excitation limit.', level: 'warn' },
  offline: { icon: 'offline', words: 'offline', explain: 'Breaker open: the set takes no share.', level: 'info' },
};

/** The display info of `flag` (unknown flags from a newer engine are shown by name). */
export function flagInfo(flag: string): FlagInfo {
  return (FLAGS as Record<string, FlagInfo | undefined>)[flag] ?? { icon: 'warn', words: flag, explain: flag, level: 'warn' };
}

/**
 * Words, icons and weight of each per-set flag. Flags are shown as an icon and words
 * together (colour is only a third cue), so no state depends on seeing colour.
 */
import { FLAG_WORDS, flagWords } from '../../../shared-types';
import type { SetFlag } from '../../../shared-types';
import type { IconName } from '../common/icons';

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

/** The icon of each flag; the words are the shared vocabulary (`FLAG_WORDS`, also used by the CLI and report). */
const FLAG_ICONS: Readonly<Record<SetFlag, IconName>> = {
  'overload-kW': 'overload',
  'overload-kVA': 'overload',
  motoring: 'reverse',
  'reverse-power': 'reverse',
  'at-max-kW': 'max',
  'at-min-kW': 'min',
  'field-limit': 'max',
  'under-excited': 'under',
  offline: 'offline',
};

export const FLAGS: Readonly<Record<SetFlag, FlagInfo>> = Object.fromEntries(
  (Object.keys(FLAG_ICONS) as SetFlag[]).map((f) => [f, { icon: FLAG_ICONS[f], ...FLAG_WORDS[f] }]),
) as Record<SetFlag, FlagInfo>;

/** The display info of `flag` (unknown flags from a newer engine are shown by name). */
export function flagInfo(flag: string): FlagInfo {
  return (FLAGS as Record<string, FlagInfo | undefined>)[flag] ?? { icon: 'warn', ...flagWords(flag) };
}

/**
 * The one schema kit: zod field helpers with one style of message ("must be a number (kW)", "must be greater than 0",
 * "must be 0 or more", "must be 2 000 000 kVA or less"), and the schemas of the contract types that more than one
 * request carries (the sync-check limits, the dead-bus permissives). Every handler schema and the project reader
 * build on these; none writes its own.
 *
 * zod 4's `z.number()` already refuses NaN and ±Infinity (with the "must be a number" message), so no helper adds a
 * finiteness check of its own.
 */
import { z } from 'zod';
import { formatBound } from '../../shared-types';
import type { SyncLimits } from '../../shared-types';

/** A number in `unit` (the unit is named in the message when the value is not a number). */
export const num = (unit = '') => z.number({ error: unit ? `must be a number (${unit})` : 'must be a number' });
/** A whole number (a count, a seed, a number of poles). */
export const whole = () => num().int('must be a whole number');
/** A power factor: above 0, at most 1. */
export const powerFactor = () => num().gt(0, 'must be greater than 0').lte(1, 'must be 1 or less');
/** A number greater than 0. */
export const positive = (unit: string) => num(unit).gt(0, 'must be greater than 0');
/** A number, or null where a figure may be missing (a recovery time never reached). */
export const numOrNull = () => z.union([num(), z.null()], { error: 'must be a number or null' });
/** A number 0 or more. */
export const nonNegative = (unit: string) => num(unit).gte(0, 'must be 0 or more');
/** A bound written the way the messages write it: 2 000 000, 0.01 (`formatBound`, shared with the screens' rules). */
const spaced = formatBound;
/** A number within [lo, hi], each rule in words with its unit ("must be 100 V or more"). */
export const between = (unit: string, lo: number, hi: number, words = unit) =>
  num(unit)
    .gte(lo, `must be ${spaced(lo)} ${words} or more`)
    .lte(hi, `must be ${spaced(hi)} ${words} or less`);
/** Text. */
export const text = () => z.string({ error: 'must be text' });
/** Text that is not empty (an id). */
export const id = () => text().min(1, 'must not be empty');
/**
 * One of the values of a `const` list from shared-types (the same list the type is made from), the choices named in
 * the message: `must be "droop", "isochronous" or "baseload"` (`quoted: false` names them bare).
 */
export function oneOf<const T extends readonly [string, ...string[]]>(values: T, { quoted = true } = {}) {
  const names = values.map((v) => (quoted ? `"${v}"` : v));
  const words = names.length > 1 ? `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}` : names[0];
  return z.enum(values, { error: `must be ${words}` });
}
/** true or false. */
export const flag = () => z.boolean({ error: 'must be true or false' });

/**
 * The sync-check window (`SyncLimits`), one rule set wherever limits travel (sync case, trainer window, project
 * file, report): slip above 0 and at most 5 Hz, angle above 0 and at most 180°, voltage difference above 0 and at
 * most 50 % (the strictest of the rules the requests used to carry separately).
 */
export const syncLimitsFields = {
  slipHz: positive('Hz').lte(5, 'must be 5 Hz or less'),
  angleDeg: positive('°').lte(180, 'must be 180° or less'),
  voltagePct: positive('%').lte(50, 'must be 50 % or less'),
  incomingFaster: flag().optional(),
  incomingHigher: flag().optional(),
};

/** The sync-check window of a request: the fields above, nothing else. */
export const syncLimitsSchema: z.ZodType<SyncLimits> = z.object(syncLimitsFields).strict();

/** A breaker's closing time, ms: a real breaker takes time to close (0 ms would hide the advance angle), so the rule is > 0. */
export const breakerClosingMs = () => positive('ms').lte(2000, 'must be 2000 ms or less');

/** The dead-bus / dead-line permissives' thresholds (`DeadPermissives`), % of rated voltage. */
export const deadFields = {
  deadBus: flag(),
  deadLine: flag(),
  livePct: positive('%').lte(150, 'must be 150 % or less'),
  deadPct: nonNegative('%'),
};

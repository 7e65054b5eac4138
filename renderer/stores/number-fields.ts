/**
 * Number fields a store takes from the screen (a view's `NumberInput` commits the number, or NaN for blank or
 * unreadable text). Each entry is checked against the field's rule: a good entry is stored; a refused one leaves the
 * field's last good value in the store and is named in `issues` (field → the rule it breaks, for the view to show
 * beside the field) until a good entry comes, or the value changes from elsewhere (defaults, a project opened).
 */
import { ref, watchEffect } from 'vue';
import { formatBound } from '../../shared-types';
import type { Ref } from 'vue';

/** A field's rule: null when `v` keeps it, else the rule in words after the field's name ("must be above 0 V"). */
export type NumberRule = (v: number) => string | null;

/** How a store reads and writes one of its fields, with the field's name and rule. */
export interface NumberFieldAccess {
  /** The field in words, as the reason and the store's sentences name it ("load power factor"). */
  name: string;
  rule: NumberRule;
  get(): number;
  set(v: number): void;
}

const NOT_A_NUMBER = 'must be a number';
const show = formatBound;
const withUnit = (x: number, unit: string): string => (unit ? `${show(x)} ${unit}` : show(x));

/** Any finite number. */
export const anyNumber: NumberRule = (v) => (Number.isFinite(v) ? null : NOT_A_NUMBER);

/** Greater than `lo` (and at most `hi` when given). */
export function above(lo: number, unit = '', hi?: number): NumberRule {
  const words = hi === undefined ? `must be above ${withUnit(lo, unit)}` : `must be above ${show(lo)} and at most ${withUnit(hi, unit)}`;
  return (v) => (!Number.isFinite(v) ? NOT_A_NUMBER : v > lo && (hi === undefined || v <= hi) ? null : words);
}

/** From `lo` to `hi`, both included (`hi` left out when the rule has no top). */
export function from(lo: number, hi: number | undefined, unit = ''): NumberRule {
  const words = hi === undefined ? `must be ${withUnit(lo, unit)} or more` : `must be from ${show(lo)} to ${withUnit(hi, unit)}`;
  return (v) => (!Number.isFinite(v) ? NOT_A_NUMBER : v >= lo && (hi === undefined || v <= hi) ? null : words);
}

/** From `lo` up to, but not including, `below`. */
export function fromBelow(lo: number, below: number, unit = ''): NumberRule {
  const words = `must be ${show(lo)} or more and below ${withUnit(below, unit)}`;
  return (v) => (!Number.isFinite(v) ? NOT_A_NUMBER : v >= lo && v < below ? null : words);
}

/** A whole number from `lo` to `hi`. */
export function whole(lo: number, hi: number): NumberRule {
  const words = `must be a whole number from ${show(lo)} to ${show(hi)}`;
  return (v) => (!Number.isFinite(v) ? NOT_A_NUMBER : Number.isInteger(v) && v >= lo && v <= hi ? null : words);
}

/** The entries a store refused: field → rule, and `take` for each entry from the screen. */
export interface NumberFields<K extends string> {
  issues: Ref<Partial<Record<K, string>>>;
  /** Stores `v` in the field when it keeps the field's rule (true), else keeps the last good value and names the rule. */
  take(key: K, v: number): boolean;
  /** "name rule" sentences of the refused entries among `keys` (all when left out), for a run the store refuses. */
  sentences(keys?: readonly K[]): string[];
  /** Forgets every refused entry (the fields' values were replaced from elsewhere). */
  clear(): void;
}

/** Number fields reached by `field(key)` (null for a key that no longer exists, such as a parameter's bound). */
export function numberFields<K extends string>(field: (key: K) => NumberFieldAccess | null): NumberFields<K> {
  const issues = ref<Partial<Record<K, string>>>({}) as Ref<Partial<Record<K, string>>>;
  /** The value each refused field held when its entry was refused. */
  const heldAt = new Map<K, number>();

  function drop(key: K): void {
    heldAt.delete(key);
    if (key in issues.value) delete issues.value[key];
  }

  function take(key: K, v: number): boolean {
    const f = field(key);
    if (!f) return false;
    const rule = f.rule(v);
    if (rule) {
      heldAt.set(key, f.get());
      issues.value[key] = rule;
      return false;
    }
    drop(key);
    f.set(v);
    return true;
  }

  // A value changed from elsewhere replaces the refused text on screen (the field shows the value), so its reason goes.
  watchEffect(() => {
    for (const key of Object.keys(issues.value) as K[]) {
      const f = field(key);
      if (!f || !Object.is(f.get(), heldAt.get(key))) drop(key);
    }
  });

  function sentences(keys?: readonly K[]): string[] {
    const refused = (Object.keys(issues.value) as K[]).filter((k) => !keys || keys.includes(k));
    return refused.map((k) => `${field(k)?.name ?? k} ${issues.value[k]}`);
  }

  function clear(): void {
    heldAt.clear();
    issues.value = {};
  }

  return { issues, take, sentences, clear };
}

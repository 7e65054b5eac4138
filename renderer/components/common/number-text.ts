/** Text ⇄ number for editor fields: the user's text is kept while typing, the model holds numbers. */

/** The number typed, or null for an empty or unreadable field (the engine then names the rule). */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\s/g, '').replace(',', '.').replace('−', '-');
  if (t === '') return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/** A model number as the field shows it (float noise trimmed: 61.440000000001 → "61.44"). */
export function showNumber(v: unknown): string {
  if (typeof v !== 'number' || !Number.isFinite(v)) return '';
  return String(Number(v.toPrecision(10)));
}

/** True for text the user typed that is not a number (kept on screen with its reason, never wiped). */
export function unreadable(text: string): boolean {
  return text.trim() !== '' && parseNumber(text) === null;
}

/**
 * A `NumberInput`'s reason props for the field at `path` of a map of refused fields (path → rule): the rule, the
 * reason's element id (`scope`-`path`, unique on the page) and its test id (`testPrefix` + path).
 */
export function reasonAt(
  errors: Partial<Record<string, string>>,
  path: string,
  scope: string,
  testPrefix = 'error-',
): { issue: string | undefined; issueKey: string; issueTest: string } {
  return { issue: errors[path], issueKey: `${scope}-${path}`, issueTest: `${testPrefix}${path}` };
}

/**
 * A store-checked number field's `NumberInput` props: its name in words and test id, and the reason the store refused
 * its entry (`issues`: field key → rule), found by `reasonAt` under the test id (reason test id `error-` + test id).
 */
export function storeFieldProps<K extends string>(
  issues: Partial<Record<K, string>>,
  key: K,
  name: string,
  testId: string,
  scope: string,
): { name: string; testId: string; issue: string | undefined; issueKey: string; issueTest: string } {
  return { name, testId, ...reasonAt({ [testId]: issues[key] }, testId, scope) };
}

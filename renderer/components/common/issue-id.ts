/** The element id of a field's reason (`aria-describedby` of the field): `issue-` and the key with every run of other characters as `-`. */
export function issueIdFor(key: string): string {
  return `issue-${key.replace(/[^a-zA-Z0-9]+/g, '-')}`;
}

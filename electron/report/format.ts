/** Text helpers of the report: HTML escaping and number formatting that never prints NaN. */

/** HTML escaping (the shared one, in shared-types/presentation.ts). */
export { escapeHtml } from '../../shared-types/presentation';

/** A number with fixed decimals; blank values and non-finite numbers print as an em dash (the shared format). */
export { formatNumber } from '../../shared-types/presentation';

/** A file-name-safe stem from free text: lower case, ASCII letters, digits and dashes. */
export function slug(text: string): string {
  const s = text
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return s.slice(0, 48).replace(/-+$/g, '') || 'plant';
}

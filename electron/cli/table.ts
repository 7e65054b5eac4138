import { formatNumber } from '../../shared-types';
/** Plain-text tables for the CLI's readable output. */
export function formatTable(header: string[], rows: (string | number)[][]): string {
  const cells = [header, ...rows.map((r) => r.map(String))];
  const widths = header.map((_, c) => Math.max(...cells.map((r) => (r[c] ?? '').length)));
  const line = (r: string[]) => r.map((v, c) => (c === 0 ? v.padEnd(widths[c]!) : v.padStart(widths[c]!))).join('  ');
  return [line(cells[0]!), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.slice(1).map(line)].join('\n') + '\n';
}

/** Fixed decimals, with "—" for missing values (never "NaN", never "-0"): the shared format. */
export function fmt(v: number | null | undefined, decimals = 1): string {
  return formatNumber(v, decimals);
}

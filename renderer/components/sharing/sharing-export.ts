/**
 * The sharing table as rows of text, and as aligned plain text (for the clipboard) or CSV
 * (for spreadsheets). Both carry the bus figures, the units and the caution.
 */
import { CAUTION, csvField } from '../../../shared-types';
import type { SharingResult } from '../../../shared-types';
import { flagInfo } from './flags';
import { fmt, fmtPF } from './format';

/** The caution every export carries. */
export const EXPORT_CAUTION = CAUTION;

/** Column headings with units, in table order. */
export const SHARING_COLUMNS = [
  'Set',
  'Name',
  'kW',
  'kVAR',
  'kVA',
  'PF',
  'Current (A)',
  'Terminal (V)',
  'Loading kW (%)',
  'Loading kVA (%)',
  'Sharing error kW (% of rating)',
  'Sharing error kVAR (% of rating)',
  'Circulating (A)',
  'Circulating (% of rated)',
  'Flags',
] as const;

/** One row of strings per set, then a totals row. */
export function sharingRows(result: SharingResult, totalPF: number | null, totalLoadingPct: number | null): string[][] {
  const rows = result.sets.map((s) => [
    s.id,
    s.name,
    fmt(s.kW, 1),
    fmt(s.kVAR, 1),
    fmt(s.kVA, 1),
    fmtPF(s.pf, s.pfLagging),
    fmt(s.currentA, 1),
    fmt(s.terminalV, 1),
    fmt(s.loadingPct, 1),
    fmt(s.loadingKVAPct, 1),
    fmt(s.sharingErrorKWPct, 2),
    fmt(s.sharingErrorKVARPct, 2),
    fmt(s.circulatingA, 1),
    fmt(s.circulatingPct, 2),
    s.flags.map((f) => flagInfo(f).words).join('; '),
  ]);
  const t = result.totals;
  rows.push([
    'Total',
    '',
    fmt(t.kW, 1),
    fmt(t.kVAR, 1),
    fmt(t.kVA, 1),
    totalPF === null ? '—' : fmtPF(totalPF, t.kVAR >= 0),
    '',
    '',
    fmt(totalLoadingPct, 1),
    '',
    '',
    '',
    '',
    '',
    '',
  ]);
  return rows;
}

function header(result: SharingResult, plantName: string): string[] {
  return [
    `Droopline sharing table: ${plantName}`,
    `Bus frequency ${fmt(result.bus.frequencyHz, 3)} Hz, bus voltage ${fmt(result.bus.voltageV, 1)} V (line-to-line)`,
    `Load ${fmt(result.totals.loadKW, 1)} kW, ${fmt(result.totals.loadKVAR, 1)} kVAR; feeder losses ${fmt(result.totals.feederLossKW, 2)} kW, ${fmt(result.totals.feederLossKVAR, 2)} kVAR`,
  ];
}

/** Aligned plain text: numbers right-aligned, one line per set, warnings and the caution below. */
export function sharingText(result: SharingResult, plantName: string, totalPF: number | null, totalLoadingPct: number | null): string {
  const rows = [SHARING_COLUMNS.map(String), ...sharingRows(result, totalPF, totalLoadingPct)];
  const widths = SHARING_COLUMNS.map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length)));
  const textCols = new Set([0, 1, 5, 14]);
  const line = (r: string[]) =>
    r
      .map((cell, c) => (textCols.has(c) ? cell.padEnd(widths[c] ?? 0) : cell.padStart(widths[c] ?? 0)))
      .join('  ')
      .trimEnd();
  const out = [...header(result, plantName), '', line(rows[0] ?? []), ...rows.slice(1).map(line)];
  if (result.warnings.length) out.push('', ...result.warnings.map((w) => `Note: ${w}`));
  out.push('', EXPORT_CAUTION);
  return out.join('\n') + '\n';
}

/**
 * CSV (RFC 4180, CRLF lines): a header block of "quantity,value" lines, a blank line,
 * then the table with its unit-bearing headings.
 */
export function sharingCsv(result: SharingResult, plantName: string, totalPF: number | null, totalLoadingPct: number | null): string {
  const lines: string[][] = [
    ['plant', plantName],
    ['bus frequency (Hz)', fmt(result.bus.frequencyHz, 4)],
    ['bus voltage (V)', fmt(result.bus.voltageV, 2)],
    ['load (kW)', fmt(result.totals.loadKW, 2)],
    ['load (kVAR)', fmt(result.totals.loadKVAR, 2)],
    ['feeder losses (kW)', fmt(result.totals.feederLossKW, 3)],
    ['caution', EXPORT_CAUTION],
    [],
    [...SHARING_COLUMNS],
    ...sharingRows(result, totalPF, totalLoadingPct),
  ];
  return lines.map((l) => l.map(csvField).join(',')).join('\r\n') + '\r\n';
}

/** A file-name-safe form of the plant name. */
export function fileStem(name: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'plant'
  );
}

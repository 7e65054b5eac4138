/** The metrics and ISO 8528-5 class tables of runs as rows (shown, and exported as CSV). */
import { isoClassName } from '../../../shared-types';
import type { ClassCheck, PerformanceClass, SimulationMetrics } from '../../../shared-types';

export const CLASSES: readonly PerformanceClass[] = ['G1', 'G2', 'G3'];

/** One metric: label with unit, decimals, and how to read it from a run's metrics. */
export interface MetricRow {
  key: string;
  label: string;
  decimals: number;
  read: (m: SimulationMetrics) => number | null;
}

/** The figures of a run, in the order shown. */
export const METRIC_ROWS: readonly MetricRow[] = [
  { key: 'initialHz', label: 'Frequency before the first event (Hz)', decimals: 3, read: (m) => m.initial?.frequencyHz ?? null },
  { key: 'nadirHz', label: 'Frequency nadir (Hz)', decimals: 3, read: (m) => m.frequencyNadirHz },
  { key: 'peakHz', label: 'Frequency peak (Hz)', decimals: 3, read: (m) => m.frequencyPeakHz },
  { key: 'devPct', label: 'Transient frequency deviation (% of rated)', decimals: 2, read: (m) => m.frequencyDeviationPct },
  { key: 'fRecS', label: 'Frequency recovery time (s)', decimals: 2, read: (m) => m.frequencyRecoveryS },
  { key: 'vDipPct', label: 'Voltage dip (% of rated)', decimals: 2, read: (m) => m.voltageDipPct },
  { key: 'vPeakPct', label: 'Voltage rise (% of rated)', decimals: 2, read: (m) => m.voltagePeakPct },
  { key: 'vRecS', label: 'Voltage recovery time (s)', decimals: 2, read: (m) => m.voltageRecoveryS },
  { key: 'finalHz', label: 'Final frequency (Hz)', decimals: 3, read: (m) => m.final.frequencyHz },
  { key: 'finalV', label: 'Final voltage (V)', decimals: 1, read: (m) => m.final.voltageV },
  { key: 'targetHz', label: 'Steady state of the final load (Hz)', decimals: 3, read: (m) => m.steadyState?.frequencyHz ?? null },
  { key: 'targetV', label: 'Steady state of the final load (V)', decimals: 1, read: (m) => m.steadyState?.voltageV ?? null },
  { key: 'unservedKWh', label: 'Load not served at low voltage (kWh)', decimals: 3, read: (m) => m.unservedKWh ?? 0 },
  { key: 'trips', label: 'Protection operations (set trips, loads shed)', decimals: 0, read: (m) => (m.trips ?? []).length },
  { key: 'badCloses', label: 'Closes outside the sync-check window', decimals: 0, read: (m) => (m.closes ?? []).filter((c) => !c.insideWindow).length },
  { key: 'unservedKW', label: 'Largest load not served at low voltage (kW)', decimals: 0, read: (m) => m.maxUnservedKW ?? 0 },
];

/** A number for a table cell: fixed decimals, never NaN ("—" for blanks); the shared format. */
export { formatNumber as fmt } from '../../../shared-types';

/** A verdict in words with an icon (never colour alone). */
export function verdict(pass: boolean | null): { icon: string; word: string; kind: 'meets' | 'fails' | 'none' } {
  if (pass === null) return { icon: '–', word: 'not judged', kind: 'none' };
  return pass ? { icon: '✓', word: 'meets', kind: 'meets' } : { icon: '✗', word: 'fails', kind: 'fails' };
}

/** CSV rows of a class table: quantity, unit, measured, then limit and verdict per class, then the source. */
export function classCsv(checks: readonly ClassCheck[]): { columns: string[]; rows: (string | number | null)[][] } {
  return {
    columns: ['Quantity', 'Unit', 'Measured', ...CLASSES.flatMap((k) => [`${isoClassName(k)} limit`, `${isoClassName(k)} verdict`]), 'Limit source', 'Note'],
    rows: checks.map((c) => [c.quantity, c.unit, c.measured, ...CLASSES.flatMap((k) => [c.limits[k], verdict(c.pass[k]).word]), c.source, c.note ?? '']),
  };
}

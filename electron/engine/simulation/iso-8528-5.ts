/**
 * ISO 8528-5 performance classes G1–G3 for generating sets: the limits Droopline checks
 * a run against, each with where its value comes from. The limits are those of the
 * standard's table of operating limit values for the classes (ISO 8528-5:2013, Table 4;
 * the table number is a value from memory). G2 and the two steady-state rows were seen in a
 * published copy; the G1 and G3 values of the other rows are values from memory: verify
 * them against the edition you hold.
 *
 * How each quantity is measured (ISO 8528-5 definitions, our reading):
 * - transient deviations are taken from the value just before the first event, as % of
 *   the rated value: δf = (f_extreme − f_initial) / f_r × 100 %, likewise for voltage;
 *   some editions widen the load-on frequency limit by the set's droop (value from memory);
 * - recovery times run from the event until the quantity stays inside the tolerance band
 *   around the steady state the governor and regulator should reach for the new load;
 *   Droopline takes that steady state from the steady-state solver (closed form of the
 *   final plant), and a run that ends outside the band fails with the reason;
 * - frequency droop is the setting of the sets in droop, not a measurement.
 */
import type { PerformanceClass } from '../../../shared-types';

/** The classes, in order. */
export const PERFORMANCE_CLASSES: readonly PerformanceClass[] = ['G1', 'G2', 'G3'];

/** One limit of the class table. `kind` says how a measured value is judged. */
export interface ClassLimit {
  key: ClassLimitKey;
  quantity: string;
  unit: string;
  /** `max`: pass when measured ≤ limit; `min`: pass when measured ≥ limit (negative deviations). */
  kind: 'max' | 'min';
  limits: Record<PerformanceClass, number>;
  source: string;
}

export type ClassLimitKey =
  | 'frequencyDroop'
  | 'frequencyBand'
  | 'frequencyRise'
  | 'frequencyDip'
  | 'frequencyRecovery'
  | 'voltageDeviation'
  | 'voltageRise'
  | 'voltageDip'
  | 'voltageRecovery';

const TABLE = 'ISO 8528-5:2013, operating limit values of the performance classes (Table 4, table number from memory)';
const G2_CONFIRMED = `${TABLE}: G2 confirmed; G1 and G3 values from memory — verify against the standard you hold`;
const ALL_CONFIRMED = `${TABLE}: all three classes confirmed`;

/** The class table. */
export const ISO_8528_5_LIMITS: readonly ClassLimit[] = [
  { key: 'frequencyDroop', quantity: 'frequency droop (setting)', unit: '%', kind: 'max', limits: { G1: 8, G2: 5, G3: 3 }, source: G2_CONFIRMED },
  { key: 'frequencyBand', quantity: 'steady-state frequency band', unit: '%', kind: 'max', limits: { G1: 2.5, G2: 1.5, G3: 0.5 }, source: ALL_CONFIRMED },
  {
    key: 'frequencyDip',
    quantity: 'transient frequency deviation, load on',
    unit: '%',
    kind: 'min',
    limits: { G1: -15, G2: -10, G3: -7 },
    source: `${G2_CONFIRMED}; some editions widen the load-on limit by the droop (value from memory)`,
  },
  {
    key: 'frequencyRise',
    quantity: 'transient frequency deviation, load off',
    unit: '%',
    kind: 'max',
    limits: { G1: 18, G2: 12, G3: 10 },
    source: G2_CONFIRMED,
  },
  { key: 'frequencyRecovery', quantity: 'frequency recovery time', unit: 's', kind: 'max', limits: { G1: 10, G2: 5, G3: 3 }, source: G2_CONFIRMED },
  { key: 'voltageDeviation', quantity: 'steady-state voltage deviation', unit: '±%', kind: 'max', limits: { G1: 5, G2: 2.5, G3: 1 }, source: ALL_CONFIRMED },
  { key: 'voltageDip', quantity: 'transient voltage deviation, load on', unit: '%', kind: 'min', limits: { G1: -25, G2: -20, G3: -15 }, source: G2_CONFIRMED },
  { key: 'voltageRise', quantity: 'transient voltage deviation, load off', unit: '%', kind: 'max', limits: { G1: 35, G2: 25, G3: 20 }, source: G2_CONFIRMED },
  { key: 'voltageRecovery', quantity: 'voltage recovery time', unit: 's', kind: 'max', limits: { G1: 10, G2: 6, G3: 4 }, source: G2_CONFIRMED },
];

/** The limit row for `key`. */
export function classLimit(key: ClassLimitKey): ClassLimit {
  return ISO_8528_5_LIMITS.find((l) => l.key === key)!;
}

/**
 * Recovery bands: frequency within half the class's steady-state frequency band,
 * voltage within the class's steady-state voltage deviation, both around the steady
 * state of the final load (our reading of ISO 8528-5's recovery-time definitions; the
 * widths are the table's).
 */
export function recoveryBandPct(quantity: 'frequency' | 'voltage', c: PerformanceClass): number {
  return quantity === 'frequency' ? classLimit('frequencyBand').limits[c] / 2 : classLimit('voltageDeviation').limits[c];
}

/** Judges `measured` against a limit row; null when nothing was measured. */
export function judge(limit: ClassLimit, c: PerformanceClass, measured: number | null): boolean | null {
  if (measured === null || !Number.isFinite(measured)) return null;
  const lim = limit.limits[c];
  // A hair of tolerance so a value printed equal to the limit passes.
  return limit.kind === 'max' ? measured <= lim + 1e-9 : measured >= lim - 1e-9;
}

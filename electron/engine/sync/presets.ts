/**
 * Sync-check limit presets from published standards and the trade's common practice. Every preset names its
 * standard and clause; values recalled but not confirmed against the standard's own table say so
 * ("verify against the standard you hold"). Sources: IEEE Std 1547-2018 clause 4.10, Table 5 (value from memory); IEEE C50.12 / C50.13 (secondary copy); common practice between generating sets.
 */
import type { SyncLimits, SyncPreset } from '../../../shared-types';
import { InvalidInput } from '../errors';

const VERIFY = 'Verify against the standard you hold.';
const UTILITY_NOTE = 'Written for a source closing onto a utility (area EPS); using it between generating sets is a convention.';

/** IEEE Std 1547-2018 clause 4.10 (enter service: synchronization), Table 5: parameter limits by aggregate rating [memory]. */
const IEEE_1547: { id: string; band: string; minKVA: number; maxKVA: number | null; limits: SyncLimits }[] = [
  { id: 'ieee1547-2018-0-500', band: '0–500 kVA', minKVA: 0, maxKVA: 500, limits: { slipHz: 0.3, voltagePct: 10, angleDeg: 20 } },
  { id: 'ieee1547-2018-500-1500', band: '> 500–1 500 kVA', minKVA: 500, maxKVA: 1500, limits: { slipHz: 0.2, voltagePct: 5, angleDeg: 15 } },
  { id: 'ieee1547-2018-over-1500', band: '> 1 500 kVA', minKVA: 1500, maxKVA: null, limits: { slipHz: 0.1, voltagePct: 3, angleDeg: 10 } },
];

const PRESETS: readonly SyncPreset[] = [
  ...IEEE_1547.map((b): SyncPreset => ({
    id: b.id,
    label: `IEEE 1547-2018, aggregate rating ${b.band}`,
    source: `IEEE Std 1547-2018, clause 4.10 (synchronization), Table 5 (aggregate rating ${b.band})`,
    note: `Values recalled, not confirmed against the published table (IEEE 1547-2003 Table 5 uses the same). ${VERIFY} ${UTILITY_NOTE}`,
    limits: { ...b.limits },
    confidence: 'memory',
    ratingBandKVA: { minKVA: b.minKVA, maxKVA: b.maxKVA },
  })),
  {
    id: 'ieee-c50.12-c50.13',
    label: 'IEEE C50.12 / C50.13 (large synchronous generators)',
    source: 'IEEE Std C50.12 (salient-pole) and IEEE Std C50.13 (cylindrical-rotor), synchronizing limits',
    note: `Angle ±10°, voltage 0 to +5 % (generator at or above the system), frequency ±0.067 Hz, from a secondary copy; the clause numbers were not confirmed. ${VERIFY}`,
    limits: { slipHz: 0.067, angleDeg: 10, voltagePct: 5, incomingHigher: true },
    confidence: 'secondary',
  },
  {
    id: 'practice-generating-sets',
    label: 'Common practice, generating sets',
    source: 'Common practice for paralleling generating sets (no standard behind it)',
    note: "Typical sync-check settings: ΔV 2–5 % with the incoming set slightly high, Δf 0.05–0.2 Hz with the incoming set slightly fast, Δφ 5–10°. A rule of thumb: follow the makers' and the site's settings.",
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true },
    confidence: 'practice',
  },
  {
    id: 'practice-generating-sets-tight',
    label: 'Common practice, generating sets (tight)',
    source: 'Common practice for paralleling generating sets (no standard behind it)',
    note: "The tight end of the usual range: incoming slightly fast and slightly high. A rule of thumb: follow the makers' and the site's settings.",
    limits: { slipHz: 0.1, angleDeg: 5, voltagePct: 2, incomingFaster: true, incomingHigher: true },
    confidence: 'practice',
  },
];

/** Every preset (fresh copies: callers may edit them). */
export function listSyncPresets(): SyncPreset[] {
  return PRESETS.map((p) => ({ ...p, limits: { ...p.limits }, ...(p.ratingBandKVA ? { ratingBandKVA: { ...p.ratingBandKVA } } : {}) }));
}

/**
 * A preset by id.
 * @throws InvalidInput naming the known ids when `id` is unknown.
 */
export function syncPreset(id: string): SyncPreset {
  const p = listSyncPresets().find((x) => x.id === id);
  if (!p) throw new InvalidInput(`Unknown sync-check preset "${id}". Known presets: ${PRESETS.map((x) => x.id).join(', ')}.`);
  return p;
}

/**
 * The IEEE 1547-2018 preset for an aggregate rating: 0–500 kVA, > 500–1 500 kVA, > 1 500 kVA (band upper
 * edges inclusive).
 * @throws InvalidInput for a rating that is not a positive number.
 */
export function ieee1547PresetForRating(aggregateKVA: number): SyncPreset {
  if (!(aggregateKVA > 0) || !Number.isFinite(aggregateKVA)) throw new InvalidInput('The aggregate rating must be a positive number of kVA.');
  const band = IEEE_1547.find((b) => b.maxKVA === null || aggregateKVA <= b.maxKVA)!;
  return syncPreset(band.id);
}

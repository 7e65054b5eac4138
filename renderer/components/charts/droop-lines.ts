/**
 * The droop charts' lines from the engine's data: each set's characteristics (speed and voltage, with their ends at
 * the set's limits) come from the engine (`describePlant` → `SetDescription.characteristics`, and the plan's
 * `characteristics` for now and as proposed); this file only turns them into chart points and picks the axes' ranges.
 * No law is computed here.
 */
import type { CharacteristicPoint, PlantDescription, SetCharacteristics, SpeedCharacteristic, VoltageCharacteristic } from '../../../shared-types';

/** A point of a characteristic: x in kW or kVAR, y in Hz or V. */
export type XY = CharacteristicPoint;

/** A set's characteristic on either droop chart. */
export type Characteristic = SpeedCharacteristic | VoltageCharacteristic;

/** The [min, max] of `values` widened by `pad` of the span (or by `minSpan` / 2 when flat). */
export function paddedRange(values: readonly number[], pad = 0.06, minSpan = 1): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, minSpan];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (hi - lo < minSpan) {
    const mid = (hi + lo) / 2;
    lo = mid - minSpan / 2;
    hi = mid + minSpan / 2;
  }
  const p = (hi - lo) * pad;
  return [lo - p, hi + p];
}

/** `[lo, hi]` widened outward to multiples of half a power of ten of its span (48.5–51.5 Hz, 390–420 V). */
export function niceRange([lo, hi]: [number, number]): [number, number] {
  const span = hi - lo;
  if (!(span > 0) || !Number.isFinite(span)) return [lo, hi];
  const step = 10 ** Math.floor(Math.log10(span)) / 2;
  return [Math.floor(lo / step) * step, Math.ceil(hi / step) * step];
}

/**
 * Points of a characteristic for a line dataset: a segment as the engine gave it; a vertical (base load) spanning
 * `[yLo, yHi]`; a power-factor set's vertical at its operating kW times the engine's kVAR per kW (`kW`, 0 without
 * an operating point).
 */
export function characteristicPoints(c: Characteristic, yLo: number, yHi: number, kW = 0): XY[] {
  if (c.kind === 'segment') return c.points;
  const x = c.kind === 'vertical' ? c.x : kW * c.kVARPerKW;
  return [
    { x, y: yLo },
    { x, y: yHi },
  ];
}

/** The characteristics of set `id` in the engine's description (null when the description has no such set). */
export function characteristicsOf(description: PlantDescription | null, id: string): SetCharacteristics | null {
  return description?.sets.find((s) => s.id === id)?.characteristics ?? null;
}

/**
 * Mean, standard deviation, percentiles and histogram of one figure over the samples.
 * Statistics from simple-statistics (a well-kept library whose quantile rule is documented:
 * `quantileSorted`); the sample standard deviation divides by n − 1.
 */
import { mean, quantileSorted, sampleStandardDeviation } from 'simple-statistics';
import type { Distribution } from '../../../shared-types';

/** Summary of `values` (the first `count` entries are used; at least one). */
export function summarise(values: Float64Array, count: number, bins: number): Distribution {
  // A typed array sorts numerically without a comparator, several times faster than an array of
  // numbers with one; simple-statistics reads any indexable list of numbers.
  const data = values.slice(0, count).sort();
  const sorted = data as unknown as number[];
  const min = data[0]!;
  const max = data[count - 1]!;
  // A figure that does not move gets one narrow bin span around its value.
  const half = max > min ? 0 : Math.max(Math.abs(min) * 1e-6, 1e-9);
  const lo = min - half;
  const hi = max + half;
  const edges = Array.from({ length: bins + 1 }, (_, k) => lo + ((hi - lo) * k) / bins);
  // Counted in a typed array over the typed data (an indexed loop: some ten times faster than
  // iterating the cast array), then handed out as plain numbers.
  const tally = new Uint32Array(bins);
  const span = hi - lo;
  for (let k = 0; k < count; k++) tally[Math.min(bins - 1, Math.floor(((data[k]! - lo) / span) * bins))]! += 1;
  const counts = Array.from(tally);
  return {
    mean: mean(sorted),
    std: count > 1 ? sampleStandardDeviation(sorted) : 0,
    p5: quantileSorted(sorted, 0.05),
    p50: quantileSorted(sorted, 0.5),
    p95: quantileSorted(sorted, 0.95),
    min,
    max,
    edges,
    counts,
  };
}

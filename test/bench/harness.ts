/** A tiny benchmark harness: median wall time per call over repeated batches. */
import { performance } from 'node:perf_hooks';

export interface BenchResult {
  name: string;
  medianMs: number;
  runs: number;
  /** Extra figures a suite reports (e.g. set-steps per second). */
  extra?: Record<string, number | string>;
}

/** Times `fn` in batches for at least `minMs` (after a warm-up); returns the median ms per call. */
export function bench(name: string, fn: () => unknown, opts: { minMs?: number; batch?: number } = {}): BenchResult {
  const minMs = opts.minMs ?? 400;
  const batch = opts.batch ?? 1;
  for (let i = 0; i < Math.max(3, batch); i++) fn();
  const samples: number[] = [];
  const start = performance.now();
  while (performance.now() - start < minMs || samples.length < 5) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) fn();
    samples.push((performance.now() - t0) / batch);
  }
  samples.sort((a, b) => a - b);
  return { name, medianMs: samples[Math.floor(samples.length / 2)]!, runs: samples.length * batch };
}

/** Formats a result line for the console and the README. */
export function formatResult(r: BenchResult): string {
  const t = Number.isNaN(r.medianMs) ? '—' : r.medianMs < 1 ? `${(r.medianMs * 1000).toFixed(1)} µs` : `${r.medianMs.toFixed(2)} ms`;
  const extra = r.extra
    ? '  ' +
      Object.entries(r.extra)
        .map(([k, v]) => `${k} ${v}`)
        .join(', ')
    : '';
  return `| ${r.name} | ${t} | ${r.runs}${extra ? ` |${extra}` : ' |'}`;
}

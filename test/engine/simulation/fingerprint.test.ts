/**
 * The simulator gives the same runs as before its step loop was reworked for speed, up to floating-point noise
 * (see `fingerprint-scenarios.ts`: the stored figures are a regression record of this engine, not reference values).
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runFingerprints } from './fingerprint-scenarios';
import type { Fingerprint } from './fingerprint-scenarios';

const FILE = join(process.cwd(), 'test/engine/simulation/fixtures/run-fingerprints.json');

/** Equal up to floating-point noise: relative 1e-7 with an absolute floor of 1e-6 (kW, V, Hz). */
function same(a: number, b: number): boolean {
  if (Number.isNaN(a) && Number.isNaN(b)) return true;
  if (a === b) return true;
  return Math.abs(a - b) <= 1e-6 + 1e-7 * Math.max(Math.abs(a), Math.abs(b));
}

describe('simulator runs against the stored fingerprints', () => {
  const now = runFingerprints();
  if (process.env.WRITE_FINGERPRINTS === '1') writeFileSync(FILE, JSON.stringify(now, null, 1) + '\n');
  const stored = JSON.parse(readFileSync(FILE, 'utf8')) as Record<string, Fingerprint>;

  it('has the fixture and every scenario in it', () => {
    expect(existsSync(FILE)).toBe(true);
    expect(Object.keys(now).sort()).toEqual(Object.keys(stored).sort());
  });

  for (const name of Object.keys(now)) {
    it(name, () => {
      const a = now[name]!;
      const b = stored[name]!;
      expect(a.steps).toBe(b.steps);
      expect(a.log).toEqual(b.log);
      expect(a.samples.length).toBe(b.samples.length);
      expect(a.metrics.length).toBe(b.metrics.length);
      const bad: string[] = [];
      a.samples.forEach((x, k) => {
        if (!same(x, b.samples[k]!)) bad.push(`sample ${k}: ${x} vs ${b.samples[k]}`);
      });
      a.metrics.forEach((x, k) => {
        if (!same(x, b.metrics[k]!)) bad.push(`metric ${k}: ${x} vs ${b.metrics[k]}`);
      });
      expect(bad).toEqual([]);
    });
  }
});

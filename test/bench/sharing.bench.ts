/** Sharing solver: one solve of n sets with feeders (Newton–Raphson), the closed forms, and a load sweep. */
import { solveSharing, sweepLoad } from '../../electron/engine';
import { plantSchema } from '../../electron/handlers';
import type { Plant } from '../../shared-types';
import { bench } from './harness';
import type { BenchResult } from './harness';

/**
 * An 11 kV plant of `n` sets (invented for the benchmark): ratings 1.2–2.4 MW, droops and
 * no-load settings spread a little, cables of different length; 70 % load at 0.85 PF, part of it
 * constant impedance. Deterministic (no random numbers).
 */
export function benchPlant(n: number, feeders = true): Plant {
  const sets = Array.from({ length: n }, (_, i) => {
    const kW = 1200 + ((i * 379) % 1200);
    return {
      id: `G${i + 1}`,
      ratedKW: kW,
      ratedKVA: kW / 0.8,
      governor: { mode: 'droop', droopPct: 3.5 + (i % 4) * 0.5, noLoadHz: 51.8 + (i % 5) * 0.05 },
      regulator: { mode: 'reactive-droop', droopPct: 3 + (i % 3), noLoadV: 11_300 + (i % 7) * 20 },
      feeder: feeders ? { rOhm: 0.02 + (i % 6) * 0.01, xOhm: 0.03 + (i % 5) * 0.012 } : { rOhm: 0, xOhm: 0 },
    };
  });
  const ratedKW = sets.reduce((a, s) => a + s.ratedKW, 0);
  const p = 0.7 * ratedKW;
  const q = p * Math.tan(Math.acos(0.85));
  return plantSchema.parse({
    format: 'droopline.plant',
    version: 1,
    name: `bench ${n}`,
    ratedFrequencyHz: 50,
    ratedVoltageV: 11_000,
    sets,
    loads: [
      { id: 'P', kW: 0.8 * p, kVAR: 0.8 * q, model: 'constant-power' },
      { id: 'Z', kW: 0.2 * p, kVAR: 0.2 * q, model: 'constant-impedance', frequencySensitivity: 1 },
    ],
  });
}

/** CPU time per call, µs (process time, so less disturbed than wall time on a busy machine). */
function cpuMicros(fn: () => unknown, calls: number): string {
  const start = process.cpuUsage();
  for (let i = 0; i < calls; i++) fn();
  const used = process.cpuUsage(start);
  return `${((used.user + used.system) / calls).toFixed(1)} µs`;
}

export function run(): BenchResult[] {
  const out: BenchResult[] = [];
  // Warm the compiled code on every size first, so the first case does not pay for the JIT.
  for (const n of [2, 8, 32, 128]) {
    const plant = benchPlant(n);
    for (let i = 0; i < 300; i++) solveSharing(plant);
  }
  for (const n of [2, 8, 32, 128]) {
    const plant = benchPlant(n);
    const r = solveSharing(plant);
    const res = bench(`solveSharing, ${n} sets with feeders (Newton–Raphson)`, () => solveSharing(plant), { batch: n >= 32 ? 10 : 100 });
    res.extra = { 'Newton iterations': r.iterations, 'CPU per call': cpuMicros(() => solveSharing(plant), n >= 32 ? 200 : 1000) };
    out.push(res);
  }
  const closed = benchPlant(32, false);
  const c = bench('solveSharing, 32 sets without feeders (closed forms)', () => solveSharing(closed), { batch: 100 });
  c.extra = { 'CPU per call': cpuMicros(() => solveSharing(closed), 1000) };
  out.push(c);
  const eight = benchPlant(8);
  const sw = bench('sweepLoad, 8 sets with feeders, 100 points', () => sweepLoad({ plant: eight, steps: 100 }), { batch: 1 });
  sw.extra = { 'CPU per call': cpuMicros(() => sweepLoad({ plant: eight, steps: 100 }), 10) };
  out.push(sw);
  return out;
}

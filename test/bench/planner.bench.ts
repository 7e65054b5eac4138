/**
 * Planner suite: 10 000 tolerance samples of the 8-set plant with feeders (the sharing suite's
 * `benchPlant`), on one core in this process; samples per second per core by wall and CPU time.
 * Also one `planDroop` and one `sharingSensitivity` of the same plant.
 */
import { performance } from 'node:perf_hooks';
import { planDroop, sharingSensitivity, toleranceAnalysis } from '../../electron/engine';
import { bench } from './harness';
import type { BenchResult } from './harness';
import { benchPlant } from './sharing.bench';

export function run(): BenchResult[] {
  const plant = benchPlant(8);
  const request = { plant, samples: 10_000, seed: 1, speedTolHz: 0.1, voltageTolPct: 0.5, droopTolPct: 5 };
  toleranceAnalysis({ ...request, samples: 500 }); // warm the compiled code
  const out: BenchResult[] = [];
  const times: number[] = [];
  const cpu: number[] = [];
  for (let k = 0; k < 3; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    toleranceAnalysis(request);
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  const wall = times[1]!;
  const cpuMs = cpu[1]!;
  out.push({
    name: 'toleranceAnalysis, 8 sets with feeders, 10 000 samples, one core',
    medianMs: wall,
    runs: 3,
    extra: {
      'samples/s per core (wall)': Math.round(10_000 / (wall / 1000)),
      'samples/s per core (CPU time)': Math.round(10_000 / (cpuMs / 1000)),
      'CPU ms': cpuMs.toFixed(0),
    },
  });
  const planReq = { plant, frequencyBandHz: { min: 49, max: 51 }, voltageBandV: { min: 10_700, max: 11_300 }, loadRangePct: { min: 0, max: 90 } };
  out.push(bench('planDroop, 8 sets with feeders (closed forms + solver checks)', () => planDroop(planReq), { minMs: 1000 }));
  out.push(bench('sharingSensitivity, 8 sets with feeders (central differences)', () => sharingSensitivity(plant), { minMs: 1000 }));
  return out;
}

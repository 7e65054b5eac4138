/**
 * Time-domain simulator: set-steps per second (sets × steps / wall time) for 2, 8 and 32
 * sets, and the real-time factor of an 8-set, 60 s run at 1 ms (target > 100).
 */
import { simulate } from '../../electron/engine';
import type { Scenario } from '../../shared-types';
import { makePlant, rawSet } from '../helpers/plants';
import { bench } from './harness';
import type { BenchResult } from './harness';

/** n droop / reactive-droop sets on feeders, loaded to 60 %, a 20 % block load a third of the way in. */
export function benchScenario(n: number, durationS: number): Scenario {
  const sets = Array.from({ length: n }, (_, i) =>
    rawSet(`G${i + 1}`, {
      ratedKVA: 1000 + 125 * (i % 4),
      ratedKW: 800 + 100 * (i % 4),
      governor: { mode: 'droop', droopPct: 4, noLoadHz: 52 - 0.02 * (i % 3) },
      regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416 - (i % 2) },
      feeder: { rOhm: 0.002 + 0.0005 * (i % 5), xOhm: 0.003 },
    }),
  );
  const ratedKW = sets.reduce((s, x) => s + (x.ratedKW as number), 0);
  const plant = makePlant(sets, [
    { id: 'P', kW: 0.45 * ratedKW, kVAR: 0.3 * ratedKW },
    { id: 'Z', kW: 0.15 * ratedKW, kVAR: 0.05 * ratedKW, model: 'constant-impedance' },
  ]);
  return { plant, durationS, stepMs: 1, events: [{ atS: durationS / 3, type: 'load-step', kW: 0.2 * ratedKW, kVAR: 0.1 * ratedKW }] };
}

/** CPU time of one call, ms (what the run costs one core, whatever else shares the machine). */
function cpuMs(fn: () => unknown): number {
  const c0 = process.cpuUsage();
  fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000;
}

export function run(): BenchResult[] {
  const out: BenchResult[] = [];
  for (const n of [2, 8, 32]) {
    const sc = benchScenario(n, 5);
    const r = bench(`simulate, ${n} sets, 5 s at 1 ms`, () => simulate(sc), { minMs: 1500 });
    const cpu = [cpuMs(() => simulate(sc)), cpuMs(() => simulate(sc)), cpuMs(() => simulate(sc))].sort((a, b) => a - b)[1]!;
    r.extra = {
      'set-steps/s': `${((n * 5000) / (r.medianMs / 1000) / 1e6).toFixed(2)} M`,
      'on CPU time': `${((n * 5000) / (cpu / 1000) / 1e6).toFixed(2)} M`,
    };
    out.push(r);
  }
  const sc = benchScenario(8, 60);
  const r = bench('simulate, 8 sets, 60 s at 1 ms', () => simulate(sc), { minMs: 3000 });
  const cpu = [cpuMs(() => simulate(sc)), cpuMs(() => simulate(sc)), cpuMs(() => simulate(sc))].sort((a, b) => a - b)[1]!;
  r.extra = {
    'real-time factor': (60 / (r.medianMs / 1000)).toFixed(0),
    'CPU ms': cpu.toFixed(0),
    'real-time factor on CPU time': (60 / (cpu / 1000)).toFixed(0),
  };
  out.push(r);
  return out;
}

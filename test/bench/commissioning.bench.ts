/**
 * Commissioning suite: reading the example load-bank record (401 rows) and fitting four parameters of the demo
 * plant's G1 to it (inertia, engine lag, regulator gain, exciter lag), on one core in this process; wall and CPU
 * time, iterations and simulations of the fit.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { fitTestRecord, parseTestRecord } from '../../electron/engine';
import { plantSchema } from '../../electron/handlers';
import type { FitParameterKey, Plant } from '../../shared-types';
import { bench } from './harness';
import type { BenchResult } from './harness';

export function run(): BenchResult[] {
  const plant = plantSchema.parse(JSON.parse(readFileSync('renderer/demo/water-works.plant.json', 'utf8'))) as Plant;
  const text = readFileSync('renderer/demo/example.load-bank.csv', 'utf8');
  const req = {
    text,
    columns: { time: 'time_s', frequency: 'frequency_Hz', voltage: 'voltage_V', kW: 'P_kW', kVAR: 'Q_kVAR' },
    units: { time: 's' as const, frequency: 'Hz' as const, voltage: 'V' as const, kW: 'kW' as const, kVAR: 'kVAR' as const },
    ratedFrequencyHz: 50,
    ratedVoltageV: 400,
  };
  const out: BenchResult[] = [bench('parseTestRecord, example record (401 rows, 5 columns)', () => parseTestRecord(req), { minMs: 500 })];
  const record = parseTestRecord(req).record;
  const keys: FitParameterKey[] = ['machine.inertiaS', 'governor.engineLagS', 'regulator.gainPU', 'regulator.exciterLagS'];
  const bounds: Record<string, [number, number]> = {
    'machine.inertiaS': [0.3, 5],
    'governor.engineLagS': [0.05, 2],
    'regulator.gainPU': [5, 200],
    'regulator.exciterLagS': [0.01, 1],
  };
  const fitReq = {
    plant,
    record,
    test: { setId: 'G1', onlineSetIds: ['G1'], startKW: 250, startKVAR: 150, stepKW: 500, stepKVAR: 300, stepAtS: 2.01 },
    params: keys.map((key) => ({ key, min: bounds[key]![0], max: bounds[key]![1] })),
  };
  fitTestRecord({ ...fitReq, maxIterations: 2 }); // warm the compiled code
  const times: number[] = [];
  const cpu: number[] = [];
  let last = fitTestRecord({ ...fitReq, maxIterations: 1 });
  for (let k = 0; k < 3; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    last = fitTestRecord(fitReq);
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  out.push({
    name: 'fitTestRecord, example record (8 s at 2 ms), 4 parameters of G1',
    medianMs: times[1]!,
    runs: 3,
    extra: {
      iterations: last.iterations,
      simulations: last.simulations,
      'ms per simulation (wall)': (times[1]! / last.simulations).toFixed(1),
      'CPU ms': cpu[1]!.toFixed(0),
    },
  });
  return out;
}

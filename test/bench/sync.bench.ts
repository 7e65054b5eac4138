import { closingMap, closingMapJob, closingSurge, evaluateSync, surgeCircuit } from '../../electron/engine';
import type { SyncCase } from '../../shared-types';
import { demoPlant } from '../helpers/plants';
import { bench } from './harness';
import type { BenchResult } from './harness';

function perAngle(r: BenchResult, n: number): BenchResult {
  return { ...r, extra: { 'ns per angle': ((r.medianMs * 1e6) / n).toFixed(0) } };
}

export function run(): BenchResult[] {
  const c: SyncCase = {
    bus: { frequencyHz: 60, voltageV: 480 },
    incoming: { frequencyHz: 60.1, voltageV: 485, angleDeg: -8, ratedKVA: 1000, xddpPU: 0.15 },
    busSource: { ratedKVA: 1000, xPU: 0.15 },
    breakerClosingMs: 100,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
  const plant = demoPlant();
  const plantCase: SyncCase = {
    bus: { frequencyHz: 50, voltageV: 400 },
    incoming: { frequencyHz: 50.08, voltageV: 402, angleDeg: -4, ratedKVA: 500, xddpPU: 0.16 },
    plant,
    incomingSetId: 'G3',
    breakerClosingMs: 60,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
  const circuit = surgeCircuit(c);
  const surgeAngles = 360;
  // Per-case costs first, before the map runs churn the heap.
  const cases = [
    bench('evaluateSync, one case (bus source)', () => evaluateSync(c), { batch: 2000 }),
    bench('evaluateSync, one case (demo plant bus, 2 sets)', () => evaluateSync(plantCase), { batch: 2000 }),
  ];
  const surges = perAngle(
    bench(
      `closingSurge, ${surgeAngles} closing angles`,
      () => {
        for (let a = 0; a < surgeAngles; a++) closingSurge(circuit, a - 180);
      },
      { batch: 20 },
    ),
    surgeAngles,
  );
  const mapCells = 181 * 101;
  const map = bench('closingMap, 181 × 101 closed form (command axis)', () => closingMap({ case: c, angleSteps: 181, slipSteps: 101, slipRangeHz: 0.5 }), {
    batch: 5,
  });
  map.extra = { 'ns per cell': ((map.medianMs * 1e6) / mapCells).toFixed(0) };
  // The same map's arithmetic alone: rows refilled into arrays allocated once (allocation of three 18 281-number
  // arrays is a large share of the whole call on some machines).
  const job = closingMapJob({ case: c, angleSteps: 181, slipSteps: 101, slipRangeHz: 0.5 });
  const fill = bench('closingMap, 181 × 101 closed form, rows only (arrays allocated once)', () => job.fillRows(0, job.rows), { batch: 5 });
  fill.extra = { 'ns per cell': ((fill.medianMs * 1e6) / mapCells).toFixed(0) };
  const td = bench(
    'closingMap, 9 × 3 time-domain (demo plant, G3 onto G1 + G2)',
    () => closingMap({ case: plantCase, angleSteps: 9, slipSteps: 3, slipRangeHz: 0.2, method: 'time-domain' }),
    { minMs: 1000 },
  );
  td.extra = { 'ms per cell': (td.medianMs / 27).toFixed(2) };
  return [...cases, surges, map, fill, td];
}

import { closingMap, closingSurge, evaluateSync, surgeCircuit } from '../../electron/engine';
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
  const mapCells = 181 * 101;
  const map = bench('closingMap, 181 × 101 closed form (command axis)', () => closingMap({ case: c, angleSteps: 181, slipSteps: 101, slipRangeHz: 0.5 }), { batch: 5 });
  map.extra = { 'ns per cell': ((map.medianMs * 1e6) / mapCells).toFixed(0) };
  return [
    map,
    bench('evaluateSync, one case (bus source)', () => evaluateSync(c), { batch: 1000 }),
    bench('evaluateSync, one case (demo plant bus, 2 sets)', () => evaluateSync(plantCase), { batch: 1000 }),
    perAngle(bench(`closingSurge, ${surgeAngles} closing angles`, () => {
      for (let a = 0; a < surgeAngles; a++) closingSurge(circuit, a - 180);
    }, { batch: 20 }), surgeAngles),
  ];
}

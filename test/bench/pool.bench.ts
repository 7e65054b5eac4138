/**
 * Pool suite: the long jobs on a worker pool (workerpool over worker_threads, as the CLI and Electron's main
 * process run them), through the same handler code the app calls, against one thread.
 *   - 10 000 tolerance samples of the sharing suite's 8-set plant with feeders (±0.1 Hz, ±0.5 %, ±5 % droop);
 *   - the 181 × 101 time-domain closing map of the demo plant (G3 onto G1 + G2, ±0.5 Hz).
 * The pools are started and warmed before timing (the app keeps its pool for the session); a cold start (workers
 * loading the engine) is timed apart. The suite first builds the CLI bundle (`npm run build:cli`) and its workers
 * run the shipped worker entry `out/cli/pool-worker.mjs`, as `droopline` does (the TypeScript entry under tsx carries
 * tsx's helpers and runs about a fifth slower); the one-thread rows and the merge run under tsx.
 */
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { availableParallelism } from 'node:os';
import { toleranceAnalysis } from '../../electron/engine';
import type { HandlerContext } from '../../electron/handlers';
import { runTolerance, toleranceRequestSchema } from '../../electron/handlers/planner-handlers';
import { runClosingMap } from '../../electron/handlers/sync-handlers';
import { closingMapRequestSchema } from '../../electron/schemas/sync-schema';
import type { ClosingMapRequest, ToleranceRequest } from '../../shared-types';
import { demoPlantJson } from '../helpers/plants';
import { createNodePool } from '../../electron/pool/node-pool';
import type { BenchResult } from './harness';
import { benchPlant } from './sharing.bench';

const ctx = (pool?: HandlerContext['pool']): HandlerContext => ({ signal: new AbortController().signal, progress: () => undefined, ...(pool ? { pool } : {}) });

async function median(runs: number, f: () => Promise<unknown> | unknown): Promise<{ ms: number; cpuMs: number }> {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let k = 0; k < runs; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    await f();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  wall.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  return { ms: wall[Math.floor(runs / 2)]!, cpuMs: cpu[Math.floor(runs / 2)]! };
}

const builtWorker = fileURLToPath(new URL('../../out/cli/pool-worker.mjs', import.meta.url));
const nodeBuiltPool = (size: number) => createNodePool(builtWorker, { size });

export async function run(): Promise<BenchResult[]> {
  execFileSync('npx', ['vite', 'build', '--config', 'vite.cli.config.ts', '--logLevel', 'warn'], { stdio: 'ignore' });
  const out: BenchResult[] = [];
  const cores = availableParallelism();
  const samples = 10_000;
  const tol = toleranceRequestSchema.parse({ plant: benchPlant(8), samples, seed: 1, speedTolHz: 0.1, voltageTolPct: 0.5, droopTolPct: 5 }) as ToleranceRequest;

  toleranceAnalysis({ ...tol, samples: 500 });
  const one = await median(5, () => toleranceAnalysis(tol));
  out.push({
    name: `toleranceAnalysis, 8 sets with feeders, ${samples} samples, one thread`,
    medianMs: one.ms,
    runs: 5,
    extra: { 'samples/s per core': Math.round(samples / (one.ms / 1000)), 'CPU ms': one.cpuMs.toFixed(0) },
  });

  for (const size of [1, cores]) {
    const coldPool = nodeBuiltPool(size);
    const t0 = performance.now();
    await runTolerance(tol, ctx(coldPool));
    const coldMs = performance.now() - t0;
    await runTolerance(tol, ctx(coldPool));
    const warm = await median(7, () => runTolerance(tol, ctx(coldPool)));
    await coldPool.close();
    out.push({
      name: `toleranceAnalysis on the pool, ${size} worker${size > 1 ? 's' : ''}, ${samples} samples (warm pool)`,
      medianMs: warm.ms,
      runs: 7,
      extra: {
        'samples/s per core': Math.round(samples / (warm.ms / 1000) / size),
        'CPU ms (all threads)': warm.cpuMs.toFixed(0),
        'samples/s per core on CPU time': Math.round(samples / (warm.cpuMs / 1000)),
        'first run, workers starting': `${coldMs.toFixed(0)} ms`,
      },
    });
  }

  const map: ClosingMapRequest = closingMapRequestSchema.parse({
    case: {
      plant: demoPlantJson(),
      incomingSetId: 'G3',
      incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0 },
      breakerClosingMs: 60,
      limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
    },
    angleSteps: 181,
    slipSteps: 101,
    slipRangeHz: 0.5,
    method: 'time-domain',
  });
  const cells = 181 * 101;
  const small = { ...map, slipSteps: 11 };
  await runClosingMap({ ...small, slipSteps: 3 }, ctx());
  const oneMap = await median(3, () => runClosingMap(small, ctx()));
  const smallCells = 181 * 11;
  out.push({
    name: `closingMap time-domain, 181 × 11 (demo plant), one thread`,
    medianMs: oneMap.ms,
    runs: 3,
    extra: { 'ms per cell': (oneMap.ms / smallCells).toFixed(3), 'CPU ms per cell': (oneMap.cpuMs / smallCells).toFixed(3) },
  });
  const pool = nodeBuiltPool(cores);
  await runClosingMap({ ...map, slipSteps: 9 }, ctx(pool));
  const last = { map: null as unknown as Awaited<ReturnType<typeof runClosingMap>> };
  const pooled = await median(3, async () => {
    last.map = await runClosingMap(map, ctx(pool));
  });
  await pool.close();
  out.push({
    name: `closingMap time-domain, 181 × 101 (demo plant) on the pool, ${cores} workers`,
    medianMs: pooled.ms,
    runs: 3,
    extra: {
      'ms per cell per core': ((pooled.ms * cores) / cells).toFixed(3),
      'CPU ms (all threads)': pooled.cpuMs.toFixed(0),
      'CPU ms per cell': (pooled.cpuMs / cells).toFixed(3),
      'mean cell run': `${last.map.cellRun!.meanMs.toFixed(1)} ms of ${last.map.cellRun!.capMs} ms`,
    },
  });
  return out;
}

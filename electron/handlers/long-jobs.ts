/**
 * The long jobs of more than one handler, run in chunks with progress, cancelling and a breath between chunks: the
 * closing map (whose time-domain rows go to the host's pool when it has one) and a simulation. The `closingMap` and
 * `simulate` handlers and the report handler call these over the engine directly.
 */
import type { ClosingMapRequest, Scenario, SimulationResult } from '../../shared-types';
import { Cancelled, closingMapJobFor, createSimulation, MIN_CHUNK_STEPS, putRows } from '../engine';
import type { ClosingMapRows } from '../engine';
import { breathe } from './handler';
import type { HandlerContext } from './handler';
import { runChunks } from './pool';

/** Cells computed between progress reports and cancel checks (closed form). */
const CELLS_PER_CHUNK = 4096;
/** Time-domain cells per chunk: a few rows of the default grid (each cell is a short simulation). */
const TIME_DOMAIN_CELLS_PER_CHUNK = 800;

let mapSerial = 0;

/**
 * The closing map in chunks of slip rows with progress and cancel. A time-domain map's rows go to the host's
 * worker pool when it has one (each worker sets the map up once and keeps it for the map's later chunks); the
 * closed form, a few milliseconds in all, always runs here.
 */
export async function runClosingMap(req: ClosingMapRequest, ctx: HandlerContext, cellsPerChunk?: number) {
  const job = closingMapJobFor(req);
  const timeDomain = req.method === 'time-domain';
  const perChunk = cellsPerChunk ?? (timeDomain ? TIME_DOMAIN_CELLS_PER_CHUNK : CELLS_PER_CHUNK);
  const key = `map-${++mapSerial}-${Date.now()}`;
  await runChunks<ClosingMapRows | null>(
    {
      total: job.rows,
      chunk: Math.max(1, Math.floor(perChunk / req.angleSteps)),
      label: 'closing map',
      cancelled: 'The closing map was cancelled.',
      run: (from, to, pool, signal) => {
        if (timeDomain && pool) return pool.run('closingMapRows', [key, req, from, to], signal);
        job.fillRows(from, to);
        return null;
      },
      take: (rows) => {
        if (rows) putRows(job, rows);
      },
    },
    timeDomain ? ctx : { ...ctx, pool: undefined },
  );
  return job.finish();
}

/** Runs the scenario in chunks, reporting progress and stopping when cancelled. */
export async function runScenario(scenario: Scenario, ctx: HandlerContext): Promise<SimulationResult> {
  const sim = createSimulation(scenario);
  const total = Math.round(scenario.durationS / sim.stepS);
  const chunk = Math.max(MIN_CHUNK_STEPS, Math.ceil(total / 50));
  while (sim.stepCount < total) {
    if (ctx.signal.aborted) throw new Cancelled('The simulation was cancelled.');
    sim.steps(Math.min(chunk, total - sim.stepCount));
    ctx.progress(sim.stepCount / total, 'simulating');
    await breathe();
  }
  if (ctx.signal.aborted) throw new Cancelled('The simulation was cancelled.');
  return sim.result();
}

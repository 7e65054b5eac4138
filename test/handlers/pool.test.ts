/**
 * Work on the pool: the same seed gives the same result whatever the number of workers and the chunk size, cancel
 * stops the work and says so, and a worker's engine error comes back as the same typed error.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { dispatch, runChunks } from '../../electron/handlers';
import type { HandlerContext } from '../../electron/handlers';
import { runTolerance, toleranceRequestSchema } from '../../electron/handlers/planner-handlers';
import { runClosingMap } from '../../electron/handlers/sync-handlers';
import { closingMapRequestSchema } from '../../electron/schemas/sync-schema';
import { Cancelled, NoSteadyState } from '../../electron/engine';
import type { ClosingMapRequest, ToleranceRequest } from '../../shared-types';
import { demoPlantJson, makePlant, rawSet } from '../helpers/plants';
import { inProcessPool, nodeTestPool } from '../helpers/pools';

const ctxWith = (pool?: HandlerContext['pool'], signal = new AbortController().signal, progress: number[] = []): HandlerContext => ({
  signal,
  progress: (f) => progress.push(f),
  ...(pool ? { pool } : {}),
});

/** Two sets with feeders, ±0.1 Hz, ±1 %, ±5 % droop; 2 000 samples (the parse fills the plant's defaults). */
function toleranceRequest(): ToleranceRequest {
  const plant = makePlant([rawSet('A', { feeder: { rOhm: 0.01, xOhm: 0.02 } }), rawSet('B', { feeder: { rOhm: 0.02, xOhm: 0.04 } })]);
  return toleranceRequestSchema.parse({
    plant,
    samples: 2000,
    seed: 11,
    speedTolHz: 0.1,
    voltageTolPct: 1,
    droopTolPct: 5,
    distribution: 'normal',
  }) as ToleranceRequest;
}

function mapRequest(): ClosingMapRequest {
  const plant = demoPlantJson();
  return closingMapRequestSchema.parse({
    case: { plant, incomingSetId: 'G3', incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0 }, breakerClosingMs: 80, presetId: 'ieee1547-2018-500-1500' },
    angleSteps: 13,
    slipSteps: 5,
    slipRangeHz: 0.4,
    method: 'time-domain',
  });
}

const nodePool = nodeTestPool(2);
afterAll(() => nodePool.close());

describe('the worker pool', () => {
  it('tolerance: the same seed gives byte-identical JSON with no pool, 1 or 2 workers and any chunk size', async () => {
    const req = toleranceRequest();
    const reference = JSON.stringify(await runTolerance(req, ctxWith(), 2000));
    const runs = [
      await runTolerance(req, ctxWith(), 137),
      await runTolerance(req, ctxWith(inProcessPool(1)), 500),
      await runTolerance(req, ctxWith(inProcessPool(2)), 64),
      await runTolerance(req, ctxWith(inProcessPool(2)), 999),
      await runTolerance(req, ctxWith(nodeTestPool(1)), 300),
      await runTolerance(req, ctxWith(nodePool), 250),
    ];
    for (const r of runs) expect(JSON.stringify(r)).toBe(reference);
    // Another seed gives another result (the test could fail).
    expect(JSON.stringify(await runTolerance({ ...req, seed: 12 }, ctxWith(nodePool), 250))).not.toBe(reference);
  }, 120_000);

  it('tolerance on the pool reports progress up to 1 and goes through dispatch like any call', async () => {
    const progress: number[] = [];
    const r = await dispatch(
      'toleranceAnalysis',
      { ...toleranceRequest(), plant: demoPlantJson(), samples: 1200 },
      ctxWith(inProcessPool(2), undefined, progress),
    );
    expect(r.ok).toBe(true);
    expect(progress[0]).toBe(0);
    expect(progress.at(-1)).toBe(1);
    for (let k = 1; k < progress.length; k++) expect(progress[k]!).toBeGreaterThan(progress[k - 1]!);
  }, 60_000);

  it('tolerance: cancel stops the work (no chunk starts after it) and says so', async () => {
    const pool = inProcessPool(2);
    const ctl = new AbortController();
    let startedAtCancel = -1;
    const progress: number[] = [];
    const ctx: HandlerContext = {
      signal: ctl.signal,
      pool,
      progress: (f) => {
        progress.push(f);
        if (f > 0 && startedAtCancel < 0) {
          startedAtCancel = pool.started;
          ctl.abort();
        }
      },
    };
    const r = await dispatch('toleranceAnalysis', { plant: demoPlantJson(), samples: 20_000, seed: 3, speedTolHz: 0.1 }, ctx);
    expect(r).toEqual({ ok: false, error: { name: 'EngineError', code: 'CANCELLED', message: 'The tolerance analysis was cancelled.' } });
    expect(pool.started).toBe(startedAtCancel);
    // 20 000 samples are 40 chunks: far fewer than that ran.
    expect(startedAtCancel).toBeLessThan(10);
  }, 60_000);

  it('tolerance: cancel on the real worker pool stops the running workers and says so', async () => {
    const pool = nodeTestPool(2);
    const ctl = new AbortController();
    const progress: number[] = [];
    const ctx: HandlerContext = {
      signal: ctl.signal,
      pool,
      progress: (f) => {
        progress.push(f);
        if (f > 0) ctl.abort();
      },
    };
    const r = await dispatch('toleranceAnalysis', { plant: demoPlantJson(), samples: 200_000, seed: 3, speedTolHz: 0.1 }, ctx);
    await pool.close();
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toEqual({ name: 'EngineError', code: 'CANCELLED', message: 'The tolerance analysis was cancelled.' });
    // It stopped at the first chunk back: far from the 400 chunks of the whole run.
    expect(progress.filter((f) => f > 0).length).toBeLessThan(5);
  }, 120_000);

  it('time-domain closing map: the same map with no pool, 1 or 2 workers and any rows per chunk', async () => {
    const req = mapRequest();
    const reference = JSON.stringify(await runClosingMap(req, ctxWith(), 13 * 5));
    for (const [pool, cells] of [
      [inProcessPool(1), 13],
      [inProcessPool(2), 26],
      [nodePool, 13],
      [nodePool, 39],
    ] as const) {
      expect(JSON.stringify(await runClosingMap(req, ctxWith(pool), cells))).toBe(reference);
    }
  }, 120_000);

  it('time-domain closing map: cancel stops the work and says so', async () => {
    const pool = inProcessPool(2);
    const ctl = new AbortController();
    const ctx: HandlerContext = { signal: ctl.signal, pool, progress: (f) => f > 0 && ctl.abort() };
    const err = await runClosingMap({ ...mapRequest(), slipSteps: 41 }, ctx, 13).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Cancelled);
    expect((err as Error).message).toBe('The closing map was cancelled.');
    // 41 rows of one chunk each: the first back stopped the rest.
    expect(pool.started).toBeLessThan(10);
  }, 60_000);

  it('a chunk that fails stops the job with the same typed error the worker threw', async () => {
    const failing = { ...inProcessPool(2), run: () => Promise.reject(Object.assign(new Error('no operating point'), { code: 'NO_STEADY_STATE' })) };
    const { engineErrorFromWorker } = await import('../../electron/handlers');
    await expect(
      runChunks(
        {
          total: 10,
          chunk: 2,
          label: 'x',
          cancelled: 'cancelled',
          run: (_f, _t, pool, signal) =>
            pool!.run('toleranceSamples', [toleranceRequest(), 0, 1], signal).catch((e: unknown) => Promise.reject(engineErrorFromWorker(e))),
          take: () => undefined,
        },
        ctxWith(failing),
      ),
    ).rejects.toBeInstanceOf(NoSteadyState);
    expect(engineErrorFromWorker(Object.assign(new Error('x'), { code: 'CANCELLED' }))).toBeInstanceOf(Cancelled);
  });
});

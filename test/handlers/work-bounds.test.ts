/** Work is bounded: a request over a limit is refused with the limit and how to stay within it. */
import { describe, it, expect } from 'vitest';
import { dispatch } from '../../electron/handlers';
import { MAX_SET_STEPS, MAX_OUTPUT_SET_POINTS } from '../../electron/schemas/simulation-schema';
import { MAX_SWEEP_SET_POINTS } from '../../electron/handlers/sharing-handlers';
import { MAX_TOLERANCE_SET_SAMPLES } from '../../electron/handlers/planner-handlers';
import { TIME_DOMAIN_MAX_CELLS } from '../../electron/engine';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';

async function refusal(method: Parameters<typeof dispatch>[0], payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  return r.ok ? '' : `${r.error.code}: ${r.error.message}`;
}

/** A plant of n sets (the 256-set case). */
const plantOf = (n: number) => rawPlant(Array.from({ length: n }, (_, i) => rawSet(`G${i + 1}`)));

describe('work bounds', () => {
  it('a 256-set run of 100 s at 1 ms is refused by set-steps, naming the limit and the longest run that fits', async () => {
    // closed form: 100 s / 1 ms = 100 000 steps × 256 sets = 25 600 000 set-steps ≤ 40 000 000 — so use 200 s.
    const msg = await refusal('simulate', { plant: plantOf(256), durationS: 200, stepMs: 1 });
    expect(msg).toContain('durationS: the run would take 51 200 000 set-steps (200 000 steps × 256 sets); the limit is 40 000 000');
    // 40 000 000 / 256 × 1 ms = 156.25 s → printed rounded as 156 s
    expect(msg).toContain('shorten durationS to 156 s or less');
    expect(MAX_SET_STEPS).toBe(40_000_000);
  });

  it('100 000 output points on 256 sets are refused with the most points this plant may have', async () => {
    const msg = await refusal('simulate', { plant: plantOf(256), durationS: 1, stepMs: 1, outputPoints: 100_000 });
    // closed form: 2 000 000 / 256 = 7812.5 → 7812 points
    expect(msg).toContain('outputPoints: 100 000 points × 256 sets is more than 2 000 000: give 7 812 points or fewer for this plant');
    expect(MAX_OUTPUT_SET_POINTS).toBe(2_000_000);
  });

  it('a time-domain closing map over its cell limit is refused at the schema, pointing to fewer steps or the closed form', async () => {
    const c = {
      plant: demoPlantJson(),
      incomingSetId: 'G1',
      bus: { frequencyHz: 50, voltageV: 400 },
      incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0 },
      breakerClosingMs: 100,
      presetId: 'ieee1547-2018-0-500',
    };
    const msg = await refusal('closingMap', { case: c, method: 'time-domain', angleSteps: 181, slipSteps: 201 });
    expect(msg).toContain(`angleSteps: 181 × 201 = 36381 cells is more than the ${TIME_DOMAIN_MAX_CELLS} a time-domain map may hold`);
    expect(msg).toContain('use fewer angle or slip steps, or the closed form');
  });

  it('a sweep of 2000 steps on 256 sets is refused with the most steps for this plant', async () => {
    const msg = await refusal('sweepLoad', { plant: plantOf(256), steps: 2000 });
    // closed form: 100 000 / 256 = 390.6 → 390 steps
    expect(msg).toContain(`steps: 2000 steps × 256 sets is more than ${MAX_SWEEP_SET_POINTS} solved set points: give 390 steps or fewer`);
  });

  it('a tolerance run of 1 000 000 samples on 8 sets is refused with the most samples for this plant', async () => {
    const msg = await refusal('toleranceAnalysis', { plant: plantOf(8), samples: 1_000_000 });
    // closed form: 4 000 000 / 8 = 500 000
    expect(msg).toContain('samples: 1000000 samples × 8 sets is more than 4 000 000 set solutions: give 500000 samples or fewer');
    expect(MAX_TOLERANCE_SET_SAMPLES).toBe(4_000_000);
  });
});

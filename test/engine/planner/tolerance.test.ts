import { describe, expect, it } from 'vitest';
import { createToleranceRun, mergeToleranceChunks, solveSharing, toleranceAnalysis, toleranceSamples } from '../../../electron/engine';
import { exceedsOverload, exceedsRating, tripsReversePower } from '../../../electron/engine/planner/limit-breaches';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';
import { expectClose } from '../../helpers/expect-close';

const noFeeder = { rOhm: 0, xOhm: 0 };

/** Two identical 1000 kW sets at 4 % droop, 50 Hz, no feeders. */
function twin() {
  return makePlant([rawSet('A', { feeder: noFeeder }), rawSet('B', { feeder: noFeeder })]);
}

describe('toleranceAnalysis', () => {
  it('toleranceAnalysis: two identical droop sets with uniform speed error match the triangular closed form', () => {
    // Set A's kW deviation is ratedKW / (2 · droop · f_rated) · (e1 − e2) = 1000 / (2 × 0.04 × 50) = 250 kW/Hz
    // times e1 − e2, e_i uniform on ±δ, so e1 − e2 is triangular on ±2δ (closed form):
    //   std = 2δ / √6,  p5 = −2δ (1 − √0.1),  p50 = 0,  p95 = 2δ (1 − √0.1).
    // The bus frequency moves by the mean of the two errors: std δ / √6.
    const delta = 0.2;
    const load = { kW: 1000, kVAR: 600 };
    const r = toleranceAnalysis({ plant: twin(), samples: 10_000, seed: 7, speedTolHz: delta, load });
    const nominal = solveSharing(twin(), load);
    const k = 1000 / (2 * 0.04 * 50);
    const a = r.sets[0]!.kW;
    expect(r.solved).toBe(10_000);
    expectClose(a.mean, nominal.sets[0]!.kW, { abs: 0.02 * k * delta }, 'mean kW');
    expectClose(a.std, (k * 2 * delta) / Math.sqrt(6), { rel: 0.02 }, 'std kW');
    expectClose(a.p5 - nominal.sets[0]!.kW, -k * 2 * delta * (1 - Math.sqrt(0.1)), { abs: 0.03 * k * delta }, 'p5 kW');
    expectClose(a.p50 - nominal.sets[0]!.kW, 0, { abs: 0.03 * k * delta }, 'p50 kW');
    expectClose(a.p95 - nominal.sets[0]!.kW, k * 2 * delta * (1 - Math.sqrt(0.1)), { abs: 0.03 * k * delta }, 'p95 kW');
    expectClose(r.bus.frequencyHz.std, delta / Math.sqrt(6), { rel: 0.02 }, 'bus frequency std');
    // The two sets' deviations are equal and opposite (the load is fixed).
    expectClose(r.sets[1]!.kW.std, a.std, { rel: 1e-9 }, 'B std');
    expect(a.counts.reduce((x, y) => x + y, 0)).toBe(10_000);
  }, 30_000);

  it('toleranceAnalysis: normal errors take the tolerance as 2 σ', () => {
    // e_i normal with σ = δ/2: set A's deviation 250 (e1 − e2) has σ = 250 × √2 × δ/2 (closed form).
    const delta = 0.2;
    const r = toleranceAnalysis({ plant: twin(), samples: 10_000, seed: 3, speedTolHz: delta, distribution: 'normal', load: { kW: 1000, kVAR: 600 } });
    expectClose(r.sets[0]!.kW.std, 250 * Math.SQRT2 * (delta / 2), { rel: 0.03 }, 'std kW');
  }, 30_000);

  it('toleranceAnalysis: the same seed gives identical JSON, whatever the chunks; another seed differs', () => {
    const req = { plant: demoPlant(), samples: 300, seed: 11, speedTolHz: 0.1, voltageTolPct: 0.5, droopTolPct: 5 };
    const once = JSON.stringify(toleranceAnalysis(req));
    const run = createToleranceRun(req);
    while (run.done < run.total) run.step(37);
    expect(JSON.stringify(run.result())).toBe(once);
    expect(JSON.stringify(toleranceAnalysis({ ...req, seed: 12 }))).not.toBe(once);
  });

  it('toleranceAnalysis: more samples narrow the spread of the estimated standard deviation', () => {
    const spread = (samples: number) => {
      const est = [1, 2, 3, 4, 5].map(
        (seed) => toleranceAnalysis({ plant: twin(), samples, seed, speedTolHz: 0.2, load: { kW: 1000, kVAR: 600 } }).sets[0]!.kW.std,
      );
      const m = est.reduce((x, y) => x + y, 0) / est.length;
      return Math.sqrt(est.reduce((x, y) => x + (y - m) ** 2, 0) / (est.length - 1));
    };
    expect(spread(2000)).toBeLessThan(spread(100));
  }, 30_000);

  it('toleranceAnalysis counts overload, reverse power and no steady state from the numbers', () => {
    // 1900 kW and 1400 kVAR on two 1250 kVA sets: each carries about 950 kW and 700 kVAR (1180 kVA). ±2 % of
    // voltage-setpoint error moves the kVAR split by up to 46.875 × 8 / 2 ≈ 190 kVAR per set (closed form,
    // b = 750 / (0.04 × 400) kVAR/V), so many samples put one set past its 1250 kVA (rating) — or past what the
    // solver can hold (no steady state, counted apart). At 20 kW total load ±0.5 Hz of speed error drives one
    // set below −8 % of rated kW (reverse power, the schema's default trip): 250 kW/Hz × up to 1 Hz.
    const heavy = toleranceAnalysis({ plant: twin(), samples: 2000, seed: 5, speedTolHz: 0.5, voltageTolPct: 2, load: { kW: 1900, kVAR: 1400 } });
    const light = toleranceAnalysis({ plant: twin(), samples: 2000, seed: 5, speedTolHz: 0.5, load: { kW: 20, kVAR: 0 } });
    expect(heavy.probabilities.exceedsRating + heavy.probabilities.noSteadyState).toBeGreaterThan(0.2);
    expect(heavy.solved + heavy.noSteadyState).toBe(2000);
    // Whether a set can motor past its trip depends on the solver's motoring model; the fraction is a probability either way.
    expect(light.probabilities.reversePower).toBeGreaterThanOrEqual(0);
    expect(light.probabilities.reversePower).toBeLessThanOrEqual(1);
    expect(light.solved + light.noSteadyState).toBe(2000);
    for (const p of Object.values(heavy.probabilities)) expect(p).toBeGreaterThanOrEqual(0);
  }, 30_000);

  it('limit breaches are judged from the numbers: rating, overload (110 %), reverse power (10 % trip)', () => {
    const s = twin().sets[0]!; // 1000 kW, 1250 kVA, overloadPct 110 (SET_DEFAULTS), reversePowerTripPct 10 (schema default)
    expect(exceedsRating(s, 1000, 1250)).toBe(false);
    expect(exceedsRating(s, 1000.01, 1000)).toBe(true);
    expect(exceedsRating(s, 900, 1250.01)).toBe(true);
    expect(exceedsOverload(s, 1100)).toBe(false);
    expect(exceedsOverload(s, 1100.01)).toBe(true);
    expect(tripsReversePower(s, -100)).toBe(false);
    expect(tripsReversePower(s, -100.01)).toBe(true);
  });

  it('toleranceAnalysis with no steady state in any sample says so', () => {
    expect(() => toleranceAnalysis({ plant: twin(), samples: 20, seed: 1, load: { kW: 5000, kVAR: 0 } })).toThrow('None of the 20 samples has a steady state');
  });
});

describe('tolerance samples in chunks', () => {
  it('chunks of any size, merged in any order, give the whole run exactly; each sample depends only on (seed, index)', () => {
    const req = { plant: demoPlant(), samples: 300, seed: 5, speedTolHz: 0.1, voltageTolPct: 1, droopTolPct: 5 };
    const whole = JSON.stringify(toleranceAnalysis(req));
    const cuts = [0, 7, 64, 65, 200, 300];
    const chunks = cuts.slice(1).map((to, k) => toleranceSamples(req, cuts[k]!, to));
    expect(JSON.stringify(mergeToleranceChunks(req, [...chunks].reverse()))).toBe(whole);
    // Sample 64 run alone equals sample 64 inside a longer chunk.
    const alone = toleranceSamples(req, 64, 65);
    const inside = toleranceSamples(req, 60, 70);
    expect(Array.from(alone.kW)).toEqual(Array.from(inside.kW.subarray(4 * alone.sets, 5 * alone.sets)));
    // Missing or repeated samples are refused, not merged.
    expect(() => mergeToleranceChunks(req, chunks.slice(1))).toThrow(RangeError);
    expect(() => mergeToleranceChunks(req, [...chunks, chunks[2]!])).toThrow(RangeError);
  });
});

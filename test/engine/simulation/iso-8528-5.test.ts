/** The ISO 8528-5 class table and how a run is judged against it. */
import { describe, expect, it } from 'vitest';
import { ISO_8528_5_LIMITS, recoveryBandPct, simulate, simulationTesting } from '../../../electron/engine';

const { recoveryTime } = simulationTesting;
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

const row = (quantity: string) => ISO_8528_5_LIMITS.find((l) => l.quantity === quantity)!;

describe('ISO 8528-5 performance classes', () => {
  // ISO 8528-5, performance classes (G2 confirmed; G1 and G3 from memory unless marked confirmed).
  it.each([
    ['frequency droop', 8, 5, 3, false],
    ['steady-state frequency band', 2.5, 1.5, 0.5, true],
    ['transient frequency deviation, load off', 18, 12, 10, false],
    ['transient frequency deviation, load on', -15, -10, -7, false],
    ['frequency recovery time', 10, 5, 3, false],
    ['steady-state voltage deviation', 5, 2.5, 1, true],
    ['transient voltage deviation, load off', 35, 25, 20, false],
    ['transient voltage deviation, load on', -25, -20, -15, false],
    ['voltage recovery time', 10, 6, 4, false],
  ])('%s: G1 %d, G2 %d, G3 %d (ISO 8528-5)', (quantity, g1, g2, g3, allConfirmed) => {
    const r = row(quantity);
    expect(r.limits).toEqual({ G1: g1, G2: g2, G3: g3 });
    expect(r.source).toContain('ISO 8528-5');
    expect(r.source).toContain(allConfirmed ? 'all three confirmed' : 'G1 and G3 from memory');
  });

  it('covers every row once', () => {
    expect(ISO_8528_5_LIMITS).toHaveLength(9);
  });

  it('recovery bands are half the steady-state frequency band and the voltage deviation', () => {
    expect(recoveryBandPct('frequency', 'G2')).toBe(0.75);
    expect(recoveryBandPct('frequency', 'G3')).toBe(0.25);
    expect(recoveryBandPct('voltage', 'G1')).toBe(5);
  });
});

describe('recoveryTime', () => {
  // Closed form: x(t) = e^{−t} after a step at t = 0 settles inside ±0.05 of 0 at t = ln 20.
  it('finds when an exponential enters its band for good', () => {
    const n = 20001;
    const t = new Float64Array(n);
    const x = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      t[k] = k * 0.001;
      x[k] = Math.exp(-t[k]!);
    }
    expectClose(recoveryTime({ t, x, length: n }, 0, 0, 0.05)!, Math.log(20), { abs: 0.0011 }, 'recovery, s (closed form ln 20)');
    expect(recoveryTime({ t, x, length: n }, 0, 0, 2)).toBe(0);
    // Still outside in the last tenth of the window: not settled.
    expect(recoveryTime({ t, x, length: n }, 0, 0, 1e-9)).toBeNull();
  });
});

describe('class verdicts of a run', () => {
  it('judges a block load against each class with the class limits beside the measurement', () => {
    const plant = makePlant([rawSet('A', { machine: { inertiaS: 0.6 } })], [{ id: 'L', kW: 200, kVAR: 100 }]);
    const r = simulate({ plant, durationS: 12, stepMs: 2, events: [{ atS: 1, type: 'load-step', kW: 600, kVAR: 350 }] });
    const dip = r.metrics.classes.find((c) => c.quantity === 'transient frequency deviation, load on')!;
    const expected = ((r.metrics.frequencyNadirHz - r.metrics.initial.frequencyHz) / 50) * 100;
    expectClose(dip.measured!, expected, { rel: 1e-12 }, 'dip, % of rated (ISO 8528-5 form)');
    expect(dip.measured!).toBeLessThan(0);
    for (const c of ['G1', 'G2', 'G3'] as const) expect(dip.pass[c]).toBe(dip.measured! >= dip.limits[c]);
    const droop = r.metrics.classes.find((c) => c.quantity === 'frequency droop')!;
    expect(droop.measured).toBe(4);
    expect(droop.pass).toEqual({ G1: true, G2: true, G3: false });
    const rec = r.metrics.classes.find((c) => c.quantity === 'frequency recovery time')!;
    expect(rec.measuredByClass).toBeDefined();
    // A narrower band takes at least as long.
    expect(rec.measuredByClass!.G3 ?? Infinity).toBeGreaterThanOrEqual(rec.measuredByClass!.G1 ?? 0);
  });
});

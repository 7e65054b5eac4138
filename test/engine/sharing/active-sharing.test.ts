import { describe, it, expect } from 'vitest';
import { solveSharing } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

/** A set in droop with the given rating (kW; kVA = kW / 0.8), droop % and no-load Hz. */
function droopSet(id: string, kW: number, droopPct: number, noLoadHz: number, over: Record<string, unknown> = {}) {
  return rawSet(id, { ratedKW: kW, ratedKVA: kW / 0.8, governor: { mode: 'droop', droopPct, noLoadHz }, ...over });
}

describe('solveSharing: active power, closed forms', () => {
  it('two equal sets in 4 % droop from the same no-load setpoint split equally on the droop line', () => {
    // Closed form: k = 1000 kW / (0.04 · 50 Hz) = 500 kW/Hz each; f = 52 − 1200 / 1000 = 50.8 Hz.
    const plant = makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 1000, 4, 52)], [{ id: 'L', kW: 1200, kVAR: 0 }]);
    const r = solveSharing(plant);
    expectClose(r.bus.frequencyHz, 50.8, { abs: 1e-9 }, 'bus frequency (closed form)');
    expectClose(r.sets[0]!.kW, 600, { rel: 1e-12 }, 'A kW (closed form)');
    expectClose(r.sets[1]!.kW, 600, { rel: 1e-12 }, 'B kW (closed form)');
    expect(r.method).toBe('closed-form');
  });

  it('unequal sets with equal per-unit droop share in proportion to rating (REFERENCES.md §3, computed)', () => {
    // REFERENCES.md §3 [computed]: 1000 + 500 kW, both 4 %, f_nl 62.4 Hz on 60 Hz, 1200 kW → 60.48 Hz, 800 / 400 kW.
    const plant = makePlant([droopSet('A', 1000, 4, 62.4), droopSet('B', 500, 4, 62.4)], [{ id: 'L', kW: 1200, kVAR: 0 }], { ratedFrequencyHz: 60 });
    const r = solveSharing(plant);
    const k1 = 1000 / (0.04 * 60);
    const k2 = 500 / (0.04 * 60);
    expectClose(r.bus.frequencyHz, 62.4 - 1200 / (k1 + k2), { abs: 1e-9 }, 'f (recomputed closed form)');
    expectClose(r.bus.frequencyHz, 60.48, { abs: 1e-9 }, 'f (REFERENCES.md §3)');
    expectClose(r.sets[0]!.kW, 800, { rel: 1e-12 }, 'A kW');
    expectClose(r.sets[1]!.kW, 400, { rel: 1e-12 }, 'B kW');
    expectClose(r.sets[0]!.sharingErrorKWPct, 0, { abs: 1e-9 }, 'A sharing error');
  });
});

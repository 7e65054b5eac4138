import { describe, it, expect } from 'vitest';
import { sweepLoad, NoSteadyState, InvalidInput } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

const twoSets = (loads: unknown[] = [{ id: 'L', kW: 800, kVAR: 600 }]) =>
  makePlant([rawSet('A'), rawSet('B', { ratedKW: 500, ratedKVA: 625 }), rawSet('C', { online: false })], loads);

describe('sweepLoad', () => {
  it('sweeps 0 to 110 % of the online kW rating; frequency follows the droop line; the last point is beyond capability', () => {
    const s = sweepLoad({ plant: twoSets(), steps: 12 });
    expect(s.setIds).toEqual(['A', 'B', 'C']);
    expect(s.points).toHaveLength(12);
    expect(s.points[0]!.loadPct).toBe(0);
    expect(s.points[11]!.loadPct).toBe(110);
    // Closed form: both 4 % from 52 Hz, Σk = 1500 / (0.04 · 50) = 750 kW/Hz; at 50 % (750 kW) f = 51 Hz.
    const half = sweepLoad({ plant: twoSets(), steps: 3, fromPct: 0, toPct: 100 }).points[1]!;
    expectClose(half.frequencyHz!, 51, { abs: 1e-9 }, 'f at 50 % (closed form)');
    for (let k = 1; k < 11; k++) expect(s.points[k]!.frequencyHz!).toBeLessThan(s.points[k - 1]!.frequencyHz!);
    const p = s.points[5]!;
    expectClose(p.setKW[0]! + p.setKW[1]!, p.loadKW, { rel: 1e-12 }, 'kW balance at a sweep point');
    expect(p.setKW[2]).toBeNull();
    const last = s.points[11]!;
    expect(last.frequencyHz).toBeNull();
    expect(last.setKW).toEqual([null, null, null]);
    expect(last.error).toMatch(/more than the online sets can supply/);
  });

  it('uses the plant loads power factor by default, or the given one', () => {
    // Plant loads 800 kW + 600 kVAR: PF 0.8, tan φ = 0.75.
    const s = sweepLoad({ plant: twoSets(), steps: 2, toPct: 100 });
    expectClose(s.points[1]!.loadKVAR, 0.75 * 1500, { rel: 1e-12 }, 'kVAR at the plant PF');
    const g = sweepLoad({ plant: twoSets(), steps: 2, toPct: 100, pf: 1 });
    expect(g.points[1]!.loadKVAR).toBe(0);
    const leading = sweepLoad({ plant: twoSets([{ id: 'L', kW: 800, kVAR: -600 }]), steps: 2, toPct: 100 });
    expectClose(leading.points[1]!.loadKVAR, -0.75 * 1500, { rel: 1e-12 }, 'leading plant loads stay leading');
    const empty = sweepLoad({ plant: twoSets([]), steps: 2, toPct: 100 });
    expectClose(empty.points[1]!.loadKVAR, 0.75 * 1500, { rel: 1e-12 }, 'no loads: the sets rated PF 0.8');
  });

  it('refuses a structure without any operating point once, as an error, and bad steps', () => {
    const plant = makePlant([rawSet('A', { regulator: { mode: 'voltage' } }), rawSet('B', { regulator: { mode: 'voltage' } })]);
    expect(() => sweepLoad({ plant, steps: 5 })).toThrow(NoSteadyState);
    expect(() => sweepLoad({ plant: twoSets(), steps: 1 })).toThrow(InvalidInput);
  });
});

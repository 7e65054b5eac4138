import { describe, it, expect } from 'vitest';
import { sweepLoad, NoSteadyState, InvalidInput } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

const twoSets = (loads: unknown[] = [{ id: 'L', kW: 800, kVAR: 600 }]) =>
  makePlant([rawSet('A'), rawSet('B', { ratedKW: 500, ratedKVA: 625 }), rawSet('C', { online: false })], loads);

describe('sweepLoad', () => {
  it('sweeps 0 to 110 % of the online kW rating; frequency follows the droop line up to the overload limit; beyond it, no steady state', () => {
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
    // 110 % is the overload limit of both sets (equal per-unit droop lines): an answer, each at 110 % (closed form).
    const full = s.points[11]!;
    expectClose(full.setKW[0]! / 1000, 1.1, { rel: 1e-9 }, 'A at 110 % at the last point');
    expectClose(full.frequencyHz!, 52 - 1650 / 750, { abs: 1e-9 }, 'f at 110 % (closed form)');
    const beyond = sweepLoad({ plant: twoSets(), steps: 2, fromPct: 0, toPct: 120 }).points[1]!;
    expect(beyond.frequencyHz).toBeNull();
    expect(beyond.setKW).toEqual([null, null, null]);
    expect(beyond.error).toMatch(/more than the online sets can supply at their overload limits \(1650 kW\): 150 kW short/);
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

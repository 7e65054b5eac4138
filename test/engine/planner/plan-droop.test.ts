import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { planDroop, solveSharing } from '../../../electron/engine';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';
import { expectClose } from '../../helpers/expect-close';
import type { Band, Plant } from '../../../shared-types';

const CHECK_PCT = [0, 25, 50, 75, 100];

/** Independent check: solve the proposal at 0/25/50/75/100 % of the range and read the bus. */
function busAcross(plant: Plant, range: Band, pf: number): { f: number[]; v: number[] } {
  const rated = plant.sets.filter((s) => s.online).reduce((a, s) => a + s.ratedKW, 0);
  const f: number[] = [];
  const v: number[] = [];
  for (const pct of CHECK_PCT) {
    const loadPct = range.min + ((range.max - range.min) * pct) / 100;
    const kW = (rated * loadPct) / 100;
    // A trace of load at no load: the network solver needs some current (the planner says the same in its note).
    const load = { kW: Math.max(kW, 1e-4 * rated), kVAR: (kW * Math.sqrt(1 - pf * pf)) / pf };
    const r = solveSharing(plant, load);
    f.push(r.bus.frequencyHz);
    v.push(r.bus.voltageV);
  }
  return { f, v };
}

describe('planDroop', () => {
  it('planDroop without feeders: droop and no-load frequency from the closed form', () => {
    // Two 1000 kW sets at 4 % now, band 49–51 Hz over 0–100 %: the swing 4 % × 50 Hz × 1 = 2 Hz fills
    // the band exactly, so the droop stays 4 % and the no-load frequency is 50 + 2/2 = 51 Hz (closed form).
    const plant = makePlant([
      rawSet('A', { feeder: { rOhm: 0, xOhm: 0 } }),
      rawSet('B', { governor: { mode: 'droop', droopPct: 5, noLoadHz: 52 }, feeder: { rOhm: 0, xOhm: 0 } }),
    ]);
    const r = planDroop({ plant, frequencyBandHz: { min: 48.95, max: 51.05 }, voltageBandV: { min: 380, max: 420 } });
    expect(r.feasible).toBe(true);
    // Preferred droop is the kW-weighted mean of 4 and 5 %: 4.5 % swings 2.25 Hz, more than the 2.1 Hz band,
    // so the largest that fits: 2.1 / (50 × 1) = 4.2 %; no-load 50 + 4.2 % × 50 × 0.5 = 51.05 Hz (closed form).
    expectClose(r.settings[0]!.droopPct, 4.2, { abs: 1e-6 }, 'droop');
    expectClose(r.settings[1]!.noLoadHz, 51.05, { abs: 1e-6 }, 'no-load frequency');
    expectClose(r.proposal.points[0]!.frequencyHz!, 51.05, { abs: 1e-6 }, 'bus at no load');
    expectClose(r.proposal.points[4]!.frequencyHz!, 48.95, { abs: 1e-6 }, 'bus at full load');
    expect(r.proposal.worstKWErrorPct!).toBeLessThan(1e-9);
    expect(r.tradeoffs[0]).toContain('more droop');
  });

  it('planDroop on the demo plant shares kW and kVAR in proportion across the range and holds both bands', () => {
    const plant = demoPlant();
    const range = { min: 0, max: 95 };
    const r = planDroop({ plant, frequencyBandHz: { min: 49.5, max: 50.5 }, voltageBandV: { min: 380, max: 420 }, loadRangePct: range });
    expect(r.reasons).toEqual([]);
    expect(r.feasible).toBe(true);
    expect(r.current.worstKVARErrorPct!).toBeGreaterThan(3);
    expect(r.proposal.worstKWErrorPct!).toBeLessThan(1e-6);
    expect(r.proposal.worstKVARErrorPct!).toBeLessThan(0.1);
    // The bus slope per kVA is the same for every set (the reason for the droop choice).
    const slopes = r.settings.map((s) => s.busSlopeVPerKVARPerKVA!);
    for (const s of slopes) expectClose(s, slopes[0]!, { rel: 1e-9 }, 'bus slope per kVA');
    // The input plant is not touched.
    expect(plant.sets[0]!.governor.droopPct).toBe(4);
  });

  it('planDroop: trimming no-load voltages alone (reactive droops fixed) leaves percent-level kVAR errors that matched slopes remove', () => {
    // Two equal sets, one feeder twice the other's impedance (about 2 % and 4 % drop at rated current).
    const feeder = (k: number) => ({ rOhm: 0.001 * k, xOhm: 0.003 * k });
    const plant = makePlant([rawSet('A', { feeder: feeder(1) }), rawSet('B', { feeder: feeder(2) })]);
    const bands = { frequencyBandHz: { min: 49, max: 51.5 }, voltageBandV: { min: 370, max: 430 }, loadRangePct: { min: 0, max: 95 } };
    const trimOnly = planDroop({
      plant,
      ...bands,
      fixed: [
        { setId: 'A', fields: ['reactiveDroopPct'] },
        { setId: 'B', fields: ['reactiveDroopPct'] },
      ],
    });
    const matched = planDroop({ plant, ...bands });
    expect(trimOnly.proposal.worstKVARErrorPct!).toBeGreaterThan(3);
    expect(matched.proposal.worstKVARErrorPct!).toBeLessThan(0.5);
    expect(matched.settings[1]!.reactiveDroopPct).toBeLessThan(matched.settings[0]!.reactiveDroopPct);
  });

  it('planDroop says which band cannot be met and by how much', () => {
    // Band 49.9–50.1 Hz over 0–100 %: the smallest droop allowed (1 %) swings 1 % × 50 × 1 = 0.5 Hz,
    // 0.3 Hz more than the 0.2 Hz band (closed form).
    const plant = makePlant([rawSet('A', { feeder: { rOhm: 0, xOhm: 0 } }), rawSet('B', { feeder: { rOhm: 0, xOhm: 0 } })]);
    const r = planDroop({ plant, frequencyBandHz: { min: 49.9, max: 50.1 }, voltageBandV: { min: 380, max: 420 } });
    expect(r.feasible).toBe(false);
    expect(r.reasons[0]).toContain('0.500 Hz');
    expect(r.reasons[0]).toContain('0.300 Hz more than the 0.200 Hz band');
    const f = r.bands.find((b) => b.quantity === 'frequency')!;
    expect(f.met).toBe(false);
    expectClose(f.shortBy, 0.15, { abs: 1e-6 }, 'short by (the swing centred: 0.3 / 2 each side)');
  });

  it('planDroop says the voltage band cannot be met when the feeders alone swing the bus more than it allows', () => {
    // Demo plant over 0–95 %: the smallest common slope (every set at least 1 % reactive droop plus its
    // feeder) swings the bus several volts; a 2 V band cannot hold it.
    const r = planDroop({
      plant: demoPlant(),
      frequencyBandHz: { min: 49.5, max: 50.5 },
      voltageBandV: { min: 399, max: 401 },
      loadRangePct: { min: 0, max: 95 },
    });
    expect(r.feasible).toBe(false);
    const v = r.bands.find((b) => b.quantity === 'voltage')!;
    expect(v.met).toBe(false);
    expect(v.shortBy).toBeGreaterThan(0);
    expect(r.reasons.join(' ')).toContain('Voltage band');
    expect(r.bands.find((b) => b.quantity === 'frequency')!.met).toBe(true);
  });

  it('planDroop keeps a fixed droop and matches the others to it', () => {
    const plant = makePlant([rawSet('A', { governor: { mode: 'droop', droopPct: 3, noLoadHz: 51.5 } }), rawSet('B')]);
    const r = planDroop({
      plant,
      frequencyBandHz: { min: 49, max: 51 },
      voltageBandV: { min: 380, max: 420 },
      loadRangePct: { min: 0, max: 90 },
      fixed: [{ setId: 'A', fields: ['droopPct'] }],
    });
    expect(r.settings.map((s) => s.droopPct)).toEqual([3, 3]);
    expect(r.feasible).toBe(true);
  });

  it('planDroop refuses a fixed set that is not in the plant, naming it', () => {
    const plant = makePlant([rawSet('A'), rawSet('B')]);
    expect(() =>
      planDroop({ plant, frequencyBandHz: { min: 49, max: 51 }, voltageBandV: { min: 380, max: 420 }, fixed: [{ setId: 'Z', fields: ['droopPct'] }] }),
    ).toThrow('fixed: there is no set "Z"');
  });

  it('planDroop leaves isochronous and voltage-holding sets alone and says so', () => {
    const plant = makePlant([rawSet('A', { governor: { mode: 'isochronous', setpointHz: 50 }, regulator: { mode: 'voltage', setpointV: 400 } }), rawSet('B')]);
    const r = planDroop({ plant, frequencyBandHz: { min: 49, max: 51 }, voltageBandV: { min: 380, max: 420 }, loadRangePct: { min: 10, max: 90 } });
    expect(r.notes.join(' ')).toContain('isochronous');
    expect(r.settings.every((s) => !s.governorPlanned && !s.regulatorPlanned)).toBe(true);
  });

  it('planDroop property: a proposal fed back to the solver at 0/25/50/75/100 % meets every band it was given', () => {
    const setArb = fc.record({
      kW: fc.integer({ min: 200, max: 2000 }),
      droop: fc.double({ min: 2, max: 6, noNaN: true }),
      qDroop: fc.double({ min: 2, max: 6, noNaN: true }),
      v0: fc.double({ min: 400, max: 420, noNaN: true }),
      rOhm: fc.double({ min: 0, max: 0.004, noNaN: true }),
      xOhm: fc.double({ min: 0, max: 0.006, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.array(setArb, { minLength: 2, maxLength: 5 }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        fc.double({ min: 30, max: 60, noNaN: true }),
        fc.double({ min: 0.75, max: 0.95, noNaN: true }),
        (sets, hzWidth, vWidth, pf) => {
          const plant = makePlant(
            sets.map((s, k) =>
              rawSet(`G${k}`, {
                ratedKW: s.kW,
                ratedKVA: s.kW * 1.25,
                governor: { mode: 'droop', droopPct: s.droop, noLoadHz: 52 },
                regulator: { mode: 'reactive-droop', droopPct: s.qDroop, noLoadV: s.v0 },
                feeder: { rOhm: s.rOhm * (1000 / s.kW), xOhm: s.xOhm * (1000 / s.kW) },
              }),
            ),
          );
          const range = { min: 0, max: 90 };
          const fBand = { min: 50 - hzWidth / 2, max: 50 + hzWidth / 2 };
          const vBand = { min: 400 - vWidth / 2, max: 400 + vWidth / 2 };
          const r = planDroop({ plant, frequencyBandHz: fBand, voltageBandV: vBand, loadRangePct: range, pf });
          expect(r.reasons).toEqual([]);
          expect(r.feasible).toBe(true);
          const bus = busAcross(r.plant, range, pf);
          for (const f of bus.f) {
            expect(f).toBeGreaterThanOrEqual(fBand.min - 1e-6);
            expect(f).toBeLessThanOrEqual(fBand.max + 1e-6);
          }
          for (const v of bus.v) {
            expect(v).toBeGreaterThanOrEqual(vBand.min - 1e-6);
            expect(v).toBeLessThanOrEqual(vBand.max + 1e-6);
          }
          // What is left is the feeders' second-order drop, zero at the middle of the range.
          expect(r.proposal.worstKVARErrorPct!).toBeLessThan(1);
        },
      ),
      { numRuns: 40, seed: 20 },
    );
  }, 60_000);
});

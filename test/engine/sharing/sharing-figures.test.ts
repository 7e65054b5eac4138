/** `solveSharingFigures` (the Monte-Carlo's solve) gives exactly the figures of `solveSharing`'s full result. */
import { describe, expect, it } from 'vitest';
import { createSharingFigures, solveSharing, solveSharingFigures } from '../../../electron/engine';
import type { SharingScratch } from '../../../electron/engine/sharing';
import type { Plant } from '../../../shared-types';
import { benchPlant } from '../../bench/sharing.bench';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';

function same(plant: Plant, load?: { kW: number; kVAR: number }) {
  const full = solveSharing(plant, load);
  const fig = createSharingFigures(plant.sets.length);
  solveSharingFigures(plant, load, fig);
  expect(fig.frequencyHz).toBe(full.bus.frequencyHz);
  expect(fig.voltageV).toBe(full.bus.voltageV);
  full.sets.forEach((s, i) => {
    expect([fig.kW[i], fig.kVAR[i], fig.kVA[i], fig.loadingPct[i], fig.circulatingA[i]]).toEqual([s.kW, s.kVAR, s.kVA, s.loadingPct, s.circulatingA]);
  });
}

describe('solveSharingFigures', () => {
  it('equals solveSharing on the demo plant, an 8-set plant with feeders, and a plant with a set off line', () => {
    same(demoPlant());
    same(benchPlant(8));
    same(benchPlant(8), { kW: 6000, kVAR: 3000 });
    same(makePlant([rawSet('A'), rawSet('B', { online: false }), rawSet('C', { feeder: { rOhm: 0.02, xOhm: 0.05 } })]));
  });

  it('gives the same figures when one scratch is carried from plant to plant (sizes, modes and a failed solve between)', () => {
    const crossPlant = makePlant([
      rawSet('A', { regulator: { mode: 'cross-current', setpointV: 400 }, feeder: { rOhm: 0.01, xOhm: 0.03 } }),
      rawSet('B', { regulator: { mode: 'cross-current', setpointV: 402 }, feeder: { rOhm: 0.02, xOhm: 0.02 } }),
      rawSet('C', { feeder: { rOhm: 0.015, xOhm: 0.04 } }),
    ]);
    const droopPlant = makePlant(['A', 'B', 'C'].map((id, i) => rawSet(id, { feeder: { rOhm: 0.01 * (i + 1), xOhm: 0.03 } })));
    const cases: [Plant, { kW: number; kVAR: number } | undefined][] = [
      [benchPlant(8), undefined],
      [crossPlant, undefined],
      [droopPlant, { kW: 1800, kVAR: 1000 }],
      [crossPlant, { kW: 2000, kVAR: 1200 }],
      [benchPlant(8), { kW: 6000, kVAR: 3000 }],
      [demoPlant(), { kW: 1e6, kVAR: 0 }],
      [makePlant([rawSet('A'), rawSet('B', { online: false }), rawSet('C', { feeder: { rOhm: 0.02, xOhm: 0.05 } })]), undefined],
      [crossPlant, { kW: 1500, kVAR: 900 }],
      [benchPlant(8), undefined],
    ];
    const scratch: SharingScratch = {};
    for (const [plant, load] of cases) {
      const fresh = createSharingFigures(plant.sets.length);
      const carried = createSharingFigures(plant.sets.length);
      let freshError = '';
      let carriedError = '';
      try {
        solveSharingFigures(plant, load, fresh);
      } catch (e) {
        freshError = String(e);
      }
      try {
        solveSharingFigures(plant, load, carried, scratch);
      } catch (e) {
        carriedError = String(e);
      }
      expect(carriedError).toBe(freshError);
      expect(carried).toEqual(fresh);
    }
    expect(scratch.work).toBeDefined();
  });

  it('throws what solveSharing throws when there is no operating point', () => {
    const plant = demoPlant();
    const load = { kW: 1e6, kVAR: 0 };
    expect(() => solveSharing(plant, load)).toThrow();
    expect(() => solveSharingFigures(plant, load, createSharingFigures(plant.sets.length))).toThrow(/./);
  });
});

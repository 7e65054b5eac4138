/** `solveSharingFigures` (the Monte-Carlo's solve) gives exactly the figures of `solveSharing`'s full result. */
import { describe, expect, it } from 'vitest';
import { createSharingFigures, solveSharing, solveSharingFigures } from '../../../electron/engine';
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

  it('throws what solveSharing throws when there is no operating point', () => {
    const plant = demoPlant();
    const load = { kW: 1e6, kVAR: 0 };
    expect(() => solveSharing(plant, load)).toThrow();
    expect(() => solveSharingFigures(plant, load, createSharingFigures(plant.sets.length))).toThrow(/./);
  });
});

import { describe, it, expect } from 'vitest';
import { closingMap } from '../../../electron/engine';
import type { ClosingMapRequest, SyncCase } from '../../../shared-types';
import { demoPlant } from '../../helpers/plants';

function demoCase(): SyncCase {
  const plant = demoPlant();
  const g3 = plant.sets[2]!;
  return {
    bus: { frequencyHz: 50, voltageV: 400 },
    incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0, ratedKVA: g3.ratedKVA, xddpPU: g3.machine.xddpPU, poles: g3.poles },
    plant,
    incomingSetId: 'G3',
    breakerClosingMs: 60,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
}

const grid = (method: ClosingMapRequest['method']): ClosingMapRequest => ({
  case: demoCase(),
  angleSteps: 7,
  slipSteps: 3,
  slipRangeHz: 0.2,
  angleAxis: 'contact',
  method,
});

describe('closingMap, time-domain method (simulator, first cycle after the close)', () => {
  it('agrees with the closed form within 10 % on the surge current, with the same torque sign (demo plant, G3 onto G1 + G2)', () => {
    const td = closingMap(grid('time-domain'));
    const cf = closingMap(grid('closed-form'));
    expect(td.method).toBe('time-domain');
    expect(td.note).toContain('First cycle');
    // Middle row: zero slip. Angles −180, −120, −60, 0, 60, 120, 180.
    for (let i = 0; i < 7; i++) {
      const a = td.anglesDeg[i]!;
      const k = 7 + i;
      if (a === 0) {
        expect(td.surgeCurrentPU[k]!).toBeLessThan(0.05);
        continue;
      }
      // The two models differ by the simulator's bus voltage at rest and its subtransient detail: 10 % band.
      expect(Math.abs(td.surgeCurrentPU[k]! / cf.surgeCurrentPU[k]! - 1)).toBeLessThan(0.1);
      if (Math.abs(a) < 180) expect(Math.sign(td.torqueStepPU[k]!)).toBe(Math.sign(cf.torqueStepPU[k]!));
    }
    for (const v of [...td.surgeCurrentPU, ...td.torqueStepPU, ...td.peakCurrentPU]) expect(Number.isFinite(v)).toBe(true);
  });

  it('grows with angle from 0° to 180° in the simulation too', () => {
    const td = closingMap(grid('time-domain'));
    const row = td.surgeCurrentPU.slice(7 + 3, 7 + 7);
    for (let i = 1; i < row.length; i++) expect(row[i]!).toBeGreaterThan(row[i - 1]!);
  });

  it('needs the case\'s plant, and refuses grids too large to simulate', () => {
    const c = demoCase();
    delete c.plant;
    delete c.incomingSetId;
    c.busSource = { ratedKVA: 2050, xPU: 0.15 };
    expect(() => closingMap({ ...grid('time-domain'), case: c })).toThrow(/^method: the time-domain closing map needs the case's plant and incomingSetId/);
    expect(() => closingMap({ ...grid('time-domain'), angleSteps: 361, slipSteps: 101 })).toThrow(/cells or fewer for the time-domain map/);
  });
});

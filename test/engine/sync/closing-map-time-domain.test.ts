import { describe, it, expect } from 'vitest';
import { closingMap, timeDomainClosingMapJob } from '../../../electron/engine';
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

  it("needs the case's plant, and refuses grids too large to simulate", () => {
    const c = demoCase();
    delete c.plant;
    delete c.incomingSetId;
    c.busSource = { ratedKVA: 2050, xPU: 0.15 };
    expect(() => closingMap({ ...grid('time-domain'), case: c })).toThrow(/^method: the time-domain closing map needs the case's plant and incomingSetId/);
    expect(() => closingMap({ ...grid('time-domain'), angleSteps: 361, slipSteps: 101 })).toThrow(/cells or fewer for the time-domain map/);
  });
});

describe('time-domain closing map: cells stop once their peaks are past', () => {
  // The stated tolerance of the early stop against cells run the whole cycle: 0.1 % of the surge current (plus
  // 1e-6 pu for a cell closed in phase, whose current is nothing) and 0.001 pu of torque (the rule is built to lose
  // nothing; the margin only allows for rounding).
  const CURRENT_REL = 1e-3;
  const TORQUE_PU = 1e-3;

  it('gives the same surge and torque peaks as whole-cycle cells, within the stated tolerance, and says how long cells ran', () => {
    const req: ClosingMapRequest = { ...grid('time-domain'), angleSteps: 19, slipSteps: 7, slipRangeHz: 0.5, angleAxis: 'command' };
    const early = timeDomainClosingMapJob(req);
    early.fillRows(0, early.rows);
    const e = early.finish();
    const whole = timeDomainClosingMapJob(req, { fullCycle: true });
    whole.fillRows(0, whole.rows);
    const w = whole.finish();
    for (let k = 0; k < e.surgeCurrentPU.length; k++) {
      expect(Math.abs(e.surgeCurrentPU[k]! - w.surgeCurrentPU[k]!)).toBeLessThanOrEqual(CURRENT_REL * w.surgeCurrentPU[k]! + 1e-6);
      expect(Math.abs(e.torqueStepPU[k]! - w.torqueStepPU[k]!)).toBeLessThanOrEqual(TORQUE_PU);
    }
    expect(e.maxSurgeCurrentPU).toBeCloseTo(w.maxSurgeCurrentPU, 6);
    // The early stop does stop early: on average well inside the cycle, and the result says so.
    const run = e.cellRun!;
    expect(run.capMs).toBe(20);
    expect(run.meanMs).toBeLessThan(0.8 * run.capMs);
    expect(run.longestMs).toBeLessThanOrEqual(run.capMs);
    expect(run.rule).toContain('could climb back to its peak');
    expect(e.note).toContain('climb back to its peak');
    expect(w.cellRun!.meanMs).toBe(20);
    // Large closing angles peak at contact and stop within a few steps.
    const row = 3 * 19; // zero slip
    expect(e.surgeCurrentPU[row]!).toBeGreaterThan(3);
  });
});

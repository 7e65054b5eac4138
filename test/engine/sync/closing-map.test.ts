import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { closingMap, closingMapJob, closingSurge, surgeCircuit, wrapAngleDeg } from '../../../electron/engine';
import type { ClosingMapRequest, SyncCase } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';

function mapCase(over: Partial<SyncCase> = {}, voltageV = 480): SyncCase {
  return {
    bus: { frequencyHz: 60, voltageV: 480 },
    incoming: { frequencyHz: 60.1, voltageV, angleDeg: 0, ratedKVA: 1000, xddpPU: 0.15, rOverX: 0 },
    busSource: { ratedKVA: 1000, xPU: 0.15 },
    breakerClosingMs: 100,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
    ...over,
  };
}

function request(c: SyncCase, over: Partial<ClosingMapRequest> = {}): ClosingMapRequest {
  return { case: c, angleSteps: 181, slipSteps: 101, slipRangeHz: 0.5, ...over };
}

const at = (m: { anglesDeg: number[] }, values: number[], row: number, col: number) => values[row * m.anglesDeg.length + col]!;

describe('closingMap (closed form)', () => {
  it('spans −180°…180° × ±range in a 181 × 101 grid, row-major by slip', () => {
    const m = closingMap(request(mapCase()));
    expect(m.anglesDeg).toHaveLength(181);
    expect(m.slipsHz).toHaveLength(101);
    expect(m.anglesDeg[0]).toBe(-180);
    expect(m.anglesDeg[180]).toBe(180);
    expectClose(m.anglesDeg[1]! - m.anglesDeg[0]!, 2, { rel: 1e-12 });
    expect(m.slipsHz[0]).toBe(-0.5);
    expect(m.slipsHz[100]).toBe(0.5);
    expect(m.surgeCurrentPU).toHaveLength(181 * 101);
    expect(m.torqueStepPU).toHaveLength(181 * 101);
    expect(m.method).toBe('closed-form');
    expect(m.angleAxis).toBe('command');
  });

  it('puts the surge where the contacts touch: command angle + 360 s t (row 0.2 Hz, 100 ms → +7.2°)', () => {
    const c = mapCase();
    const m = closingMap(request(c));
    const circuit = surgeCircuit(c);
    const row = m.slipsHz.findIndex((s) => Math.abs(s - 0.2) < 1e-9);
    for (const col of [0, 45, 90, 95, 135, 180]) {
      const expected = closingSurge(circuit, wrapAngleDeg(m.anglesDeg[col]! + 7.2));
      expectClose(at(m, m.surgeCurrentPU, row, col), expected.surgeCurrentPU, { rel: 1e-9 });
      expectClose(at(m, m.peakCurrentPU, row, col), expected.peakCurrentPU, { rel: 1e-9 });
    }
  });

  it('carries the first-cycle peak torque layer at the contact angle, wrapped (θ + 2 sin(θ/2) is not 360°-periodic)', () => {
    const c = mapCase();
    const m = closingMap(request(c));
    const circuit = surgeCircuit(c);
    const row = m.slipsHz.findIndex((s) => Math.abs(s - 0.2) < 1e-9);
    // Column 180 is +180° at the command: contact at 187.2°, i.e. −172.8° — the peak is negative there.
    for (const col of [0, 60, 90, 120, 150, 180]) {
      const expected = closingSurge(circuit, wrapAngleDeg(m.anglesDeg[col]! + 7.2));
      // The case's incoming runs at 60.1 Hz; this row's at 60.2 Hz: torque = power / speed.
      expectClose(at(m, m.peakTorquePU, row, col), (expected.peakTorquePU * 60.1) / 60.2, { rel: 1e-9, abs: 1e-12 });
    }
    expect(at(m, m.peakTorquePU, row, 180)).toBeLessThan(0);
  });

  it('maps the bare contact angle with angleAxis "contact" (slip then changes only the speed)', () => {
    const c = mapCase();
    const m = closingMap(request(c, { angleAxis: 'contact' }));
    const circuit = surgeCircuit(c);
    // 10° at contact: 2 sin 5° / 0.30 = 0.581 pu (closed form), on every slip row.
    const col = m.anglesDeg.indexOf(10);
    for (const row of [0, 50, 100]) expectClose(at(m, m.surgeCurrentPU, row, col), closingSurge(circuit, 10).surgeCurrentPU, { rel: 1e-12 });
    expectClose(at(m, m.surgeCurrentPU, 50, col), 0.581, { abs: 5e-4 });
    expectClose(m.maxSurgeCurrentPU, 2 / 0.3, { rel: 1e-12 }, '180°: 6.67 pu');
  });

  it('draws the window rectangle, one-sided in slip when the incoming set must run faster', () => {
    expect(closingMap(request(mapCase())).window).toEqual({ angleDeg: 10, slipHz: 0.2, slipMinHz: -0.2, slipMaxHz: 0.2 });
    const faster = mapCase({ limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true } });
    expect(closingMap(request(faster)).window).toEqual({ angleDeg: 10, slipHz: 0.2, slipMinHz: 0, slipMaxHz: 0.2 });
  });

  it('finds the worst surge inside the window: command at the edge, 0.2 Hz, lands at 10° + 7.2°', () => {
    const m = closingMap(request(mapCase()));
    expectClose(m.maxSurgeInWindowPU, (2 * Math.sin((17.2 * Math.PI) / 360)) / 0.3, { rel: 1e-9 });
  });

  it('uses the requested voltage difference for the whole map', () => {
    const m = closingMap(request(mapCase(), { voltageDifferencePct: 5, angleAxis: 'contact' }));
    expect(m.voltageDifferencePct).toBe(5);
    // At 0° only the magnitude differs: 0.05 / 0.30 pu.
    expectClose(at(m, m.surgeCurrentPU, 50, 90), 0.05 / 0.3, { rel: 1e-9 });
    const own = closingMap(request(mapCase({}, 489.6)));
    expectClose(own.voltageDifferencePct, 2, { rel: 1e-9 });
  });

  it('is symmetric in angle at zero voltage difference (contact axis, or no breaker delay) — property', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        fc.double({ min: 0.1, max: 2, noNaN: true }),
        fc.integer({ min: 0, max: 200 }),
        (xBus, range, ms) => {
          const c = mapCase({ busSource: { ratedKVA: 1000, xPU: xBus }, breakerClosingMs: ms });
          for (const m of [
            closingMap(request(c, { angleSteps: 37, slipSteps: 9, slipRangeHz: range, angleAxis: 'contact' })),
            closingMap(request({ ...c, breakerClosingMs: 0 }, { angleSteps: 37, slipSteps: 9, slipRangeHz: range })),
          ]) {
            const n = m.anglesDeg.length;
            let worst = 0;
            for (let row = 0; row < m.slipsHz.length; row++) {
              for (let col = 0; col < n; col++) {
                worst = Math.max(worst, Math.abs(at(m, m.surgeCurrentPU, row, col) - at(m, m.surgeCurrentPU, row, n - 1 - col)));
                worst = Math.max(worst, Math.abs(at(m, m.torqueStepPU, row, col) + at(m, m.torqueStepPU, row, n - 1 - col)));
              }
            }
            expect(worst).toBeLessThan(1e-12);
          }
        },
      ),
      { numRuns: 30 },
    );
  });

  it('is point-symmetric (θ, s) ↔ (−θ, −s) on the command axis with a breaker delay — property', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 200 }), (ms) => {
        const m = closingMap(request(mapCase({ breakerClosingMs: ms }), { angleSteps: 73, slipSteps: 11 }));
        const n = m.anglesDeg.length;
        const rows = m.slipsHz.length;
        let worst = 0;
        for (let row = 0; row < rows; row++) {
          for (let col = 0; col < n; col++) {
            worst = Math.max(worst, Math.abs(at(m, m.surgeCurrentPU, row, col) - at(m, m.surgeCurrentPU, rows - 1 - row, n - 1 - col)));
          }
        }
        expect(worst).toBeLessThan(1e-9);
      }),
      { numRuns: 20 },
    );
  });

  it('fills in chunks to the same result as in one go', () => {
    const req = request(mapCase(), { angleSteps: 61, slipSteps: 21 });
    const job = closingMapJob(req);
    for (let r = 0; r < job.rows; r += 4) job.fillRows(r, Math.min(job.rows, r + 4));
    expect(job.map).toEqual(closingMap(req));
  });

  it('refuses a dead bus and bad grids with a sentence naming the field', () => {
    expect(() => closingMap(request(mapCase({ bus: { frequencyHz: 0, voltageV: 0 }, ratedVoltageV: 480 })))).toThrow(
      /^case\.bus\.voltageV: the bus is not live/,
    );
    expect(() => closingMap(request(mapCase(), { angleSteps: 1 }))).toThrow('angleSteps, slipSteps: must be whole numbers of 2 or more.');
    expect(() => closingMap(request(mapCase(), { slipRangeHz: 0 }))).toThrow('slipRangeHz: must be greater than 0.');
  });

  it('does not mutate the request', () => {
    const req = request(mapCase(), { angleSteps: 11, slipSteps: 3 });
    const before = JSON.stringify(req);
    closingMap(req);
    expect(JSON.stringify(req)).toBe(before);
  });
});

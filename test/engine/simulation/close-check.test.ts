/**
 * A close event in a run: without angle or slip fields the set closes at the run's own phase
 * and the run says the angle, slip and ΔV at contact; a close outside the sync-check window
 * (common-practice settings between generating sets: ±10°, ±0.2 Hz, ±5 %, incoming faster) is
 * flagged in the metrics.
 */
import { describe, expect, it } from 'vitest';
import { simulate } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

function plant() {
  // A at 4 % droop carrying 200 kW: 52 − 0.04 · 50 · 0.2 = 51.6 Hz (droop line). B off line at no load.
  return makePlant([rawSet('A'), rawSet('B', { online: false, governor: { mode: 'droop', droopPct: 4, noLoadHz: 52 } })], [{ id: 'L', kW: 200, kVAR: 100 }]);
}

describe('close events judged at contact', () => {
  it('a close without angle or slip fields closes at the run phase and says so', () => {
    const r = simulate({ plant: plant(), durationS: 2.3, stepMs: 1, events: [{ atS: 1.3, type: 'close', setId: 'B' }] });
    expect(r.metrics.closes).toHaveLength(1);
    const c = r.metrics.closes[0]!;
    expect(c.stateGiven).toBe(false);
    // Slip = 52 − 51.6 = 0.4 Hz (closed form, both droop lines): beyond ±0.2 Hz.
    expectClose(c.slipHz, 0.4, { abs: 1e-3 }, 'slip at contact, Hz');
    // Phase after 1.3 s of 0.4 Hz slip from 0°: 360 · 0.4 · 1.3 = 187.2° → −172.8° (wrapped).
    expectClose(c.angleDeg, -172.8, { abs: 0.5 }, 'angle at contact, °');
    expect(c.insideWindow).toBe(false);
    expect(c.reasons.join(' ')).toMatch(/[Ss]lip/);
    const w = r.warnings.join('\n');
    expect(w).toMatch(
      /B closed at t = 1\.300 s as the run had it \(no angle, slip or voltage given\): angle -17\d\.\d°, slip 0\.400 Hz, ΔV -?\d+\.\d % of rated at contact/,
    );
    expect(w).toMatch(/B closed outside the sync-check window/);
  });

  it('a close given inside the window is not flagged', () => {
    const r = simulate({
      plant: plant(),
      durationS: 2,
      stepMs: 1,
      events: [{ atS: 1, type: 'close', setId: 'B', angleDeg: 3, frequencyHz: 51.7, voltageV: 402 }],
    });
    const c = r.metrics.closes[0]!;
    expect(c.stateGiven).toBe(true);
    expectClose(c.angleDeg, 3, { abs: 1e-6 }, 'angle, °');
    expect(c.insideWindow).toBe(true);
    expect(r.warnings.join(' ')).not.toMatch(/sync-check window|as the run had it/);
  });
});

/**
 * Protection in a run: each set's 81U/81O/27/59/32 elements (IEEE C37.2 device numbers) trip
 * after their delay, a trip that overloads the rest cascades, and under-frequency
 * load-shedding stages on the loads shed at their setting.
 */
import { describe, expect, it } from 'vitest';
import { simulate } from '../../../electron/engine';
import { plantSchema } from '../../../electron/handlers';
import { SET_DEFAULTS } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawPlant, rawSet } from '../../helpers/plants';

// Two 1000 kW sets at 4 % droop (no-load 52 Hz) share 1600 kW: 52 − 0.04 · 50 · 0.8 = 50.4 Hz.
const sets = () => [rawSet('A'), rawSet('B')];

describe('set protection', () => {
  it('fills the common-practice defaults and refuses pickups out of range, naming the field', () => {
    const p = makePlant(sets());
    expect(p.sets[0]!.protection).toEqual(SET_DEFAULTS.protection);
    const bad = plantSchema.safeParse(rawPlant([rawSet('A', { protection: { overFrequencyPct: 90 } })]));
    expect(bad.success).toBe(false);
    const issue = bad.error!.issues[0]!;
    expect(issue.path).toEqual(['sets', 0, 'protection', 'overFrequencyPct']);
    expect(issue.message).toBe('must be 0 (off) or from 100 to 150 %');
  });

  it('a set made to motor trips after its reverse-power (32) delay', () => {
    const p = makePlant([rawSet('A'), rawSet('B', { reversePowerTripPct: 5, reversePowerDelayS: 2 })], [{ id: 'L', kW: 800, kVAR: 400 }]);
    const r = simulate({ plant: p, durationS: 5, stepMs: 2, events: [{ atS: 0.5, type: 'trip', setId: 'B', openBreaker: false }] });
    const trip = r.metrics.trips.find((x) => x.device === '32')!;
    expect(trip.id).toBe('B');
    // B runs down to motoring at its 25 % (the default motoringPct): the relay times from the
    // first instant below −5 % of 1000 kW = −50 kW, for 2 s.
    const below = r.series.t.find((t, k) => t > 0.5 && r.series.setKW[1]![k]! < -50)!;
    expect(trip.atS).toBeGreaterThan(0.5 + 2);
    expectClose(trip.atS, below + 2, { abs: 0.05 }, 'trip time, s');
  });

  it('a trip that overloads the other set cascades: it goes on under-frequency (81U) after its delay', () => {
    const p = makePlant(sets(), [{ id: 'L', kW: 1600, kVAR: 800 }]);
    const r = simulate({ plant: p, durationS: 14, stepMs: 2, events: [{ atS: 1, type: 'trip', setId: 'A' }] });
    const trip = r.metrics.trips.find((x) => x.id === 'B')!;
    expect(trip.device).toBe('81U');
    // 81U default: 95 % of 50 Hz = 47.5 Hz for 5 s. The first plotted point below 47.5 Hz, plus 5 s.
    const below = r.series.t.find((t, k) => t > 1 && r.series.frequencyHz[k]! < 47.5)!;
    expectClose(trip.atS, below + 5, { abs: 0.05 }, 'trip time, s');
    expect(r.log.some((l) => /B tripped on under-frequency \(device 81U\): below 47\.50 Hz/.test(l.text))).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/No set is on line at the end of the run/);
    expect(r.metrics.unservedKWh).toBeGreaterThan(0);
  });

  it('an under-frequency load-shedding stage sheds its load at its setting and saves the set', () => {
    const p = makePlant(sets(), [
      { id: 'L1', kW: 800, kVAR: 400 },
      { id: 'L2', kW: 800, kVAR: 400, shedFrequencyPct: 97, shedDelayS: 0.3 },
    ]);
    const r = simulate({ plant: p, durationS: 14, stepMs: 2, events: [{ atS: 1, type: 'trip', setId: 'A' }] });
    const shed = r.metrics.trips.find((x) => x.kind === 'load')!;
    expect(shed.id).toBe('L2');
    // 97 % of 50 Hz = 48.5 Hz for 0.3 s.
    const below = r.series.t.find((t, k) => t > 1 && r.series.frequencyHz[k]! < 48.5)!;
    expectClose(shed.atS, below + 0.3, { abs: 0.05 }, 'shed time, s');
    expect(r.metrics.trips.some((x) => x.kind === 'set')).toBe(false);
    // B alone carries L1: 52 − 0.04 · 50 · 800 / 1000 = 50.4 Hz (droop line).
    expectClose(r.metrics.final.frequencyHz, 50.4, { abs: 0.02 }, 'final frequency, Hz');
    expectClose(r.metrics.steadyState!.frequencyHz, 50.4, { abs: 1e-6 }, 'closed-form steady state, Hz');
  });

  it('overvoltage (59) trips a set whose voltage setpoint is raised above its pickup', () => {
    const p = makePlant([rawSet('A', { protection: { overVoltagePct: 110, overVoltageDelayS: 1 } })], [{ id: 'L', kW: 400, kVAR: 200 }]);
    const r = simulate({ plant: p, durationS: 8, stepMs: 2, events: [{ atS: 0.5, type: 'setpoint', setId: 'A', voltageV: 480 }] });
    const trip = r.metrics.trips[0]!;
    expect(trip.device).toBe('59');
    const above = r.series.t.find((t, k) => r.series.setTerminalV[0]![k]! > 440)!;
    expectClose(trip.atS, above + 1, { abs: 0.05 }, 'trip time, s (first point above 440 V + 1 s)');
  });
});

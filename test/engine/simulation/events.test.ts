/** Scenario events and protection: trips, reverse power, ramps, motor starts, load switching, setpoints. */
import { describe, expect, it } from 'vitest';
import { createSimulation, InvalidInput, simulate, solveSharing, Cancelled } from '../../../electron/engine';
import { SET_DEFAULTS } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';

const twoSets = (kW = 800) => makePlant([rawSet('A'), rawSet('B', { reversePowerTripPct: 5 })], [{ id: 'L', kW, kVAR: kW / 2 }]);

describe('simulation events', () => {
  it('a trip moves the whole load to the remaining set, which lands on its droop line', () => {
    const r = simulate({ plant: twoSets(), durationS: 12, stepMs: 2, events: [{ atS: 0.5, type: 'trip', setId: 'B' }] });
    const a = r.metrics.final.sets[0]!;
    const b = r.metrics.final.sets[1]!;
    expect(b.online).toBe(false);
    expectClose(b.kW, 0, { abs: 1e-9 }, 'tripped set kW');
    expectClose(a.kW, 800, { abs: 0.5 }, 'remaining set kW');
    // The droop line (closed form): 52 − 0.04 · 50 · 0.8 = 50.4 Hz.
    expectClose(r.metrics.final.frequencyHz, 50.4, { abs: 0.002 }, 'final frequency, Hz');
    expect(r.metrics.frequencyNadirHz).toBeLessThan(50.4);
    expect(r.log.map((l) => l.text)).toContain('B tripped and shut down');
  });

  it('an engine trip with the breaker closed: the set motors until device 32 opens it', () => {
    // B's engine stops; it then draws its motoring power (the default motoringPct of 1000 kW)
    // from the bus, beyond its 5 % reverse-power setting, so the relay opens the breaker after
    // its delay (the default reversePowerDelayS).
    const r = simulate({ plant: twoSets(), durationS: 8, stepMs: 2, events: [{ atS: 0.5, type: 'trip', setId: 'B', openBreaker: false }] });
    const trip = r.log.find((l) => l.text.includes('reverse power'));
    expect(trip, 'reverse-power trip in the log').toBeDefined();
    expect(trip!.atS).toBeGreaterThan(0.5 + SET_DEFAULTS.reversePowerDelayS);
    expect(trip!.atS).toBeLessThan(0.5 + SET_DEFAULTS.reversePowerDelayS + 1);
    expect(r.metrics.final.sets[1]!.online).toBe(false);
    expect(SET_DEFAULTS.motoringPct).toBeGreaterThan(5);
    // While motoring, B drew power: its kW went below −5 % of rating.
    expect(Math.min(...r.series.setKW[1]!)).toBeLessThan(-50);
  });

  it('a droop governor asked for a speed far below the bus goes to zero fuel and motors; beyond its 32 setting the relay opens it', () => {
    // Zero fuel: B draws its motoring power, 25 % of 1000 kW (IEEE C37.102, four-stroke diesel, value from memory),
    // beyond its 5 % setting, so device 32 opens it after its delay (the default reversePowerDelayS).
    const r = simulate({ plant: twoSets(), durationS: 8, stepMs: 2, events: [{ atS: 0.5, type: 'setpoint', setId: 'B', frequencyHz: 45 }] });
    const trip = r.log.find((l) => l.text.includes('reverse power'));
    expect(trip, 'reverse-power trip in the log').toBeDefined();
    expect(trip!.atS).toBeGreaterThan(0.5 + SET_DEFAULTS.reversePowerDelayS);
    expect(Math.min(...r.series.setKW[1]!)).toBeLessThan(-200);
  });

  it('a base-load set asked for less than its minKW backs off to minKW and does not motor', () => {
    const plant = makePlant(
      [rawSet('A'), rawSet('B', { reversePowerTripPct: 5, governor: { mode: 'baseload', baseKW: 300 } })],
      [{ id: 'L', kW: 800, kVAR: 400 }],
    );
    const r = simulate({ plant, durationS: 8, stepMs: 2, events: [{ atS: 0.5, type: 'setpoint', setId: 'B', kW: -400 }] });
    expect(r.log.some((l) => l.text.includes('reverse power'))).toBe(false);
    expectClose(r.metrics.final.sets[1]!.kW, 0, { abs: 0.5 }, 'B at minKW = 0, kW');
  });

  it('a ramp takes a set to its target kW in load control', () => {
    const plant = twoSets(1100);
    const sim = createSimulation({ plant, durationS: 15, stepMs: 2, events: [{ atS: 1, type: 'ramp', setId: 'B', toKW: 200, durationS: 5 }] });
    sim.advance(3.5);
    const mid = sim.snapshot().sets[1]!.kW;
    // Halfway along the line from 550 kW to 200 kW, with the engine lags behind it.
    expect(mid).toBeGreaterThan(340);
    expect(mid).toBeLessThan(420);
    sim.advance(11.5);
    const s = sim.snapshot();
    expectClose(s.sets[1]!.kW, 200, { abs: 0.5 }, 'ramped set kW');
    expectClose(s.sets[0]!.kW, 900, { abs: 0.5 }, 'the other set takes the rest, kW');
    expectClose(s.frequencyHz, 52 - 0.04 * 50 * 0.9, { abs: 0.002 }, "frequency on A's droop line, Hz");
  });

  it('a motor start dips the voltage while the locked rotor lasts, then the running load stays', () => {
    const plant = twoSets();
    const r = simulate({
      plant,
      durationS: 10,
      stepMs: 2,
      events: [{ atS: 1, type: 'motor-start', kVA: 1500, pf: 0.3, durationS: 3, runningKW: 150, runningKVAR: 90 }],
    });
    expect(r.metrics.voltageDipPct).toBeGreaterThan(5);
    const after = {
      ...plant,
      loads: [...plant.loads, { id: 'M', name: 'M', online: true, kW: 150, kVAR: 90, model: 'constant-power' as const, frequencySensitivity: 0 }],
    };
    const ss = solveSharing(after);
    expectClose(r.metrics.final.voltageV, ss.bus.voltageV, { abs: 0.3 }, 'final voltage with the running motor, V');
    expect(r.log.map((l) => l.text).join('\n')).toMatch(/motor up to speed/);
  });

  it('a motor start without a running load leaves kVA / 6 at 0.85 PF running (common practice, stated in the log)', () => {
    const plant = twoSets();
    const r = simulate({ plant, durationS: 10, stepMs: 2, events: [{ atS: 1, type: 'motor-start', kVA: 1200, pf: 0.3, durationS: 2 }] });
    // Running kVA = 1200 / 6 = 200 kVA: 170 kW and 200 · √(1 − 0.85²) = 105.4 kVAR.
    const kW = 170;
    const kVAR = 200 * Math.sqrt(1 - 0.85 * 0.85);
    expect(r.log.map((l) => l.text).join('\n')).toMatch(/running load 170 kW, 105 kVAR \(not given: locked-rotor 1200 kVA \/ 6 at 0.85 power factor\)/);
    const ss = solveSharing({
      ...plant,
      loads: [...plant.loads, { id: 'M', name: 'M', online: true, kW, kVAR, model: 'constant-power' as const, frequencySensitivity: 0 }],
    });
    expectClose(r.metrics.final.frequencyHz, ss.bus.frequencyHz, { abs: 0.002 }, 'final frequency with the running motor, Hz');
    expectClose(r.metrics.steadyState!.frequencyHz, ss.bus.frequencyHz, { abs: 1e-6 }, 'run target = closed form with the running motor, Hz');
  });

  it('switches a plant load off by id and back on', () => {
    const plant = demoPlant();
    const r = simulate({ plant, durationS: 14, stepMs: 2, events: [{ atS: 0.5, type: 'load-step', loadId: 'L1', online: false }] });
    expect(r.metrics.frequencyPeakHz).toBeGreaterThan(r.metrics.initial.frequencyHz);
    const ss = solveSharing({ ...plant, loads: plant.loads.map((l) => (l.id === 'L1' ? { ...l, online: false } : l)) });
    expectClose(r.metrics.final.frequencyHz, ss.bus.frequencyHz, { abs: 0.002 }, 'frequency after load rejection, Hz');
  });

  it('a voltage setpoint change moves the reactive-droop line', () => {
    const plant = makePlant([rawSet('A')], [{ id: 'L', kW: 500, kVAR: 300 }]);
    const r = simulate({ plant, durationS: 8, stepMs: 2, events: [{ atS: 0.5, type: 'setpoint', setId: 'A', voltageV: 420 }] });
    // Reactive droop (closed form): V = 420 − 0.04 · 400 · 300 / 750 = 413.6 V.
    expectClose(r.metrics.final.voltageV, 420 - 0.04 * 400 * (300 / 750), { abs: 0.05 }, 'bus voltage, V');
  });

  it('names an unknown set or load in a user sentence', () => {
    expect(() => simulate({ plant: twoSets(), durationS: 1, events: [{ atS: 0.1, type: 'trip', setId: 'Z' }] })).toThrow(InvalidInput);
    expect(() => simulate({ plant: twoSets(), durationS: 1, events: [{ atS: 0.1, type: 'trip', setId: 'Z' }] })).toThrow(
      'trip: there is no set "Z" in the plant.',
    );
    expect(() => simulate({ plant: twoSets(), durationS: 1, events: [{ atS: 0.1, type: 'load-step', loadId: 'Q' }] })).toThrow(
      'load-step: there is no load "Q" in the plant.',
    );
  });

  it('reports progress and stops when cancelled', () => {
    const seen: number[] = [];
    expect(() =>
      simulate({ plant: twoSets(), durationS: 5, stepMs: 2, events: [] }, { progress: (f) => seen.push(f), isCancelled: () => seen.length >= 3 }),
    ).toThrow(Cancelled);
    expect(seen.length).toBe(3);
    expect(seen[2]!).toBeGreaterThan(seen[0]!);
    const all: number[] = [];
    simulate({ plant: twoSets(), durationS: 2, stepMs: 2, events: [] }, { progress: (f) => all.push(f) });
    expect(all[all.length - 1]).toBe(1);
  });

  it('does not touch the scenario or plant it is given', () => {
    const plant = twoSets();
    const scenario = {
      plant,
      durationS: 2,
      stepMs: 2,
      events: [
        { atS: 0.5, type: 'setpoint' as const, setId: 'A', frequencyHz: 51 },
        { atS: 0.2, type: 'trip' as const, setId: 'B' },
      ],
    };
    const before = JSON.stringify(scenario);
    simulate(scenario);
    expect(JSON.stringify(scenario)).toBe(before);
  });

  it('decimates the series to about outputPoints points and keeps the last instant', () => {
    const r = simulate({ plant: twoSets(), durationS: 4, stepMs: 1, outputPoints: 101, events: [] });
    expect(r.series.t.length).toBeGreaterThanOrEqual(100);
    expect(r.series.t.length).toBeLessThanOrEqual(102);
    expect(r.series.t[r.series.t.length - 1]).toBeCloseTo(4, 9);
    expect(r.series.setKW.length).toBe(2);
    expect(r.series.setKW[0]!.length).toBe(r.series.t.length);
    expect(r.steps).toBe(4000);
  });
});

/**
 * A run to rest lands on the steady-state solver's answer: bus frequency and voltage,
 * every set's kW and kVAR. One case per governor and regulator mode; each starts at
 * rest, takes a disturbance (so the end is not the start) and is compared with
 * `solveSharing` of the plant as it stands after the disturbance.
 * Reference: the definitions of the README ("Speed droop", "Reactive droop", cross-current
 * and isochronous sharing), as implemented by the sharing solver.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { simulate, solveSharing } from '../../../electron/engine';
import type { Plant, ScenarioEvent } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';

const block = { id: 'B', name: 'B', online: true, kW: 300, kVAR: 180, model: 'constant-power' as const, frequencySensitivity: 0 };

function settlesOnSolver(
  plant: Plant,
  durationS: number,
  stepMs = 5,
  events: ScenarioEvent[] = [{ atS: 0.5, type: 'load-step', kW: block.kW, kVAR: block.kVAR }],
): void {
  const r = simulate({ plant, durationS, stepMs, events, outputPoints: 50 });
  const after = { ...plant, loads: [...plant.loads, block] };
  const ss = solveSharing(after);
  const m = r.metrics.final;
  expectClose(m.frequencyHz, ss.bus.frequencyHz, { abs: 0.002 }, 'bus frequency, Hz');
  expectClose(m.voltageV, ss.bus.voltageV, { abs: 0.2 }, 'bus voltage, V');
  for (const s of ss.sets) {
    const got = m.sets.find((x) => x.id === s.id)!;
    expectClose(got.kW, s.kW, { abs: 1 }, `${s.id} kW`);
    expectClose(got.kVAR, s.kVAR, { abs: 1 }, `${s.id} kVAR`);
  }
}

const load = (kW: number, kVAR: number, model: 'constant-power' | 'constant-impedance' = 'constant-power') => ({ id: 'L', kW, kVAR, model });

describe('simulation run to rest agrees with solveSharing', () => {
  it('droop + reactive droop, with feeders and mixed loads (the demo plant)', () => {
    settlesOnSolver(demoPlant(), 14);
  });

  it('isochronous pair on a load-sharing link with a droop set', () => {
    const plant = makePlant(
      [
        rawSet('A', { governor: { mode: 'isochronous' } }),
        rawSet('B', { ratedKVA: 625, ratedKW: 500, governor: { mode: 'isochronous' } }),
        rawSet('C', { ratedKVA: 625, ratedKW: 500 }),
      ],
      [load(900, 500)],
    );
    settlesOnSolver(plant, 20);
  });

  it('base load set with droop sets', () => {
    const plant = makePlant([rawSet('A'), rawSet('B', { governor: { mode: 'baseload', baseKW: 350 } })], [load(1000, 600)]);
    settlesOnSolver(plant, 14);
  });

  // Unequal feeders: the regulator modes must agree with the solver's network too.
  const feederA = { feeder: { rOhm: 0.004, xOhm: 0.006 } };
  const feederB = { feeder: { rOhm: 0.01, xOhm: 0.008 } };

  it('cross-current group holding voltage, sharing kVAR by ratedKVA (unequal feeders)', () => {
    const cc = { mode: 'cross-current', droopPct: 4 };
    const plant = makePlant(
      [rawSet('A', { regulator: cc, ...feederA }), rawSet('B', { ratedKVA: 800, ratedKW: 640, regulator: cc, ...feederB })],
      [load(900, 650, 'constant-impedance')],
    );
    settlesOnSolver(plant, 14);
  });

  it('voltage-control set with a reactive-droop set (unequal feeders)', () => {
    const plant = makePlant([rawSet('A', { regulator: { mode: 'voltage' }, ...feederA }), rawSet('B', feederB)], [load(900, 500)]);
    settlesOnSolver(plant, 14);
  });

  it('power-factor control set with a reactive-droop set (unequal feeders)', () => {
    const plant = makePlant([rawSet('A', feederA), rawSet('B', { regulator: { mode: 'power-factor', pf: 0.95 }, ...feederB })], [load(1000, 650)]);
    settlesOnSolver(plant, 40);
  });

  it('loads that follow frequency (frequencySensitivity)', () => {
    const plant = makePlant([rawSet('A'), rawSet('B')], [{ id: 'L', kW: 900, kVAR: 400, frequencySensitivity: 2 }]);
    settlesOnSolver(plant, 14);
  });
});

describe('property: any droop plant comes to rest where solveSharing puts it', () => {
  it('holds for random sizes, droops, setpoints, feeders and load steps', () => {
    const setArb = fc.record({
      kva: fc.integer({ min: 300, max: 2000 }),
      droop: fc.double({ min: 2.5, max: 6, noNaN: true }),
      dfHz: fc.double({ min: -0.3, max: 0.3, noNaN: true }),
      qDroop: fc.double({ min: 3, max: 6, noNaN: true }),
      dV: fc.double({ min: -4, max: 4, noNaN: true }),
      xOhm: fc.double({ min: 0, max: 0.01, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.array(setArb, { minLength: 2, maxLength: 4 }),
        fc.double({ min: 0.2, max: 0.5, noNaN: true }),
        fc.double({ min: -0.15, max: 0.2, noNaN: true }),
        (sets, loadFraction, stepFraction) => {
          const raw = sets.map((x, i) =>
            rawSet(`G${i + 1}`, {
              ratedKVA: x.kva,
              ratedKW: 0.8 * x.kva,
              governor: { mode: 'droop', droopPct: x.droop, noLoadHz: 50 * (1 + x.droop / 100) + x.dfHz },
              regulator: { mode: 'reactive-droop', droopPct: x.qDroop, noLoadV: 400 * (1 + x.qDroop / 100) + x.dV },
              feeder: { rOhm: x.xOhm / 2, xOhm: x.xOhm },
            }),
          );
          const ratedKW = sets.reduce((sum, x) => sum + 0.8 * x.kva, 0);
          const plant = makePlant(raw, [load(loadFraction * ratedKW, 0.5 * loadFraction * ratedKW)]);
          const stepKW = stepFraction * ratedKW;
          const r = simulate({ plant, durationS: 14, stepMs: 5, outputPoints: 20, events: [{ atS: 0.5, type: 'load-step', kW: stepKW, kVAR: stepKW / 3 }] });
          const ss = solveSharing({ ...plant, loads: [...plant.loads, { ...block, kW: stepKW, kVAR: stepKW / 3 }] });
          expectClose(r.metrics.final.frequencyHz, ss.bus.frequencyHz, { abs: 0.003 }, 'bus frequency, Hz');
          expectClose(r.metrics.final.voltageV, ss.bus.voltageV, { abs: 0.3 }, 'bus voltage, V');
          ss.sets.forEach((x, i) => {
            expectClose(r.metrics.final.sets[i]!.kW, x.kW, { abs: 1.5 }, `${x.id} kW`);
            expectClose(r.metrics.final.sets[i]!.kVAR, x.kVAR, { abs: 1.5 }, `${x.id} kVAR`);
          });
        },
      ),
      { numRuns: 8, seed: 20261202 },
    );
  });
});

describe('simulation at the edges agrees with solveSharing', () => {
  // A 1000 kW, 4 %, f_nl 52 Hz; B 500 kW, 4 %, f_nl 52 Hz at first; load 600 kW.
  const edgePlant = (trip: number, delayS: number) =>
    makePlant([rawSet('A'), rawSet('B', { ratedKVA: 625, ratedKW: 500, reversePowerTripPct: trip, reversePowerDelayS: delayS })], [load(600, 300)]);
  const lowerB = (atS: number): ScenarioEvent => ({ atS, type: 'setpoint', setId: 'B', frequencyHz: 49 });
  const withB49 = (p: Plant): Plant => ({ ...p, sets: p.sets.map((s) => (s.id === 'B' ? { ...s, governor: { ...s.governor, noLoadHz: 49 } } : s)) });

  it('a droop set whose speed setting drops below the bus motors at −motoring power, as the steady state says', () => {
    // Closed form (steady state): B at zero fuel gives −25 % × 500 = −125 kW (motoring power, IEEE C37.102 four-stroke
    // diesel, value from memory); A carries 600 + 125 = 725 kW at 52 − 725/500 = 50.55 Hz. The 32 setting (30 %,
    // 150 kW) is not reached, so B stays on.
    const plant = edgePlant(30, 2);
    const r = simulate({ plant, durationS: 15, stepMs: 5, events: [lowerB(0.5)], outputPoints: 50 });
    const ss = solveSharing(withB49(plant));
    expectClose(ss.sets[1]!.kW, -125, { rel: 1e-9 }, 'steady state: B at −motoring power (closed form)');
    expectClose(ss.bus.frequencyHz, 50.55, { abs: 1e-6 }, 'steady state f (closed form, feeders none)');
    const m = r.metrics.final;
    expectClose(m.frequencyHz, ss.bus.frequencyHz, { abs: 0.002 }, 'bus frequency, Hz');
    for (const s of ss.sets) {
      const got = m.sets.find((x) => x.id === s.id)!;
      expect(got.online).toBe(true);
      expectClose(got.kW, s.kW, { abs: 1 }, `${s.id} kW`);
      expectClose(got.kVAR, s.kVAR, { abs: 1 }, `${s.id} kVAR`);
    }
  });

  it('beyond its 32 setting the motoring set trips after its delay, and A alone carries the load', () => {
    // 32 at 10 % of 500 kW = 50 kW < 125 kW: the relay trips B after its 2 s delay; A then gives 600 kW at
    // 52 − 600/500 = 50.8 Hz (closed form).
    const plant = edgePlant(10, 2);
    const r = simulate({ plant, durationS: 15, stepMs: 5, events: [lowerB(0.5)], outputPoints: 50 });
    const trip = r.log.find((e) => /B tripped on reverse power \(device 32\)/.test(e.text));
    expect(trip, 'B trips on 32').toBeDefined();
    // It trips after the power has passed −50 kW and stayed there for 2 s: not before 0.5 + 2 s.
    expect(trip!.atS).toBeGreaterThan(2.5);
    expect(trip!.atS).toBeLessThan(6);
    const m = r.metrics.final;
    expect(m.sets.find((x) => x.id === 'B')!.online).toBe(false);
    expectClose(m.frequencyHz, 50.8, { abs: 0.002 }, 'f with A alone (closed form)');
    expectClose(m.sets.find((x) => x.id === 'A')!.kW, 600, { abs: 1 }, 'A kW');
  });

  it('a set at its overload limit holds it in the simulator too (the steady state’s fuel limit)', () => {
    // Closed form: A 500 kW (f_nl 52.5, 250 kW/Hz) reaches 550 kW (110 %) at 50.3 Hz; B 1000 kW (52 Hz, 500 kW/Hz)
    // takes the rest of 1500 kW: 950 kW at 50.1 Hz.
    const plant = makePlant(
      [rawSet('A', { ratedKVA: 625, ratedKW: 500, governor: { mode: 'droop', droopPct: 4, noLoadHz: 52.5 } }), rawSet('B')],
      [load(1200, 500)],
    );
    const r = simulate({ plant, durationS: 14, stepMs: 5, events: [{ atS: 0.5, type: 'load-step', kW: 300, kVAR: 0 }], outputPoints: 50 });
    const m = r.metrics.final;
    expectClose(m.sets.find((x) => x.id === 'A')!.kW, 550, { abs: 1 }, 'A at its overload limit');
    expectClose(m.frequencyHz, 50.1, { abs: 0.002 }, 'f (closed form)');
  });
});

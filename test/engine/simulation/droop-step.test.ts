/** A load step on one set in droop: where it ends, and the energy it takes on the way. */
import { describe, expect, it } from 'vitest';
import { createSimulation, simulate } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

describe('load step on a set in droop', () => {
  // Speed-droop definition (README "Definitions"): P = ratedKW (f_nl − f) / (droop · f_rated), so after a step to
  // 700 kW a 1000 kW set at 4 % droop, f_nl 52 Hz, settles at 52 − 0.04 · 50 · 0.7 = 50.6 Hz.
  it('ends on the droop line', () => {
    const plant = makePlant([rawSet('A')], [{ id: 'L', kW: 400, kVAR: 250 }]);
    const r = simulate({ plant, durationS: 12, stepMs: 2, events: [{ atS: 0.5, type: 'load-step', kW: 300, kVAR: 150 }] });
    expectClose(r.metrics.initial.frequencyHz, 52 - 0.04 * 50 * 0.4, { abs: 1e-6 }, 'initial frequency, Hz (droop line at 400 kW)');
    expectClose(r.metrics.final.frequencyHz, 52 - 0.04 * 50 * 0.7, { abs: 0.002 }, 'final frequency, Hz (droop line at 700 kW)');
    expectClose(r.metrics.final.sets[0]!.kW, 700, { abs: 0.5 }, 'final kW');
    // It dips below the final value on the way (the engine lags) and recovers.
    expect(r.metrics.frequencyNadirHz).toBeLessThan(r.metrics.final.frequencyHz);
    expect(r.metrics.frequencyRecoveryS).not.toBeNull();
  });

  // Chapman, Electric Machinery Fundamentals, parallel operation of generators (example):
  // G1 f_nl 61.5 Hz, G2 61.0 Hz, both 1 MW/Hz, load 2.5 MW → 60 Hz, 1.5 / 1.0 MW; add 1 MW →
  // 59.5 Hz, 2.0 / 1.5 MW; raise G2 by 0.5 Hz → 59.75 Hz, 1.75 / 1.75 MW.
  it("reproduces Chapman's two-set example through a load step and a speed raise", () => {
    // 1 MW/Hz = ratedKW / (droop · 60 Hz) with ratedKW 3000 kW and 5 % droop.
    const set = (id: string, noLoadHz: number) => rawSet(id, { ratedKVA: 3750, ratedKW: 3000, governor: { mode: 'droop', droopPct: 5, noLoadHz } });
    const plant = makePlant([set('G1', 61.5), set('G2', 61)], [{ id: 'L', kW: 2500, kVAR: 800 }], { ratedFrequencyHz: 60 });
    const sim = createSimulation({
      plant,
      durationS: 30,
      stepMs: 2,
      events: [
        { atS: 0.5, type: 'load-step', kW: 1000, kVAR: 0 },
        { atS: 15, type: 'setpoint', setId: 'G2', frequencyHz: 61.5 },
      ],
    });
    const s0 = sim.snapshot();
    expectClose(s0.frequencyHz, 60, { abs: 1e-6 }, 'f, Hz (Chapman: 60)');
    expectClose(s0.sets[0]!.kW, 1500, { abs: 1e-3 }, 'G1 kW (Chapman: 1500)');
    sim.advance(14.5);
    let s = sim.snapshot();
    expectClose(s.frequencyHz, 59.5, { abs: 0.002 }, 'f after 1 MW more, Hz (Chapman: 59.5)');
    expectClose(s.sets[0]!.kW, 2000, { abs: 2 }, 'G1 kW (Chapman: 2000)');
    expectClose(s.sets[1]!.kW, 1500, { abs: 2 }, 'G2 kW (Chapman: 1500)');
    sim.advance(15);
    s = sim.snapshot();
    expectClose(s.frequencyHz, 59.75, { abs: 0.002 }, 'f after raising G2, Hz (Chapman: 59.75)');
    expectClose(s.sets[0]!.kW, 1750, { abs: 2 }, 'G1 kW (Chapman: 1750)');
    expectClose(s.sets[1]!.kW, 1750, { abs: 2 }, 'G2 kW (Chapman: 1750)');
  });

  // Closed form: with damping off, d(H S ω²)/dt = S (Pm − Pe) for each set (torque-form swing
  // equation, Kundur 1994 eq. 3.9), and without feeders Σ Pe is the load. So the change of
  // kinetic energy equals ∫ (Σ Pm − P_load) dt.
  it('keeps the energy books with damping off', () => {
    const noDamping = { xdPU: 2.5, dampingPU: 0, inertiaS: 1.2 };
    const plant = makePlant(
      [rawSet('A', { machine: noDamping }), rawSet('B', { ratedKVA: 625, ratedKW: 500, machine: { ...noDamping, inertiaS: 0.8 } })],
      [{ id: 'L', kW: 700, kVAR: 300 }],
    );
    const sim = createSimulation({ plant, durationS: 4, stepMs: 1, events: [] });
    const h = [1.2 * 1250, 0.8 * 625];
    const ke = () => sim.snapshot().sets.reduce((sum, s, i) => sum + h[i]! * (s.speedHz / 50) ** 2, 0);
    const net = () => {
      const s = sim.snapshot();
      return s.sets.reduce((sum, x) => sum + x.mechanicalKW, 0) - s.loadKW;
    };
    sim.advance(0.2);
    sim.applyEvent({ atS: 0, type: 'load-step', kW: 400, kVAR: 100 });
    const ke0 = ke();
    let integral = 0;
    let prev = net();
    const dt = 0.001;
    for (let k = 0; k < 2500; k++) {
      sim.advance(dt);
      const now = net();
      integral += 0.5 * (prev + now) * dt;
      prev = now;
    }
    const dKE = ke() - ke0;
    expect(Math.abs(dKE)).toBeGreaterThan(20); // the step really moved the rotors (kW·s)
    expectClose(dKE, integral, { rel: 0.005 }, 'kinetic energy change, kW·s');
  });
});

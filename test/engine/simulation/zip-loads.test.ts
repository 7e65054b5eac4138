/**
 * ZIP loads in the simulator: the bus solve's constant-current term and break voltage against
 * closed forms, and a run that keeps the steady-state solver's load law (at rest it stays at
 * rest; after a ZIP load switches on it settles on the closed-form steady state).
 */
import { describe, expect, it } from 'vitest';
import { createSimulation, simulate } from '../../../electron/engine';
import {
  NET_A_IM,
  NET_A_RE,
  NET_BREAK,
  NET_IN_IM,
  NET_IN_RE,
  NET_LENGTH,
  NET_P,
  NET_PI,
  NET_Q,
  NET_QI,
  solveBus,
} from '../../../electron/engine/simulation/network';
import type { BusVoltage } from '../../../electron/engine/simulation/network';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

/** A purely real bus: conductance g, Norton current iN, constant-power p and constant-current pI (pu), break b. */
function realBus(g: number, iN: number, p: number, pI: number, b: number): number {
  const net = new Float64Array(NET_LENGTH);
  net[NET_A_RE] = g;
  net[NET_A_IM] = 0;
  net[NET_IN_RE] = iN;
  net[NET_IN_IM] = 0;
  net[NET_P] = p;
  net[NET_Q] = 0;
  net[NET_PI] = pI;
  net[NET_QI] = 0;
  net[NET_BREAK] = b;
  const bus: BusVoltage = { re: 1, im: 0, iterations: 0, converged: false };
  solveBus(net, bus);
  expect(bus.converged).toBe(true);
  expectClose(bus.im, 0, { abs: 1e-12 }, 'imaginary part of a real bus');
  return bus.re;
}

describe('bus solve with constant-current loads', () => {
  it('above the break: g V + P_I = I_N, so V = (I_N − P_I) / g (closed form)', () => {
    expectClose(realBus(10, 10.5, 0, 1, 0.7), 0.95, { abs: 1e-12 }, 'V, pu (closed form (10.5 − 1) / 10)');
  });

  it('below the break the constant-current share draws as impedance: V = I_N / (g + P_I / b) (closed form)', () => {
    // (10.5 − 8) / 10 = 0.25 < 0.7 would be the constant-current answer; as impedance: 10.5 / (10 + 8 / 0.7).
    expectClose(realBus(10, 10.5, 0, 8, 0.7), 10.5 / (10 + 8 / 0.7), { abs: 1e-12 }, 'V, pu (closed form)');
  });

  it('constant power and constant current together: g V² − I_N V + P_I V + P = 0 (closed form, larger root)', () => {
    // 10 V² − 10.5 V + 1 V + 0.5 = 0 → V = (9.5 + √(9.5² − 20)) / 20.
    expectClose(realBus(10, 10.5, 0.5, 1, 0.7), (9.5 + Math.sqrt(9.5 * 9.5 - 20)) / 20, { abs: 1e-12 }, 'V, pu (quadratic)');
  });
});

/** A complex bus: admittance A, Norton current I_N, constant-power load P + jQ, break b, warm start (re, im). */
function complexBus(a: [number, number], iN: [number, number], pq: [number, number], b: number, warm: [number, number]): BusVoltage {
  const net = new Float64Array(NET_LENGTH);
  net[NET_A_RE] = a[0];
  net[NET_A_IM] = a[1];
  net[NET_IN_RE] = iN[0];
  net[NET_IN_IM] = iN[1];
  net[NET_P] = pq[0];
  net[NET_Q] = pq[1];
  net[NET_BREAK] = b;
  const bus: BusVoltage = { re: warm[0], im: warm[1], iterations: -1, converged: false };
  solveBus(net, bus);
  expect(bus.converged).toBe(true);
  return bus;
}

describe('bus solve with constant-power loads and no constant-current share (direct solution)', () => {
  it('a real bus: g V² − I_N V + P = 0, the larger root, without iterating (closed form)', () => {
    // 10 V² − 10.5 V + 0.5 = 0 → V = (10.5 + √(10.5² − 20)) / 20.
    const bus = complexBus([10, 0], [10.5, 0], [0.5, 0], 0.7, [1, 0]);
    expect(bus.iterations).toBe(0);
    expectClose(bus.re, (10.5 + Math.sqrt(10.5 * 10.5 - 20)) / 20, { abs: 1e-14 }, 'V, pu (quadratic)');
    expectClose(bus.im, 0, { abs: 1e-15 }, 'imaginary part of a real bus');
  });

  it('a complex bus: the direct answer satisfies A V + S* / V* = I_N and equals the Newton answer (closed form: residual 0)', () => {
    const a: [number, number] = [6.2, -9.1];
    const iN: [number, number] = [7.9, -7.4];
    const pq: [number, number] = [0.45, 0.3];
    const direct = complexBus(a, iN, pq, 0.7, [0.92, 0.18]);
    expect(direct.iterations).toBe(0);
    const [vr, vi] = [direct.re, direct.im];
    const v2 = vr * vr + vi * vi;
    // S* / V* = (P − jQ) V / |V|².
    const fr = a[0] * vr - a[1] * vi + (pq[0] * vr + pq[1] * vi) / v2 - iN[0];
    const fi = a[0] * vi + a[1] * vr + (pq[0] * vi - pq[1] * vr) / v2 - iN[1];
    expect(Math.hypot(fr, fi)).toBeLessThan(1e-13);
    // A warm start 0.45 pu away is left to Newton's method, which reaches the same voltage.
    const newton = complexBus(a, iN, pq, 0.7, [0.6, 0.5]);
    expect(newton.iterations).toBeGreaterThan(0);
    expectClose(newton.re, vr, { abs: 1e-13 }, 'V real part, pu (Newton against the direct solution)');
    expectClose(newton.im, vi, { abs: 1e-13 }, 'V imaginary part, pu (Newton against the direct solution)');
  });

  it('near the nose of the curve (roots about to meet) it iterates instead', () => {
    // 10 V² − 10.5 V + P = 0 has a double root at P = 10.5² / 40 = 2.75625; at P = 2.7562495 the quadratic in
    // |V|² has a discriminant of 7.3e-7 of b², under the 1e-6 below which the direct solution is not taken.
    const p = 2.7562495;
    const bus = complexBus([10, 0], [10.5, 0], [p, 0], 0.1, [0.53, 0]);
    expect(bus.iterations).toBeGreaterThan(0);
    expectClose(bus.re, (10.5 + Math.sqrt(10.5 * 10.5 - 40 * p)) / 20, { abs: 1e-6 }, 'V, pu (quadratic, larger root)');
  });
});

const zipLoad = {
  id: 'Z',
  kW: 500,
  kVAR: 300,
  model: 'zip',
  kWImpedancePct: 40,
  kWCurrentPct: 30,
  kVARImpedancePct: 20,
  kVARCurrentPct: 50,
  frequencySensitivity: 1.5,
  kVARFrequencySensitivity: 2,
};

/** The ZIP law of `zipLoad` at bus voltage v (V) and frequency f (Hz), 400 V / 50 Hz plant. */
function law(v: number, f: number): { kW: number; kVAR: number } {
  const u = v / 400;
  const df = (f - 50) / 50;
  return { kW: 500 * (0.4 * u * u + 0.3 * u + 0.3) * (1 + 1.5 * df), kVAR: 300 * (0.2 * u * u + 0.5 * u + 0.3) * (1 + 2 * df) };
}

describe('ZIP loads in a run', () => {
  it('a plant with a ZIP load starts at rest and stays there (same law as the steady-state solve)', () => {
    const plant = makePlant([rawSet('A')], [{ id: 'L', kW: 300, kVAR: 200 }, zipLoad]);
    const sim = createSimulation({ plant, durationS: 2, stepMs: 2, events: [] });
    const s0 = sim.snapshot();
    sim.advance(2);
    const s1 = sim.snapshot();
    expectClose(s1.frequencyHz, s0.frequencyHz, { abs: 1e-6 }, 'frequency, Hz (at rest)');
    expectClose(s1.voltageV, s0.voltageV, { abs: 1e-5 }, 'voltage, V (at rest)');
    const l = law(s1.voltageV, s1.frequencyHz);
    expectClose(s1.loadKW, 300 + l.kW, { rel: 1e-9 }, 'load kW, closed form at the run voltage and frequency');
    expectClose(s1.loadKVAR, 200 + l.kVAR, { rel: 1e-9 }, 'load kVAR, closed form');
  });

  it('after a ZIP load switches on the run settles on the closed-form steady state of the final loads', () => {
    const plant = makePlant(
      [rawSet('A')],
      [
        { id: 'L', kW: 300, kVAR: 200 },
        { ...zipLoad, online: false },
      ],
    );
    const r = simulate({ plant, durationS: 20, stepMs: 2, events: [{ atS: 1, type: 'load-step', loadId: 'Z', online: true }] });
    const ss = r.metrics.steadyState!;
    expect(ss).not.toBeNull();
    expectClose(r.metrics.final.frequencyHz, ss.frequencyHz, { abs: 0.01 }, 'final frequency, Hz (steady state of the solver)');
    expectClose(r.metrics.final.voltageV, ss.voltageV, { abs: 0.5 }, 'final voltage, V (steady state of the solver)');
    // The set's kW is the loads' law at the final voltage and frequency (no feeder: no loss).
    const l = law(r.metrics.final.voltageV, r.metrics.final.frequencyHz);
    expectClose(r.metrics.final.sets[0]!.kW, 300 + l.kW, { rel: 1e-4 }, 'set kW, closed form of the loads at the final V and f');
    expectClose(r.metrics.final.sets[0]!.kVAR, 200 + l.kVAR, { rel: 1e-4 }, 'set kVAR, closed form of the loads at the final V and f');
    expect(r.warnings.some((w) => /not served/.test(w))).toBe(false);
  });

  it('below the break voltage the run says how much constant-current and constant-power load it does not serve', () => {
    const plant = makePlant(
      [rawSet('A', { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416, ceilingPU: 1.2 } })],
      [{ id: 'L', kW: 200, kVAR: 100 }],
      { powerLoadBreakPct: 90 },
    );
    const r = simulate({ plant, durationS: 6, stepMs: 2, events: [{ atS: 1, type: 'load-step', kW: 900, kVAR: 900 }] });
    const line = r.log.find((e) => /below 90 % voltage/.test(e.text));
    expect(line?.text).toMatch(/constant-power and constant-current loads now draw as constant impedance \(\d+ kW not served\)/);
    expect(r.metrics.unservedKWh).toBeGreaterThan(0);
  });
});

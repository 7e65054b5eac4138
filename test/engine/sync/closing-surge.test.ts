import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { closingSurge, closingSurgeForCase, iecPeakFactor, peakTorqueFactor, surgeCircuit, syncBasis } from '../../../electron/engine';
import type { SurgeCircuit } from '../../../electron/engine';
import type { SyncCase } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';

/** Two 1000 kVA 480 V sets, X''d 0.15 each (a worked example of our own): loop 0.30 pu, R/X given as 0. */
function twoSets(over: Partial<SyncCase['incoming']> = {}): SyncCase {
  return {
    bus: { frequencyHz: 60, voltageV: 480 },
    incoming: { frequencyHz: 60, voltageV: 480, angleDeg: 0, ratedKVA: 1000, xddpPU: 0.15, rOverX: 0, poles: 4, ...over },
    busSource: { ratedKVA: 1000, xPU: 0.15 },
    breakerClosingMs: 0,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
}

describe('closingSurge: two 1000 kVA 480 V sets, X total 0.30 pu', () => {
  const circuit = surgeCircuit(twoSets());

  it('has the 1202.8 A base and the 0.30 pu loop (closed form S/(√3 V) = 1 000 000 / (√3 × 480))', () => {
    expectClose(circuit.baseCurrentA, 1202.8, { abs: 0.05 });
    expectClose(circuit.loopXPU, 0.3, { rel: 1e-12 });
  });

  // Closed form, worked by hand: I'' = |ΔV| / 0.30 = 2 sin(θ/2) / 0.30; amperes × 1202.8 A.
  it.each([
    [10, 0.581, 699],
    [20, 1.158, 1392],
    [180, 6.67, 8019],
  ])('closing at %s° gives %s pu, %s A', (deg, pu, amps) => {
    const s = closingSurge(circuit, deg);
    expectClose(s.surgeCurrentPU, (2 * Math.sin((deg * Math.PI) / 360)) / 0.3, { rel: 1e-12 }, 'closed form 2 sin(θ/2) / X');
    expectClose(s.surgeCurrentPU, pu, { abs: 0.006 }, 'hand-worked pu, rounded');
    expectClose(s.surgeCurrentA, amps, { abs: 1.5 }, 'hand-worked A, rounded');
  });

  it('gives a 1.667 pu synchronizing power step at 30° ((E1 E2 / X) sin θ = 0.5 / 0.3, closed form)', () => {
    const s = closingSurge(circuit, 30);
    expectClose(s.powerStepPU, 0.5 / 0.3, { rel: 1e-12 });
    expectClose(s.powerStepPU, 1.667, { abs: 5e-4 });
    expectClose(s.powerStepKW, 1666.7, { abs: 0.05 });
    expect(closingSurge(circuit, -30).powerStepPU).toBeCloseTo(-s.powerStepPU, 12);
  });

  it('turns the power step into torque on the 1800 rpm torque base (T_base = S / ω_m, closed form)', () => {
    // 1000 kVA at 1800 rpm (60 Hz, 4 poles, N = 120 f / P): ω = 188.50 rad/s → 5.305 kN·m.
    const basis = syncBasis(twoSets());
    expect(basis.ratedSpeedRpm).toBe(1800);
    expectClose(basis.torqueKNm, 1000 / (2 * Math.PI * 30), { rel: 1e-12 });
    const s = closingSurge(circuit, 30);
    expectClose(s.torqueStepPU, s.powerStepPU, { rel: 1e-12 }, 'at rated speed torque pu = power pu');
    expectClose(s.torqueStepKNm, (0.5 / 0.3) * 5.3052, { abs: 1e-3 });
  });

  it('divides by the incoming speed: 1 % fast gives 1 % less torque per power (T = P / ω)', () => {
    const fast = surgeCircuit(twoSets({ frequencyHz: 60.6 }));
    const s = closingSurge(fast, 30);
    expectClose(s.torqueStepPU, s.powerStepPU / 1.01, { rel: 1e-12 });
  });

  it("peaks at √2 × 2.0 × I'' for a purely reactive loop (IEC 60909: κ(0) = 2.0)", () => {
    const s = closingSurge(circuit, 20);
    expect(s.peakFactor).toBe(2);
    expectClose(s.peakCurrentA, 2 * Math.SQRT2 * s.surgeCurrentA, { rel: 1e-12 });
  });
});

/**
 * First-cycle air-gap torque of an out-of-phase close with the stator's DC offset, R neglected:
 * T(t) = (E1 E2 / X)[sin θ − sin(ωt + θ) + sin ωt], peak (E1 E2 / X)(sin θ + 2 sin(θ/2)) — the classical result for
 * out-of-phase synchronizing (Kundur, Power System Stability and Control, 1994, chapter on subsynchronous
 * oscillations and torsional effects; location from memory). Each expected value is recomputed here: by the
 * closed form, and independently by sampling T(t) over one cycle.
 */
describe('peak closing torque (first cycle, with the DC offset)', () => {
  const circuit = surgeCircuit(twoSets());
  const eeOverX = 1 / 0.3; // E1 = E2 = 1 pu, X = 0.30 pu
  const rad = (d: number): number => (d * Math.PI) / 180;
  /** Largest |T(t)| over one cycle, sampled every 0.01° of ωt: the waveform itself, not the closed form. */
  const sampledPeak = (thetaDeg: number): number => {
    const th = rad(thetaDeg);
    let best = 0;
    for (let k = 0; k <= 36000; k++) {
      const wt = rad(k / 100);
      const t = Math.sin(th) - Math.sin(wt + th) + Math.sin(wt);
      if (Math.abs(t) > Math.abs(best)) best = t;
    }
    return best;
  };

  it.each([
    // θ, sin θ + 2 sin(θ/2) worked by hand, peak / step
    [10, 0.173648 + 2 * 0.087156, 2.0038],
    [60, 0.866025 + 2 * 0.5, 2.1547],
    [120, 0.866025 + 2 * 0.866025, 3.0],
  ])('at %s° the peak is (E1E2/X)(sin θ + 2 sin(θ/2)) = %s × E1E2/X, %s × the step', (deg, factor, ratio) => {
    const s = closingSurge(circuit, deg);
    expectClose(peakTorqueFactor(deg), factor, { abs: 2e-6 }, 'closed form by hand');
    expectClose(peakTorqueFactor(deg), sampledPeak(deg), { abs: 1e-6 }, 'largest of the sampled waveform');
    expectClose(s.peakTorquePU, eeOverX * factor, { abs: 1e-5 });
    expectClose(s.peakTorquePU / s.torqueStepPU, ratio, { abs: 1e-4 }, 'peak / step = 1 + 1/cos(θ/2)');
    expectClose(s.peakTorqueKNm, s.peakTorquePU * syncBasis(twoSets()).torqueKNm, { rel: 1e-12 });
  });

  it('reads 2.15 × the step at 60° and 3.00 × at 120° (peak / step = 1 + 1/cos(θ/2))', () => {
    expect((closingSurge(circuit, 60).peakTorquePU / closingSurge(circuit, 60).torqueStepPU).toFixed(2)).toBe('2.15');
    expect((closingSurge(circuit, 120).peakTorquePU / closingSurge(circuit, 120).torqueStepPU).toFixed(2)).toBe('3.00');
  });

  it('is 2 E1E2/X at 180°, where the torque step reads zero', () => {
    const s = closingSurge(circuit, 180);
    expect(Math.abs(s.torqueStepPU)).toBeLessThan(1e-12);
    expectClose(s.peakTorquePU, 2 * eeOverX, { rel: 1e-12 }, '0 + 2 sin 90°');
    expectClose(sampledPeak(180), 2, { abs: 1e-9 });
  });

  it('is odd in θ, takes the wrapped angle (190° is −170°), and divides by the incoming speed', () => {
    expectClose(closingSurge(circuit, -60).peakTorquePU, -closingSurge(circuit, 60).peakTorquePU, { rel: 1e-12 });
    expectClose(closingSurge(circuit, 190).peakTorquePU, closingSurge(circuit, -170).peakTorquePU, { rel: 1e-12 });
    const fast = surgeCircuit(twoSets({ frequencyHz: 60.6 }));
    expectClose(closingSurge(fast, 60).peakTorquePU, closingSurge(circuit, 60).peakTorquePU / 1.01, { rel: 1e-12 });
  });

  it('is never smaller than the step and largest at 120° (3√3/2 E1E2/X) — property', () => {
    fc.assert(
      fc.property(fc.double({ min: -180, max: 180, noNaN: true }), (a) => {
        const s = closingSurge(circuit, a);
        expect(Math.abs(s.peakTorquePU)).toBeGreaterThanOrEqual(Math.abs(s.torqueStepPU) - 1e-12);
        expect(Math.abs(s.peakTorquePU)).toBeLessThanOrEqual(eeOverX * ((3 * Math.sqrt(3)) / 2) + 1e-12);
      }),
    );
  });
});

describe('iecPeakFactor', () => {
  it('is 1.02 + 0.98 e^(−3R/X) (IEC 60909-0)', () => {
    expect(iecPeakFactor(0)).toBe(2);
    expectClose(iecPeakFactor(0.15), 1.02 + 0.98 * Math.exp(-0.45), { rel: 1e-14 });
    expectClose(iecPeakFactor(0.15), 1.645, { abs: 5e-4 }, 'closed form, rounded');
    expectClose(iecPeakFactor(0.07), 1.02 + 0.98 * Math.exp(-0.21), { rel: 1e-14 });
    expectClose(iecPeakFactor(100), 1.02, { abs: 1e-12 }, 'resistive limit');
  });

  it('falls as R/X grows (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 5, noNaN: true }), fc.double({ min: 1e-3, max: 1, noNaN: true }), (r, d) => {
        expect(iecPeakFactor(r + d)).toBeLessThan(iecPeakFactor(r));
      }),
    );
  });
});

describe('surge circuit from the case', () => {
  it("takes R/X from the IEC 60909 fictitious generator resistance when not given (0.15 X''d at ≤ 1 kV [memory])", () => {
    const c = twoSets({ rOverX: undefined });
    delete c.incoming.rOverX;
    const circuit = surgeCircuit(c);
    expectClose(circuit.rOverX, 0.15, { rel: 1e-12 });
    const mv: SyncCase = { ...c, bus: { frequencyHz: 50, voltageV: 11000 }, incoming: { ...c.incoming, voltageV: 11000, frequencyHz: 50 } };
    expectClose(surgeCircuit(mv).rOverX, 0.07, { rel: 1e-12 }, 'above 1 kV');
  });

  it('moves the bus source to the incoming base by S_in / S_bus', () => {
    // A 3000 kVA bus at X 0.15 on its base is 0.05 pu on 1000 kVA: loop 0.20 pu.
    const c: SyncCase = { ...twoSets(), busSource: { ratedKVA: 3000, xPU: 0.15 } };
    expectClose(surgeCircuit(c).loopXPU, 0.2, { rel: 1e-12 });
  });

  it('takes an infinite bus when no bus source is given (largest surge)', () => {
    const c = twoSets();
    delete c.busSource;
    expectClose(surgeCircuit(c).loopXPU, 0.15, { rel: 1e-12 });
    expect(closingSurgeForCase(c, 10).surgeCurrentPU).toBeGreaterThan(closingSurgeForCase(twoSets(), 10).surgeCurrentPU);
  });

  it('does not mutate the case', () => {
    const c = twoSets();
    const before = JSON.stringify(c);
    closingSurgeForCase(c, 45);
    expect(JSON.stringify(c)).toBe(before);
  });
});

describe('closing surge properties', () => {
  const anyCircuit = fc.record({
    busVoltagePU: fc.double({ min: 0.8, max: 1.2, noNaN: true }),
    incomingVoltagePU: fc.double({ min: 0.8, max: 1.2, noNaN: true }),
    loopXPU: fc.double({ min: 0.05, max: 1, noNaN: true }),
    rOverX: fc.double({ min: 0, max: 1, noNaN: true }),
    baseCurrentA: fc.constant(1202.8),
    incomingKVA: fc.constant(1000),
    torqueBaseKNm: fc.constant(5.3),
    speedPU: fc.constant(1),
  }) as fc.Arbitrary<SurgeCircuit>;

  it('surge current grows with angle from 0° to 180°', () => {
    fc.assert(
      fc.property(anyCircuit, fc.double({ min: 0, max: 179, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true }), (circuit, a, d) => {
        const lo = closingSurge(circuit, a);
        const hi = closingSurge(circuit, Math.min(180, a + d));
        expect(hi.surgeCurrentPU).toBeGreaterThan(lo.surgeCurrentPU);
        expect(hi.peakCurrentA).toBeGreaterThan(lo.peakCurrentA);
      }),
    );
  });

  it('is the same at ±θ, and the torque step is odd in θ', () => {
    fc.assert(
      fc.property(anyCircuit, fc.double({ min: -180, max: 180, noNaN: true }), (circuit, a) => {
        expectClose(closingSurge(circuit, a).surgeCurrentPU, closingSurge(circuit, -a).surgeCurrentPU, { abs: 1e-12 });
        expectClose(closingSurge(circuit, a).torqueStepPU, -closingSurge(circuit, -a).torqueStepPU, { abs: 1e-12 });
      }),
    );
  });
});

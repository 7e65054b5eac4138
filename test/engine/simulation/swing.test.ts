/**
 * Electromechanical swing of one set against a stiff bus, and the first instants of a
 * load step: checks of the swing equation against closed forms.
 */
import { describe, expect, it } from 'vitest';
import { createSimulation } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

describe('small-signal swing frequency against a stiff bus', () => {
  // Kundur, Power System Stability and Control (1994), Example 12.2 (figures confirmed via a public reproduction of the example):
  // E' = 1.123, E_B = 0.995, X_T = X'd + X_E = 0.3 + 0.65 = 0.95, δ0 = 49.92°, H = 3.5 s, 60 Hz,
  // P = 0.9 → Ks = 0.757 pu/rad, ωn = 6.39 rad/s.
  function stiffBusCase(dampingPU: number) {
    const vr = 400;
    // X_E is folded into the machine (X'd = X''d = X_T), so the bus is the set's terminal; the
    // kVAR the set sends into the bus follows from Kundur's E', E_B, δ0:
    // I = (E'∠δ0 − E_B) / jX_T, Q_bus = Im(E_B I*).
    const d0 = (49.92 * Math.PI) / 180;
    const iRe = (1.123 * Math.sin(d0)) / 0.95;
    const iIm = -(1.123 * Math.cos(d0) - 0.995) / 0.95;
    const qBusPU = -0.995 * iIm;
    const qBase = 1000 * Math.sqrt(1 - 0.95 ** 2);
    const noLoadV = 0.995 * vr + 0.04 * vr * ((qBusPU * 1000) / qBase);
    expectClose(0.995 * iRe, 0.9, { abs: 0.002 }, 'P at the bus, pu (Kundur Ex. 12.2: 0.9)');
    const plant = makePlant(
      [
        rawSet('G', {
          ratedKVA: 1000,
          ratedKW: 950,
          ratedPF: 0.95,
          governor: { mode: 'baseload', baseKW: 0.995 * iRe * 1000, actuatorLagS: 0.01, engineLagS: 0.01 },
          regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV },
          // Classical model: X''d = X'd = X_T, field flux frozen (T'd0 = 10 000 s, far beyond the run), no damping.
          machine: { xdPU: 1.81, xdpPU: 0.95, xddpPU: 0.95, tdopS: 1e4, inertiaS: 3.5, dampingPU },
        }),
        // The "infinite bus": a set a thousand times larger holding 0.995 pu.
        rawSet('BUS', {
          ratedKVA: 1e6,
          ratedKW: 8e5,
          governor: { mode: 'isochronous', setpointHz: 60 },
          regulator: { mode: 'voltage', setpointV: 0.995 * vr },
          machine: { xddpPU: 0.15, xdpPU: 0.2, inertiaS: 10 },
        }),
      ],
      [{ id: 'L', kW: 900, kVAR: 0 }],
      { ratedFrequencyHz: 60, ratedVoltageV: vr },
    );
    const sim = createSimulation({ plant, durationS: 6, stepMs: 1, events: [] });
    return { sim, baseKW: 0.995 * iRe * 1000 };
  }

  /** Slip of G against the bus every 2 ms for 6 s after a small kW step. */
  function swing(dampingPU: number): { t: number[]; slip: number[]; delta0Deg: number } {
    const { sim, baseKW } = stiffBusCase(dampingPU);
    const delta0Deg = sim.snapshot().sets[0]!.rotorAngleDeg!;
    sim.applyEvent({ atS: 0, type: 'setpoint', setId: 'G', kW: baseKW + 4.5 });
    const t: number[] = [];
    const slip: number[] = [];
    for (let k = 0; k < 3000; k++) {
      sim.advance(0.002);
      const s = sim.snapshot();
      t.push(s.timeS);
      slip.push(s.sets[0]!.speedHz - s.sets[1]!.speedHz);
    }
    return { t, slip, delta0Deg };
  }

  const ks = ((1.123 * 0.995) / 0.95) * Math.cos((49.92 * Math.PI) / 180);
  const omegaN = Math.sqrt((2 * Math.PI * 60 * ks) / (2 * 3.5));

  it('recovers ωn = sqrt(ωs Ks / 2H) within 1 %', () => {
    const { t, slip, delta0Deg } = swing(0);
    // The operating point is Kundur's: rotor angle ahead of the bus.
    expectClose(delta0Deg, 49.92, { abs: 0.3 }, 'δ0, degrees (Kundur Ex. 12.2)');
    const times: number[] = [];
    for (let k = 101; k < t.length; k++) {
      if (slip[k - 1]! < 0 && slip[k]! >= 0) times.push(t[k - 1]! + ((t[k]! - t[k - 1]!) * -slip[k - 1]!) / (slip[k]! - slip[k - 1]!));
    }
    expect(times.length).toBeGreaterThanOrEqual(4);
    const period = (times[times.length - 1]! - times[0]!) / (times.length - 1);
    expectClose(ks, 0.757, { abs: 0.001 }, 'Ks recomputed (Kundur Ex. 12.2: 0.757 pu/rad)');
    expectClose((2 * Math.PI) / period, omegaN, { rel: 0.01 }, 'ωn, rad/s (Kundur Ex. 12.2: 6.39)');
  });

  // Kundur 1994, Example 12.2 with K_D = 10: ζ = K_D / (2 sqrt(2H Ks ωs)) = 0.112.
  // Measured from the logarithmic decrement of successive slip peaks, ln(x_k / x_k+1) = 2πζ / sqrt(1 − ζ²).
  it('recovers the damping ratio ζ = K_D / (2 sqrt(2H Ks ωs)) within 3 % with K_D = 10', () => {
    const { slip } = swing(10);
    const peaks: number[] = [];
    for (let k = 200; k < slip.length - 1; k++) if (slip[k]! > slip[k - 1]! && slip[k]! >= slip[k + 1]! && slip[k]! > 0) peaks.push(slip[k]!);
    expect(peaks.length).toBeGreaterThanOrEqual(3);
    const dec = Math.log(peaks[0]! / peaks[1]!);
    const zeta = dec / Math.sqrt(4 * Math.PI * Math.PI + dec * dec);
    const expected = 10 / (2 * Math.sqrt(2 * 3.5 * ks * 2 * Math.PI * 60));
    expectClose(expected, 0.112, { abs: 0.001 }, 'ζ recomputed (Kundur Ex. 12.2: 0.112)');
    expectClose(zeta, expected, { rel: 0.03 }, 'damping ratio ζ');
  });
});

describe('the first instant of a load step', () => {
  // Closed form: swing equation 2H dω/dt = Pm − Pe, so RoCoF = ΔP f0 / 2H:
  // 0.3 pu step, H = 1 s, 50 Hz → 7.5 Hz/s.
  it('falls at ΔP f0 / 2H', () => {
    const plant = makePlant([rawSet('A', { ratedKVA: 1000, ratedKW: 800, machine: { inertiaS: 1 } })], [{ id: 'L', kW: 400, kVAR: 200 }]);
    const sim = createSimulation({ plant, durationS: 1, stepMs: 0.5, events: [] });
    sim.advance(0.01);
    sim.applyEvent({ atS: 0, type: 'load-step', kW: 300, kVAR: 0 });
    const f0 = sim.snapshot().frequencyHz;
    sim.advance(0.005);
    const rocof = (sim.snapshot().frequencyHz - f0) / 0.005;
    expectClose(rocof, -(0.3 * 50) / (2 * 1), { rel: 0.02 }, 'RoCoF, Hz/s (closed form: −7.5)');
  });
});

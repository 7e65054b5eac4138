/**
 * ZIP loads in the steady state: constant impedance, constant current and constant power
 * shares of kW and kVAR, each with its frequency factor. Every expected value is a closed form
 * of the load law P = kW (pZ u² + pI u + pP)(1 + s_P Δf / f_r), u = V / V_r (and alike for Q).
 */
import { describe, expect, it } from 'vitest';
import { solveSharing } from '../../../electron/engine';
import { plantSchema } from '../../../electron/handlers';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawPlant, rawSet } from '../../helpers/plants';

/** One isochronous set holding `hz` and `v` (voltage control) with the given loads. */
function held(hz: number, v: number, loads: unknown[]) {
  return makePlant([rawSet('A', { governor: { mode: 'isochronous', setpointHz: hz }, regulator: { mode: 'voltage', setpointV: v } })], loads);
}

describe('ZIP loads in the steady-state solve', () => {
  it('a pure constant-impedance load draws P (V/Vr)² and Q (V/Vr)² (closed form)', () => {
    const r = solveSharing(held(50, 360, [{ id: 'L', kW: 500, kVAR: 300, model: 'zip', kWImpedancePct: 100, kVARImpedancePct: 100 }]));
    expectClose(r.bus.voltageV, 360, { abs: 1e-9 }, 'bus voltage, V (held)');
    expectClose(r.sets[0]!.kW, 500 * 0.9 ** 2, { rel: 1e-9 }, 'kW, closed form 500 · 0.81');
    expectClose(r.sets[0]!.kVAR, 300 * 0.9 ** 2, { rel: 1e-9 }, 'kVAR, closed form 300 · 0.81');
  });

  it('a pure constant-current load draws P V/Vr and Q V/Vr (closed form)', () => {
    const r = solveSharing(held(50, 360, [{ id: 'L', kW: 500, kVAR: 300, model: 'zip', kWCurrentPct: 100, kVARCurrentPct: 100 }]));
    expectClose(r.sets[0]!.kW, 500 * 0.9, { rel: 1e-9 }, 'kW, closed form 500 · 0.9');
    expectClose(r.sets[0]!.kVAR, 300 * 0.9, { rel: 1e-9 }, 'kVAR, closed form 300 · 0.9');
  });

  it('a mixed ZIP load sums its shares (closed form)', () => {
    // kW: 30 % Z, 20 % I, 50 % P; kVAR: 50 % Z, 0 % I, 50 % P; at u = 0.9.
    const r = solveSharing(held(50, 360, [{ id: 'L', kW: 500, kVAR: 300, model: 'zip', kWImpedancePct: 30, kWCurrentPct: 20, kVARImpedancePct: 50 }]));
    expectClose(r.sets[0]!.kW, 500 * (0.3 * 0.81 + 0.2 * 0.9 + 0.5), { rel: 1e-9 }, 'kW, closed form 461.5');
    expectClose(r.sets[0]!.kVAR, 300 * (0.5 * 0.81 + 0.5), { rel: 1e-9 }, 'kVAR, closed form 271.5');
  });

  it('frequency coefficients: P (1 + kpf Δf/fr) and Q (1 + kqf Δf/fr) (closed form)', () => {
    // Held at 49 Hz on a 50 Hz plant: Δf/fr = −0.02; kpf 2 → 0.96, kqf −3 → 1.06.
    const r = solveSharing(held(49, 400, [{ id: 'L', kW: 500, kVAR: 300, frequencySensitivity: 2, kVARFrequencySensitivity: -3 }]));
    expectClose(r.sets[0]!.kW, 500 * 0.96, { rel: 1e-9 }, 'kW, closed form 480');
    expectClose(r.sets[0]!.kVAR, 300 * 1.06, { rel: 1e-9 }, 'kVAR, closed form 318');
  });

  it('a constant-current kVAR load on a reactive-droop set: V = s V_nl / (s + Q/V_r) (closed form)', () => {
    // 1250 kVA at 0.8 PF: Qbase 750 kVAR; 4 % droop: s = 750 / (0.04 · 400) = 46.875 kVAR/V; V_nl 416 V.
    const plant = makePlant([rawSet('A')], [{ id: 'L', kW: 400, kVAR: 300, model: 'zip', kVARCurrentPct: 100 }]);
    const s = 750 / (0.04 * 400);
    const v = (s * 416) / (s + 300 / 400);
    const r = solveSharing(plant);
    expectClose(r.bus.voltageV, v, { rel: 1e-9 }, 'bus voltage, V (closed form 409.45)');
    expectClose(r.sets[0]!.kVAR, (300 * v) / 400, { rel: 1e-9 }, 'kVAR = 300 · V / 400');
  });

  it('through feeders (network solve) the load still follows its law at the bus voltage', () => {
    const plant = makePlant(
      [rawSet('A', { feeder: { rOhm: 0.004, xOhm: 0.006 } }), rawSet('B', { feeder: { rOhm: 0.002, xOhm: 0.004 } })],
      [
        {
          id: 'L',
          kW: 1200,
          kVAR: 700,
          model: 'zip',
          kWImpedancePct: 40,
          kWCurrentPct: 30,
          kVARImpedancePct: 20,
          kVARCurrentPct: 50,
          frequencySensitivity: 1.5,
          kVARFrequencySensitivity: 2,
        },
      ],
    );
    const r = solveSharing(plant);
    expect(r.method).toBe('newton-raphson');
    const u = r.bus.voltageV / 400;
    const df = (r.bus.frequencyHz - 50) / 50;
    const p = 1200 * (0.4 * u * u + 0.3 * u + 0.3) * (1 + 1.5 * df);
    const q = 700 * (0.2 * u * u + 0.5 * u + 0.3) * (1 + 2 * df);
    expectClose(r.totals.loadKW, p, { rel: 1e-9 }, 'load kW, closed form at the solved V and f');
    expectClose(r.totals.loadKVAR, q, { rel: 1e-9 }, 'load kVAR, closed form at the solved V and f');
  });

  it('an old file (no ZIP fields) keeps its behaviour: constant power, no kVAR frequency factor', () => {
    const r = solveSharing(held(49, 360, [{ id: 'L', kW: 500, kVAR: 300 }]));
    expectClose(r.sets[0]!.kW, 500, { rel: 1e-12 }, 'kW, constant power');
    expectClose(r.sets[0]!.kVAR, 300, { rel: 1e-12 }, 'kVAR, constant power');
  });

  it('refuses shares beyond 100 %, naming the field and the rule', () => {
    const bad = plantSchema.safeParse(rawPlant([rawSet('A')], [{ id: 'L', kW: 1, kVAR: 0, model: 'zip', kWImpedancePct: 70, kWCurrentPct: 40 }]));
    expect(bad.success).toBe(false);
    const issue = bad.error!.issues.find((i) => i.path.join('.') === 'loads.0.kWCurrentPct');
    expect(issue?.message).toMatch(/must not exceed 100 %/);
    const neg = plantSchema.safeParse(rawPlant([rawSet('A')], [{ id: 'L', kW: 1, kVAR: 0, model: 'zip', kVARImpedancePct: -5 }]));
    expect(neg.error!.issues[0]!.path.join('.')).toBe('loads.0.kVARImpedancePct');
  });
});

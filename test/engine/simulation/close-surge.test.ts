/** An out-of-phase breaker close against the closed-form subtransient surge. */
import { describe, expect, it } from 'vitest';
import { createSimulation } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

// Two 1000 kVA, 480 V, 60 Hz sets, X''d = 0.15 pu each, no feeders: the surge circuit is
// X''d1 + X''d2 = 0.30 pu (closed form):
//   |ΔV| = √(V1² + V2² − 2 V1 V2 cos θ), I'' = |ΔV| / 0.30; 20° → 1.158 pu, 1392 A.
//   Power pulse (E1 E2 / X) sin θ: 30° → 1.667 pu.
function pair() {
  const set = (id: string, online: boolean) =>
    rawSet(id, {
      online,
      ratedKVA: 1000,
      ratedKW: 800,
      governor: { mode: 'droop', droopPct: 4, noLoadHz: 60 },
      regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 480 },
      machine: { xddpPU: 0.15, xdpPU: 0.25 },
    });
  return makePlant([set('RUN', true), set('IN', false)], [], { ratedFrequencyHz: 60, ratedVoltageV: 480 });
}

describe('breaker close of an incoming set out of phase', () => {
  it('gives the closed-form first-cycle surge current', () => {
    const sim = createSimulation({ plant: pair(), durationS: 1, stepMs: 0.5, events: [] });
    sim.advance(0.01);
    sim.applyEvent({ atS: 0, type: 'close', setId: 'IN', angleDeg: 20, frequencyHz: 60, voltageV: 480 });
    const iBase = (1000 * 1000) / (Math.sqrt(3) * 480);
    const dv = Math.sqrt(2 - 2 * Math.cos((20 * Math.PI) / 180));
    const closedForm = (dv / 0.3) * iBase;
    expectClose(closedForm, 1392, { abs: 1 }, 'closed-form surge, A (closed form)');
    const first = sim.snapshot();
    expectClose(first.sets[1]!.currentA, closedForm, { rel: 0.01 }, 'surge at the instant of closing, A');
    expectClose(first.sets[0]!.currentA, closedForm, { rel: 0.01 }, 'the running set carries the same surge, A');
    // Over the first cycle (1/60 s) the RMS surge stays within a few % of the closed form
    // (dampers decay with T''d ≈ T''d0 X''d / X'd; the angle barely moves).
    let peak = 0;
    for (let k = 0; k < 33; k++) {
      sim.advance(0.0005);
      peak = Math.max(peak, sim.snapshot().sets[1]!.currentA);
    }
    expect(peak).toBeLessThanOrEqual(closedForm * 1.03);
    expect(peak).toBeGreaterThanOrEqual(closedForm * 0.85);
  });

  it('gives the closed-form synchronizing power step', () => {
    const sim = createSimulation({ plant: pair(), durationS: 1, stepMs: 0.5, events: [] });
    sim.applyEvent({ atS: 0, type: 'close', setId: 'IN', angleDeg: 30, frequencyHz: 60, voltageV: 480 });
    const s = sim.snapshot();
    expectClose(s.sets[1]!.kW / 1000, (1 / 0.3) * Math.sin(Math.PI / 6), { rel: 0.01 }, 'power step of the incoming set, pu (closed form 1.667)');
    expectClose(s.sets[0]!.kW, -s.sets[1]!.kW, { rel: 1e-6 }, 'the running set takes it back, kW');
  });

  it('pulls the incoming set into step; it then sits on its droop line', () => {
    const plant = pair();
    const r = createSimulation({
      plant: { ...plant, loads: [{ id: 'L', name: 'L', online: true, kW: 600, kVAR: 300, model: 'constant-power', frequencySensitivity: 0 }] },
      durationS: 15,
      stepMs: 1,
      // Droop line: the bus runs at 60 − 0.04 · 60 · 600/800 = 58.2 Hz; the incoming set 0.1 Hz fast.
      events: [{ atS: 0.5, type: 'close', setId: 'IN', angleDeg: 10, frequencyHz: 58.3, voltageV: 485 }],
    });
    r.advance(15);
    const s = r.snapshot();
    expect(s.sets[1]!.online).toBe(true);
    expectClose(s.sets[0]!.speedHz, s.sets[1]!.speedHz, { abs: 1e-3 }, 'speeds after pull-in, Hz');
    // Droop lines after the close (README "Definitions"): 333.3 kW/Hz each, no-load 60 and 58.3 Hz,
    // 600 kW → f = (60 + 58.3 − 600/333.3) / 2 = 58.25 Hz, the incoming set at 16.7 kW.
    const k = 800 / (0.04 * 60);
    const f = (60 + 58.3 - 600 / k) / 2;
    expectClose(s.frequencyHz, f, { abs: 0.002 }, 'bus frequency after the close, Hz');
    expectClose(s.sets[1]!.kW, k * (58.3 - f), { abs: 0.5 }, 'incoming set kW on its droop line');
    const log = r
      .result()
      .log.map((l) => l.text)
      .join('\n');
    expect(log).toMatch(/IN breaker closed at 10\.0° \(slip 0\.(09|10)\d Hz\)/);
  });
});

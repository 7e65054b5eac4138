/** Driving a simulation a frame at a time, as a live view (the operator trainer) does. */
import { describe, expect, it } from 'vitest';
import { createSimulation } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

function plant() {
  return makePlant(
    [
      rawSet('BUS1'),
      rawSet('INC', {
        online: false,
        governor: { mode: 'droop', droopPct: 4, noLoadHz: 50.6 },
        regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 396 },
      }),
    ],
    [{ id: 'L', kW: 600, kVAR: 300 }],
  );
}

describe('a simulation driven frame by frame', () => {
  // Closed form: the incoming set's phase angle advances 360 · slip degrees a second.
  it('shows the phase angle of an off-line set advancing at 360 · slip degrees a second', () => {
    const sim = createSimulation({ plant: plant(), durationS: 60, events: [] });
    const s0 = sim.snapshot();
    const slip = s0.sets[1]!.speedHz - s0.frequencyHz;
    // Bus: 52 − 0.04 · 50 · 0.6 = 50.8 Hz on BUS1's droop line; INC idles at 50.6 Hz.
    expectClose(s0.frequencyHz, 50.8, { abs: 1e-6 }, 'bus frequency, Hz');
    expectClose(slip, -0.2, { abs: 1e-6 }, 'slip, Hz');
    let prev = s0.sets[1]!.phaseAngleDeg!;
    let turned = 0;
    for (let f = 0; f < 30; f++) {
      sim.advance(1 / 60);
      const a = sim.snapshot().sets[1]!.phaseAngleDeg!;
      let d = a - prev;
      if (d > 180) d -= 360;
      if (d < -180) d += 360;
      turned += d;
      prev = a;
    }
    expectClose(turned / 0.5, 360 * slip, { rel: 0.01 }, 'phase angle rate, °/s (closed form −72)');
  });

  it("raises the incoming set's speed and voltage, closes near 0°, and the set joins the bus", () => {
    const sim = createSimulation({ plant: plant(), durationS: 60, events: [] });
    // The operator raises speed until the set runs 0.1 Hz fast, and the voltage to the bus's.
    let ref = 50.6;
    while (ref < 50.9) {
      ref = Math.min(50.9, ref + 0.01);
      sim.applyEvent({ atS: 0, type: 'setpoint', setId: 'INC', frequencyHz: ref, voltageV: sim.snapshot().voltageV });
      sim.advance(1 / 60);
    }
    sim.advance(8);
    let s = sim.snapshot();
    expectClose(s.sets[1]!.speedHz - s.frequencyHz, 0.1, { abs: 0.005 }, 'slip after raising, Hz');
    // Wait for the synchroscope to come round to within 3° before 0°, then close.
    for (let f = 0; f < 60 * 15; f++) {
      const a = s.sets[1]!.phaseAngleDeg!;
      if (a > -3 && a < 0) break;
      sim.advance(1 / 60);
      s = sim.snapshot();
    }
    expect(Math.abs(s.sets[1]!.phaseAngleDeg!)).toBeLessThan(3);
    sim.applyEvent({ atS: 0, type: 'close', setId: 'INC' });
    const rated = (1250 * 1000) / (Math.sqrt(3) * 400);
    let peak = 0;
    for (let f = 0; f < 60 * 2; f++) {
      sim.advance(1 / 60);
      peak = Math.max(peak, sim.snapshot().sets[1]!.currentA);
    }
    // A close at a few degrees and 0.1 Hz draws a fraction of rated current, not a surge.
    expect(peak).toBeLessThan(0.5 * rated);
    sim.advance(10);
    s = sim.snapshot();
    expect(s.sets[1]!.online).toBe(true);
    expect(s.sets[1]!.kW).toBeGreaterThan(0);
    expectClose(s.sets[0]!.speedHz, s.sets[1]!.speedHz, { abs: 1e-3 }, 'speeds in step, Hz');
  });
});

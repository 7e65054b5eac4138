import 'vitest-canvas-mock';
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import BeatWaveform from '../../renderer/components/sync/BeatWaveform.vue';
import { beatEnvelope, commandTimes, envelopeAt, waveformsAround, windowOpenSpans } from '../../renderer/components/sync/beat';
import type { BeatCase } from '../../renderer/components/sync/beat';
import { evaluateSync } from '../../electron/engine';
import { angleAfterDeg } from '../../shared-types';
import { expectClose } from '../helpers/expect-close';

const C: BeatCase = { busFrequencyHz: 50, incomingFrequencyHz: 50.2, busPU: 1, incomingPU: 1.02, angleDeg: -90 };

describe('beat envelope, window and command moments', () => {
  it('follows the law of cosines: |Vi − Vb| in phase, Vi + Vb in opposition', () => {
    // Closed form: at 0.2 Hz the angle goes from −90° to 0° in 1.25 s and to 180° in 3.75 s.
    expectClose(envelopeAt(C, 1.25), 0.02, { abs: 1e-9 }, 'in phase');
    expectClose(envelopeAt(C, 3.75), 2.02, { abs: 1e-9 }, 'in opposition');
    expectClose(envelopeAt(C, 0), Math.sqrt(1 + 1.02 ** 2), { abs: 1e-9 }, 'at 90° apart');
    const e = beatEnvelope(C, 5, 11);
    expect(e.tS[10]).toBe(5);
    expectClose(e.dvPU[5]!, envelopeAt(C, 2.5), { abs: 0 }, 'sampled');
  });

  it("opens the window for 2A / (360 |s|) a slip cycle, the engine's windowOpenS", () => {
    const r = evaluateSync({
      bus: { frequencyHz: 50, voltageV: 400 },
      incoming: { frequencyHz: 50.2, voltageV: 408, angleDeg: -90, ratedKVA: 500, xddpPU: 0.15 },
      breakerClosingMs: 100,
      limits: { slipHz: 0.3, angleDeg: 10, voltagePct: 5 },
    });
    const spans = windowOpenSpans(C, 15, 10);
    expect(spans).toHaveLength(3);
    for (const [a, b] of spans) expectClose(b - a, r.windowOpenS!, { abs: 1e-9 }, 'open time');
    // The first opening: −10° reached at (−10 + 90) / 72 s.
    expectClose(spans[0]![0], 80 / 72, { abs: 1e-12 }, 'first opening');
    for (const [a, b] of spans) expect(Math.abs(angleAfterDeg(C.angleDeg, 0.2, (a + b) / 2))).toBeLessThan(1e-9);
    // Slow incoming: the angle falls, the window is met as often.
    expect(windowOpenSpans({ ...C, incomingFrequencyHz: 49.8 }, 15, 10)).toHaveLength(3);
    // No slip: open all the time or never.
    expect(windowOpenSpans({ ...C, incomingFrequencyHz: 50, angleDeg: 4 }, 1, 10)).toEqual([[0, 1]]);
    expect(windowOpenSpans({ ...C, incomingFrequencyHz: 50, angleDeg: 40 }, 1, 10)).toEqual([]);
  });

  it("puts the close command where the angle reaches the engine's command angle, once every slip period", () => {
    const cmd = -360 * 0.2 * 0.1; // −7.2°: 0.2 Hz, 100 ms breaker (closed form, as the engine's closeCommandAngleDeg)
    const ts = commandTimes(C, 15, cmd);
    expect(ts).toHaveLength(3);
    expectClose(ts[1]! - ts[0]!, 5, { abs: 1e-9 }, 'one slip period apart');
    for (const t of ts) expectClose(angleAfterDeg(C.angleDeg, 0.2, t), cmd, { abs: 1e-9 }, 'angle at the command');
    // Contact one breaker time later is in phase.
    expectClose(angleAfterDeg(C.angleDeg, 0.2, ts[0]! + 0.1), 0, { abs: 1e-9 }, 'in phase at contact');
  });

  it('zooms on a few cycles whose difference is the incoming minus the bus', () => {
    const z = waveformsAround(C, 1.15, 4, 201);
    expectClose(z.tS[200]! - z.tS[0]!, 4 / 50, { abs: 1e-12 }, 'four mains cycles');
    for (const k of [0, 50, 137]) expectClose(z.difference[k]!, z.incoming[k]! - z.bus[k]!, { abs: 1e-15 }, 'difference');
    expectClose(z.bus[0]!, Math.sin(2 * Math.PI * 50 * z.tS[0]!), { abs: 1e-12 }, 'bus phase A');
  });
});

describe('beat chart', () => {
  it('says where the first command falls and what |ΔV| is there', () => {
    const w = mount(BeatWaveform, { props: { beat: C, windowDeg: 10, commandAngleDeg: -7.2, breakerClosingMs: 100 } });
    const words = w.get('[data-test="beat-words"]').text();
    expect(words).toContain('incoming fast by +0.200 Hz');
    // |ΔV| at −7.2° (law of cosines) = sqrt(1 + 1.0404 − 2.04 cos 7.2°).
    expect(words).toContain(`|ΔV| is ${Math.sqrt(1 + 1.0404 - 2.04 * Math.cos((7.2 * Math.PI) / 180)).toFixed(3)} pu`);
    expect(words).toContain('contact follows 100 ms later');
  });

  it('draws nothing false for a refused figure', () => {
    const w = mount(BeatWaveform, { props: { beat: { ...C, incomingFrequencyHz: Number.NaN }, windowDeg: 10 } });
    expect(w.get('[data-test="beat-words"]').text()).toContain('No beat while a figure of the case is refused');
  });
});

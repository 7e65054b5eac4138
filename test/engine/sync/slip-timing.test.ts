import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { advanceAngleDeg, angleAtContactDeg, closeCommandAngleDeg, slipPeriodS, timeToAngleS, windowOpenS, windowTiming } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';

describe('advanceAngleDeg', () => {
  // 360 × s × t (closed form).
  it.each([
    [0.1, 100, 3.6],
    [0.1, 60, 2.16],
    [0.25, 80, 7.2],
    [0.5, 100, 18],
  ])('%s Hz slip with a %s ms breaker gives %s°', (s, ms, deg) => {
    expectClose(advanceAngleDeg(s, ms), deg, { rel: 1e-12 });
    expectClose(advanceAngleDeg(-s, ms), deg, { rel: 1e-12 }, 'magnitude for negative slip');
  });
});

describe('slip period and window', () => {
  it('slip period is 1/|s| and null at zero slip (closed form)', () => {
    expectClose(slipPeriodS(0.1)!, 10, { rel: 1e-12 });
    expectClose(slipPeriodS(-0.25)!, 4, { rel: 1e-12 });
    expect(slipPeriodS(0)).toBeNull();
  });

  // (2 Δφ / 360) / s: closed form.
  it('a ±10° window at 0.1 Hz stays open 0.556 s every 10 s', () => {
    expectClose(windowOpenS(10, 0.1)!, 20 / 36, { rel: 1e-12 });
    expectClose(windowOpenS(10, 0.1)!, 0.556, { abs: 5e-4 }, 'closed form');
  });

  it('a ±20° window at 0.3 Hz stays open 0.370 s', () => {
    expectClose(windowOpenS(20, 0.3)!, 0.37, { abs: 5e-4 }, 'closed form');
    expectClose(windowOpenS(20, -0.3)!, 40 / 108, { rel: 1e-12 });
  });

  it('never changes at zero slip and is capped at the slip period for ±180°', () => {
    expect(windowOpenS(10, 0)).toBeNull();
    expectClose(windowOpenS(180, 0.2)!, 5, { rel: 1e-12 });
  });
});

describe('windowTiming', () => {
  it('counts to the entry edge and then the width when closed now (incoming fast)', () => {
    // 0.1 Hz = 36 °/s. From +30° forward to −10° is 320° → 8.889 s; open 20° → 0.556 s more (closed form).
    const t = windowTiming(30, 10, 0.1);
    expect(t.openNow).toBe(false);
    expectClose(t.opensInS!, 320 / 36, { rel: 1e-12 });
    expectClose(t.closesInS!, 340 / 36, { rel: 1e-12 });
  });

  it('counts backwards when the incoming set is slow', () => {
    // −0.1 Hz: the angle falls from +30° to the +10° edge in 20/36 s, leaves at −10° after 40/36 s.
    const t = windowTiming(30, 10, -0.1);
    expectClose(t.opensInS!, 20 / 36, { rel: 1e-12 });
    expectClose(t.closesInS!, 40 / 36, { rel: 1e-12 });
  });

  it('is open now with 0 s to open and the time to the far edge', () => {
    const t = windowTiming(-5, 10, 0.1);
    expect(t).toMatchObject({ openNow: true, opensInS: 0 });
    expectClose(t.closesInS!, 15 / 36, { rel: 1e-12 });
  });

  it('never opens or closes at zero slip', () => {
    expect(windowTiming(30, 10, 0)).toEqual({ openNow: false, opensInS: null, closesInS: null });
    expect(windowTiming(3, 10, 0)).toEqual({ openNow: true, opensInS: 0, closesInS: null });
  });

  it('keeps opensIn < closesIn and within one slip period (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: 0.5, max: 179, noNaN: true }),
        fc.double({ min: 0.001, max: 2, noNaN: true }),
        fc.boolean(),
        (a, w, s0, neg) => {
          const s = neg ? -s0 : s0;
          const t = windowTiming(a, w, s);
          const period = 1 / s0;
          expect(t.opensInS!).toBeGreaterThanOrEqual(0);
          expect(t.opensInS!).toBeLessThanOrEqual(period + 1e-9);
          expect(t.closesInS!).toBeGreaterThanOrEqual(t.opensInS! - 1e-12);
          if (!t.openNow) expectClose(t.closesInS! - t.opensInS!, windowOpenS(w, s)!, { abs: 1e-9 });
        },
      ),
    );
  });
});

describe('close command', () => {
  it('issues the command at −360 s t so the contacts touch at 0° (closed form)', () => {
    expectClose(closeCommandAngleDeg(0.1, 100), -3.6, { rel: 1e-12 });
    expectClose(closeCommandAngleDeg(-0.1, 100), 3.6, { rel: 1e-12 });
    expectClose(angleAtContactDeg(closeCommandAngleDeg(0.25, 80), 0.25, 80), 0, { abs: 1e-12 });
  });

  it('times the command: from −10° at +0.1 Hz, −3.6° comes after 6.4/36 s', () => {
    expectClose(timeToAngleS(-10, -3.6, 0.1)!, 6.4 / 36, { rel: 1e-12 });
    // Already past it: wait a whole slip cycle less the overshoot.
    expectClose(timeToAngleS(0, -3.6, 0.1)!, (360 - 3.6) / 36, { rel: 1e-12 });
    expect(timeToAngleS(5, -3.6, 0)).toBeNull();
  });
});

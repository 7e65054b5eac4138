/**
 * The rotor angle's sine and cosine reached from an anchor by angle addition (`rotor-trig.ts`) agree with
 * `Math.sin` / `Math.cos` to a few units in the last place, and a step beyond the anchor's span takes a new anchor.
 */
import { describe, expect, it } from 'vitest';
import { ANCHOR_SPAN_RAD, rotorSinCos } from '../../../electron/engine/simulation/rotor-trig';

// Layout of the scratch array: sin, cos, anchor angle, anchor sin, anchor cos.
function fresh(): Float64Array {
  const a = new Float64Array(5);
  a[2] = Number.NaN;
  return a;
}

describe('rotor sine and cosine from an anchor', () => {
  it('matches Math.sin and Math.cos within 4e-16 over a walk of angles (closed form: sin, cos)', () => {
    const a = fresh();
    let worst = 0;
    let anchors = 0;
    // A seeded walk: steps of up to ±0.012 rad, as a rotor slipping a few hertz moves in 1 ms, across many turns.
    let seed = 12345;
    let d = -40;
    for (let k = 0; k < 200_000; k++) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      d += ((seed / 2147483648) * 2 - 1) * 0.012 + 0.0004;
      const before = a[2];
      rotorSinCos(a, d, 0, 1, 2, 3, 4);
      if (a[2] !== before) anchors++;
      worst = Math.max(worst, Math.abs(a[0]! - Math.sin(d)), Math.abs(a[1]! - Math.cos(d)));
    }
    expect(worst).toBeLessThan(4e-16);
    // Anchors are taken only when the angle leaves the span (the walk drifts 80 rad: at least 80 / 0.05 of them).
    expect(anchors).toBeGreaterThanOrEqual(80 / ANCHOR_SPAN_RAD - 1);
    expect(anchors).toBeLessThan(200_000 / 4);
  });

  it('is exact at the anchor and takes a new anchor past the span', () => {
    const a = fresh();
    rotorSinCos(a, 1.2, 0, 1, 2, 3, 4);
    expect(a[2]).toBe(1.2);
    expect(a[0]).toBe(Math.sin(1.2));
    expect(a[1]).toBe(Math.cos(1.2));
    rotorSinCos(a, 1.2 + 0.9 * ANCHOR_SPAN_RAD, 0, 1, 2, 3, 4);
    expect(a[2]).toBe(1.2);
    rotorSinCos(a, 1.2 + 1.1 * ANCHOR_SPAN_RAD, 0, 1, 2, 3, 4);
    expect(a[2]).toBe(1.2 + 1.1 * ANCHOR_SPAN_RAD);
  });

  it('takes an anchor when it has none, and on a non-finite angle gives NaN', () => {
    const a = fresh();
    rotorSinCos(a, 0.3, 0, 1, 2, 3, 4);
    expect(a[2]).toBe(0.3);
    rotorSinCos(a, Number.NaN, 0, 1, 2, 3, 4);
    expect(a[0]).toBeNaN();
    expect(a[1]).toBeNaN();
  });
});

import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { deltaVMagnitude, phasorDifference, wrapAngleDeg } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';

describe('phasorDifference', () => {
  it('gives 2 sin 15° between equal voltages 30° apart (closed form: |ΔV| = 2 V sin(θ/2))', () => {
    expectClose(phasorDifference(1, 1, 30).magnitude, 2 * Math.sin((15 * Math.PI) / 180), { rel: 1e-12 }, '|ΔV|');
  });

  // Phasor difference table (closed form), recomputed here from the law of cosines.
  it.each([
    [1, 1, 10, 0.1743],
    [1, 1, 20, 0.3473],
    [1, 0.95, 20, 0.3422],
    [1, 1, 60, 1.0],
    [1, 1, 120, 1.732],
    [1, 1, 180, 2.0],
  ])('V1 %s, V2 %s at %s° gives %s pu (closed form)', (v1, v2, th, expected) => {
    const cosine = Math.sqrt(v1 * v1 + v2 * v2 - 2 * v1 * v2 * Math.cos((th * Math.PI) / 180));
    expectClose(phasorDifference(v1, v2, th).magnitude, cosine, { rel: 1e-12 }, 'law of cosines');
    expectClose(phasorDifference(v1, v2, th).magnitude, expected, { abs: 5e-4 }, 'table value');
  });

  it('gives the phasor angle of V2∠θ − V1: 90° + θ/2 for equal voltages (closed form)', () => {
    expectClose(phasorDifference(1, 1, 30).angleDeg, 105, { abs: 1e-9 });
    expectClose(phasorDifference(1, 1, -30).angleDeg, -105, { abs: 1e-9 });
    // In phase, incoming 5 % high: ΔV = +0.05 along the bus phasor.
    expectClose(phasorDifference(1, 1.05, 0).magnitude, 0.05, { abs: 1e-12 });
    expect(phasorDifference(1, 1.05, 0).angleDeg).toBe(0);
    expect(phasorDifference(1, 1, 0)).toEqual({ magnitude: 0, angleDeg: 0 });
  });

  it('deltaVMagnitude agrees with phasorDifference and is even in angle (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.double({ min: -720, max: 720, noNaN: true }),
        (v1, v2, th) => {
          const a = deltaVMagnitude(v1, v2, th);
          expectClose(a, phasorDifference(v1, v2, th).magnitude, { abs: 1e-9 });
          expectClose(a, deltaVMagnitude(v1, v2, -th), { abs: 1e-12 });
          expect(a).toBeGreaterThanOrEqual(Math.abs(v1 - v2) - 1e-9);
          expect(a).toBeLessThanOrEqual(v1 + v2 + 1e-9);
        },
      ),
    );
  });
});

describe('wrapAngleDeg', () => {
  it('wraps to (−180°, 180°]', () => {
    expect(wrapAngleDeg(190)).toBe(-170);
    expect(wrapAngleDeg(-180)).toBe(180);
    expect(wrapAngleDeg(180)).toBe(180);
    expect(wrapAngleDeg(720 + 30)).toBe(30);
    expect(wrapAngleDeg(-370)).toBe(-10);
  });
});

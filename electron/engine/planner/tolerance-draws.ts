/**
 * Seeded, repeatable random draws for the tolerance analysis. The generator is pure-rand's
 * xoroshiro128+ (a well-tested small-state generator; the same seed gives the same stream on
 * every platform), read as 53-bit doubles in [0, 1). Normal draws use the Box–Muller transform
 * (Box and Muller 1958), which is exact; each call uses two uniforms and returns one value, so
 * the stream advances by the same amount whatever the distribution.
 */
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import type { ToleranceDistribution } from '../../../shared-types';

/** A stream of tolerance errors. */
export interface ToleranceDraws {
  /**
   * One error for a tolerance `tol`: uniform on [−tol, tol], or normal with σ = tol / 2
   * (the tolerance is 2 σ). Always consumes two uniforms.
   */
  next(tol: number): number;
  /** A uniform value in [lo, hi] (consumes two uniforms). */
  uniform(lo: number, hi: number): number;
}

const TWO_PI = 2 * Math.PI;

/** A seeded stream (`seed` a 32-bit integer). */
export function toleranceDraws(seed: number, distribution: ToleranceDistribution): ToleranceDraws {
  const rng = xoroshiro128plus(seed | 0);
  return {
    next(tol: number): number {
      const u1 = uniformFloat64(rng);
      const u2 = uniformFloat64(rng);
      if (distribution === 'uniform') return tol * (2 * u1 - 1);
      // 1 − u1 is in (0, 1], so the logarithm is finite.
      return (tol / 2) * Math.sqrt(-2 * Math.log(1 - u1)) * Math.cos(TWO_PI * u2);
    },
    uniform(lo: number, hi: number): number {
      const u1 = uniformFloat64(rng);
      uniformFloat64(rng);
      return lo + (hi - lo) * u1;
    },
  };
}

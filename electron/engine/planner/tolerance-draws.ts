/**
 * Seeded, repeatable random draws for the tolerance analysis. Each sample has its own stream, so
 * a sample's draws depend only on (seed, sample index) — never on which worker runs it or how the
 * run is cut into chunks. The generator is pure-rand's xoroshiro128+ (a well-tested small-state
 * generator; the same state gives the same stream on every platform), read as 53-bit doubles in
 * [0, 1). A sample's 128-bit state is four words of MurmurHash3's 32-bit finaliser `fmix32`
 * (Appleby, MurmurHash3, public domain), two of the seed and two of the sample index: `fmix32` is a
 * bijection on 32 bits, so distinct indices give distinct states (no two samples share a stream),
 * and it avalanches, so neighbouring indices give unrelated states. The first outputs are
 * discarded so the linear engine is well away from its seeding.
 *
 * Normal draws use the Box–Muller transform (Box and Muller 1958), which is exact; each call uses
 * two uniforms and returns one value, so the stream advances by the same amount whatever the
 * distribution.
 */
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
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
/** Outputs of each sample's generator thrown away before its first draw. */
const WARM_UP = 4;

/** MurmurHash3's 32-bit finaliser (a bijection on 32-bit integers). */
export function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h | 0;
}

/** The xoroshiro128+ state of sample `index` of a run seeded `seed` (both 32-bit integers). */
export function sampleState(seed: number, index: number): [number, number, number, number] {
  return [fmix32(seed ^ 0x2545f491), fmix32(seed ^ 0x6a09e667), fmix32(index | 0), fmix32(index ^ 0x3c6ef372)];
}

/** The draws of sample `index` of a run seeded `seed`. */
export function sampleDraws(seed: number, index: number, distribution: ToleranceDistribution): ToleranceDraws {
  const rng = xoroshiro128plusFromState(sampleState(seed, index));
  for (let k = 0; k < WARM_UP; k++) rng.next();
  const normal = distribution === 'normal';
  return {
    next(tol: number): number {
      const u1 = uniformFloat64(rng);
      const u2 = uniformFloat64(rng);
      if (!normal) return tol * (2 * u1 - 1);
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

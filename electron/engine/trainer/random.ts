/**
 * A small seeded pseudo-random generator (mulberry32) so an exercise started from
 * the same seed is the same exercise on every machine. Not for cryptography.
 */

/** Returns a generator of uniform numbers in [0, 1) for `seed` (any integer; its low 32 bits are used). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A uniform number in [lo, hi) from `rand`. */
export function uniform(rand: () => number, lo: number, hi: number): number {
  return lo + (hi - lo) * rand();
}

/** ±1 with equal odds. */
export function randomSign(rand: () => number): 1 | -1 {
  return rand() < 0.5 ? -1 : 1;
}

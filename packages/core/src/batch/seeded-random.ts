/**
 * A small seeded generator of uniform numbers in [0, 1): mulberry32, a 32-bit state advanced by
 * the Weyl increment 0x6D2B79F5 and passed through an xorshift–multiply output mix.
 *
 *   a ← a + 0x6D2B79F5 (mod 2³²);  t = mix(a);  return t / 2³²
 *
 * Period 2³²; every 32-bit output value occurs once per period. Plenty for sweep designs (at most
 * a few million draws), and the same seed gives the same sequence on every platform: only 32-bit
 * integer arithmetic (Math.imul, >>>) is used, no floating-point rounding enters the state.
 *
 * seed: any finite number; it is reduced to an unsigned 32-bit integer (seed >>> 0), so seeds
 * that differ by a multiple of 2³² give the same sequence. Throws a RangeError for a non-finite seed.
 *
 * Reference: T. Ettinger, mulberry32 (public domain), 2017, as distributed in
 * https://gist.github.com/tommyettinger/46a874533244883189143505d203312c (from memory).
 */
export function createSeededRandom(seed: number): () => number {
  if (typeof seed !== "number" || !Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${String(seed)}`);
  let a = seed >>> 0;
  return () => {
    a = (a + MULBERRY32_INCREMENT) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / TWO_POW_32;
  };
}

/** Weyl-sequence increment of mulberry32 (Ettinger 2017). */
const MULBERRY32_INCREMENT = 0x6d2b79f5;
const TWO_POW_32 = 4294967296;

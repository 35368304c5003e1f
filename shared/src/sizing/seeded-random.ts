/**
 * mulberry32: a small, fast 32-bit seeded PRNG (public-domain algorithm by T. Ettinger). Same seed, same
 * sequence on every platform. Returns numbers in [0, 1).
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviate by the Box-Muller transform on a uniform source. */
export function normalFrom(uniform: () => number): number {
  const u1 = Math.max(uniform(), Number.MIN_VALUE);
  const u2 = uniform();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

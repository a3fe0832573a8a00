/**
 * Test helpers for random circuits: a small seeded generator independent of the engine's own
 * streams, so a reference check does not share its randomness with the code under test.
 */

/**
 * Linear congruential generator (the Numerical Recipes constants, from memory), uniform in [0, 1).
 *
 * @example const r = lcg(1); r(); // 0.23645552527159452
 */
export function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

/** Log-uniform draw in [lo, hi) from a uniform generator (values spread over decades). */
export const logUniform = (r: () => number, lo: number, hi: number): number => lo * (hi / lo) ** r();

/** |a − b| / |b| (0 when equal; b near 0 guarded). */
export const relativeError = (a: number, b: number): number =>
  a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

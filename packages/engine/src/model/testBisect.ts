/**
 * Test helper: a root of fn in [lo, hi] by plain bisection (200 halvings), for the independent
 * reference solves the engine's Newton solvers are checked against. fn(lo) and fn(hi) must differ
 * in sign.
 *
 * @example bisect((x) => x * x - 2, 0, 2) // 1.414213562373095
 */
export function bisect(fn: (v: number) => number, lo: number, hi: number): number {
  let flo = fn(lo);
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = fn(mid);
    if (fm === 0) return mid;
    if (fm > 0 === flo > 0) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

import { normalTail } from './normalTail.js';

export interface TwoProportionResult {
  /** Difference of proportions p1 − p2. */
  diff: number;
  /** z statistic with the pooled standard error. */
  z: number;
  /** Two-sided p-value of H0: p1 = p2. */
  p: number;
}

/**
 * Two-proportion z-test (pooled) for comparing the yields of two runs: x passes out of n samples each.
 * Returns NaN statistics when the test is undefined (a run with no samples, or both yields 0 or 1).
 */
export function twoProportionZTest(x1: number, n1: number, x2: number, n2: number): TwoProportionResult {
  const p1 = x1 / n1;
  const p2 = x2 / n2;
  const pooled = (x1 + x2) / (n1 + n2);
  const se = Math.sqrt(pooled * (1 - pooled) * (1 / n1 + 1 / n2));
  const diff = p1 - p2;
  if (!(n1 > 0 && n2 > 0) || !(se > 0)) return { diff, z: Number.NaN, p: Number.NaN };
  const z = diff / se;
  return { diff, z, p: Math.min(1, 2 * normalTail(Math.abs(z))) };
}

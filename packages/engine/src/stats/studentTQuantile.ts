import { inverseIncompleteBeta } from './specialFunctions.js';

/**
 * Quantile of Student's t distribution with `df` degrees of freedom, for p in (0, 1). Through the
 * regularized incomplete beta: for t > 0, P(T > t) = ½·I_{df/(df+t²)}(df/2, ½), so
 * t = √(df·(1/x − 1)) with x = I⁻¹(2·(1 − p); df/2, ½).
 *
 * @example studentTQuantile(0.975, 31) // ≈ 2.0395 (the 95 % interval factor for 32 samples)
 */
export function studentTQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1) || !(df > 0)) return NaN;
  if (p === 0.5) return 0;
  const upper = p > 0.5;
  const tail = upper ? 1 - p : p;
  const x = inverseIncompleteBeta(2 * tail, df / 2, 0.5);
  const t = Math.sqrt(df * (1 / x - 1));
  return upper ? t : -t;
}

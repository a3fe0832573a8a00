import { normalQuantile } from '../spread/normalQuantile.js';
import { inverseIncompleteBeta } from './specialFunctions.js';

/** Two-sided confidence level used for every reported interval. */
export const CONFIDENCE = 0.95;

/**
 * Wilson score interval for a proportion x/n (default 95 %): centre (x + z²/2)/(n + z²),
 * half-width z·√(x(n−x)/n + z²/4)/(n + z²). Returns [NaN, NaN] when n = 0.
 *
 * @example wilsonInterval(95, 100) // [0.8882, 0.9785]
 */
export function wilsonInterval(x: number, n: number, confidence = CONFIDENCE): [number, number] {
  if (n <= 0) return [NaN, NaN];
  const z = normalQuantile(1 - (1 - confidence) / 2);
  const z2 = z * z;
  const centre = (x + z2 / 2) / (n + z2);
  const half = (z * Math.sqrt((x * (n - x)) / n + z2 / 4)) / (n + z2);
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

/**
 * Clopper–Pearson ("exact") interval for x/n: the beta quantiles B(α/2; x, n−x+1) and
 * B(1−α/2; x+1, n−x), with 0 and 1 at the ends.
 *
 * @example clopperPearsonInterval(0, 1000) // [0, 0.003682]
 */
export function clopperPearsonInterval(x: number, n: number, confidence = CONFIDENCE): [number, number] {
  if (n <= 0) return [NaN, NaN];
  const alpha = 1 - confidence;
  const lo = x === 0 ? 0 : inverseIncompleteBeta(alpha / 2, x, n - x + 1);
  const hi = x === n ? 1 : inverseIncompleteBeta(1 - alpha / 2, x + 1, n - x);
  return [lo, hi];
}

import { wilsonInterval } from '../stats/binomialIntervals.js';

/**
 * The largest number of failures out of n samples whose Wilson upper bound of the reject rate
 * (two-sided interval at `confidence`) stays at or below `targetPpm`; −1 when even zero failures
 * is too many (n too small for the target).
 *
 * @example maxFailures(1000, 20_000, 0.95) // 10: 10/20 000 has an upper bound below 1000 PPM
 */
export function maxFailures(targetPpm: number, n: number, confidence: number): number {
  const target = targetPpm / 1e6;
  let x = -1;
  while (x + 1 <= n && wilsonInterval(x + 1, n, confidence)[1] <= target) x++;
  return x;
}

/**
 * Reject rate of x failures in n samples in PPM, with its Wilson interval (PPM).
 *
 * @example rejectPpm(10, 20_000) // { ppm: 500, low: 272, high: 920 } (rounded)
 */
export function rejectPpm(
  x: number,
  n: number,
  confidence = 0.95,
): { ppm: number; low: number; high: number } {
  const [lo, hi] = wilsonInterval(x, n, confidence);
  return { ppm: (x / n) * 1e6, low: lo * 1e6, high: hi * 1e6 };
}

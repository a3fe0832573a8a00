import { Z95 } from './wilsonInterval.js';

/**
 * Approximate two-sided confidence interval for Cpk from n samples (Bissell's normal
 * approximation): Cpk ± z·√(1/(9n) + Cpk²/(2(n − 1))). Null when Cpk or n does not allow one.
 */
export function cpkInterval(cpk: number | null, n: number, z = Z95): [number, number] | null {
  if (cpk === null || !Number.isFinite(cpk) || !(n > 1)) return null;
  const half = z * Math.sqrt(1 / (9 * n) + (cpk * cpk) / (2 * (n - 1)));
  return [cpk - half, cpk + half];
}

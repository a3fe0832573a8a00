import { normalCdf } from '../spread/normalCdf.js';

/**
 * Kolmogorov–Smirnov distance D = sup |F_n(x) − Φ((x−mean)/sd)| between the sample's empirical
 * distribution and a given normal. With the mean and sd estimated from the same sample the
 * classical Kolmogorov p-value does not apply (it would be far too large), so only the distance
 * is reported; the Anderson–Darling test carries the verdict.
 *
 * @example ksDistanceNormal([1, 2, 3], 2, 1) // ≈ 0.174
 */
export function ksDistanceNormal(values: ArrayLike<number>, mean: number, sd: number): number {
  const x = Float64Array.from(values).sort();
  const n = x.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = normalCdf((x[i] - mean) / sd);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  }
  return d;
}

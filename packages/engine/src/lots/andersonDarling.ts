import { normalCdf } from '../spread/normalCdf.js';

/** An Anderson–Darling normality test with the mean and sd estimated from the data. */
export type AndersonDarlingResult = {
  /** A², the raw statistic. */
  statistic: number;
  /** A*² = A²·(1 + 0.75/n + 2.25/n²), the small-sample adjusted statistic the p-value is read from. */
  adjusted: number;
  /** Probability of an A*² this large or larger if the data were normal (0..1). */
  pValue: number;
};

/**
 * Anderson–Darling test of normality, mean and sd estimated from the sample (Stephens' "case 3"):
 *   A² = −n − (1/n)·Σ (2i−1)·[ln Φ(z_i) + ln(1 − Φ(z_{n+1−i}))],  z sorted ascending,
 * then A*² and the p-value from the piecewise exponential fit of D'Agostino & Stephens (1986),
 * Table 4.9 (coefficients from memory; the test suite checks the p-value against the simulated
 * null distribution). For a lognormal fit pass ln(x). Needs n ≥ 8 and a non-zero sd.
 *
 * @example andersonDarlingNormal([9.8, 10.1, 10.0, 9.9, 10.2, 10.05, 9.95, 10.3]).pValue // ≈ 0.9
 */
export function andersonDarlingNormal(values: ArrayLike<number>): AndersonDarlingResult {
  const n = values.length;
  if (n < 8) throw new RangeError('the Anderson–Darling test needs at least 8 values');
  const x = Float64Array.from(values).sort();
  let mean = 0;
  for (let i = 0; i < n; i++) mean += x[i];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (x[i] - mean) ** 2;
  const sd = Math.sqrt(ss / (n - 1));
  if (!(sd > 0)) throw new RangeError('the Anderson–Darling test needs values that are not all equal');
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const lo = normalCdf((x[i] - mean) / sd);
    // 1 − Φ(z) = Φ(−z): keeps precision in the upper tail.
    const hi = normalCdf(-(x[n - 1 - i] - mean) / sd);
    sum += (2 * i + 1) * (Math.log(lo) + Math.log(hi));
  }
  const statistic = -n - sum / n;
  const adjusted = statistic * (1 + 0.75 / n + 2.25 / (n * n));
  return { statistic, adjusted, pValue: andersonDarlingPValue(adjusted) };
}

/**
 * p-value of the adjusted statistic A*² for the normal with estimated parameters
 * (D'Agostino & Stephens 1986, Table 4.9), clamped to [0, 1].
 *
 * @example andersonDarlingPValue(0.752) // ≈ 0.05
 */
export function andersonDarlingPValue(a: number): number {
  let p: number;
  if (a >= 0.6) p = Math.exp(1.2937 - 5.709 * a + 0.0186 * a * a);
  else if (a >= 0.34) p = Math.exp(0.9177 - 4.279 * a - 1.38 * a * a);
  else if (a >= 0.2) p = 1 - Math.exp(-8.318 + 42.796 * a - 59.938 * a * a);
  else p = 1 - Math.exp(-13.436 + 101.14 * a - 223.73 * a * a);
  return Math.min(1, Math.max(0, p));
}

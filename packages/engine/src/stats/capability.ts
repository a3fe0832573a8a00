/**
 * Process capability of a metric against its spec limits, with σ taken as the sample standard
 * deviation of the Monte Carlo run (there is no subgrouping, so this is the overall σ):
 * Cp = (max − min)/(6σ) when both limits exist, else null;
 * Cpk = min(max − mean, mean − min)/(3σ) over the limits that exist.
 * For a centred normal metric Cpk = 1 corresponds to about 2700 PPM outside (two-sided).
 *
 * @example capability(0, 1, -3, 3) // { cp: 1, cpk: 1 }
 */
export function capability(
  mean: number,
  sd: number,
  min: number | undefined,
  max: number | undefined,
): { cp: number | null; cpk: number | null } {
  if (!(sd > 0) || !Number.isFinite(mean)) return { cp: null, cpk: null };
  const cp = min !== undefined && max !== undefined ? (max - min) / (6 * sd) : null;
  let cpk = Infinity;
  if (max !== undefined) cpk = Math.min(cpk, (max - mean) / (3 * sd));
  if (min !== undefined) cpk = Math.min(cpk, (mean - min) / (3 * sd));
  return { cp, cpk: Number.isFinite(cpk) ? cpk : null };
}

/** Two-sided 95 % standard-normal quantile. */
const Z95 = 1.959963984540054;

/**
 * Approximate two-sided confidence interval for Cpk from n samples (Bissell's normal
 * approximation): Cpk ± z·√(1/(9n) + Cpk²/(2(n − 1))). Null when Cpk or n does not allow one.
 *
 * @example cpkInterval(1.33, 100) // [1.1336, 1.5264]
 */
export function cpkInterval(cpk: number | null, n: number, z = Z95): [number, number] | null {
  if (cpk === null || !Number.isFinite(cpk) || !(n > 1)) return null;
  const half = z * Math.sqrt(1 / (9 * n) + (cpk * cpk) / (2 * (n - 1)));
  return [cpk - half, cpk + half];
}

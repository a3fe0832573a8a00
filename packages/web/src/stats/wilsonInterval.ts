/** 97.5 % point of the standard normal, for two-sided 95 % intervals. */
export const Z95 = 1.959963984540054;

/**
 * Wilson score interval for a proportion: x successes in n trials, two-sided at the z given
 * (95 % by default). Used for the convergence band, where the engine stores only point yields.
 */
export function wilsonInterval(x: number, n: number, z = Z95): [number, number] {
  if (!(n > 0)) return [Number.NaN, Number.NaN];
  const p = x / n;
  const d = 1 + (z * z) / n;
  const centre = (p + (z * z) / (2 * n)) / d;
  const half = (z / d) * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n));
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

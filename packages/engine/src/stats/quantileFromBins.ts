import type { HistogramGrid } from './histogramGrid.js';
import type { MetricTotals } from './metricTotals.js';

/**
 * Quantile p (0..1) read from the fine histogram by linear interpolation inside the bucket that
 * holds rank p·count. Error bound: the true sample quantile lies in the same bucket, so the error
 * is at most that bucket's width (`maxError`): one fine bin width ((pilot range)/1024) inside the
 * grid, or the distance from the grid edge to the sample min/max when the rank falls in the
 * underflow/overflow bucket. NaN when there are no values.
 *
 * @example quantileFromBins(totals, grid, 0.5) // { value: 1.02, maxError: 0.0004 }
 */
export function quantileFromBins(
  t: MetricTotals,
  grid: HistogramGrid,
  p: number,
): { value: number; maxError: number } {
  if (t.count === 0) return { value: NaN, maxError: NaN };
  const rank = p * t.count;
  const top = grid.lo + grid.bins * grid.width;
  let cum = t.under;
  if (rank <= cum && t.under > 0) return interpolate(t.min, Math.min(grid.lo, t.max), rank / t.under, t);
  for (let b = 0; b < grid.bins; b++) {
    const c = t.bins[b];
    if (c > 0 && rank <= cum + c) {
      const a = grid.lo + b * grid.width;
      return interpolate(a, a + grid.width, (rank - cum) / c, t);
    }
    cum += c;
  }
  return interpolate(Math.max(top, t.min), t.max, t.over > 0 ? (rank - cum) / t.over : 1, t);
}

function interpolate(a: number, b: number, f: number, t: MetricTotals): { value: number; maxError: number } {
  const lo = Math.max(a, t.min);
  const hi = Math.min(b, t.max);
  const x = lo + Math.min(1, Math.max(0, f)) * (hi - lo);
  return { value: x, maxError: Math.max(0, hi - lo) };
}

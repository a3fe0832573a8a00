import type { HistogramGrid } from './histogramGrid.js';
import type { MetricChunk } from './metricChunk.js';

/** Running totals of one metric across chunks (merged in chunk order; mutable). */
export type MetricTotals = {
  count: number;
  mean: number;
  m2: number;
  min: number;
  max: number;
  under: number;
  over: number;
  bins: Float64Array;
};

/** Empty totals for a grid. */
export function createMetricTotals(grid: HistogramGrid): MetricTotals {
  return {
    count: 0,
    mean: 0,
    m2: 0,
    min: Infinity,
    max: -Infinity,
    under: 0,
    over: 0,
    bins: new Float64Array(grid.bins),
  };
}

/**
 * In place: adds a chunk's statistics with the exact pairwise update of Chan, Golub & LeVeque
 * (1979): δ = mean_b − mean_a, mean = mean_a + δ·n_b/n, M2 = M2_a + M2_b + δ²·n_a·n_b/n.
 * Floating-point results depend on the order, so callers add chunks in chunk-index order.
 */
export function addMetricChunkInPlace(t: MetricTotals, c: MetricChunk): void {
  t.under += c.under;
  t.over += c.over;
  for (let i = 0; i < c.bins.length; i++) t.bins[c.binOffset + i] += c.bins[i];
  if (c.count === 0 || c.mean === null || c.min === null || c.max === null) return;
  const n = t.count + c.count;
  const delta = c.mean - t.mean;
  t.mean = t.count === 0 ? c.mean : t.mean + (delta * c.count) / n;
  t.m2 = t.m2 + c.m2 + (delta * delta * t.count * c.count) / n;
  t.count = n;
  if (c.min < t.min) t.min = c.min;
  if (c.max > t.max) t.max = c.max;
}

/** Sample standard deviation (n − 1 denominator); NaN below two values. */
export function totalsSd(t: MetricTotals): number {
  return t.count > 1 ? Math.sqrt(t.m2 / (t.count - 1)) : NaN;
}

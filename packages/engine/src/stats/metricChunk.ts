import type { HistogramGrid } from './histogramGrid.js';

/**
 * One metric's statistics over one chunk, plain JSON. Only finite values count (NaN marks a
 * sample with no bias point). `mean`, `min`, `max` are null when count is 0 (JSON has no NaN).
 * `m2` is the sum of squared deviations from the chunk mean. `bins` are the fine-grid counts from
 * bin `binOffset` to the last non-empty bin (zeros outside are left out to keep chunks small).
 */
export type MetricChunk = {
  count: number;
  mean: number | null;
  m2: number;
  min: number | null;
  max: number | null;
  under: number;
  over: number;
  binOffset: number;
  bins: number[];
};

/**
 * Summarises column values col[0..n) on a fixed grid in one pass; `scratch` (length >= grid.bins) is zeroed and reused to avoid per-chunk growth.
 *
 * @example summarizeColumn(Float64Array.of(1, 2, NaN), 3, grid, new Float64Array(grid.bins))
 */
export function summarizeColumn(
  col: Float64Array,
  n: number,
  grid: HistogramGrid,
  scratch: Float64Array,
): MetricChunk {
  // One pass with sums shifted by the first finite value K: M2 = Σ(x−K)² − (Σ(x−K))²/n. With K a
  // sample of the same metric, x − K is of the order of the spread, so the subtraction loses
  // almost nothing (unlike raw sums of squares).
  let count = 0;
  let shift = NaN;
  let s1 = 0;
  let s2 = 0;
  let min = Infinity;
  let max = -Infinity;
  let under = 0;
  let over = 0;
  scratch.fill(0, 0, grid.bins);
  const inv = 1 / grid.width;
  const lo = grid.lo;
  const bins = grid.bins;
  for (let s = 0; s < n; s++) {
    const x = col[s];
    // x − x is 0 exactly for finite x, NaN for NaN and ±Infinity.
    if (x - x !== 0) continue;
    if (count === 0) shift = x;
    count++;
    const dx = x - shift;
    s1 += dx;
    s2 += dx * dx;
    if (x < min) min = x;
    if (x > max) max = x;
    // Position in bins; truncation equals floor once b >= 0.
    const b = (x - lo) * inv;
    if (b < 0) under++;
    else if (b >= bins) over++;
    else scratch[b | 0]++;
  }
  if (count === 0) {
    return { count, mean: null, m2: 0, min: null, max: null, under, over, binOffset: 0, bins: [] };
  }
  const mean = shift + s1 / count;
  const m2 = Math.max(0, s2 - (s1 * s1) / count);
  let first = 0;
  while (first < bins && scratch[first] === 0) first++;
  let last = bins - 1;
  while (last >= first && scratch[last] === 0) last--;
  const occupied = Array.from(scratch.subarray(first, last + 1));
  return { count, mean, m2, min, max, under, over, binOffset: last >= first ? first : 0, bins: occupied };
}

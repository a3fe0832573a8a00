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
 * Summarises column values col[0..n) on a fixed grid. Two passes (sum, then squared deviations)
 * for accuracy; `scratch` (length >= grid.bins) is zeroed and reused to avoid per-chunk growth.
 *
 * @example summarizeColumn(Float64Array.of(1, 2, NaN), 3, grid, new Float64Array(grid.bins))
 */
export function summarizeColumn(
  col: Float64Array,
  n: number,
  grid: HistogramGrid,
  scratch: Float64Array,
): MetricChunk {
  let count = 0;
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  let under = 0;
  let over = 0;
  scratch.fill(0, 0, grid.bins);
  const inv = 1 / grid.width;
  for (let s = 0; s < n; s++) {
    const x = col[s];
    if (!Number.isFinite(x)) continue;
    count++;
    sum += x;
    if (x < min) min = x;
    if (x > max) max = x;
    const b = Math.floor((x - grid.lo) * inv);
    if (b < 0) under++;
    else if (b >= grid.bins) over++;
    else scratch[b]++;
  }
  if (count === 0) {
    return { count, mean: null, m2: 0, min: null, max: null, under, over, binOffset: 0, bins: [] };
  }
  const mean = sum / count;
  let m2 = 0;
  for (let s = 0; s < n; s++) {
    const x = col[s];
    if (Number.isFinite(x)) m2 += (x - mean) * (x - mean);
  }
  let first = 0;
  while (first < grid.bins && scratch[first] === 0) first++;
  let last = grid.bins - 1;
  while (last >= first && scratch[last] === 0) last--;
  const bins = Array.from(scratch.subarray(first, last + 1));
  return { count, mean, m2, min, max, under, over, binOffset: last >= first ? first : 0, bins };
}

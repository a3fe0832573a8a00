import {
  accumulateColumnInPlace,
  columnAccumulatorResult,
  createColumnAccumulator,
} from './columnAccumulator.js';
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
 * Summarises column values col[0..n) on a fixed grid in one pass (see ColumnAccumulator for the
 * shifted sums). For whole columns in tests and tools; runs feed accumulators block by block.
 *
 * @example summarizeColumn(Float64Array.of(1, 2, NaN), 3, grid)
 */
export function summarizeColumn(col: Float64Array, n: number, grid: HistogramGrid): MetricChunk {
  const acc = createColumnAccumulator(grid);
  accumulateColumnInPlace(acc, col, n);
  return columnAccumulatorResult(acc);
}

/**
 * Fine fixed-edge histogram grid for one metric: `bins` bins of equal `width` from `lo`, plus an
 * underflow and an overflow count. The grid is fixed per design before any chunk runs (from a
 * pilot, see pilotGrids), so every chunk bins identically and counts add exactly.
 */
export type HistogramGrid = { lo: number; width: number; bins: number };

/** Fine bins per metric. Quantiles read from the grid are within one bin width (see quantileFromBins). */
export const FINE_BINS = 2048;

/**
 * Grid spanning the pilot range widened by half its width on each side, so the bulk of a run
 * lands inside it: bin width = (max − min)/1024. A constant metric gets a tiny grid around its
 * value; a metric with no finite pilot value gets [0, 1).
 *
 * @example gridFromRange(1, 3) // { lo: 0, width: 4/2048, bins: 2048 }
 */
export function gridFromRange(min: number, max: number): HistogramGrid {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { lo: 0, width: 1 / FINE_BINS, bins: FINE_BINS };
  let span = max - min;
  if (!(span > 0)) span = Math.max(Math.abs(min) * 1e-6, 1e-12);
  const lo = min - span / 2;
  return { lo, width: (2 * span) / FINE_BINS, bins: FINE_BINS };
}

import type { HistogramGrid } from './histogramGrid.js';
import type { MetricChunk } from './metricChunk.js';

/**
 * One metric's running statistics within a chunk, fed block by block (mutable). Sums are shifted
 * by the first finite value K: M2 = Σ(x−K)² − (Σ(x−K))²/n. With K a sample of the same metric,
 * x − K is of the order of the spread, so the subtraction loses almost nothing (unlike raw sums
 * of squares). Feeding a column in blocks gives the same bits as feeding it whole.
 */
export type ColumnAccumulator = {
  readonly grid: HistogramGrid;
  count: number;
  shift: number;
  s1: number;
  s2: number;
  min: number;
  max: number;
  under: number;
  over: number;
  /** Fine-grid counts (a chunk holds at most 2^20 samples, so 32 bits suffice). */
  readonly bins: Uint32Array;
};

/** Empty accumulator on a grid. */
export function createColumnAccumulator(grid: HistogramGrid): ColumnAccumulator {
  return {
    grid,
    count: 0,
    shift: NaN,
    s1: 0,
    s2: 0,
    min: Infinity,
    max: -Infinity,
    under: 0,
    over: 0,
    bins: new Uint32Array(grid.bins),
  };
}

/** In place: empties the accumulator for the next chunk (keeps its bins array). */
export function resetColumnAccumulator(a: ColumnAccumulator): void {
  a.count = 0;
  a.shift = NaN;
  a.s1 = 0;
  a.s2 = 0;
  a.min = Infinity;
  a.max = -Infinity;
  a.under = 0;
  a.over = 0;
  a.bins.fill(0);
}

/**
 * In place: adds col[0..n) to the accumulator. Non-finite values (no bias point) are skipped.
 * A block holding one repeated value equal to the shift (a metric that does not vary, e.g. the
 * bias point when only the small signal is drawn per sample) is added in one step: its deviations
 * are exactly 0, so the sums, extremes and counts come out bit for bit as the sample loop's.
 *
 * @example accumulateColumnInPlace(acc, out[m], 4096)
 */
export function accumulateColumnInPlace(a: ColumnAccumulator, col: Float64Array, n: number): void {
  let s = 0;
  if (a.count === 0) {
    // The first finite value becomes the shift. x − x is 0 exactly for finite x, NaN for NaN and ±Infinity.
    while (s < n && col[s] - col[s] !== 0) s++;
    if (s === n) return;
    a.shift = col[s];
  }
  if (s === n) return;
  const x0 = col[s];
  if (repeatedTo(col, x0, s + 1, n) === n && x0 - a.shift === 0) addRepeatedInPlace(a, x0, n - s);
  else accumulateRangeInPlace(a, col, s, n);
}

/** First index in [from, n) whose value is not x0 (n if none); four samples per step. */
function repeatedTo(col: Float64Array, x0: number, from: number, n: number): number {
  let s = from;
  while (s + 3 < n && col[s] === x0 && col[s + 1] === x0 && col[s + 2] === x0 && col[s + 3] === x0) s += 4;
  while (s < n && col[s] === x0) s++;
  return s;
}

/** In place: adds k copies of x, where x − shift is exactly 0 (so s1 and s2 do not change). */
function addRepeatedInPlace(a: ColumnAccumulator, x: number, k: number): void {
  a.count += k;
  if (x < a.min) a.min = x;
  if (x > a.max) a.max = x;
  const b = (x - a.grid.lo) * (1 / a.grid.width);
  if (b < 0) a.under += k;
  else if (b >= a.grid.bins) a.over += k;
  else a.bins[b | 0] += k;
}

/**
 * In place: adds col[from..n) sample by sample; the shift is already set. This loop is bound by
 * instructions per sample, so it takes four samples per step while all four lie strictly between
 * the extremes so far and inside the grid: then none is a new minimum or maximum and all are
 * finite, so the extremes, the finite test and the under/over counts are left out of the step.
 * The test runs on bin positions: b(x) = (x − lo)·inv never decreases as x grows (each rounding
 * is monotone), so b(x) > b(min) implies x > min and b(x) < b(max) implies x < max. Any other
 * group of four goes one by one. The sums still add in sample order, so the bits are those of the
 * plain one-sample loop (columnAccumulator.test.ts holds them to it).
 */
function accumulateRangeInPlace(a: ColumnAccumulator, col: Float64Array, from: number, n: number): void {
  const shift = a.shift;
  let s1 = a.s1;
  let s2 = a.s2;
  let min = a.min;
  let max = a.max;
  let under = a.under;
  let over = a.over;
  let skipped = 0;
  const bins = a.bins;
  const lo = a.grid.lo;
  const inv = 1 / a.grid.width;
  const nb = a.grid.bins;
  let s = from;
  while (s < n) {
    // Open interval of bin positions for the four-sample step: inside (b(min), b(max)) and the
    // grid [0, nb). b > -MIN_VALUE is b >= 0. With no sample yet (min = +∞) it is empty.
    const low = Math.max((min - lo) * inv, -Number.MIN_VALUE);
    const high = Math.min((max - lo) * inv, nb);
    for (; s + 3 < n; s += 4) {
      const x0 = col[s];
      const x1 = col[s + 1];
      const x2 = col[s + 2];
      const x3 = col[s + 3];
      const b0 = (x0 - lo) * inv;
      const b1 = (x1 - lo) * inv;
      const b2 = (x2 - lo) * inv;
      const b3 = (x3 - lo) * inv;
      // NaN fails every comparison, so a sample without a value leaves the step too.
      if (!(b0 > low && b0 < high && b1 > low && b1 < high && b2 > low && b2 < high && b3 > low && b3 < high))
        break;
      // Truncation equals floor for b >= 0.
      bins[b0 | 0]++;
      bins[b1 | 0]++;
      bins[b2 | 0]++;
      bins[b3 | 0]++;
      const d0 = x0 - shift;
      s1 += d0;
      s2 += d0 * d0;
      const d1 = x1 - shift;
      s1 += d1;
      s2 += d1 * d1;
      const d2 = x2 - shift;
      s1 += d2;
      s2 += d2 * d2;
      const d3 = x3 - shift;
      s1 += d3;
      s2 += d3 * d3;
    }
    // The next four one by one (a new extreme, a value off the grid or not finite), or the last
    // one to three samples of the column.
    for (const end = Math.min(s + 4, n); s < end; s++) {
      const x = col[s];
      const b = (x - lo) * inv;
      if (b >= 0 && b < nb) bins[b | 0]++;
      else if (x - x !== 0) {
        skipped++;
        continue;
      } else if (b < 0) under++;
      else over++;
      const d = x - shift;
      s1 += d;
      s2 += d * d;
      if (x < min) min = x;
      if (x > max) max = x;
    }
  }
  // Plain field writes: no temporary object per call.
  a.count += n - from - skipped;
  a.s1 = s1;
  a.s2 = s2;
  a.min = min;
  a.max = max;
  a.under = under;
  a.over = over;
}

/** The chunk statistics as plain JSON (see MetricChunk). */
export function columnAccumulatorResult(a: ColumnAccumulator): MetricChunk {
  const { count, under, over } = a;
  if (count === 0)
    return { count, mean: null, m2: 0, min: null, max: null, under, over, binOffset: 0, bins: [] };
  const mean = a.shift + a.s1 / count;
  const m2 = Math.max(0, a.s2 - (a.s1 * a.s1) / count);
  const nb = a.grid.bins;
  let first = 0;
  while (first < nb && a.bins[first] === 0) first++;
  let last = nb - 1;
  while (last >= first && a.bins[last] === 0) last--;
  // A plain loop: Array.from over a typed array steps an iterator per element.
  const bins: number[] = new Array<number>(Math.max(0, last - first + 1));
  for (let i = first; i <= last; i++) bins[i - first] = a.bins[i];
  return { count, mean, m2, min: a.min, max: a.max, under, over, binOffset: last >= first ? first : 0, bins };
}

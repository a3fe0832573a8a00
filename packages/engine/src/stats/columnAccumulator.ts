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
 * In place: adds col[from..n) sample by sample; the shift is already set. Four samples per step
 * when all four fall inside the grid (then all are finite, so neither the finite test nor the
 * under/over counts are needed): fewer instructions per sample, which is what this loop is bound
 * by. The sums still add in sample order, so the bits are those of the one-sample loop.
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
  for (; s + 3 < n; s += 4) {
    const x0 = col[s];
    const x1 = col[s + 1];
    const x2 = col[s + 2];
    const x3 = col[s + 3];
    // Position in bins; truncation equals floor once b >= 0. NaN fails every comparison.
    const b0 = (x0 - lo) * inv;
    const b1 = (x1 - lo) * inv;
    const b2 = (x2 - lo) * inv;
    const b3 = (x3 - lo) * inv;
    if (b0 >= 0 && b0 < nb && b1 >= 0 && b1 < nb && b2 >= 0 && b2 < nb && b3 >= 0 && b3 < nb) {
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
      if (x0 < min) min = x0;
      if (x0 > max) max = x0;
      if (x1 < min) min = x1;
      if (x1 > max) max = x1;
      if (x2 < min) min = x2;
      if (x2 > max) max = x2;
      if (x3 < min) min = x3;
      if (x3 > max) max = x3;
      continue;
    }
    // Some sample is outside the grid or not finite: these four one by one, as the tail below.
    for (let t = s; t < s + 4; t++) {
      const x = col[t];
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
  for (; s < n; s++) {
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

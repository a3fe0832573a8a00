import { evaluatePoints } from '../influence/nominalMetrics.js';
import type { SampleModel } from '../run/sampleModel.js';
import { cornerSearch } from './cornerSearch.js';

/** Full corner enumeration up to this many varied inputs (2^16 = 65 536 kernel evaluations). */
export const MAX_CORNER_INPUTS = 16;
/** Corners evaluated per kernel call during enumeration. */
const BATCH = 4096;

/** Per metric: extreme corner values, which corner gave them, and the RSS estimate. */
export type WorstCaseMetric = {
  min: number | null;
  max: number | null;
  /** Input id → 'low' | 'high' for the corner giving min / max. */
  minCorner: Record<string, 'low' | 'high'> | null;
  maxCorner: Record<string, 'low' | 'high'> | null;
  /** Root-sum-square: nominal ± √Σ((y(high_i) − y(low_i))/2)², one input at a time. */
  rss: { nominal: number | null; halfSpan: number | null; low: number | null; high: number | null };
  /** Monte Carlo spread of the same run, for comparison (filled in by the merge). */
  monteCarlo?: { min: number | null; max: number | null; p0135: number | null; p99865: number | null };
};

/**
 * Worst case of every metric over the varied inputs' extreme values (tolerance bounds, lot
 * min/max, tube ±3σ). method 'corners': all 2^k corners for k <= 16. method 'search' (k > 16):
 * per metric and direction, start at the corner signed by the one-at-a-time swings, then
 * coordinate ascent (flip one input at a time while it improves) — finds a local extreme.
 * Pairing rules are not applied to the corners. Corners with no bias point are skipped.
 */
export type WorstCaseResult = {
  method: 'corners' | 'search';
  inputs: string[];
  evaluations: number;
  metrics: Record<string, WorstCaseMetric>;
};

/**
 * Computes the worst case and RSS estimate for every metric.
 *
 * @example worstCase(model).metrics.gainDiff.min
 */
export function worstCase(model: SampleModel): WorstCaseResult {
  const idx = model.ranges.flatMap((r, i) => (r.varied ? [i] : []));
  const names = idx.map((i) => model.ranges[i].input);
  const base = Float64Array.from(model.ranges, (r) => r.nominal);
  const metrics = model.kernel.metrics;
  const nm = metrics.length;
  // One-at-a-time extremes: the RSS estimate and the signs for the search.
  const oat: Float64Array[] = [base];
  for (const i of idx) {
    for (const v of [model.ranges[i].low, model.ranges[i].high]) {
      const p = Float64Array.from(base);
      p[i] = v;
      oat.push(p);
    }
  }
  const oatOut = evaluatePoints(model, oat);
  const best = {
    min: new Float64Array(nm).fill(Infinity),
    max: new Float64Array(nm).fill(-Infinity),
    minCorner: new Array<number[] | null>(nm).fill(null),
    maxCorner: new Array<number[] | null>(nm).fill(null),
  };
  let evaluations = oat.length;
  let method: WorstCaseResult['method'] = 'corners';
  if (idx.length <= MAX_CORNER_INPUTS) {
    const total = 2 ** idx.length;
    for (let first = 0; first < total; first += BATCH) {
      const points: Float64Array[] = [];
      for (let c = first; c < Math.min(total, first + BATCH); c++)
        points.push(cornerPoint(model, base, idx, bitsOf(c, idx.length)));
      const out = evaluatePoints(model, points);
      evaluations += points.length;
      for (let m = 0; m < nm; m++) {
        for (let p = 0; p < points.length; p++) {
          const y = out[m][p];
          if (y < best.min[m]) {
            best.min[m] = y;
            best.minCorner[m] = bitsOf(first + p, idx.length);
          }
          if (y > best.max[m]) {
            best.max[m] = y;
            best.maxCorner[m] = bitsOf(first + p, idx.length);
          }
        }
      }
    }
  } else {
    method = 'search';
    for (let m = 0; m < nm; m++) {
      for (const dir of [1, -1] as const) {
        const start = idx.map((_i, k) => ((oatOut[m][2 + 2 * k] - oatOut[m][1 + 2 * k]) * dir >= 0 ? 1 : 0));
        const found = cornerSearch(
          (bits) => evaluatePoints(model, [cornerPoint(model, base, idx, bits)])[m][0],
          start,
          dir,
        );
        evaluations += found.evaluations;
        const key = dir === 1 ? 'max' : 'min';
        best[key][m] = found.value;
        best[key === 'max' ? 'maxCorner' : 'minCorner'][m] = found.bits;
      }
    }
  }
  const label = (bits: number[] | null) =>
    bits
      ? Object.fromEntries(names.map((n, k) => [n, bits[k] ? ('high' as const) : ('low' as const)]))
      : null;
  const result: Record<string, WorstCaseMetric> = {};
  metrics.forEach((id, m) => {
    const y0 = oatOut[m][0];
    let ss = 0;
    for (let k = 0; k < idx.length; k++) ss += ((oatOut[m][2 + 2 * k] - oatOut[m][1 + 2 * k]) / 2) ** 2;
    const half = Math.sqrt(ss);
    const fin = (x: number) => (Number.isFinite(x) ? x : null);
    result[id] = {
      min: fin(best.min[m]),
      max: fin(best.max[m]),
      minCorner: label(best.minCorner[m]),
      maxCorner: label(best.maxCorner[m]),
      rss: { nominal: fin(y0), halfSpan: fin(half), low: fin(y0 - half), high: fin(y0 + half) },
    };
  });
  return { method, inputs: names, evaluations, metrics: result };
}

function bitsOf(c: number, k: number): number[] {
  const bits: number[] = [];
  for (let j = 0; j < k; j++) bits.push(Math.floor(c / 2 ** j) % 2);
  return bits;
}

function cornerPoint(
  model: SampleModel,
  base: Float64Array,
  idx: readonly number[],
  bits: readonly number[],
): Float64Array {
  const p = Float64Array.from(base);
  idx.forEach((i, k) => (p[i] = bits[k] ? model.ranges[i].high : model.ranges[i].low));
  return p;
}

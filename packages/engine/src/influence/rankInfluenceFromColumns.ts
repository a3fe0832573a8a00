import { rankInPlace, rankRegression } from './rankInfluence.js';

/**
 * Spearman and SRRC for every metric against the given input columns, on the rows where every
 * metric is finite. Returns metric → input → value maps and the number of rows used.
 *
 * @example rankInfluenceFromColumns(['x'], [xs], ['y'], [ys]).spearman.y.x
 */
export function rankInfluenceFromColumns(
  inputNames: readonly string[],
  inputCols: readonly Float64Array[],
  metricNames: readonly string[],
  metricCols: readonly Float64Array[],
): {
  rows: number;
  spearman: Record<string, Record<string, number | null>>;
  srrc: Record<string, Record<string, number | null>>;
} {
  const n = inputCols[0]?.length ?? metricCols[0]?.length ?? 0;
  const keep: number[] = [];
  for (let s = 0; s < n; s++) if (metricCols.every((c) => Number.isFinite(c[s]))) keep.push(s);
  const pick = (c: Float64Array) => Float64Array.from(keep, (s) => c[s]);
  const toRanks = (c: Float64Array) => {
    const r = new Float64Array(keep.length);
    rankInPlace(pick(c), r);
    return r;
  };
  const inputRanks = inputCols.map(toRanks);
  const spearman: Record<string, Record<string, number | null>> = {};
  const srrc: Record<string, Record<string, number | null>> = {};
  metricNames.forEach((id, m) => {
    const res = keep.length > 2 ? rankRegression(inputRanks, toRanks(metricCols[m])) : null;
    spearman[id] = Object.fromEntries(inputNames.map((x, i) => [x, res ? res.spearman[i] : null]));
    srrc[id] = Object.fromEntries(inputNames.map((x, i) => [x, res ? res.srrc[i] : null]));
  });
  return { rows: keep.length, spearman, srrc };
}

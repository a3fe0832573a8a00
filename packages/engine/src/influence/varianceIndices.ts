import { createStream } from '../random/createStream.js';
import type { SampleModel } from '../run/sampleModel.js';

/** Base samples M of the variance-based indices; cost M·(d + 2) kernel evaluations. */
export const VARIANCE_BASE_SAMPLES = 8192;

/**
 * Variance-based indices per metric and draw dimension: first order S_i (Saltelli et al. 2010
 * estimator, mean of f(B)·(f(A_B^i) − f(A)), with f(B) centred on the mean of f — which leaves
 * the expectation unchanged but removes the noise a large mean would add) and total S_Ti (Jansen 1999, mean of
 * (f(A) − f(A_B^i))²/2), both divided by the variance of f over A and B. A, B are two independent
 * pseudo-random M×d matrices from the run seed; A_B^i is A with column i from B. Budget:
 * M·(d + 2) evaluations (8192·15 = 122 880 for 13 dimensions). Statistical error is roughly
 * ±0.02 on indices of this size at M = 8192. Indices refer to the independent draw dimensions;
 * pairing rules are not applied here (they make inputs dependent). Rows with a NaN metric
 * (no bias point) are dropped for that metric. null = undefined (zero variance).
 */
export type VarianceIndicesResult = {
  baseSamples: number;
  evaluations: number;
  dims: string[];
  firstOrder: Record<string, (number | null)[]>;
  total: Record<string, (number | null)[]>;
};

/**
 * Computes the indices for every kernel metric (see VarianceIndicesResult).
 *
 * @example varianceIndices(model, 'seed', 4096).firstOrder.y // [S_1, S_2, ...]
 */
export function varianceIndices(
  model: SampleModel,
  seed: string,
  m = VARIANCE_BASE_SAMPLES,
): VarianceIndicesResult {
  const all = model.dims.map((_n, i) => i);
  return combineVarianceIndices(model, [varianceIndicesGroup(model, seed, all, m)], m);
}

/**
 * The indices of some draw dimensions only (`dims`, indices into model.dims): A, B and A_B^i for
 * those i, so several groups can be computed in parallel. Each group evaluates A and B itself
 * (M·(|dims| + 2) evaluations); the figures are bit for bit those of varianceIndices.
 */
export type VarianceIndicesGroup = {
  dims: number[];
  /** Per metric, one value per entry of `dims`. */
  firstOrder: Record<string, (number | null)[]>;
  total: Record<string, (number | null)[]>;
};

/**
 * Computes one group of dimensions (see VarianceIndicesGroup).
 *
 * @example varianceIndicesGroup(model, 'seed', [0, 2]).firstOrder.y // [S_1, S_3]
 */
export function varianceIndicesGroup(
  model: SampleModel,
  seed: string,
  dims: readonly number[],
  m = VARIANCE_BASE_SAMPLES,
): VarianceIndicesGroup {
  const uA = model.dims.map((_n, j) => fillColumn(seed, 'A', j, m));
  const uB = model.dims.map((_n, j) => fillColumn(seed, 'B', j, m));
  const fA = evaluateU(model, uA, m);
  const fB = evaluateU(model, uB, m);
  const fAB = dims.map((i) =>
    evaluateU(
      model,
      uA.map((col, j) => (j === i ? uB[i] : col)),
      m,
    ),
  );
  const firstOrder: VarianceIndicesGroup['firstOrder'] = {};
  const total: VarianceIndicesGroup['total'] = {};
  model.kernel.metrics.forEach((id, k) => {
    const a = fA[k];
    const b = fB[k];
    const { mean, variance: v } = meanVarianceOfBoth(a, b);
    firstOrder[id] = [];
    total[id] = [];
    for (let g = 0; g < dims.length; g++) {
      const ab = fAB[g][k];
      let s1 = 0;
      let st = 0;
      let cnt = 0;
      for (let r = 0; r < m; r++) {
        if (!(Number.isFinite(a[r]) && Number.isFinite(b[r]) && Number.isFinite(ab[r]))) continue;
        s1 += (b[r] - mean) * (ab[r] - a[r]);
        st += (a[r] - ab[r]) * (a[r] - ab[r]);
        cnt++;
      }
      const ok = v > 0 && cnt > 0;
      firstOrder[id].push(ok ? s1 / cnt / v : null);
      total[id].push(ok ? st / (2 * cnt) / v : null);
    }
  });
  return { dims: [...dims], firstOrder, total };
}

/**
 * Puts groups back together in dimension order. Throws RangeError when a dimension is in no group.
 *
 * @example combineVarianceIndices(model, [g0, g1]).total.y // [S_T1, S_T2, ...]
 */
export function combineVarianceIndices(
  model: SampleModel,
  groups: readonly VarianceIndicesGroup[],
  m = VARIANCE_BASE_SAMPLES,
): VarianceIndicesResult {
  const d = model.dims.length;
  const where = new Map<number, [VarianceIndicesGroup, number]>();
  for (const g of groups) g.dims.forEach((i, at) => where.set(i, [g, at]));
  const firstOrder: VarianceIndicesResult['firstOrder'] = {};
  const total: VarianceIndicesResult['total'] = {};
  for (const id of model.kernel.metrics) {
    firstOrder[id] = [];
    total[id] = [];
    for (let i = 0; i < d; i++) {
      const hit = where.get(i);
      if (!hit) throw new RangeError(`variance indices: dimension ${i} is in no group`);
      firstOrder[id].push(hit[0].firstOrder[id][hit[1]]);
      total[id].push(hit[0].total[id][hit[1]]);
    }
  }
  return { baseSamples: m, evaluations: m * (d + 2), dims: [...model.dims], firstOrder, total };
}

function fillColumn(seed: string, matrix: string, j: number, m: number): Float64Array {
  const col = new Float64Array(m);
  createStream(seed, 'variance-indices', matrix, j).fillOpen(col, m);
  return col;
}

function evaluateU(model: SampleModel, u: readonly Float64Array[], m: number): Float64Array[] {
  const inputs = model.kernel.inputs.map(() => new Float64Array(m));
  const out = model.kernel.metrics.map(() => new Float64Array(m));
  model.fillInputs(u, m, inputs, null, { samples: 0, draws: 0, failures: 0 });
  model.kernel.evaluate(inputs, m, out);
  return out;
}

function meanVarianceOfBoth(a: Float64Array, b: Float64Array): { mean: number; variance: number } {
  let n = 0;
  let mean = 0;
  for (const col of [a, b]) {
    for (const x of col) {
      if (Number.isFinite(x)) {
        n++;
        mean += x;
      }
    }
  }
  mean /= n;
  let ss = 0;
  for (const col of [a, b]) for (const x of col) if (Number.isFinite(x)) ss += (x - mean) * (x - mean);
  return { mean, variance: n > 1 ? ss / (n - 1) : NaN };
}

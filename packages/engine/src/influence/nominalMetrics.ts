import type { SampleModel } from '../run/sampleModel.js';

/**
 * Kernel metrics at every input's nominal value (one kernel call). NaN where no bias point exists.
 *
 * @example nominalMetrics(model)[0] // value of metric 0 at nominal
 */
export function nominalMetrics(model: SampleModel): Float64Array {
  const inputs = model.ranges.map((r) => Float64Array.of(r.nominal));
  const out = model.kernel.metrics.map(() => new Float64Array(1));
  model.kernel.evaluate(inputs, 1, out);
  return Float64Array.from(out, (c) => c[0]);
}

/**
 * Evaluates the kernel at `points` input vectors (points[p][i] = input i), returning out[m][p].
 * For one-off analyses (sensitivities, corners), not for the sampling loop.
 */
export function evaluatePoints(model: SampleModel, points: readonly Float64Array[]): Float64Array[] {
  const n = points.length;
  const inputs = model.ranges.map((_r, i) => Float64Array.from(points, (p) => p[i]));
  const out = model.kernel.metrics.map(() => new Float64Array(n));
  if (n > 0) model.kernel.evaluate(inputs, n, out);
  return out;
}

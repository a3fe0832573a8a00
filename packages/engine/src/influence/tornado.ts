import type { SampleModel } from '../run/sampleModel.js';
import { evaluatePoints } from './nominalMetrics.js';

/** One bar of a tornado chart: the metric with one input at its low/high extreme, the rest nominal. */
export type TornadoBar = {
  input: string;
  inputLow: number;
  inputHigh: number;
  /** Metric value with the input at inputLow / inputHigh (null = no bias point). */
  low: number | null;
  high: number | null;
  /** |high − low|, the sort key (null sorts last). */
  swing: number | null;
};

/**
 * Tornado data per metric: every varied input moved alone to its extreme values (tolerance bounds,
 * lot min/max, tube ±3σ), bars sorted by swing, largest first.
 *
 * @example tornado(model).gainDiff[0].input // the input that moves gainDiff most
 */
export function tornado(model: SampleModel): Record<string, TornadoBar[]> {
  const idx = model.ranges.flatMap((r, i) => (r.varied ? [i] : []));
  const base = Float64Array.from(model.ranges, (r) => r.nominal);
  const points: Float64Array[] = [];
  for (const i of idx) {
    for (const v of [model.ranges[i].low, model.ranges[i].high]) {
      const p = Float64Array.from(base);
      p[i] = v;
      points.push(p);
    }
  }
  const out = evaluatePoints(model, points);
  const result: Record<string, TornadoBar[]> = {};
  model.kernel.metrics.forEach((id, m) => {
    const bars = idx.map((i, k): TornadoBar => {
      const lo = out[m][2 * k];
      const hi = out[m][2 * k + 1];
      const swing = Math.abs(hi - lo);
      return {
        input: model.ranges[i].input,
        inputLow: model.ranges[i].low,
        inputHigh: model.ranges[i].high,
        low: Number.isFinite(lo) ? lo : null,
        high: Number.isFinite(hi) ? hi : null,
        swing: Number.isFinite(swing) ? swing : null,
      };
    });
    result[id] = bars.sort((a, b) => (b.swing ?? -1) - (a.swing ?? -1));
  });
  return result;
}

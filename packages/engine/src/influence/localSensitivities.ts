import type { SampleModel } from '../run/sampleModel.js';
import { evaluatePoints } from './nominalMetrics.js';

/** Relative step of the central differences. */
const STEP = 1e-4;

/**
 * Local normalised sensitivities at nominal, ∂ln y/∂ln x ≈ (y(x(1+h)) − y(x(1−h)))/(2h·y(x)),
 * h = 1e-4, for every varied input with a finite non-zero nominal. result[m][i] is metric m
 * against varied input i (order of `inputs`); null where y(x) is 0 or not finite.
 *
 * @example localSensitivities(model).values[0][0] // e.g. 0.98 for gain against rl1
 */
export function localSensitivities(model: SampleModel): { inputs: string[]; values: (number | null)[][] } {
  const idx = model.ranges.flatMap((r, i) =>
    r.varied && Number.isFinite(r.nominal) && r.nominal !== 0 ? [i] : [],
  );
  const base = Float64Array.from(model.ranges, (r) => r.nominal);
  const points = [base];
  for (const i of idx) {
    for (const f of [1 + STEP, 1 - STEP]) {
      const p = Float64Array.from(base);
      p[i] = base[i] * f;
      points.push(p);
    }
  }
  const out = evaluatePoints(model, points);
  const values = out.map((col) =>
    idx.map((_i, k) => {
      const y0 = col[0];
      const s = (col[1 + 2 * k] - col[2 + 2 * k]) / (2 * STEP * y0);
      return y0 !== 0 && Number.isFinite(s) ? s : null;
    }),
  );
  return { inputs: idx.map((i) => model.ranges[i].input), values };
}

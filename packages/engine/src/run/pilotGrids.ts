import { createStream } from '../random/createStream.js';
import { fillUniforms } from '../sampling/fillUniforms.js';
import { gridFromRange, type HistogramGrid } from '../stats/histogramGrid.js';
import type { SampleModel } from './sampleModel.js';

/** Samples in the pilot that fixes histogram grids. */
export const PILOT_SAMPLES = 4096;
/** Fixed pilot seed: grids depend on the design only, so runs with different seeds compare bin by bin. */
const PILOT_SEED = 'sigmatail-histogram-pilot';

/**
 * Histogram grid per kernel metric from a fixed pseudo-random pilot of 4096 samples (never from
 * whichever chunk finishes first), so every chunk of every run of a design bins identically.
 *
 * @example pilotGrids(model)[0] // { lo, width, bins: 2048 }
 */
export function pilotGrids(model: SampleModel): HistogramGrid[] {
  const n = PILOT_SAMPLES;
  const u = model.dims.map(() => new Float64Array(n));
  const inputs = model.kernel.inputs.map(() => new Float64Array(n));
  const out = model.kernel.metrics.map(() => new Float64Array(n));
  fillUniforms('random', PILOT_SEED, 0, 0, n, u);
  model.fillInputs(u, n, inputs, createStream(PILOT_SEED, 'pairing'), { samples: 0, draws: 0, failures: 0 });
  model.kernel.evaluate(inputs, n, out);
  return out.map((col) => {
    let min = Infinity;
    let max = -Infinity;
    for (let s = 0; s < n; s++) {
      const x = col[s];
      if (x < min) min = x;
      if (x > max) max = x;
    }
    return gridFromRange(min, max);
  });
}

import type { ResolvedDesign } from '../design/designSchema.js';
import type { HistogramGrid } from '../stats/histogramGrid.js';
import { pilotGrids } from './pilotGrids.js';
import type { SampleModel } from './sampleModel.js';
import { specColumnId } from '../model/metrics.js';

/**
 * A limit on a metric (at least one of min/max), as in the design's specs; `frequency` (Hz) for
 * the frequency metrics, whose kernel column is `metric@frequency`.
 */
export type SpecLimit = { metric: string; frequency?: number; min?: number; max?: number; label?: string };

/**
 * Everything a chunk needs besides the plan: the model, its specs (with metric column indices)
 * and the fixed histogram grids. Built once per design (see designSetup) and reused per chunk.
 */
export type RunSetup = {
  readonly model: SampleModel;
  readonly specs: readonly SpecLimit[];
  readonly specMetric: readonly number[];
  readonly grids: readonly HistogramGrid[];
  /** Column of the kernel's 'valid' metric (1 = bias point exists), or -1. */
  readonly validMetric: number;
  /** The design the setup was built from (designSetup sets it), for analyses beyond the kernel. */
  readonly design?: ResolvedDesign;
};

/**
 * Builds a RunSetup: checks each spec names a kernel metric and has a limit (RangeError naming
 * `specs[i]`), and fixes the histogram grids from the pilot.
 *
 * @example createRunSetup(model, [{ metric: 'gainDiff', min: 20 }])
 */
export function createRunSetup(model: SampleModel, specs: readonly SpecLimit[]): RunSetup {
  const metrics = model.kernel.metrics;
  const specMetric = specs.map((s, i) => {
    const m = metrics.indexOf(specColumnId(s));
    if (m < 0) throw new RangeError(`specs[${i}].metric '${specColumnId(s)}' is not a metric`);
    if (s.min === undefined && s.max === undefined) throw new RangeError(`specs[${i}] needs min or max`);
    return m;
  });
  return { model, specs, specMetric, grids: pilotGrids(model), validMetric: metrics.indexOf('valid') };
}

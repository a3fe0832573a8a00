import type { ResolvedDesign } from '../design/designSchema.js';
import { createStageKernel, INPUTS, type InputId } from './stageKernel.js';
import type { MetricId } from './metrics.js';

/**
 * Every metric of one evaluated point (SI units; NaN when there is no valid bias), including the
 * design's frequency columns (`acBalanceDb@20000`, ...).
 */
export type MetricValues = Record<MetricId, number> & Record<string, number>;

/**
 * A single-point evaluator of a design: metrics at nominal, or with some inputs overridden.
 * Allocates per call, so it is for nominal reports and trims, not for Monte Carlo.
 *
 * @example
 * const at = createStagePoint(design);
 * at({ rl2: 91e3 }).balanceDb; // dB with RL2 = 91 kΩ
 */
export function createStagePoint(
  design: ResolvedDesign,
): (overrides?: Partial<Record<InputId, number>>) => MetricValues {
  const kernel = createStageKernel(design);
  const nominal = kernel.nominalInputs();
  const inputs = INPUTS.map(() => new Float64Array(1));
  const out = kernel.metrics.map(() => new Float64Array(1));
  return (overrides = {}) => {
    INPUTS.forEach((id, i) => (inputs[i][0] = overrides[id] ?? nominal[i]));
    kernel.evaluate(inputs, 1, out);
    return Object.fromEntries(kernel.metrics.map((id, m) => [id, out[m][0]])) as MetricValues;
  };
}

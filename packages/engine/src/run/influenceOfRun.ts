import { RANK_SUBSAMPLE, type InfluenceResult } from '../influence/influenceResult.js';
import { localSensitivities } from '../influence/localSensitivities.js';
import { rankInfluenceFromColumns } from '../influence/rankInfluenceFromColumns.js';
import { tornado } from '../influence/tornado.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';
import { evaluateChunk } from './runSetupChunk.js';

/**
 * Influence of a run's varied inputs on its metrics: local sensitivities, Spearman/SRRC on the
 * first min(N, 20 000) samples regenerated from the run's own chunks, and the tornado.
 *
 * @example influenceOfRun(setup, plan).spearman.balanceDb.rl1 // −0.71
 */
export function influenceOfRun(setup: RunSetup, plan: RunPlan): InfluenceResult {
  const { model } = setup;
  const local = localSensitivities(model);
  const varied = model.ranges.flatMap((r, i) => (r.varied ? [i] : []));
  const rows = Math.min(plan.samples, RANK_SUBSAMPLE);
  const inputs = varied.map(() => new Float64Array(rows));
  const metrics = model.kernel.metrics.map(() => new Float64Array(rows));
  let filled = 0;
  for (let k = 0; k < chunkCount(plan) && filled < rows; k++) {
    const { columns, n } = evaluateChunk(setup, plan, k, rows - filled);
    const take = n;
    varied.forEach((i, j) => inputs[j].set(columns.inputs[i].subarray(0, take), filled));
    metrics.forEach((col, m) => col.set(columns.out[m].subarray(0, take), filled));
    filled += take;
  }
  const names = varied.map((i) => model.ranges[i].input);
  const ranks = rankInfluenceFromColumns(names, inputs, model.kernel.metrics, metrics);
  const localMap = Object.fromEntries(
    model.kernel.metrics.map((id, m) => [
      id,
      Object.fromEntries(
        names.map((x) => [x, local.inputs.includes(x) ? local.values[m][local.inputs.indexOf(x)] : null]),
      ),
    ]),
  );
  return {
    inputs: names,
    rankSamples: ranks.rows,
    local: localMap,
    spearman: ranks.spearman,
    srrc: ranks.srrc,
    tornado: tornado(model),
  };
}

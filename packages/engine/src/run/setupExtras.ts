import { RANK_SUBSAMPLE, type InfluenceResult } from '../influence/influenceResult.js';
import { localSensitivities } from '../influence/localSensitivities.js';
import { nominalMetrics } from '../influence/nominalMetrics.js';
import { rankInfluenceFromColumns } from '../influence/rankInfluenceFromColumns.js';
import { tornado } from '../influence/tornado.js';
import { varianceIndices } from '../influence/varianceIndices.js';
import { worstCase } from '../worstcase/worstCase.js';
import { largeSignalSpread } from './largeSignalSpread.js';
import { finiteOrNull, type RunResults } from './runResults.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';
import { evaluateChunk } from './runSetupChunk.js';

/**
 * Work done once per run rather than per chunk: nominal metrics, influence (local sensitivities,
 * Spearman/SRRC on the first min(N, 20 000) samples regenerated from the run's own chunks,
 * tornado), variance-based indices (their own A/B samples, VARIANCE_BASE_SAMPLES·(d+2)
 * evaluations) and worst case, as switched on in plan.analyses (all on by default), and the
 * per-sample large-signal figures on a subsample (off by default; needs `setup.design`).
 * Pure function of (setup, plan); mergeChunks calls it unless given precomputed extras.
 */
export function setupExtras(setup: RunSetup, plan: RunPlan): Partial<RunResults> {
  const { model } = setup;
  const a = plan.analyses ?? {};
  const nominal = nominalMetrics(model);
  const extras: Partial<RunResults> = {
    nominal: Object.fromEntries(model.kernel.metrics.map((id, m) => [id, finiteOrNull(nominal[m])])),
  };
  if (a.influence !== false) extras.influence = influence(setup, plan);
  if (a.varianceIndices !== false && model.dims.length > 0)
    extras.varianceIndices = varianceIndices(model, plan.seed);
  if (a.worstCase !== false) extras.worstCase = worstCase(model);
  // Needs the design itself (not only the kernel); largeSignalReport dispatches on the topology.
  if (a.largeSignal === true && setup.design)
    extras.largeSignal = largeSignalSpread(setup.design, setup, plan);
  return extras;
}

function influence(setup: RunSetup, plan: RunPlan): InfluenceResult {
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

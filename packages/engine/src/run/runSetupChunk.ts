import { createStream } from '../random/createStream.js';
import { fillUniforms } from '../sampling/fillUniforms.js';
import { summarizeColumn } from '../stats/metricChunk.js';
import type { ChunkResult } from './chunkResult.js';
import { chunkBounds, type RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';

/** Column buffers of one chunk, allocated once per chunk and reused by every stage. */
export type ChunkColumns = { u: Float64Array[]; inputs: Float64Array[]; out: Float64Array[] };

/**
 * Buffers kept per setup for runSetupChunk: a worker thread runs its chunks one after another,
 * so the ~30 MB of columns of a 65 536-sample chunk are allocated once, not once per chunk.
 */
const pool = new WeakMap<
  RunSetup,
  { size: number; columns: ChunkColumns; scratch: Float64Array; joint: Uint8Array }
>();

function pooledBuffers(setup: RunSetup, size: number) {
  let entry = pool.get(setup);
  if (!entry || entry.size < size) {
    const { model } = setup;
    entry = {
      size,
      columns: {
        u: model.dims.map(() => new Float64Array(size)),
        inputs: model.kernel.inputs.map(() => new Float64Array(size)),
        out: model.kernel.metrics.map(() => new Float64Array(size)),
      },
      scratch: new Float64Array(Math.max(1, ...setup.grids.map((g) => g.bins))),
      joint: new Uint8Array(size),
    };
    pool.set(setup, entry);
  }
  return entry;
}

/**
 * In place: draws and evaluates samples start..start+n-1 of chunk k into fresh column buffers.
 * Returns the buffers and the pairing tally. With `limit`, only the chunk's first `limit` samples
 * are evaluated (same values as in the full chunk). `buffers` (at least chunk-sized) are filled
 * instead of fresh arrays. Shared by runChunk and sampleRows so an export
 * regenerates exactly the samples the statistics saw.
 */
export function evaluateChunk(
  setup: RunSetup,
  plan: RunPlan,
  chunkIndex: number,
  limit = Infinity,
  buffers?: ChunkColumns,
): { columns: ChunkColumns; start: number; n: number; pairing: ChunkResult['pairing'] } {
  const bounds = chunkBounds(plan, chunkIndex);
  const start = bounds.start;
  const n = Math.min(bounds.n, limit);
  const { model } = setup;
  // Uniforms for the whole chunk (a Latin hypercube needs all its strata); the rest only for
  // the first `limit` samples, which are a prefix of the full chunk's samples.
  const columns: ChunkColumns = buffers ?? {
    u: model.dims.map(() => new Float64Array(bounds.n)),
    inputs: model.kernel.inputs.map(() => new Float64Array(n)),
    out: model.kernel.metrics.map(() => new Float64Array(n)),
  };
  const pairing = { samples: 0, draws: 0, failures: 0 };
  fillUniforms(plan.plan, plan.seed, chunkIndex, start, bounds.n, columns.u);
  model.fillInputs(columns.u, n, columns.inputs, createStream(plan.seed, 'pairing', chunkIndex), pairing);
  model.kernel.evaluate(columns.inputs, n, columns.out);
  return { columns, start, n, pairing };
}

/**
 * Runs chunk k of a run on a prepared setup: samples, evaluates, and summarises every metric and
 * spec. Pure function of (setup, plan, k).
 *
 * @example runSetupChunk(setup, { samples: 1e6, seed: 's', plan: 'random', chunkSize: 65536 }, 0)
 */
export function runSetupChunk(setup: RunSetup, plan: RunPlan, chunkIndex: number): ChunkResult {
  const buffers = pooledBuffers(setup, chunkBounds(plan, chunkIndex).n);
  const { columns, start, n, pairing } = evaluateChunk(setup, plan, chunkIndex, Infinity, buffers.columns);
  const { out } = columns;
  const metricIds = setup.model.kernel.metrics;
  const { scratch, joint } = buffers;
  const metrics: ChunkResult['metrics'] = {};
  for (let m = 0; m < metricIds.length; m++) {
    metrics[metricIds[m]] = summarizeColumn(out[m], n, setup.grids[m], scratch);
  }
  // Joint flags: start from validity, clear on each failed spec.
  let validCount = 0;
  const valid = setup.validMetric >= 0 ? out[setup.validMetric] : null;
  for (let s = 0; s < n; s++) {
    const ok = valid === null || valid[s] === 1;
    joint[s] = ok ? 1 : 0;
    if (ok) validCount++;
  }
  const specPass = setup.specs.map((spec, i) => {
    const col = out[setup.specMetric[i]];
    const lo = spec.min ?? -Infinity;
    const hi = spec.max ?? Infinity;
    let pass = 0;
    for (let s = 0; s < n; s++) {
      const x = col[s];
      // NaN compares false, so a sample without a bias point fails.
      if (x >= lo && x <= hi && (valid === null || valid[s] === 1)) pass++;
      else joint[s] = 0;
    }
    return pass;
  });
  let jointPass = 0;
  for (let s = 0; s < n; s++) jointPass += joint[s];
  return { chunkIndex, start, n, validCount, metrics, specPass, jointPass, pairing };
}

import { createStream } from '../random/createStream.js';
import { createChunkSampler } from '../sampling/createChunkSampler.js';
import {
  accumulateColumnInPlace,
  columnAccumulatorResult,
  createColumnAccumulator,
  resetColumnAccumulator,
  type ColumnAccumulator,
} from '../stats/columnAccumulator.js';
import type { ChunkResult } from './chunkResult.js';
import { chunkBounds, type RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';

/** Samples per block: a block's ~60 columns (~1 MB) stay in cache through every stage. */
export const BLOCK_SIZE = 2048;

/** Column buffers: uniforms per draw dimension, kernel inputs, kernel metrics. */
export type ChunkColumns = { u: Float64Array[]; inputs: Float64Array[]; out: Float64Array[] };

type Work = { columns: ChunkColumns; acc: ColumnAccumulator[]; alive: Uint8Array; joint: Uint8Array };

/**
 * Block buffers and accumulators kept per setup: a worker thread runs its chunks one after
 * another, so they are allocated once, not per chunk, and nothing is allocated per sample.
 */
const pool = new WeakMap<RunSetup, Work>();

function workFor(setup: RunSetup): Work {
  let w = pool.get(setup);
  if (!w) {
    w = {
      columns: allocateColumns(setup, BLOCK_SIZE),
      acc: setup.grids.map((g) => createColumnAccumulator(g)),
      alive: new Uint8Array(BLOCK_SIZE),
      joint: new Uint8Array(BLOCK_SIZE),
    };
    pool.set(setup, w);
  }
  return w;
}

function allocateColumns(setup: RunSetup, n: number): ChunkColumns {
  const { model } = setup;
  return {
    u: model.dims.map(() => new Float64Array(n)),
    inputs: model.kernel.inputs.map(() => new Float64Array(n)),
    out: model.kernel.metrics.map(() => new Float64Array(n)),
  };
}

/**
 * Draws and evaluates the first min(n, limit) samples of chunk k into fresh whole-chunk columns
 * (for export and the rank subsample). Same values as runSetupChunk sees: the sampler, the
 * pairing stream and the kernel are all sequential in sample order, whatever the block size.
 */
export function evaluateChunk(
  setup: RunSetup,
  plan: RunPlan,
  chunkIndex: number,
  limit = Infinity,
): { columns: ChunkColumns; start: number; n: number; pairing: ChunkResult['pairing'] } {
  const bounds = chunkBounds(plan, chunkIndex);
  const n = Math.min(bounds.n, limit);
  const { model } = setup;
  const columns = allocateColumns(setup, n);
  const pairing = { samples: 0, draws: 0, failures: 0 };
  const sampler = createChunkSampler(
    plan.plan,
    plan.seed,
    chunkIndex,
    bounds.start,
    bounds.n,
    model.dims.length,
  );
  sampler.fill(columns.u, n);
  model.fillInputs(columns.u, n, columns.inputs, createStream(plan.seed, 'pairing', chunkIndex), pairing);
  model.kernel.evaluate(columns.inputs, n, columns.out);
  return { columns, start: bounds.start, n, pairing };
}

/**
 * Runs chunk k of a run on a prepared setup: samples, evaluates and summarises every metric and
 * spec, block by block (BLOCK_SIZE samples through sampling, inputs, kernel and statistics while
 * they are in cache). Pure function of (setup, plan, k).
 *
 * @example runSetupChunk(setup, { samples: 1e6, seed: 's', plan: 'random', chunkSize: 65536 }, 0)
 */
export function runSetupChunk(setup: RunSetup, plan: RunPlan, chunkIndex: number): ChunkResult {
  const { start, n } = chunkBounds(plan, chunkIndex);
  const { model, specs, specMetric, validMetric } = setup;
  const { columns, acc, alive, joint } = workFor(setup);
  const { u, inputs, out } = columns;
  acc.forEach(resetColumnAccumulator);
  const sampler = createChunkSampler(plan.plan, plan.seed, chunkIndex, start, n, model.dims.length);
  const redraw = createStream(plan.seed, 'pairing', chunkIndex);
  const pairing = { samples: 0, draws: 0, failures: 0 };
  const lo = specs.map((s) => s.min ?? -Infinity);
  const hi = specs.map((s) => s.max ?? Infinity);
  const specPass = specs.map(() => 0);
  let validCount = 0;
  let jointPass = 0;
  for (let off = 0; off < n; off += BLOCK_SIZE) {
    const b = Math.min(BLOCK_SIZE, n - off);
    sampler.fill(u, b);
    model.fillInputs(u, b, inputs, redraw, pairing);
    model.kernel.evaluate(inputs, b, out);
    for (let m = 0; m < out.length; m++) accumulateColumnInPlace(acc[m], out[m], b);
    const valid = validMetric >= 0 ? out[validMetric] : null;
    validCount += markValidInPlace(alive, joint, valid, b);
    for (let i = 0; i < specs.length; i++) {
      specPass[i] += countPassInPlace(alive, joint, out[specMetric[i]], lo[i], hi[i], b);
    }
    jointPass += countFlags(joint, b);
  }
  const metrics: ChunkResult['metrics'] = {};
  model.kernel.metrics.forEach((id, m) => (metrics[id] = columnAccumulatorResult(acc[m])));
  return { chunkIndex, start, n, validCount, metrics, specPass, jointPass, pairing };
}

// The per-sample loops live in small functions called once per block: they get optimised
// after a few blocks, whereas a loop inside the long-running chunk function would stay in
// unoptimised code for a while and box every double it reads.

/**
 * In place: alive[s] = joint[s] = 1 where the sample has a bias point (valid = 1, or the kernel
 * has no valid column), else 0. Returns the number of such samples.
 */
function markValidInPlace(
  alive: Uint8Array,
  joint: Uint8Array,
  valid: Float64Array | null,
  n: number,
): number {
  let count = 0;
  for (let s = 0; s < n; s++) {
    const ok = valid === null || valid[s] === 1 ? 1 : 0;
    alive[s] = ok;
    joint[s] = ok;
    count += ok;
  }
  return count;
}

/**
 * Counts the samples with a bias point (alive) and lo <= x <= hi — independent of other specs —
 * and clears the joint flag of every sample that fails. NaN compares false, so a sample without
 * a bias point fails.
 */
function countPassInPlace(
  alive: Uint8Array,
  joint: Uint8Array,
  col: Float64Array,
  lo: number,
  hi: number,
  n: number,
): number {
  let pass = 0;
  for (let s = 0; s < n; s++) {
    const x = col[s];
    if (x >= lo && x <= hi && alive[s] === 1) pass++;
    else joint[s] = 0;
  }
  return pass;
}

/** Number of set flags in joint[0..n). */
function countFlags(joint: Uint8Array, n: number): number {
  let c = 0;
  for (let s = 0; s < n; s++) c += joint[s];
  return c;
}

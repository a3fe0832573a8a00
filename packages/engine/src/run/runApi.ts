import type { ResolvedDesign } from '../design/designSchema.js';
import type { ChunkResult } from './chunkResult.js';
import { designSetup } from './designSetup.js';
import { mergeSetupChunks } from './mergeSetupChunks.js';
import type { RunPlan } from './runPlan.js';
import type { RunResults } from './runResults.js';
import { runSetupChunk } from './runSetupChunk.js';
import { setupExtras } from './setupExtras.js';
import { setupSampleRows } from './setupSampleRows.js';

/**
 * Runs chunk `chunkIndex` of a run: samples chunkSize (or the remainder) designs from the stream
 * of (seed, chunkIndex), evaluates the stage kernel (DC point per sample) and returns plain JSON
 * statistics. Throws RangeError naming the field for a bad plan or chunk index.
 *
 * @example
 * const plan = { samples: 1_000_000, seed: 'lot-7', plan: 'random', chunkSize: DEFAULT_CHUNK_SIZE } as const;
 * const chunks = Array.from({ length: chunkCount(plan) }, (_, k) => runChunk(design, plan, k));
 * const results = mergeChunks(design, plan, chunks);
 */
export function runChunk(design: ResolvedDesign, plan: RunPlan, chunkIndex: number): ChunkResult {
  return runSetupChunk(designSetup(design), plan, chunkIndex);
}

/**
 * Merges every chunk of a run into RunResults. Chunks may come in any order (sorted by index
 * first), so the result is bit-identical for any worker count. Includes the once-per-run extras
 * (nominal, influence, variance indices, worst case per plan.analyses), computed here unless
 * `extras` (from runExtras) is given. Throws RangeError if chunks are missing.
 */
export function mergeChunks(
  design: ResolvedDesign,
  plan: RunPlan,
  chunks: readonly ChunkResult[],
  extras?: Partial<RunResults>,
): RunResults {
  return mergeSetupChunks(designSetup(design), plan, chunks, extras);
}

/**
 * The once-per-run part of the results (nominal, influence, variance indices, worst case, and the
 * large-signal spread when plan.analyses.largeSignal is true), for a
 * caller that wants to compute it in parallel with the chunks and pass it to mergeChunks.
 * Costs about 20 000 + 8192·(d+2) + 2^k kernel evaluations.
 */
export function runExtras(design: ResolvedDesign, plan: RunPlan): Partial<RunResults> {
  return setupExtras(designSetup(design), plan);
}

/**
 * Raw inputs and metrics of one chunk, regenerated from the seed for export: columns
 * 'sample', the kernel inputs (multiplier inputs that share a metric's name get a 'Factor'
 * suffix, e.g. mu1Factor), then the metrics. NaN marks a sample without a bias point.
 */
export function sampleRows(
  design: ResolvedDesign,
  plan: RunPlan,
  chunkIndex: number,
): { columns: string[]; rows: Iterable<number[]> } {
  return setupSampleRows(designSetup(design), plan, chunkIndex);
}

/**
 * Checks that a parsed design can be run (spread parameters the schema cannot check alone, e.g. a
 * binned part's inner band must be narrower than its tolerance). Returns the problems with the
 * field path, empty when the design runs. Call before queueing a run to answer 400, not fail later.
 *
 * @example runDesignIssues(design) // [{ path: 'parts.rt.spread.inner', message: 'parts.rt.spread.inner must be 0 <= inner < tolerance (got 12)' }]
 */
export function runDesignIssues(design: ResolvedDesign): { path: string; message: string }[] {
  try {
    designSetup(design);
    return [];
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    return [{ path: err.message.split(' ')[0], message: err.message }];
  }
}

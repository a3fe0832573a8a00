import type { ChunkResult } from './chunkResult.js';
import { createRunAccumulator } from './runAccumulator.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import type { RunResults } from './runResults.js';
import type { RunSetup } from './runSetup.js';
import { setupExtras } from './setupExtras.js';

/**
 * Merges all chunk results of a run: sorts by chunkIndex first, so the result is bit-identical for
 * any arrival order or worker count; throws RangeError if a chunk is missing or duplicated. Adds
 * the once-per-run extras (computed here unless passed in) and the Monte Carlo spread beside the
 * worst case.
 */
export function mergeSetupChunks(
  setup: RunSetup,
  plan: RunPlan,
  chunks: readonly ChunkResult[],
  extras?: Partial<RunResults>,
): RunResults {
  const total = chunkCount(plan);
  const sorted = [...chunks].sort((a, b) => a.chunkIndex - b.chunkIndex);
  if (sorted.length !== total) throw new RangeError(`run has ${total} chunks, got ${sorted.length}`);
  const acc = createRunAccumulator(setup, plan);
  for (const c of sorted) acc.add(c);
  return withMonteCarloSpread(acc.finish(extras ?? setupExtras(setup, plan)));
}

/** Copies each metric's Monte Carlo min/max/p0.135/p99.865 next to its worst case. */
export function withMonteCarloSpread(results: RunResults): RunResults {
  const wc = results.worstCase;
  if (!wc) return results;
  const metrics = Object.fromEntries(
    Object.entries(wc.metrics).map(([id, w]) => {
      const s = results.metrics[id];
      return [
        id,
        {
          ...w,
          monteCarlo: {
            min: s.min,
            max: s.max,
            p0135: s.quantiles['p0.135'],
            p99865: s.quantiles['p99.865'],
          },
        },
      ];
    }),
  );
  return { ...results, worstCase: { ...wc, metrics } };
}

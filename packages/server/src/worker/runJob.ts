/** The run parameters every chunk of a run shares (the engine's RunPlan). */
export type JobPlan = {
  samples: number;
  seed: string;
  plan: 'random' | 'lhs' | 'sobol';
  chunkSize: number;
  analyses?: {
    influence?: boolean;
    varianceIndices?: boolean;
    worstCase?: boolean;
    largeSignal?: boolean;
    largeSignalSamples?: number;
  };
};

/**
 * The body of a run, defined once: what one chunk computes and how chunk results merge.
 * Worker threads call it; tests call it directly, without the queue.
 */
export interface RunJob<Design = unknown, Chunk = unknown, Results = unknown> {
  /** Turns the stored design document into what runChunk needs (parsed once per run per thread). */
  prepare(document: unknown): Design;
  runChunk(design: Design, plan: JobPlan, chunkIndex: number): Chunk;
  /**
   * The once-per-run work (nominal, influence, worst case...), queued as one more task beside the
   * chunks (chunk index EXTRAS_INDEX) so it runs in parallel with them instead of inside the merge.
   */
  runExtras(design: Design, plan: JobPlan): unknown;
  /**
   * A merge fed the chunk results one at a time in chunk order (memory stays flat whatever the
   * number of chunks); `extras` is what runExtras returned. Same result as merging all at once.
   */
  createMerger(
    design: Design,
    plan: JobPlan,
    extras: unknown,
  ): { add(chunk: Chunk): void; finish(): Results };
  /** Scalar columns stored beside the results, for listing without reading the whole document. */
  summarize(results: Results): { validCount: number | null; jointYield: number | null };
}

/** Chunk index of a run's once-per-run task in the queue (it sorts first, so it starts early). */
export const EXTRAS_INDEX = -1;

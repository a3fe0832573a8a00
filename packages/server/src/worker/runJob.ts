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
   * Optional binary form of a chunk result (bytes travel from the pool thread without a copy and
   * are stored as bytea, so neither side writes or parses JSON); without it, chunks travel as JSON.
   * decodeChunk(encodeChunk(c)) must merge exactly as JSON.parse(JSON.stringify(c)) does.
   */
  encodeChunk?(design: Design, chunk: Chunk): Uint8Array;
  decodeChunk?(design: Design, bytes: Uint8Array): Chunk;
  /**
   * The once-per-run work (nominal, influence, worst case...) is cut into `extrasParts` parts,
   * each queued as one more task beside the chunks (chunk index extrasPartIndex(p)), so pool
   * threads compute them in parallel with each other and with the chunks.
   */
  readonly extrasParts: number;
  runExtrasPart(design: Design, plan: JobPlan, part: number): unknown;
  /** The merge's `extras` from every part's output, in part order. */
  assembleExtras(design: Design, plan: JobPlan, parts: unknown[]): unknown;
  /** All the once-per-run work in one task: runs queued before the split (chunk index EXTRAS_INDEX). */
  runExtras(design: Design, plan: JobPlan): unknown;
  /**
   * A merge fed the chunk results one at a time in chunk order (memory stays flat whatever the
   * number of chunks); `extras` is what assembleExtras (or runExtras) returned. Same result as
   * merging all at once.
   */
  createMerger(
    design: Design,
    plan: JobPlan,
    extras: unknown,
  ): { add(chunk: Chunk): void; finish(): Results };
  /** Scalar columns stored beside the results, for listing without reading the whole document. */
  summarize(results: Results): { validCount: number | null; jointYield: number | null };
}

/**
 * Chunk index of the whole once-per-run work as one task, as runs launched before the split
 * queued it; still computed and merged for such runs.
 */
export const EXTRAS_INDEX = -1;

/** Chunk index of once-per-run part p: −2, −3, ... (they sort before the chunks, so start early). */
export const extrasPartIndex = (part: number): number => -2 - part;

/** The part a negative chunk index below EXTRAS_INDEX stands for. */
export const extrasPartOf = (chunkIndex: number): number => -2 - chunkIndex;

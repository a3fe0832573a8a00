import {
  MAX_LARGE_SIGNAL_SAMPLES,
  MAX_SAMPLES,
  MAX_SEED_LENGTH,
  MIN_LARGE_SIGNAL_SAMPLES,
  MIN_SAMPLES,
  SAMPLING_PLANS,
  type SamplingPlanId,
} from '../limits.js';

/**
 * Samples per chunk unless a plan says otherwise. Stored in every plan, so a run keeps its
 * chunking (and therefore its LHS strata and bits) even if this default changes.
 */
export const DEFAULT_CHUNK_SIZE = 65_536;

/**
 * Which once-per-run analyses to include in the results: influence, variance indices and worst
 * case default to true; the per-sample large-signal figures (on a subsample) default to false.
 */
export type RunAnalyses = {
  influence?: boolean;
  varianceIndices?: boolean;
  worstCase?: boolean;
  largeSignal?: boolean;
  /** Size of the large-signal subsample (the run's first samples), 32..512; default 32. */
  largeSignalSamples?: number;
};

/**
 * A run's sampling plan: samples 1..1e8, seed text, plan kind, chunk size (samples per chunk).
 *
 * @example { samples: 1_000_000, seed: 'lot-7', plan: 'sobol', chunkSize: DEFAULT_CHUNK_SIZE }
 */
export type RunPlan = {
  samples: number;
  seed: string;
  plan: SamplingPlanId;
  chunkSize: number;
  analyses?: RunAnalyses;
};

/**
 * Checks a plan; throws RangeError whose message names the field (e.g. "samples must be an
 * integer 1..100000000").
 */
export function validateRunPlan(plan: RunPlan): void {
  const { samples, seed, chunkSize } = plan;
  if (!Number.isInteger(samples) || samples < MIN_SAMPLES || samples > MAX_SAMPLES) {
    throw new RangeError(`samples must be an integer ${MIN_SAMPLES}..${MAX_SAMPLES}`);
  }
  if (typeof seed !== 'string' || seed.length > MAX_SEED_LENGTH) {
    throw new RangeError(`seed must be a string of at most ${MAX_SEED_LENGTH} characters`);
  }
  if (!SAMPLING_PLANS.includes(plan.plan))
    throw new RangeError(`plan must be one of ${SAMPLING_PLANS.join(', ')}`);
  if (!Number.isInteger(chunkSize) || chunkSize < 1 || chunkSize > 1_048_576) {
    throw new RangeError('chunkSize must be an integer 1..1048576');
  }
  const ls = plan.analyses?.largeSignalSamples;
  if (
    ls !== undefined &&
    (!Number.isInteger(ls) || ls < MIN_LARGE_SIGNAL_SAMPLES || ls > MAX_LARGE_SIGNAL_SAMPLES)
  ) {
    throw new RangeError(
      `analyses.largeSignalSamples must be an integer ${MIN_LARGE_SIGNAL_SAMPLES}..${MAX_LARGE_SIGNAL_SAMPLES}`,
    );
  }
}

/**
 * Number of chunks in a run: ceil(samples / chunkSize).
 *
 * @example chunkCount({ samples: 100_000, seed: 's', plan: 'random', chunkSize: 65_536 }) // 2
 */
export function chunkCount(plan: RunPlan): number {
  validateRunPlan(plan);
  return Math.ceil(plan.samples / plan.chunkSize);
}

/** First sample index and sample count of chunk k. Throws RangeError for a chunk outside the run. */
export function chunkBounds(plan: RunPlan, chunkIndex: number): { start: number; n: number } {
  const count = chunkCount(plan);
  if (!Number.isInteger(chunkIndex) || chunkIndex < 0 || chunkIndex >= count) {
    throw new RangeError(`chunkIndex must be an integer 0..${count - 1}`);
  }
  const start = chunkIndex * plan.chunkSize;
  return { start, n: Math.min(plan.chunkSize, plan.samples - start) };
}

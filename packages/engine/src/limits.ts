/**
 * Shared limits: the server's request schemas, the web forms and the engine all import these, so a
 * bound is stated once. Units are given per constant.
 */

/** Fewest samples a run may ask for. */
export const MIN_SAMPLES = 1;
/** Most samples a run may ask for (1e8). Memory stays flat in N; time does not. */
export const MAX_SAMPLES = 100_000_000;
/** Part tolerance bounds, percent: 0 <= tolerance < 100. */
export const MIN_TOLERANCE_PERCENT = 0;
/** Exclusive upper bound on a part tolerance, percent. */
export const MAX_TOLERANCE_PERCENT = 100;
/** Largest tolerance-to-sigma ratio k of a normal-family spread (tolerance = k·σ); k > 0. */
export const MAX_SPREAD_K = 10;
/** Longest accepted run seed, characters. */
export const MAX_SEED_LENGTH = 200;
/** Sampling plans a run may use. */
export const SAMPLING_PLANS = ['random', 'lhs', 'sobol'] as const;
/** One sampling plan id. */
export type SamplingPlanId = (typeof SAMPLING_PLANS)[number];
/**
 * Bounds on a run's large-signal subsample (samples the per-sample large-signal figures are
 * computed on; ~5 ms CPU each). No fewer than the default 32, where the interval's normal
 * approximation is fair; at most 512 (a few seconds in the once-per-run task).
 */
export const MIN_LARGE_SIGNAL_SAMPLES = 32;
/** Most samples a run's large-signal subsample may hold. */
export const MAX_LARGE_SIGNAL_SAMPLES = 512;

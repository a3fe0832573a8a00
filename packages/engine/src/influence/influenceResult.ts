import type { TornadoBar } from './tornado.js';

/** Samples used for rank statistics: the first min(N, 20 000) samples of the run, regenerated. */
export const RANK_SUBSAMPLE = 20_000;

/**
 * Influence of each varied input on each metric. Maps are metric id → input id → value;
 * null = undefined (zero or non-finite nominal, constant column, singular rank correlations).
 * - local: ∂ln y/∂ln x at nominal (central differences).
 * - spearman / srrc: Spearman rank correlation and standardised rank regression coefficient over
 *   the first `rankSamples` samples of the run whose metrics are all finite.
 * - tornado: one-at-a-time extremes, sorted by swing.
 */
export type InfluenceResult = {
  inputs: string[];
  rankSamples: number;
  local: Record<string, Record<string, number | null>>;
  spearman: Record<string, Record<string, number | null>>;
  srrc: Record<string, Record<string, number | null>>;
  tornado: Record<string, TornadoBar[]>;
};

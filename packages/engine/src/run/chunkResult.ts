import type { MetricChunk } from '../stats/metricChunk.js';
import type { PairingTally } from '../spread/tubeSpread.js';

/**
 * The result of one chunk: plain JSON, stored as-is (PostgreSQL jsonb) and merged later.
 * Non-finite numbers never appear: a metric with no finite value in the chunk has count 0 and
 * null mean/min/max; samples whose metric is NaN (no bias point) are left out of that metric's
 * statistics and fail every spec.
 */
export type ChunkResult = {
  chunkIndex: number;
  /** Absolute index of the chunk's first sample. */
  start: number;
  /** Samples in this chunk. */
  n: number;
  /** Samples with a bias point (kernel metric 'valid' = 1; all samples if there is no such metric). */
  validCount: number;
  /** Per metric id, in kernel metric order. */
  metrics: Record<string, MetricChunk>;
  /** Per spec (design order): samples inside the limits. */
  specPass: number[];
  /** Samples inside every spec (and valid). */
  jointPass: number;
  /** Pairing rejection counts (draws = envelopes tried). */
  pairing: PairingTally;
};

import type { InfluenceResult } from '../influence/influenceResult.js';
import type { VarianceIndicesResult } from '../influence/varianceIndices.js';
import type { WorstCaseResult } from '../worstcase/worstCase.js';
import type { LargeSignalSpread } from './largeSignalSpread.js';

/** Reported quantile labels and their probabilities. */
export const REPORTED_QUANTILES = [
  ['p0.135', 0.00135],
  ['p2.5', 0.025],
  ['p50', 0.5],
  ['p97.5', 0.975],
  ['p99.865', 0.99865],
] as const;

/** Per-metric summary. null stands for "undefined" (no finite values, or fewer than two for sd). */
export type MetricSummary = {
  count: number;
  mean: number | null;
  sd: number | null;
  min: number | null;
  max: number | null;
  quantiles: Record<(typeof REPORTED_QUANTILES)[number][0], number | null>;
  /** Largest error bound of the quantiles above (one fine bin width inside the grid; see quantileFromBins). */
  quantileMaxError: number | null;
  /** Display histogram: counts[i] lies in [edges[i], edges[i+1]); underflow/overflow lie outside the fine grid. */
  histogram: { edges: number[]; counts: number[]; underflow: number; overflow: number };
};

/** Yield of one spec (or jointly) with its 95 % intervals, reject rate in PPM and capability. */
export type YieldSummary = {
  pass: number;
  samples: number;
  yield: number;
  wilson: [number, number];
  clopperPearson: [number, number];
  ppm: number;
};

/** Per spec: the limit, the yield summary and Cp/Cpk (σ = Monte Carlo sample sd; null if undefined). */
export type SpecSummary = YieldSummary & {
  metric: string;
  /** Hz, for a frequency metric (its column in `metrics` is `metric@frequency`); absent otherwise. */
  frequency?: number;
  label: string | null;
  min: number | null;
  max: number | null;
  cp: number | null;
  cpk: number | null;
};

/**
 * Results of a whole run: plain JSON (stored in PostgreSQL jsonb). Non-finite values are encoded
 * as null (JSON has no NaN/Infinity); every field that may be null says so in its type.
 */
export type RunResults = {
  format: 'sigmatail-run-results';
  version: 1;
  engineVersion: string;
  samples: number;
  seed: string;
  plan: RunResultsPlan;
  chunkSize: number;
  chunks: number;
  validCount: number;
  metrics: Record<string, MetricSummary>;
  specs: SpecSummary[];
  joint: YieldSummary;
  /** Pairing rule bookkeeping: acceptance rate = samples / draws (1 when unpaired). */
  pairing: { draws: number; failures: number; acceptanceRate: number };
  /** Cumulative figures at chunk boundaries (at most ~200 points): N, joint yield, per-spec yield, spec metric means. */
  convergence: {
    n: number[];
    jointYield: number[];
    specYield: number[][];
    means: Record<string, (number | null)[]>;
  };
  /** Metric values at nominal inputs (null = NaN). */
  nominal?: Record<string, number | null>;
  influence?: InfluenceResult;
  varianceIndices?: VarianceIndicesResult;
  worstCase?: WorstCaseResult;
  /** Per-sample large-signal figures on a subsample (plan.analyses.largeSignal). */
  largeSignal?: LargeSignalSpread;
};

/** The plan kind as stored in results. */
export type RunResultsPlan = 'random' | 'lhs' | 'sobol';

/** JSON-safe number: non-finite → null. */
export function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

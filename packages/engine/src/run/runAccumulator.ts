import { ENGINE_VERSION } from '../version.js';
import { clopperPearsonInterval, wilsonInterval } from '../stats/binomialIntervals.js';
import { capability } from '../stats/capability.js';
import {
  addMetricChunkInPlace,
  createMetricTotals,
  totalsSd,
  type MetricTotals,
} from '../stats/metricTotals.js';
import { quantileFromBins } from '../stats/quantileFromBins.js';
import type { HistogramGrid } from '../stats/histogramGrid.js';
import type { ChunkResult } from './chunkResult.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import {
  finiteOrNull,
  REPORTED_QUANTILES,
  type MetricSummary,
  type RunResults,
  type YieldSummary,
} from './runResults.js';
import type { RunSetup } from './runSetup.js';

/** Display histogram bins at most. */
const DISPLAY_BINS = 64;
/** Convergence trace points at most (thinned evenly over chunks). */
const TRACE_POINTS = 200;

/**
 * Streaming merge of chunk results in chunk order: memory stays flat whatever the number of
 * chunks. `add` throws if a chunk arrives out of order (mergeChunks sorts first).
 */
export type RunAccumulator = {
  add(chunk: ChunkResult): void;
  /** Results so far; `extras` (nominal, influence, worst case...) are copied in. */
  finish(extras?: Partial<RunResults>): RunResults;
};

/**
 * Creates an accumulator for a run. Bits of the result depend only on the chunk contents, because
 * the order of addition is fixed (chunk 0, 1, 2, ...).
 *
 * @example const acc = createRunAccumulator(setup, plan); chunks.forEach(acc.add); acc.finish()
 */
export function createRunAccumulator(setup: RunSetup, plan: RunPlan): RunAccumulator {
  const metricIds = setup.model.kernel.metrics;
  const totals = setup.grids.map((g) => createMetricTotals(g));
  const specPass = setup.specs.map(() => 0);
  const total = chunkCount(plan);
  const every = Math.ceil(total / TRACE_POINTS);
  const traceMetrics = [...new Set(setup.specMetric)];
  const trace: RunResults['convergence'] = {
    n: [],
    jointYield: [],
    specYield: setup.specs.map(() => []),
    means: Object.fromEntries(traceMetrics.map((m) => [metricIds[m], []])),
  };
  let next = 0;
  let n = 0;
  let valid = 0;
  let joint = 0;
  const pairing = { samples: 0, draws: 0, failures: 0 };

  return {
    add(chunk) {
      if (chunk.chunkIndex !== next)
        throw new RangeError(`chunk ${chunk.chunkIndex} arrived, expected ${next}`);
      next++;
      n += chunk.n;
      valid += chunk.validCount;
      joint += chunk.jointPass;
      pairing.samples += chunk.pairing.samples;
      pairing.draws += chunk.pairing.draws;
      pairing.failures += chunk.pairing.failures;
      for (let m = 0; m < metricIds.length; m++)
        addMetricChunkInPlace(totals[m], chunk.metrics[metricIds[m]]);
      chunk.specPass.forEach((p, i) => (specPass[i] += p));
      if (next % every === 0 || next === total) {
        trace.n.push(n);
        trace.jointYield.push(joint / n);
        specPass.forEach((p, i) => trace.specYield[i].push(p / n));
        for (const m of traceMetrics)
          trace.means[metricIds[m]].push(totals[m].count > 0 ? totals[m].mean : null);
      }
    },
    finish(extras = {}) {
      const metrics: Record<string, MetricSummary> = {};
      metricIds.forEach((id, m) => (metrics[id] = summarizeMetric(totals[m], setup.grids[m])));
      return {
        format: 'sigmatail-run-results',
        version: 1,
        engineVersion: ENGINE_VERSION,
        samples: n,
        seed: plan.seed,
        plan: plan.plan,
        chunkSize: plan.chunkSize,
        chunks: next,
        validCount: valid,
        metrics,
        specs: setup.specs.map((spec, i) => {
          const t = totals[setup.specMetric[i]];
          const sd = totalsSd(t);
          return {
            metric: spec.metric,
            ...(spec.frequency !== undefined ? { frequency: spec.frequency } : {}),
            label: spec.label ?? null,
            min: spec.min ?? null,
            max: spec.max ?? null,
            ...yieldSummary(specPass[i], n),
            ...capability(t.count > 0 ? t.mean : NaN, sd, spec.min, spec.max),
          };
        }),
        joint: yieldSummary(joint, n),
        pairing: {
          draws: pairing.draws,
          failures: pairing.failures,
          acceptanceRate: pairing.draws > 0 ? pairing.samples / pairing.draws : 1,
        },
        convergence: trace,
        ...extras,
      };
    },
  };
}

function yieldSummary(pass: number, samples: number): YieldSummary {
  const y = samples > 0 ? pass / samples : NaN;
  return {
    pass,
    samples,
    yield: y,
    wilson: wilsonInterval(pass, samples),
    clopperPearson: clopperPearsonInterval(pass, samples),
    // From the fail count, so 17 fails in 20 000 is exactly 850 PPM (1 − y loses digits).
    ppm: samples > 0 ? ((samples - pass) * 1e6) / samples : NaN,
  };
}

function summarizeMetric(t: MetricTotals, grid: HistogramGrid): MetricSummary {
  const quantiles = {} as MetricSummary['quantiles'];
  let maxError = 0;
  for (const [label, p] of REPORTED_QUANTILES) {
    const q = quantileFromBins(t, grid, p);
    quantiles[label] = finiteOrNull(q.value);
    maxError = Math.max(maxError, q.maxError);
  }
  const empty = t.count === 0;
  return {
    count: t.count,
    mean: empty ? null : t.mean,
    sd: finiteOrNull(totalsSd(t)),
    min: empty ? null : t.min,
    max: empty ? null : t.max,
    quantiles,
    quantileMaxError: empty ? null : finiteOrNull(maxError),
    histogram: displayHistogram(t, grid),
  };
}

/** Groups the occupied part of the fine grid into at most 64 equal display bins. */
function displayHistogram(t: MetricTotals, grid: HistogramGrid): MetricSummary['histogram'] {
  let first = 0;
  while (first < grid.bins && t.bins[first] === 0) first++;
  let last = grid.bins - 1;
  while (last >= first && t.bins[last] === 0) last--;
  if (last < first) return { edges: [], counts: [], underflow: t.under, overflow: t.over };
  const group = Math.ceil((last - first + 1) / DISPLAY_BINS);
  const edges: number[] = [grid.lo + first * grid.width];
  const counts: number[] = [];
  for (let b = first; b <= last; b += group) {
    let c = 0;
    for (let i = b; i < b + group && i < grid.bins; i++) c += t.bins[i];
    counts.push(c);
    edges.push(grid.lo + Math.min(b + group, grid.bins) * grid.width);
  }
  return { edges, counts, underflow: t.under, overflow: t.over };
}

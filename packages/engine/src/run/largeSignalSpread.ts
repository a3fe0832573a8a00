import type { ResolvedDesign } from '../design/designSchema.js';
import { studentTQuantile } from '../stats/studentTQuantile.js';
import { largeSignalReport } from '../model/largeSignalReport.js';
import { nominalStageInputs, type StageInputs } from '../model/stageEvaluator.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';
import { evaluateChunk } from './runSetupChunk.js';

/**
 * Samples of a run the per-sample large-signal figures are computed on (the run's first ones),
 * unless plan.analyses.largeSignalSamples says otherwise.
 */
export const LARGE_SIGNAL_SUBSAMPLE = 32;

/** One large-signal figure over the subsample: mean with its 95 % interval, min and max. */
export type LargeSignalSummary = {
  count: number;
  mean: number | null;
  /** mean ± t(0.975, count − 1)·sd/√count (Student t interval of the mean). */
  interval: [number, number] | null;
  min: number | null;
  max: number | null;
};

/** Per-sample large-signal figures of a run, on its first `subsample` samples. */
export type LargeSignalSpread = {
  subsample: number;
  /** Grid-1 drive (V peak) the distortion is stated at: half the nominal symmetrical drive limit. */
  drive: number;
  driveSymmetric: LargeSignalSummary;
  swing1: LargeSignalSummary;
  swing2: LargeSignalSummary;
  thd1Percent: LargeSignalSummary;
  thd2Percent: LargeSignalSummary;
  h2Percent1: LargeSignalSummary;
  h3Percent1: LargeSignalSummary;
  /** Absent in runs stored before output 2's harmonics were kept. */
  h2Percent2?: LargeSignalSummary;
  h3Percent2?: LargeSignalSummary;
};

function summarize(values: number[]): LargeSignalSummary {
  const v = values.filter(Number.isFinite);
  const n = v.length;
  if (n === 0) return { count: 0, mean: null, interval: null, min: null, max: null };
  const mean = v.reduce((a, b) => a + b, 0) / n;
  const sd = n > 1 ? Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1)) : NaN;
  // Student t rather than 1.96: at 32 samples the normal factor is ~4 % too narrow.
  const half = n > 1 ? (studentTQuantile(0.975, n - 1) * sd) / Math.sqrt(n) : NaN;
  return {
    count: n,
    mean,
    interval: Number.isFinite(half) ? [mean - half, mean + half] : null,
    min: Math.min(...v),
    max: Math.max(...v),
  };
}

/**
 * The large-signal figures (largeSignalReport) per sample on the run's first 32 samples (or
 * plan.analyses.largeSignalSamples), each
 * at its own parts and tube multipliers, at one stated drive (half the nominal symmetrical
 * limit): the quasi-static solve costs ~10–20 ms a sample, too much for every sample.
 *
 * @example largeSignalSpread(design, setup, plan).thd1Percent.mean // %
 */
export function largeSignalSpread(design: ResolvedDesign, setup: RunSetup, plan: RunPlan): LargeSignalSpread {
  const nominal = largeSignalReport(design);
  const drive = nominal.drive;
  const inputs = setup.model.kernel.inputs;
  const rows: StageInputs[] = [];
  const want = Math.min(plan.samples, plan.analyses?.largeSignalSamples ?? LARGE_SIGNAL_SUBSAMPLE);
  for (let k = 0; k < chunkCount(plan) && rows.length < want; k++) {
    const { columns, n } = evaluateChunk(setup, plan, k, want - rows.length);
    for (let s = 0; s < n; s++) {
      const x = { ...nominalStageInputs(design) } as Record<string, number>;
      inputs.forEach((id, i) => (x[id] = columns.inputs[i][s]));
      rows.push(x as unknown as StageInputs);
    }
  }
  const reports = rows.map((x) =>
    largeSignalReport(design, { x, drive: Number.isFinite(drive) ? drive : undefined }),
  );
  const pick = (f: (r: (typeof reports)[number]) => number | undefined) =>
    summarize(reports.map((r) => f(r) ?? Number.NaN));
  return {
    subsample: rows.length,
    drive,
    driveSymmetric: pick((r) => r.driveSymmetric),
    swing1: pick((r) => r.swing1),
    swing2: pick((r) => r.swing2),
    thd1Percent: pick((r) => r.out1?.thdPercent),
    thd2Percent: pick((r) => r.out2?.thdPercent),
    h2Percent1: pick((r) => r.out1?.h2Percent),
    h3Percent1: pick((r) => r.out1?.h3Percent),
    h2Percent2: pick((r) => r.out2?.h2Percent),
    h3Percent2: pick((r) => r.out2?.h3Percent),
  };
}

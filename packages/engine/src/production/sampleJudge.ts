import type { ResolvedDesign } from '../design/designSchema.js';
import { CORNER_METRIC_IDS, specColumnId } from '../model/metrics.js';
import { createStageKernel, INPUTS, type StageKernel } from '../model/stageKernel.js';

/** Samples per kernel call: small, so a candidate that fails early stops after little work. */
const BLOCK = 256;

/**
 * Samples that failed some earlier candidate. With common random numbers a sample that fails one
 * assignment tends to fail its neighbours too, so evaluating these first lets a candidate that
 * misses the target stop after a few kernel evaluations. Only the order changes, never the count
 * of a candidate evaluated to the end.
 */
export type HardSamples = { list: number[]; pos: Int32Array };

/** Pass/fail of samples against a design's specs, with the design's stage kernel (DC point per sample). */
export type SampleJudge = {
  readonly kernel: StageKernel;
  readonly lo: readonly number[];
  readonly hi: readonly number[];
  readonly specMetric: readonly number[];
  readonly validMetric: number;
  /** Kernel evaluations so far (all calls). */
  evaluations: number;
  readonly blockIn: Float64Array[];
  readonly blockOut: Float64Array[];
  readonly index: Int32Array;
};

/**
 * A judge for the design's specs. Part values in the design only set the kernel's nominal point
 * (the warm start of each sample's bias solve); per-sample values come in the columns.
 *
 * @example const j = createSampleJudge(design); countFailures(j, columns, n, null, Infinity).fails
 */
export function createSampleJudge(design: ResolvedDesign): SampleJudge {
  // Only what the specs read: −3 dB points when a spec is on one, never the balance band.
  const corners = design.specs.some((s) => (CORNER_METRIC_IDS as readonly string[]).includes(s.metric));
  const kernel = createStageKernel(design, { dcPerSample: true, corners, band: false });
  const specMetric = design.specs.map((s) => kernel.metrics.indexOf(specColumnId(s)));
  return {
    kernel,
    lo: design.specs.map((s) => s.min ?? -Infinity),
    hi: design.specs.map((s) => s.max ?? Infinity),
    specMetric,
    validMetric: kernel.metrics.indexOf('valid'),
    evaluations: 0,
    blockIn: INPUTS.map(() => new Float64Array(BLOCK)),
    blockOut: kernel.metrics.map(() => new Float64Array(BLOCK)),
    index: new Int32Array(BLOCK),
  };
}

/** An empty hard-sample set for n samples. */
export function createHardSamples(n: number): HardSamples {
  return { list: [], pos: new Int32Array(n).fill(-1) };
}

/**
 * Counts the samples (of n, kernel input columns in INPUTS order) that fail any spec or have no
 * bias point. Evaluates hard samples first, then the rest in order, and stops as soon as more than
 * `stopAfter` failures are seen (then `evaluated` < n). Failing samples join `hard`.
 *
 * @example countFailures(judge, columns, 20_000, hard, 12) // { fails: 13, evaluated: 40 }
 */
export function countFailures(
  judge: SampleJudge,
  columns: readonly Float64Array[],
  n: number,
  hard: HardSamples | null,
  stopAfter: number,
): { fails: number; evaluated: number } {
  const { blockIn, index } = judge;
  let fails = 0;
  let evaluated = 0;
  let b = 0;
  // Small blocks first, so a candidate that fails at once stops after few evaluations; then
  // growing to BLOCK, where the per-call overhead no longer shows.
  let size = 16;
  const hardCount = hard ? hard.list.length : 0;
  const failedNow: number[] = [];
  const flush = (): boolean => {
    fails += judgeBlock(judge, b, hard, failedNow);
    evaluated += b;
    b = 0;
    size = Math.min(BLOCK, size * 2);
    return fails > stopAfter;
  };
  const finish = () => {
    if (hard) moveToFront(hard, failedNow);
    return { fails, evaluated };
  };
  for (let h = 0; h < hardCount; h++) {
    const s = hard!.list[h];
    index[b] = s;
    for (let i = 0; i < columns.length; i++) blockIn[i][b] = columns[i][s];
    if (++b === size && flush()) return finish();
  }
  for (let s = 0; s < n; s++) {
    // Skip the samples already evaluated up front (those listed before this call).
    if (hard && hard.pos[s] >= 0 && hard.pos[s] < hardCount) continue;
    index[b] = s;
    for (let i = 0; i < columns.length; i++) blockIn[i][b] = columns[i][s];
    if (++b === size && flush()) return finish();
  }
  if (b > 0) flush();
  return finish();
}

/**
 * Puts the samples that failed this candidate at the front of the hard list: candidates are
 * visited in cost order, and a sample that failed the last one is the likeliest to fail the next.
 */
function moveToFront(hard: HardSamples, failed: readonly number[]): void {
  if (failed.length === 0) return;
  const mark = new Set(failed);
  hard.list = [...failed, ...hard.list.filter((s) => !mark.has(s))];
  hard.list.forEach((s, i) => (hard.pos[s] = i));
}

/** Evaluates the b samples in the judge's block; returns the failures and marks them hard. */
function judgeBlock(judge: SampleJudge, b: number, hard: HardSamples | null, failed: number[]): number {
  const { kernel, blockIn, blockOut, index, lo, hi, specMetric, validMetric } = judge;
  kernel.evaluate(blockIn, b, blockOut);
  judge.evaluations += b;
  let fails = 0;
  for (let k = 0; k < b; k++) {
    let ok = validMetric < 0 || blockOut[validMetric][k] === 1;
    for (let i = 0; ok && i < specMetric.length; i++) {
      const x = blockOut[specMetric[i]][k];
      ok = x >= lo[i] && x <= hi[i];
    }
    if (ok) continue;
    fails++;
    const s = index[k];
    failed.push(s);
    if (hard && hard.pos[s] < 0) {
      hard.pos[s] = hard.list.length;
      hard.list.push(s);
    }
  }
  return fails;
}

/**
 * Evaluates every sample and returns all metric columns (kernel metric order, length n).
 *
 * @example evaluateAll(judge, columns, n)[judge.kernel.metrics.indexOf('balanceDb')]
 */
export function evaluateAll(judge: SampleJudge, columns: readonly Float64Array[], n: number): Float64Array[] {
  const out = judge.kernel.metrics.map(() => new Float64Array(n));
  const { blockIn, blockOut } = judge;
  for (let off = 0; off < n; off += BLOCK) {
    const b = Math.min(BLOCK, n - off);
    for (let i = 0; i < columns.length; i++) blockIn[i].set(columns[i].subarray(off, off + b));
    judge.kernel.evaluate(blockIn, b, blockOut);
    judge.evaluations += b;
    for (let m = 0; m < out.length; m++) out[m].set(blockOut[m].subarray(0, b), off);
  }
  return out;
}

/**
 * Whether sample s of full metric columns passes every spec (and has a bias point).
 */
export function samplePasses(judge: SampleJudge, out: readonly Float64Array[], s: number): boolean {
  if (judge.validMetric >= 0 && out[judge.validMetric][s] !== 1) return false;
  for (let i = 0; i < judge.specMetric.length; i++) {
    const x = out[judge.specMetric[i]][s];
    if (!(x >= judge.lo[i] && x <= judge.hi[i])) return false;
  }
  return true;
}

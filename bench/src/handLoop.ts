import { chunkBounds, createStream, type RunPlan, type RunSetup } from '@sigmatail/engine';

/** What the hand loop yields: the figures a yield report needs, no metric statistics. */
export type HandLoopResult = { n: number; validCount: number; specPass: number[]; jointPass: number };

const BLOCK = 2048;

/**
 * The comparison for the full chunk: the loop an engineer would write by hand to get one chunk's
 * yield on the same design. Per block it draws the same uniforms (one sfc32 stream per draw
 * dimension, as the random plan does), maps them to the kernel inputs with the engine's own
 * sample model (`fillInputs`: spreads, tube copula, pairing redraws) and evaluates the same kernel;
 * then one fused pass per sample counts the passes of every spec and the joint pass. No
 * statistics of the metrics. Buffers are allocated once per setup. Random plan only.
 */
export function createHandLoop(setup: RunSetup): (plan: RunPlan, chunkIndex: number) => HandLoopResult {
  const { model, specs, specMetric, validMetric } = setup;
  const u = model.dims.map(() => new Float64Array(BLOCK));
  const inputs = model.kernel.inputs.map(() => new Float64Array(BLOCK));
  const out = model.kernel.metrics.map(() => new Float64Array(BLOCK));
  const ones = new Float64Array(BLOCK).fill(1);
  const valid = validMetric >= 0 ? out[validMetric] : ones;
  const specCols = specMetric.map((m) => out[m]);
  const lo = Float64Array.from(specs, (s) => s.min ?? -Infinity);
  const hi = Float64Array.from(specs, (s) => s.max ?? Infinity);
  // [valid samples, joint passes, passes of spec 0, 1, ...]
  const tally = new Float64Array(2 + specs.length);
  return (plan, chunkIndex) => {
    const { n } = chunkBounds(plan, chunkIndex);
    if (plan.plan !== 'random') throw new RangeError('the hand loop draws the random plan only');
    const streams = model.dims.map((_d, j) => createStream(plan.seed, 'draw', chunkIndex, j));
    const redraw = createStream(plan.seed, 'pairing', chunkIndex);
    const pairing = { samples: 0, draws: 0, failures: 0 };
    tally.fill(0);
    for (let off = 0; off < n; off += BLOCK) {
      const b = Math.min(BLOCK, n - off);
      for (let j = 0; j < streams.length; j++) streams[j].fillOpen(u[j], b);
      model.fillInputs(u, b, inputs, redraw, pairing);
      model.kernel.evaluate(inputs, b, out);
      countBlockInPlace(valid, specCols, lo, hi, tally, b);
    }
    return { n, validCount: tally[0], jointPass: tally[1], specPass: Array.from(tally.subarray(2)) };
  };
}

/** In place: one pass over a block, per sample every spec in turn, counts added to tally. */
function countBlockInPlace(
  valid: Float64Array,
  cols: readonly Float64Array[],
  lo: Float64Array,
  hi: Float64Array,
  tally: Float64Array,
  n: number,
): void {
  let validCount = 0;
  let joint = 0;
  const k = cols.length;
  for (let s = 0; s < n; s++) {
    if (valid[s] !== 1) continue;
    validCount++;
    let all = 1;
    for (let i = 0; i < k; i++) {
      const x = cols[i][s];
      if (x >= lo[i] && x <= hi[i]) tally[2 + i]++;
      else all = 0;
    }
    joint += all;
  }
  tally[0] += validCount;
  tally[1] += joint;
}

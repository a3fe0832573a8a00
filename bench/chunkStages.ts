// Where a full chunk spends its time, per stage, in ns per sample (CPU time of this process):
// drawing the uniforms, the sample model (spreads, tube copula, pairing), the kernel, the metric
// statistics, and the rest (spec counts, per-block overhead: the whole chunk minus the stages).
// Beside it the hand loop (bench/src/handLoop.ts) and the ratio, measured in turns.
// Run: npx tsx --conditions=@sigmatail/source bench/chunkStages.ts
import os from 'node:os';
import {
  accumulateColumnInPlace,
  buildTestDesign,
  columnAccumulatorResult,
  createColumnAccumulator,
  createStream,
  DEFAULT_CHUNK_SIZE,
  designSetup,
  resetColumnAccumulator,
  runSetupChunk,
  type RunPlan,
  type RunSetup,
} from '@sigmatail/engine';
import { createHandLoop } from './src/handLoop.js';

const N = DEFAULT_CHUNK_SIZE;
const BLOCK = 2048;
const REPS = 12;
const cpuMs = () => {
  const c = process.cpuUsage();
  return (c.user + c.system) / 1000;
};
const nsPerSample = (ms: number) => +((ms * 1e6) / N).toFixed(1);
type Stages = { sampling: number; sampleModel: number; kernel: number; statistics: number };

/** One chunk of the random plan, block by block as runSetupChunk runs it, each stage timed. */
function timedStages(setup: RunSetup, chunkIndex: number): Stages {
  const { model, grids } = setup;
  const u = model.dims.map(() => new Float64Array(BLOCK));
  const inputs = model.kernel.inputs.map(() => new Float64Array(BLOCK));
  const out = model.kernel.metrics.map(() => new Float64Array(BLOCK));
  const acc = grids.map((g) => createColumnAccumulator(g));
  acc.forEach(resetColumnAccumulator);
  const streams = model.dims.map((_d, j) => createStream('bench', 'draw', chunkIndex, j));
  const redraw = createStream('bench', 'pairing', chunkIndex);
  const pairing = { samples: 0, draws: 0, failures: 0 };
  const t: Stages = { sampling: 0, sampleModel: 0, kernel: 0, statistics: 0 };
  for (let off = 0; off < N; off += BLOCK) {
    const t0 = cpuMs();
    for (let j = 0; j < streams.length; j++) streams[j].fillOpen(u[j], BLOCK);
    const t1 = cpuMs();
    model.fillInputs(u, BLOCK, inputs, redraw, pairing);
    const t2 = cpuMs();
    model.kernel.evaluate(inputs, BLOCK, out);
    const t3 = cpuMs();
    for (let m = 0; m < out.length; m++) accumulateColumnInPlace(acc[m], out[m], BLOCK);
    const t4 = cpuMs();
    t.sampling += t1 - t0;
    t.sampleModel += t2 - t1;
    t.kernel += t3 - t2;
    t.statistics += t4 - t3;
  }
  const t5 = cpuMs();
  acc.forEach(columnAccumulatorResult);
  t.statistics += cpuMs() - t5;
  return t;
}

const design = buildTestDesign();
const rows: Record<string, string | number>[] = [];
for (const dcPerSample of [false, true]) {
  const setup = designSetup(design, { dcPerSample });
  const plan: RunPlan = { samples: 8 * N, seed: 'bench', plan: 'random', chunkSize: N };
  const hand = createHandLoop(setup);
  const best: Stages = { sampling: Infinity, sampleModel: Infinity, kernel: Infinity, statistics: Infinity };
  let chunk = Infinity;
  let handBest = Infinity;
  for (let r = 0; r < REPS; r++) {
    const k = r % 8;
    const st = timedStages(setup, k);
    const c0 = cpuMs();
    runSetupChunk(setup, plan, k);
    const c1 = cpuMs();
    hand(plan, k);
    const c2 = cpuMs();
    if (r < 2) continue; // warm-up
    for (const key of Object.keys(best) as (keyof Stages)[]) best[key] = Math.min(best[key], st[key]);
    chunk = Math.min(chunk, c1 - c0);
    handBest = Math.min(handBest, c2 - c1);
  }
  const staged = best.sampling + best.sampleModel + best.kernel + best.statistics;
  rows.push({
    case: dcPerSample ? '(b) DC point per sample' : '(a) small signal only',
    sampling: nsPerSample(best.sampling),
    'sample model': nsPerSample(best.sampleModel),
    kernel: nsPerSample(best.kernel),
    statistics: nsPerSample(best.statistics),
    'specs + rest': nsPerSample(chunk - staged),
    'full chunk': nsPerSample(chunk),
    'hand loop': nsPerSample(handBest),
    'chunk / hand loop': +(handBest / chunk).toFixed(2),
  });
}
console.log(
  '\nFull chunk per stage, ns per sample (CPU time, best of 10; chunk = 65 536 samples, random plan)',
);
console.table(rows);
console.log(
  `load average ${os
    .loadavg()
    .map((l) => l.toFixed(1))
    .join(' ')}`,
);

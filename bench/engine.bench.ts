// Engine figures: kernel and full-chunk throughput per core, the ml-matrix baseline, the full chunk
// against a hand loop (src/handLoop.ts), PRNG speed and heap use against N. Fixed seeds and sizes;
// speed is reported here, never asserted in tests.
// Run: npm run bench (repo root). Add --expose-gc (the script does) for settled heap figures.
import os from 'node:os';
import {
  buildTestDesign,
  chunkCount,
  createRunAccumulator,
  createStream,
  designSetup,
  DEFAULT_CHUNK_SIZE,
  runSetupChunk,
  fillUniforms,
  type RunPlan,
  type RunSetup,
} from '@sigmatail/engine';
import { createBaselineStage } from './src/baselineStage.js';
import { createHandLoop } from './src/handLoop.js';
import { createMnaBaselineStage } from './src/mnaBaselineStage.js';

import { timeBest } from './src/timeBest.js';

const design = buildTestDesign();
const N = DEFAULT_CHUNK_SIZE;
const BASELINE_N = 2000;
// BENCH_QUICK=1: fewer repetitions and no 1e7 heap row; BENCH_1E8=1 adds a 1e8 heap row (minutes).
const quick = process.env.BENCH_QUICK === '1';
const mega = (n: number, ms: number) => n / ms / 1e3; // samples per ms → M samples/s

function sampledInputs(setup: RunSetup, n: number): Float64Array[] {
  const m = setup.model;
  const u = m.dims.map(() => new Float64Array(n));
  const inputs = m.kernel.inputs.map(() => new Float64Array(n));
  fillUniforms('random', 'bench', 0, 0, n, u);
  m.fillInputs(u, n, inputs, createStream('bench', 'pairing'), { samples: 0, draws: 0, failures: 0 });
  return inputs;
}

/**
 * Heap bytes the kernel allocates per sample: heap growth over one 2048-sample block right after a
 * full gc, averaged over blocks (a block allocating less than the young generation cannot trigger a
 * collection part-way, which would hide the growth). 'n/a' without --expose-gc.
 */
function kernelBytesPerSample(kernel: RunSetup['model']['kernel'], inputs: Float64Array[]): string {
  const gcNow = (globalThis as { gc?: () => void }).gc;
  if (!gcNow) return 'n/a';
  const b = 2048;
  const ins = inputs.map((c) => c.subarray(0, b));
  const outs = kernel.metrics.map(() => new Float64Array(b));
  let bytes = 0;
  const reps = 20;
  for (let r = 0; r < reps; r++) {
    gcNow();
    const h0 = process.memoryUsage().heapUsed;
    kernel.evaluate(ins, b, outs);
    bytes += process.memoryUsage().heapUsed - h0;
  }
  return (bytes / (reps * b)).toFixed(1);
}

const rows: Record<string, string | number>[] = [];
for (const dcPerSample of [false, true]) {
  const setup = designSetup(design, { dcPerSample });
  const { kernel } = setup.model;
  const inputs = sampledInputs(setup, N);
  const out = kernel.metrics.map(() => new Float64Array(N));
  const k = timeBest(() => kernel.evaluate(inputs, N, out), quick ? 3 : 7);
  const plan: RunPlan = { samples: 8 * N, seed: 'bench', plan: 'random', chunkSize: N };
  let chunk = 0;
  let handChunk = 0;
  const hand = createHandLoop(setup);
  // Same chunk, same yield: the hand loop does the work the yield figure needs.
  const full = runSetupChunk(setup, plan, 3);
  const h3 = hand(plan, 3);
  if (h3.jointPass !== full.jointPass || h3.specPass.join() !== full.specPass.join())
    throw new Error(
      `hand loop yield differs: ${JSON.stringify(h3)} vs ${full.jointPass} ${full.specPass.join()}`,
    );
  // Chunk and hand loop timed in turns (best CPU time of each), so load changes hit both alike.
  let c = { best: Infinity, median: Infinity, cpu: Infinity };
  let hl = { best: Infinity, cpu: Infinity };
  for (let turn = 0; turn < (quick ? 2 : 4); turn++) {
    const ct = timeBest(() => void runSetupChunk(setup, plan, chunk++ % 8), 3);
    const ht = timeBest(() => void hand(plan, handChunk++ % 8), 3);
    c = {
      best: Math.min(c.best, ct.best),
      median: Math.min(c.median, ct.median),
      cpu: Math.min(c.cpu, ct.cpu),
    };
    hl = { best: Math.min(hl.best, ht.best), cpu: Math.min(hl.cpu, ht.cpu) };
  }
  // Baseline: nominal DC point from the kernel's own nominal outputs as the Newton start.
  const nominal = kernel.metrics.map(() => new Float64Array(1));
  kernel.evaluate(
    kernel.nominalInputs().reduce<Float64Array[]>((cols, v) => [...cols, Float64Array.of(v)], []),
    1,
    nominal,
  );
  const at = (id: string) => nominal[kernel.metrics.indexOf(id)][0];
  const vk = at('vk');
  const nominalDc = [at('va1'), at('va2'), vk, vk + at('vgk1')];
  const bOut = new Float64Array(BASELINE_N);
  const reduced = createBaselineStage(design, dcPerSample);
  const r = timeBest(() => reduced.evaluate(inputs, BASELINE_N, bOut, nominalDc), 5, 3);
  const a11 = out[kernel.metrics.indexOf('a11')];
  const maxRel = (y: Float64Array) => y.reduce((w, v, s) => Math.max(w, Math.abs(v / a11[s] - 1)), 0);
  const reducedDiff = maxRel(bOut);
  const mna = createMnaBaselineStage(design, dcPerSample);
  const b = timeBest(() => mna.evaluate(inputs, BASELINE_N, bOut, nominalDc), 5, 3);
  const mnaDiff = maxRel(bOut);
  const kernelRate = mega(N, k.cpu);
  const baseRate = mega(BASELINE_N, b.cpu);
  const reducedRate = mega(BASELINE_N, r.cpu);
  rows.push({
    case: dcPerSample ? '(b) DC point per sample' : '(a) small signal only',
    'kernel M/s (cpu)': +kernelRate.toFixed(3),
    'kernel M/s (wall best/median)': `${mega(N, k.best).toFixed(2)} / ${mega(N, k.median).toFixed(2)}`,
    'kernel heap B/sample': kernelBytesPerSample(kernel, inputs),
    'full chunk M/s (cpu)': +mega(N, c.cpu).toFixed(3),
    'full chunk M/s (wall best)': +mega(N, c.best).toFixed(3),
    'hand loop M/s (cpu)': +mega(N, hl.cpu).toFixed(3),
    'chunk / hand loop': +(hl.cpu / c.cpu).toFixed(2),
    'ns/sample chunk − hand': Math.round(((c.cpu - hl.cpu) * 1e6) / N),
    'MNA baseline M/s (cpu)': +baseRate.toFixed(4),
    'kernel / MNA': Math.round(kernelRate / baseRate),
    'chunk / MNA': Math.round(mega(N, c.cpu) / baseRate),
    '4-node baseline M/s (cpu)': +reducedRate.toFixed(4),
    'kernel / 4-node': Math.round(kernelRate / reducedRate),
    'a11 rel diff MNA / 4-node': `${mnaDiff.toExponential(1)} / ${reducedDiff.toExponential(1)}`,
    target: dcPerSample ? '≥ 1 M/s, ≥ 100×' : '≥ 2.5 M/s, ≥ 100×, ≥ 0.8× hand loop',
  });
}
console.log(
  '\nThroughput per core (one thread; chunk = 65 536 samples, seed "bench", design: bench 12AX7 pair)',
);
console.table(rows);
console.log(
  `load average ${os
    .loadavg()
    .map((l) => l.toFixed(1))
    .join(' ')}`,
);

const g = createStream('prng');
const buf = new Float64Array(1 << 20);
const p = timeBest(() => g.fillOpen(buf, buf.length), 7);
console.log(`sfc32 fillOpen: ${mega(buf.length, p.cpu).toFixed(0)} M doubles/s (cpu time, best of 7)`);

// Heap against N: the run accumulates in chunk order, nothing per sample is kept.
const gc = (globalThis as { gc?: () => void }).gc;
const setup = designSetup(design, { dcPerSample: false });
const memRows: Record<string, string | number>[] = [];
const sizes = quick ? [1e5, 1e6] : [1e5, 1e6, 1e7];
if (process.env.BENCH_1E8 === '1') sizes.push(1e8);
for (const samples of sizes) {
  const plan: RunPlan = {
    samples,
    seed: 'memory',
    plan: 'random',
    chunkSize: N,
    analyses: { influence: false, varianceIndices: false, worstCase: false },
  };
  gc?.();
  const before = process.memoryUsage().heapUsed;
  let peak = before;
  const c0 = process.cpuUsage();
  const acc = createRunAccumulator(setup, plan);
  for (let k = 0; k < chunkCount(plan); k++) {
    acc.add(runSetupChunk(setup, plan, k));
    peak = Math.max(peak, process.memoryUsage().heapUsed);
  }
  const results = acc.finish();
  const cpu = process.cpuUsage(c0);
  const ms = (cpu.user + cpu.system) / 1000;
  gc?.();
  memRows.push({
    samples,
    'heap before MB': +(before / 2 ** 20).toFixed(1),
    'heap peak MB': +(peak / 2 ** 20).toFixed(1),
    'heap after MB (results held)': +(process.memoryUsage().heapUsed / 2 ** 20).toFixed(1),
    'run M/s (cpu)': +mega(samples, ms).toFixed(3),
    'joint yield': +results.joint.yield.toFixed(5),
  });
}
console.log(
  `\nHeap used against N (small-signal kernel, random plan${gc ? ', after gc' : ', gc not exposed'})`,
);
console.table(memRows);

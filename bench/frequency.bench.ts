// Frequency-response figures: kernel and full-chunk throughput per core with the DC point and the
// frequency metrics at 3 spec frequencies per sample, then with the −3 dB points and the balance
// band added, for the long-tailed pair and the split-load example; and the editor's nominal
// frequency response (121 frequencies). Fixed seeds and sizes; speed is reported here, never
// asserted in tests. Run: npm run bench:frequency -w @sigmatail/bench
import { readFileSync } from 'node:fs';
import {
  buildTestDesign,
  createStream,
  DEFAULT_CHUNK_SIZE,
  designSetup,
  fillUniforms,
  largeSignalReport,
  nominalFrequencyResponse,
  parseDesign,
  runSetupChunk,
  type RunPlan,
  type RunSetup,
} from '@sigmatail/engine';
import { timeBest } from './src/timeBest.js';
import { BENCH_CAPACITORS } from './src/benchCapacitors.js';

const plain = buildTestDesign();
// The engine's bench design with film coupling/bypass capacitors, stray capacitance and 3 spec
// frequencies (20 Hz, 1 kHz, 20 kHz).
const design = buildTestDesign({
  parts: {
    ...Object.fromEntries(Object.entries(plain.parts).map(([k, p]) => [k, { ...p }])),
    ...BENCH_CAPACITORS,
  },
  specs: [
    { metric: 'balanceDb', min: -1, max: 1 },
    { metric: 'acPhaseDeg', frequency: 20, min: -5, max: 5 },
    { metric: 'acBalanceDb', frequency: 1000, min: -1, max: 1 },
    { metric: 'acBalanceDb', frequency: 20000, min: -1, max: 1 },
  ],
});
// The split-load example: input and output coupling capacitors, strays, balance specs at 20 Hz and
// 20 kHz; plus a 1 kHz spec so it has 3 spec frequencies like the pair.
const splitLoadDoc = JSON.parse(
  readFileSync(new URL('../packages/engine/examples/guitar-12au7-split-load.json', import.meta.url), 'utf8'),
) as { specs: unknown[] };
splitLoadDoc.specs.push({ metric: 'acBalanceDb', frequency: 1000, min: -1, max: 1 });
const parsedSplitLoad = parseDesign(splitLoadDoc);
if (!parsedSplitLoad.ok) throw new Error(JSON.stringify(parsedSplitLoad.errors));
const splitLoad = parsedSplitLoad.design;
const N = DEFAULT_CHUNK_SIZE;
const quick = process.env.BENCH_QUICK === '1';
const mega = (n: number, ms: number) => n / ms / 1e3;

function sampledInputs(setup: RunSetup, n: number): Float64Array[] {
  const m = setup.model;
  const u = m.dims.map(() => new Float64Array(n));
  const inputs = m.kernel.inputs.map(() => new Float64Array(n));
  fillUniforms('random', 'bench', 0, 0, n, u);
  m.fillInputs(u, n, inputs, createStream('bench', 'pairing'), { samples: 0, draws: 0, failures: 0 });
  return inputs;
}

const cases: [string, RunSetup, string][] = [
  ['midband only (no capacitors, no frequency specs)', designSetup(plain), ''],
  ['DC + 3 spec frequencies', designSetup(design, { corners: false, band: false }), '≥ 0.5 M/s'],
  ['DC + 3 spec frequencies + −3 dB points', designSetup(design, { band: false }), ''],
  ['DC + 3 spec frequencies + band (13 frequencies)', designSetup(design, { corners: false }), ''],
  ['full (default for this design)', designSetup(design), ''],
  ['split-load: DC + 3 spec frequencies', designSetup(splitLoad, { corners: false, band: false }), ''],
  ['split-load: full (spec frequencies, −3 dB points, band)', designSetup(splitLoad), ''],
];
const rows: Record<string, string | number>[] = [];
for (const [name, setup, target] of cases) {
  const { kernel } = setup.model;
  const inputs = sampledInputs(setup, N);
  const out = kernel.metrics.map(() => new Float64Array(N));
  const k = timeBest(() => kernel.evaluate(inputs, N, out), quick ? 3 : 5);
  const plan: RunPlan = { samples: 8 * N, seed: 'bench', plan: 'random', chunkSize: N };
  let chunk = 0;
  const c = timeBest(() => void runSetupChunk(setup, plan, chunk++ % 8), quick ? 3 : 5);
  rows.push({
    case: name,
    columns: kernel.metrics.length,
    'kernel M/s (cpu)': +mega(N, k.cpu).toFixed(3),
    'kernel µs/sample': +((k.cpu * 1e3) / N).toFixed(2),
    'full chunk M/s (cpu)': +mega(N, c.cpu).toFixed(3),
    'full chunk M/s (wall best)': +mega(N, c.best).toFixed(3),
    target,
  });
}
console.log('\nFrequency response throughput per core (one thread; chunk = 65 536 samples, seed "bench")');
console.table(rows);
const kernelRate = (name: string) => Number(rows.find((r) => r.case === name)?.['kernel M/s (cpu)']);
console.log(
  `split-load full / pair full, kernel M samples/s (same process): ${(
    kernelRate('split-load: full (spec frequencies, −3 dB points, band)') /
    kernelRate('full (default for this design)')
  ).toFixed(2)}`,
);

// The editor's nominal view: bias point + 121 frequencies, as the web app runs it per keystroke.
const nominal = timeBest(
  () => {
    for (let i = 0; i < 100; i++) nominalFrequencyResponse(design);
  },
  quick ? 3 : 7,
);
console.log(
  `nominalFrequencyResponse (121 frequencies, with the nominal bias solve): ${(nominal.cpu / 100).toFixed(3)} ms per call (cpu)`,
);

// The large-signal report (drive limits, swings, H2/H3/THD of both plates), nominal.
const large = timeBest(
  () => {
    for (let i = 0; i < 10; i++) largeSignalReport(design);
  },
  quick ? 3 : 5,
);
console.log(`largeSignalReport (nominal): ${(large.cpu / 10).toFixed(1)} ms per call (cpu)`);
const largeSplit = timeBest(
  () => {
    for (let i = 0; i < 10; i++) largeSignalReport(splitLoad);
  },
  quick ? 3 : 5,
);
console.log(`largeSignalReport (split-load, nominal): ${(largeSplit.cpu / 10).toFixed(1)} ms per call (cpu)`);

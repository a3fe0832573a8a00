// Tolerance plan search for the demo guitar design: 6 parts × 4 classes + the tube pairing option
// (8 192 candidate plans), timed on one core (this process, one thread), against judging every
// candidate with its own fresh Monte Carlo run; then the chosen plan's confirming run (ordinary
// runChunk/mergeChunks with another seed) beside the search's estimate.
// Run: npx tsx --conditions=@sigmatail/source bench/planSearch.ts
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  chunkCount,
  commonUniforms,
  countFailures,
  createSampleJudge,
  INPUTS,
  mergeChunks,
  parseDesign,
  partColumn,
  plannedDesign,
  runChunk,
  searchPlan,
  tubeColumns,
  wilsonInterval,
  type PartName,
  type PriceTable,
  type ResolvedDesign,
} from '@sigmatail/engine';

const REPO = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const doc = JSON.parse(
  readFileSync(path.join(REPO, 'packages/engine/examples/guitar-12ax7-cap-coupled.json'), 'utf8'),
);
const parsed = parseDesign(doc);
if (!parsed.ok) throw new Error('demo guitar design does not parse');
const guitar = parsed.design;

// The demo seed's metal-film rows and tube prices (invented).
const prices: PriceTable = {
  currency: 'EUR',
  resistors: [
    { kind: 'metal-film', tolerance: 5, price: 0.04 },
    { kind: 'metal-film', tolerance: 2, price: 0.06 },
    { kind: 'metal-film', tolerance: 1, price: 0.09 },
    { kind: 'metal-film', tolerance: 0.5, price: 0.24 },
  ],
  tubes: { unmatched: 16.5, matched: 22 },
};

/** CPU (user + system) and wall milliseconds of fn, run once. */
function timed<T>(fn: () => T): { value: T; cpu: number; wall: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = fn();
  const wall = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { value, cpu: (c.user + c.system) / 1000, wall };
}

/**
 * The naive method's cost per candidate: one fresh Monte Carlo run (own draws, every sample
 * judged) for each of `k` candidates; the per-candidate time extrapolates to all of them.
 */
function freshRunsPerCandidate(design: ResolvedDesign, n: number, k: number): number {
  const judge = createSampleJudge(design);
  const nominal = judge.kernel.nominalInputs();
  const t = timed(() => {
    for (let c = 0; c < k; c++) {
      const seed = `fresh-${c}`;
      const tubes = tubeColumns(design, { kind: 'unmatched' }, seed, n);
      const columns = INPUTS.map((id, i) => {
        if (id === 'perv1' || id === 'perv2' || id === 'mu1' || id === 'mu2') return tubes[id];
        const part = design.parts[id as PartName];
        return part
          ? partColumn(part, part.tolerance, commonUniforms(seed, 'part', id, n), n)
          : new Float64Array(n).fill(nominal[i]);
      });
      countFailures(judge, columns, n, null, Infinity);
    }
  });
  return t.cpu / k;
}

function confirm(design: ResolvedDesign, samples: number) {
  const plan = {
    samples,
    seed: 'bench-confirm',
    plan: 'random' as const,
    chunkSize: 65_536,
    analyses: { influence: false, varianceIndices: false, worstCase: false },
  };
  const chunks = Array.from({ length: chunkCount(plan) }, (_v, k) => runChunk(design, plan, k));
  const j = mergeChunks(design, plan, chunks).joint;
  const [lo, hi] = wilsonInterval(j.pass, j.samples);
  return { ppm: (1 - j.yield) * 1e6, low: (1 - hi) * 1e6, high: (1 - lo) * 1e6 };
}

/** The demo guitar design with its balance spec tightened to ±limit dB. */
function balance(limit: number): ResolvedDesign {
  return {
    ...guitar,
    specs: guitar.specs.map((s) => (s.metric === 'balanceDb' ? { ...s, min: -limit, max: limit } : s)),
  };
}

const cases = [
  { name: 'demo guitar, 500 PPM', design: guitar, targetPpm: 500, samples: 20_000 },
  { name: 'demo guitar, 50 PPM', design: guitar, targetPpm: 50, samples: 100_000 },
  { name: 'demo guitar, balance ±0.7 dB, 1000 PPM', design: balance(0.7), targetPpm: 1000, samples: 20_000 },
  // Worst case: no plan comes near (best ~19 % rejects), so every candidate is judged against loose targets.
  {
    name: 'demo guitar, balance ±0.5 dB (unreachable)',
    design: balance(0.5),
    targetPpm: 1000,
    samples: 20_000,
  },
];

const rows: Record<string, string | number>[] = [];
for (const c of cases) {
  searchPlan(c.design, { prices, targetPpm: 20_000, samples: 2000, seed: 'warm' }); // warm the kernel
  const s = timed(() =>
    searchPlan(c.design, { prices, targetPpm: c.targetPpm, samples: c.samples, seed: 'bench-plan' }),
  );
  const r = s.value;
  const fresh = freshRunsPerCandidate(c.design, c.samples, 8) * r.candidates;
  const chosen = r.chosen;
  const conf = chosen ? confirm(plannedDesign(c.design, r, chosen), 400_000) : null;
  rows.push({
    case: c.name,
    candidates: r.candidates,
    judged: r.judged,
    'kernel evals': r.kernelEvaluations,
    'search cpu s': (s.cpu / 1000).toFixed(2),
    'search wall s': (s.wall / 1000).toFixed(2),
    'fresh runs cpu s (est.)': (fresh / 1000).toFixed(0),
    'speed-up': `${(fresh / s.cpu).toFixed(0)}×`,
    'chosen cost': chosen ? chosen.cost.toFixed(2) : '—',
    'estimate PPM (95 %)': chosen
      ? `${chosen.rejectPpm.toFixed(0)} (${chosen.lowPpm.toFixed(0)}–${chosen.highPpm.toFixed(0)})`
      : '—',
    'confirm PPM (95 %)': conf
      ? `${conf.ppm.toFixed(0)} (${conf.low.toFixed(0)}–${conf.high.toFixed(0)})`
      : '—',
    'confirm in estimate interval':
      chosen && conf ? (conf.ppm >= chosen.lowPpm && conf.ppm <= chosen.highPpm ? 'yes' : 'no') : '—',
  });
}
console.table(rows);

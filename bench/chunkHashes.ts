// Fingerprints of chunk results over many design × kernel × plan combinations, to show a speed
// change leaves every result bit for bit the same: run before and after, compare the lines.
// Run: npx tsx --conditions=@sigmatail/source bench/chunkHashes.ts
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import {
  buildTestDesign,
  chunkCount,
  designSetup,
  parseDesign,
  runSetupChunk,
  type DesignSetupOptions,
  type ResolvedDesign,
  type RunPlan,
} from '@sigmatail/engine';
import { BENCH_CAPACITORS } from './src/benchCapacitors.js';

const exampleDoc = (name: string): Record<string, unknown> =>
  JSON.parse(readFileSync(new URL(`../packages/engine/examples/${name}.json`, import.meta.url), 'utf8'));
const parsed = (doc: unknown): ResolvedDesign => {
  const r = parseDesign(doc);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
};
const example = (name: string) => parsed(exampleDoc(name));
const plain = buildTestDesign();
const withCaps = buildTestDesign({
  parts: {
    ...plain.parts,
    ...BENCH_CAPACITORS,
  },
  specs: [
    { metric: 'balanceDb', min: -1, max: 1 },
    { metric: 'acPhaseDeg', frequency: 20, min: -5, max: 5 },
    { metric: 'acBalanceDb', frequency: 1000, min: -1, max: 1 },
  ],
});
const lot = buildTestDesign();
lot.tube.spread = {
  perveanceSd: 0,
  muSd: 0,
  sectionCorrelation: 0,
  pairing: { quantity: 'ia', within: 5 },
  lot: {
    name: 'tubes',
    tubes: [
      [1, 1.02, 1, 1],
      [1, 1.4, 1, 1],
      [0.9, 0.91, 1, 1],
      [1.1, 1.05, 0.98, 1.01],
    ],
  },
};
// Wide spreads: some samples lose their bias point (NaN metrics, valid = 0).
const wide = buildTestDesign({
  tube: { type: '12AX7', spread: { perveanceSd: 60, muSd: 20, sectionCorrelation: 0 } },
  supply: { bPlus: 120, tail: 0 },
});

// Grid 1 far above the tail: most samples have no bias point (a mix with the DC point per sample,
// none with the nominal one).
const hifi = exampleDoc('hifi-6sn7-direct-coupled');
const cutoff = parsed({
  ...hifi,
  supply: { bPlus: 330, tail: -150 },
  drive: { grid1Dc: 100, grid2: { mode: 'leak-to-grid1' } },
  tube: { type: '6SN7', spread: { perveanceSd: 40, muSd: 20, sectionCorrelation: 0 } },
});

const designs: [string, ResolvedDesign, DesignSetupOptions[]][] = [
  ['test', plain, [{ dcPerSample: false }, { dcPerSample: true }]],
  ['caps', withCaps, [{ dcPerSample: false }, { corners: false, band: false }, {}]],
  ['lot', lot, [{ dcPerSample: false }, { dcPerSample: true }]],
  ['wide', wide, [{ dcPerSample: false }, { dcPerSample: true }]],
  ['guitar', example('guitar-12ax7-cap-coupled'), [{ dcPerSample: false }, { dcPerSample: true }]],
  ['split', example('guitar-12au7-split-load'), [{ dcPerSample: false }, { dcPerSample: true }]],
  ['hifi', example('hifi-6sn7-direct-coupled'), [{ dcPerSample: false }, { dcPerSample: true }]],
  ['cutoff', cutoff, [{ dcPerSample: false }, { dcPerSample: true }]],
  ['12at7', example('bench-12at7-loaded'), [{ dcPerSample: true }]],
];
const plans: RunPlan[] = [
  { samples: 20_000, seed: 'hash', plan: 'random', chunkSize: 7000 },
  { samples: 20_000, seed: 'hash', plan: 'lhs', chunkSize: 7000 },
  { samples: 20_000, seed: 'hash', plan: 'sobol', chunkSize: 7000 },
  { samples: 70_000, seed: 'big', plan: 'random', chunkSize: 65_536 },
];
// -0 and 0 print alike in JSON; keep them apart.
const replacer = (_k: string, v: unknown) => (Object.is(v, -0) ? '-0' : v);
const all = createHash('sha256');
let combos = 0;
for (const [name, design, options] of designs) {
  for (const opt of options) {
    const setup = designSetup(design, opt);
    for (const plan of plans) {
      if (plan.chunkSize === 65_536 && name !== 'test' && name !== 'wide') continue;
      const h = createHash('sha256');
      for (let k = 0; k < chunkCount(plan); k++)
        h.update(JSON.stringify(runSetupChunk(setup, plan, k), replacer));
      const hex = h.digest('hex');
      all.update(hex);
      combos++;
      console.log(
        `${name} ${JSON.stringify(opt)} ${plan.plan}/${plan.samples}/${plan.chunkSize} ${hex.slice(0, 16)}`,
      );
    }
  }
}
console.log(`all ${combos} combinations: ${all.digest('hex')}`);

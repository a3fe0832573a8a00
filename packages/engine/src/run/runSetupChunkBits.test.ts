import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseDesign } from '../design/parseDesign.js';
import { buildTestDesign } from './buildTestDesign.js';
import { designSetup, type DesignSetupOptions } from './designSetup.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import { runSetupChunk } from './runSetupChunk.js';

// Chunk results pinned bit for bit: speed work on the chunk loop and its statistics must leave
// every stored number as it was (stored runs are merged with new chunks after a resume, and an
// export regenerates the samples). The hashes were taken before the four-samples-per-step
// statistics and are the same after; bench/chunkHashes.ts checks 58 combinations the same way.

/** sha256 of the chunk results as stored (JSON; -0 kept apart from 0), first 16 hex digits. */
function chunksHash(
  design: ReturnType<typeof buildTestDesign>,
  options: DesignSetupOptions,
  plan: RunPlan,
): string {
  const setup = designSetup(design, options);
  const h = createHash('sha256');
  for (let k = 0; k < chunkCount(plan); k++) {
    h.update(JSON.stringify(runSetupChunk(setup, plan, k), (_key, v) => (Object.is(v, -0) ? '-0' : v)));
  }
  return h.digest('hex').slice(0, 16);
}

// The direct-coupled example with grid 1 at +100 V over the -150 V tail and wide tube spreads:
// about one sample in eight has a bias point, so NaN columns and partial counts are covered.
const hifi = JSON.parse(
  readFileSync(
    fileURLToPath(new URL('../../examples/hifi-6sn7-direct-coupled.json', import.meta.url)),
    'utf8',
  ),
);
const cutoff = parseDesign({
  ...hifi,
  drive: { grid1Dc: 100, grid2: { mode: 'leak-to-grid1' } },
  tube: { type: '6SN7', spread: { perveanceSd: 40, muSd: 20, sectionCorrelation: 0 } },
});

describe('chunk results stay bit for bit the same', () => {
  const plan = (kind: RunPlan['plan']): RunPlan => ({
    samples: 5000,
    seed: 'pin',
    plan: kind,
    chunkSize: 2500,
  });
  const design = buildTestDesign();
  const cases: [string, () => string, string][] = [
    [
      'small signal only, random',
      () => chunksHash(design, { dcPerSample: false }, plan('random')),
      'c2ea6701882e682c',
    ],
    [
      'small signal only, lhs',
      () => chunksHash(design, { dcPerSample: false }, plan('lhs')),
      '101748dee90e6178',
    ],
    [
      'DC point per sample, random',
      () => chunksHash(design, { dcPerSample: true }, plan('random')),
      '0a15b3b0dd2bb9f9',
    ],
    [
      'DC point per sample, sobol',
      () => chunksHash(design, { dcPerSample: true }, plan('sobol')),
      '62ceccb695d590e3',
    ],
  ];
  it.each(cases)('%s', (_name, hash, pinned) => {
    expect(hash()).toBe(pinned);
  });

  it('a design where most samples have no bias point', () => {
    if (!cutoff.ok) throw new Error(JSON.stringify(cutoff.errors));
    const setup = designSetup(cutoff.design, { dcPerSample: true });
    const r = runSetupChunk(setup, plan('random'), 0);
    expect([r.n, r.validCount, r.metrics.a11.count]).toEqual([2500, 303, 303]);
    expect(chunksHash(cutoff.design, { dcPerSample: true }, plan('random'))).toBe('1d9658bb3d4265fa');
  });

  it('exact figures of one chunk of the bench design', () => {
    const r = runSetupChunk(designSetup(design, { dcPerSample: false }), plan('random'), 1);
    const b = r.metrics.balanceDb;
    expect([
      r.jointPass,
      ...r.specPass,
      b.count,
      b.mean,
      b.m2,
      b.min,
      b.max,
      b.binOffset,
      b.bins.length,
    ]).toEqual([
      2368, 2500, 2368, 2500, 2500, 0.26807710315596117, 83.68115184107225, -0.40386868089264555,
      0.9316977309054337, 497, 1057,
    ]);
  });
});

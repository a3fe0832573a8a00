import { describe, expect, it } from 'vitest';
import { preparePartSpread } from '../spread/partSpread.js';
import { createSampleModel } from './createSampleModel.js';
import { mergeSetupChunks } from './mergeSetupChunks.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import { createRunSetup } from './runSetup.js';
import { runSetupChunk } from './runSetupChunk.js';
import type { Kernel } from './sampleModel.js';

/** A kernel with no bias point when x < 1 (valid = 0, metric NaN), else y = x. */
const halfInvalid: Kernel = {
  inputs: ['x'],
  metrics: ['y', 'valid'],
  nominalInputs: () => Float64Array.of(1),
  evaluate(x, n, out) {
    for (let s = 0; s < n; s++) {
      const ok = x[0][s] >= 1;
      out[0][s] = ok ? x[0][s] : NaN;
      out[1][s] = ok ? 1 : 0;
    }
  },
};

function run(plan: RunPlan, kernel = halfInvalid) {
  const model = createSampleModel(kernel, {
    x: preparePartSpread({ value: 1, tolerance: 6, spread: { kind: 'uniform' } }),
  });
  const setup = createRunSetup(model, [{ metric: 'y', max: 1.03 }]);
  const chunks = Array.from({ length: chunkCount(plan) }, (_v, k) => runSetupChunk(setup, plan, k));
  return mergeSetupChunks(setup, plan, chunks);
}

describe('run results', () => {
  it('samples without a bias point fail every spec and stay out of the metric statistics', () => {
    const r = run({ samples: 20_000, seed: 'inv', plan: 'lhs', chunkSize: 4096 });
    // x uniform on [0.94, 1.06]: half the samples are invalid; y <= 1.03 holds for 3/4 of the valid ones.
    expect(r.validCount / r.samples).toBeCloseTo(0.5, 3);
    expect(r.metrics.y.count).toBe(r.validCount);
    expect(r.specs[0].yield).toBeCloseTo(0.25, 3);
    expect(r.joint.pass).toBe(r.specs[0].pass);
    expect(r.metrics.y.min).toBeGreaterThanOrEqual(1);
  });

  it('is plain JSON: a JSON round trip changes nothing, even with undefined figures', () => {
    const r = run({ samples: 1, seed: 'one', plan: 'random', chunkSize: 4096 });
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
    expect(r.metrics.valid.sd).toBeNull();
  });

  it('convergence trace: cumulative N at chunk boundaries, at most ~200 points, ending at the total', () => {
    const r = run({
      samples: 50_000,
      seed: 'trace',
      plan: 'random',
      chunkSize: 100,
      analyses: { influence: false, varianceIndices: false, worstCase: false },
    });
    const t = r.convergence;
    expect(t.n.length).toBeLessThanOrEqual(200);
    expect(t.n.at(-1)).toBe(50_000);
    expect(t.jointYield.at(-1)).toBe(r.joint.yield);
    expect(t.means.y.at(-1)).toBe(r.metrics.y.mean);
    expect([...t.n].sort((a, b) => a - b)).toEqual(t.n);
  });
});

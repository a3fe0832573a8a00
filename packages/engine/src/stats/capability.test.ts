import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { preparePartSpread } from '../spread/partSpread.js';
import { createSampleModel } from '../run/createSampleModel.js';
import { createRunSetup } from '../run/runSetup.js';
import { runSetupChunk } from '../run/runSetupChunk.js';
import { mergeSetupChunks } from '../run/mergeSetupChunks.js';
import { chunkCount, type RunPlan } from '../run/runPlan.js';
import { additiveKernel } from '../run/testKernels.js';
import { capability, cpkInterval } from './capability.js';

describe('capability and reject rate', () => {
  it('Cp/Cpk formulas', () => {
    expect(capability(0, 1, -3, 3)).toEqual({ cp: 1, cpk: 1 });
    expect(capability(1, 1, -3, 3)).toEqual({ cp: 1, cpk: 2 / 3 });
    expect(capability(0, 2, undefined, 3)).toEqual({ cp: null, cpk: 0.5 });
  });

  it('a centred normal metric with Cpk 1.0 rejects about 2700 PPM (two-sided)', () => {
    // Expected PPM = 2·Φ(−3)·1e6 = 2699.8 (Φ from jstat). Binomial sd at N = 2^20: ≈ 51 PPM.
    const model = createSampleModel(additiveKernel([0.01]), {
      x1: preparePartSpread({ value: 1, tolerance: 3, spread: { kind: 'normal' } }),
    });
    const setup = createRunSetup(model, [{ metric: 'y', min: -3, max: 3 }]);
    const plan: RunPlan = { samples: 2 ** 20, seed: 'cpk', plan: 'sobol', chunkSize: 65_536, analyses: {} };
    plan.analyses = { influence: false, varianceIndices: false, worstCase: false };
    const chunks = Array.from({ length: chunkCount(plan) }, (_v, k) => runSetupChunk(setup, plan, k));
    const r = mergeSetupChunks(setup, plan, chunks);
    const spec = r.specs[0];
    const expected = 2 * jStat.normal.cdf(-3, 0, 1) * 1e6;
    expect(Math.abs(spec.ppm - expected)).toBeLessThan(150);
    expect(spec.cpk).toBeCloseTo(1, 2);
    expect(spec.cp).toBeCloseTo(1, 2);
    expect(spec.clopperPearson[0]).toBeLessThan(spec.yield);
    expect(spec.wilson[1]).toBeGreaterThan(spec.yield);
  });
});

describe('cpkInterval', () => {
  it('matches a hand computation of the normal approximation', () => {
    // Bissell (1990), Applied Statistics 39: Cpk ± z·√(1/(9n) + Cpk²/(2(n−1))) — formula from memory;
    // values hand-computed in Python: Cpk 1.33, n 100 → [1.13356, 1.52644].
    const [lo, hi] = cpkInterval(1.33, 100)!;
    expect(lo).toBeCloseTo(1.133563598483375, 10);
    expect(hi).toBeCloseTo(1.5264364015166252, 10);
  });
  it('narrows with n and refuses undefined input', () => {
    const [lo, hi] = cpkInterval(1, 10000)!;
    expect(hi - lo).toBeCloseTo(0.0306446, 6);
    expect(cpkInterval(null, 100)).toBeNull();
    expect(cpkInterval(1, 1)).toBeNull();
  });
});

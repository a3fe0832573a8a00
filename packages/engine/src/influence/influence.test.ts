import { describe, expect, it } from 'vitest';
import { preparePartSpread } from '../spread/partSpread.js';
import { createSampleModel } from '../run/createSampleModel.js';
import { additiveKernel } from '../run/testKernels.js';
import { createRunSetup } from '../run/runSetup.js';
import { setupExtras } from '../run/setupExtras.js';
import { localSensitivities } from './localSensitivities.js';
import { rankInPlace, rankRegression, solveLinear } from './rankInfluence.js';
import type { Kernel } from '../run/sampleModel.js';

describe('influence', () => {
  it('ranks give ties their average rank', () => {
    const out = new Float64Array(5);
    rankInPlace(Float64Array.of(3, 1, 3, 7, 1), out);
    expect(Array.from(out)).toEqual([3.5, 1.5, 3.5, 5, 1.5]);
  });

  it('linear solve', () => {
    expect(
      solveLinear(
        [
          [2, 1],
          [1, 3],
        ],
        [3, 5],
      )?.map((x) => +x.toFixed(12)),
    ).toEqual([0.8, 1.4]);
    expect(
      solveLinear(
        [
          [1, 1],
          [1, 1],
        ],
        [1, 1],
      ),
    ).toBeNull();
  });

  it('SRRC on independent inputs equals the Spearman correlation', () => {
    const a = Float64Array.from({ length: 6 }, (_v, i) => i + 1);
    const y = Float64Array.of(1, 3, 2, 5, 4, 6);
    const r = rankRegression([a], y);
    expect(r.srrc[0]).toBeCloseTo(r.spearman[0]!, 12);
    // Spearman ρ = 1 − 6Σd²/(n(n²−1)) = 1 − 6·4/210 (textbook formula for untied ranks).
    expect(r.spearman[0]).toBeCloseTo(1 - 24 / 210, 12);
  });

  it('local sensitivity of y = x1²·x2⁻¹ is (2, −1) (∂ln y/∂ln x, analytic)', () => {
    const kernel: Kernel = {
      inputs: ['x1', 'x2'],
      metrics: ['y'],
      nominalInputs: () => Float64Array.of(2, 5),
      evaluate(x, n, out) {
        for (let s = 0; s < n; s++) out[0][s] = (x[0][s] * x[0][s]) / x[1][s];
      },
    };
    const part = (value: number) => preparePartSpread({ value, tolerance: 5, spread: { kind: 'normal' } });
    const model = createSampleModel(kernel, { x1: part(2), x2: part(5) });
    const s = localSensitivities(model);
    expect(s.values[0][0]).toBeCloseTo(2, 6);
    expect(s.values[0][1]).toBeCloseTo(-1, 6);
  });

  it('run extras on an additive model: SRRC ∝ weights, tornado sorted, indices ≈ w²/Σw²', () => {
    const weights = [3, -2, 1];
    const parts = Object.fromEntries(
      weights.map((_w, i) => [
        `x${i + 1}`,
        preparePartSpread({ value: 1, tolerance: 3, spread: { kind: 'normal' } }),
      ]),
    );
    const setup = createRunSetup(createSampleModel(additiveKernel([0.01, 0.01, 0.01], weights), parts), []);
    const e = setupExtras(setup, { samples: 30_000, seed: 'inf', plan: 'random', chunkSize: 8192 });
    const inf = e.influence!;
    expect(inf.rankSamples).toBe(20_000);
    expect(inf.tornado.y.map((b) => b.input)).toEqual(['x1', 'x2', 'x3']);
    const total = weights.reduce((a, w) => a + w * w, 0);
    // Additive model: S_i = w_i²/Σw² (analytic); SRRC ≈ w_i/√Σw² on ranks for near-linear data.
    weights.forEach((w, i) => {
      expect(e.varianceIndices!.firstOrder.y[i]!).toBeCloseTo((w * w) / total, 1);
      expect(inf.srrc.y[`x${i + 1}`]!).toBeCloseTo(w / Math.sqrt(total), 1);
    });
  });
});

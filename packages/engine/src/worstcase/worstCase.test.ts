import { describe, expect, it } from 'vitest';
import { preparePartSpread } from '../spread/partSpread.js';
import { createSampleModel } from '../run/createSampleModel.js';
import { additiveKernel } from '../run/testKernels.js';
import { worstCase } from './worstCase.js';
import { cornerSearch } from './cornerSearch.js';

function linearModel(k: number) {
  const weights = Array.from({ length: k }, (_v, i) => (i % 3 === 0 ? -1 : 1) * (i + 1));
  const parts = Object.fromEntries(
    weights.map((_w, i) => [
      `x${i + 1}`,
      preparePartSpread({ value: 1, tolerance: 6, spread: { kind: 'normal' } }),
    ]),
  );
  return {
    model: createSampleModel(
      additiveKernel(
        weights.map(() => 0.02),
        weights,
      ),
      parts,
    ),
    weights,
  };
}

describe('worst case', () => {
  it('corners: a linear metric reaches ±Σ|w_i|·t/σ at the sign-matched corners; RSS = √Σ(w_i·t/σ)² (analytic)', () => {
    const { model, weights } = linearModel(6);
    const r = worstCase(model);
    // Tolerance 6 % of nominal 1, scale 0.02: each input moves y by ±3·w_i.
    const sumAbs = weights.reduce((a, w) => a + 3 * Math.abs(w), 0);
    const rss = Math.sqrt(weights.reduce((a, w) => a + (3 * w) ** 2, 0));
    expect(r.method).toBe('corners');
    expect(r.evaluations).toBe(2 ** 6 + 13);
    expect(r.metrics.y.max).toBeCloseTo(sumAbs, 9);
    expect(r.metrics.y.min).toBeCloseTo(-sumAbs, 9);
    expect(r.metrics.y.maxCorner?.x1).toBe('low');
    expect(r.metrics.y.maxCorner?.x2).toBe('high');
    expect(r.metrics.y.rss.halfSpan).toBeCloseTo(rss, 9);
  });

  it('search beyond 16 inputs finds the same extreme for a monotone metric', () => {
    const { model, weights } = linearModel(20);
    const r = worstCase(model);
    expect(r.method).toBe('search');
    expect(r.metrics.y.max).toBeCloseTo(
      weights.reduce((a, w) => a + 3 * Math.abs(w), 0),
      9,
    );
    expect(r.evaluations).toBeLessThan(2000);
  });

  it('coordinate ascent climbs out of a bad start', () => {
    const f = (b: number[]) => b[0] + b[1] - b[2];
    expect(cornerSearch(f, [0, 0, 1], 1)).toMatchObject({ bits: [1, 1, 0], value: 2 });
    expect(cornerSearch(f, [1, 1, 0], -1)).toMatchObject({ bits: [0, 0, 1], value: -1 });
  });
});

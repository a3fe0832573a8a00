import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { clopperPearsonInterval, wilsonInterval } from './binomialIntervals.js';
import { incompleteBeta, logGamma } from './specialFunctions.js';

describe('binomial intervals (95 %)', () => {
  it('Wilson and Clopper–Pearson for 81/263 match the published worked example', () => {
    // Newcombe, Statistics in Medicine 17 (1998) 857–872, Table I, example 81/263 (from memory):
    // Wilson 0.2553–0.3662, Clopper–Pearson 0.2527–0.3676.
    const w = wilsonInterval(81, 263);
    expect(w[0]).toBeCloseTo(0.2553, 4);
    expect(w[1]).toBeCloseTo(0.3662, 4);
    const cp = clopperPearsonInterval(81, 263);
    expect(cp[0]).toBeCloseTo(0.2527, 4);
    expect(cp[1]).toBeCloseTo(0.3676, 4);
  });

  it('Clopper–Pearson equals the jstat beta quantiles, including large runs', () => {
    // Reference: jStat.beta.inv (independent statistics library).
    for (const [x, n] of [
      [1, 20],
      [19, 20],
      [997, 1000],
      [999_000, 1_000_000],
    ]) {
      const [lo, hi] = clopperPearsonInterval(x, n);
      expect(lo / jStat.beta.inv(0.025, x, n - x + 1)).toBeCloseTo(1, 7);
      expect(hi / jStat.beta.inv(0.975, x + 1, n - x)).toBeCloseTo(1, 7);
    }
    // x = 0: upper bound 1 − (α/2)^(1/n) (closed form).
    expect(clopperPearsonInterval(0, 1000)[1]).toBeCloseTo(1 - 0.025 ** (1 / 1000), 12);
    expect(clopperPearsonInterval(1000, 1000)[0]).toBeCloseTo(0.025 ** (1 / 1000), 12);
    expect(clopperPearsonInterval(1000, 1000)[1]).toBe(1);
  });

  it('stays finite and ordered at 1e8 samples', () => {
    const n = 100_000_000;
    const [lo, hi] = clopperPearsonInterval(n - 270_000, n);
    const [wlo, whi] = wilsonInterval(n - 270_000, n);
    expect(lo).toBeLessThan(0.9973);
    expect(hi).toBeGreaterThan(0.9973);
    expect(Math.abs(lo - wlo)).toBeLessThan(1e-6);
    expect(Math.abs(hi - whi)).toBeLessThan(1e-6);
  });

  it('special functions agree with jstat', () => {
    for (const x of [0.1, 1, 2.5, 10.5, 1e3, 1e7]) expect(logGamma(x)).toBeCloseTo(jStat.gammaln(x), 7);
    for (const [x, a, b] of [
      [0.3, 2, 3],
      [0.9, 50, 4],
      [0.01, 0.5, 0.5],
    ]) {
      expect(incompleteBeta(x, a, b)).toBeCloseTo(jStat.ibeta(x, a, b), 10);
    }
  });
});

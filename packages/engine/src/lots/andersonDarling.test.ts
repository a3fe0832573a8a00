import kstest from '@stdlib/stats-kstest';
import jStat from 'jstat';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { andersonDarlingNormal, andersonDarlingPValue } from './andersonDarling.js';
import { ksDistanceNormal } from './ksDistance.js';

/** Seeded normal sample through jstat's inverse CDF (independent of the engine's quantile). */
function normalSample(seed: string, n: number, mean = 0, sd = 1): number[] {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, () => jStat.normal.inv(rng(), mean, sd));
}

/** A² written out from the textbook definition with jstat's normal CDF (independent reference). */
function referenceA2(x: number[]): number {
  const s = [...x].sort((a, b) => a - b);
  const n = s.length;
  const mean = s.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(s.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
  let sum = 0;
  for (let i = 1; i <= n; i++) {
    sum +=
      (2 * i - 1) *
      (Math.log(jStat.normal.cdf(s[i - 1]!, mean, sd)) +
        Math.log(jStat.normal.cdf(2 * mean - s[n - i]!, mean, sd)));
  }
  return -n - sum / n;
}

describe('andersonDarlingNormal', () => {
  it('matches the statistic computed from its definition with jstat (independent library)', () => {
    for (const [seed, n] of [
      ['a', 20],
      ['b', 200],
      ['c', 1000],
    ] as const) {
      const x = normalSample(seed, n, 4700, 47);
      expect(andersonDarlingNormal(x).statistic).toBeCloseTo(referenceA2(x), 8);
    }
    const skewed = normalSample('d', 300, 0, 0.4).map(Math.exp);
    expect(andersonDarlingNormal(skewed).statistic).toBeCloseTo(referenceA2(skewed), 8);
  });

  it('gives p-values that are uniform under the null: 5 % of normal samples fall below p = 0.05', () => {
    // The simulated null distribution checks the Table 4.9 coefficients (D'Agostino & Stephens
    // 1986, from memory): 2000 seeded samples of n = 50, rejection rate 0.05 ± 3 binomial se.
    const trials = 2000;
    let below05 = 0;
    let below20 = 0;
    for (let t = 0; t < trials; t++) {
      const p = andersonDarlingNormal(normalSample(`null-${t}`, 50)).pValue;
      if (p < 0.05) below05++;
      if (p < 0.2) below20++;
    }
    expect(Math.abs(below05 / trials - 0.05)).toBeLessThan(3 * Math.sqrt((0.05 * 0.95) / trials));
    expect(Math.abs(below20 / trials - 0.2)).toBeLessThan(3 * Math.sqrt((0.2 * 0.8) / trials));
  });

  it('rejects a lognormal lot as normal and accepts its logarithms', () => {
    const x = normalSample('skew', 400, 0, 0.5).map(Math.exp);
    expect(andersonDarlingNormal(x).pValue).toBeLessThan(0.001);
    expect(andersonDarlingNormal(x.map(Math.log)).pValue).toBeGreaterThan(0.05);
  });

  it('has the published 5 % critical value of A*² near 0.752 (Stephens 1974 table, from memory)', () => {
    expect(andersonDarlingPValue(0.752)).toBeCloseTo(0.05, 2);
    expect(andersonDarlingPValue(1.035)).toBeCloseTo(0.01, 2);
  });

  it('refuses too few or constant values, naming why', () => {
    expect(() => andersonDarlingNormal([1, 2, 3])).toThrow(/at least 8/);
    expect(() => andersonDarlingNormal(new Array(10).fill(1))).toThrow(/not all equal/);
  });
});

describe('ksDistanceNormal', () => {
  it('equals the Kolmogorov–Smirnov statistic of @stdlib/stats-kstest (independent library)', () => {
    for (const [seed, n] of [
      ['k1', 30],
      ['k2', 500],
    ] as const) {
      const x = normalSample(seed, n, 10, 2);
      const ref = kstest(x, 'normal', 10.1, 2.2);
      expect(ksDistanceNormal(x, 10.1, 2.2)).toBeCloseTo(ref.statistic, 10);
    }
  });
});

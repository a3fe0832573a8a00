// @vitest-environment node
import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { normalTail } from './normalTail.js';
import { twoProportionZTest } from './twoProportionZTest.js';

describe('twoProportionZTest', () => {
  it('matches a hand computation: 90/100 against 80/100', () => {
    // Hand-computed: pooled p = 0.85, SE = sqrt(0.85·0.15·(1/100 + 1/100)) = 0.0504975,
    // z = 0.1 / SE = 1.980295, two-sided p = erfc(z/√2) = 0.0476704 (Python math.erfc).
    const r = twoProportionZTest(90, 100, 80, 100);
    expect(r.diff).toBeCloseTo(0.1, 12);
    expect(r.z).toBeCloseTo(1.9802950859533488, 9);
    expect(r.p).toBeCloseTo(0.04767038065616144, 6);
  });

  it('keeps small p-values accurate: 9950/10000 against 9900/10000', () => {
    // Hand-computed with Python math.erfc: z = 4.0978789, p = 4.16953e-5.
    const r = twoProportionZTest(9950, 10000, 9900, 10000);
    expect(r.z).toBeCloseTo(4.097878872178835, 8);
    expect(r.p / 4.169533567036883e-5).toBeCloseTo(1, 5);
  });

  it('is symmetric and gives p = 1 for equal yields', () => {
    const a = twoProportionZTest(80, 100, 90, 100);
    expect(a.z).toBeCloseTo(-1.9802950859533488, 9);
    expect(twoProportionZTest(50, 100, 500, 1000).p).toBeCloseTo(1, 12);
  });

  it('returns NaN where the test is undefined', () => {
    expect(twoProportionZTest(100, 100, 50, 50).p).toBeNaN();
    expect(twoProportionZTest(0, 0, 5, 10).z).toBeNaN();
  });
});

describe('normalTail', () => {
  it('agrees with the jStat library across the range', () => {
    // Independent general-purpose npm library: jstat (jStat.normal.cdf).
    for (const z of [-3, -1, 0, 0.5, 1.96, 3, 5]) {
      const ref = 1 - jStat.normal.cdf(z, 0, 1);
      expect(Math.abs(normalTail(z) - ref)).toBeLessThan(2e-7 * Math.max(ref, 1e-3));
    }
  });
  it('has the published two-sided 5 % point: Q(1.959964) = 0.025', () => {
    // Standard normal table (any statistics handbook): z = 1.959964 for the 97.5 % quantile.
    expect(normalTail(1.959964)).toBeCloseTo(0.025, 7);
  });
});

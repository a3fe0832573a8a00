import jStat from 'jstat';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { quantileSorted, summarizeLot } from './summarizeLot.js';

const normals = (seed: string, n: number, mean: number, sd: number) => {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, () => jStat.normal.inv(rng(), mean, sd));
};

describe('summarizeLot', () => {
  it('reports moments, quantiles and a histogram that holds every value', () => {
    const x = normals('lot', 400, 100e3, 1.5e3);
    const s = summarizeLot(x);
    expect(s.count).toBe(400);
    expect(s.mean).toBeCloseTo(x.reduce((a, b) => a + b) / 400, 6);
    expect(s.histogram.counts.reduce((a, b) => a + b)).toBe(400);
    expect(s.quantiles.find((q) => q.p === 0.5)!.value).toBeGreaterThan(s.min);
    expect(s.fits.map((f) => f.dist)).toEqual(['normal', 'lognormal']);
    expect(s.fits[0]!.plausible).toBe(true);
    expect(s.binned!.looksBinned).toBe(false);
  });

  it('flags a lot with the ±1 % class sorted out of 5 % parts, and not a uniform one', () => {
    // 5 % parts (σ = 5/3 %), truncated at ±5 %, with everything within ±1 % removed.
    const rng = seedrandom('binned');
    const binned: number[] = [];
    while (binned.length < 400) {
      const r = jStat.normal.inv(rng(), 0, 5 / 3);
      if (Math.abs(r) > 1 && Math.abs(r) <= 5) binned.push(10e3 * (1 + r / 100));
    }
    const v = summarizeLot(binned).binned!;
    expect(v.looksBinned).toBe(true);
    expect(v.gap.low).toBeLessThan(10e3);
    expect(v.gap.high).toBeGreaterThan(10e3);
    expect(v.gap.high - v.gap.low).toBeGreaterThan(150);
    const uniform = Array.from({ length: 400 }, (_, i) => 1000 + i);
    expect(summarizeLot(uniform).binned!.looksBinned).toBe(false);
    expect(summarizeLot(normals('n', 30, 1, 0.1)).binned!.looksBinned).toBe(false);
  });

  it('interpolates quantiles like the type-7 rule of jstat.percentile (independent library)', () => {
    const x = normals('q', 101, 0, 1);
    const sorted = Float64Array.from(x).sort();
    for (const p of [0.01, 0.25, 0.5, 0.9]) {
      expect(quantileSorted(sorted, p)).toBeCloseTo(jStat.percentile(x, p), 12);
    }
  });

  it('fits no lognormal to a lot with a non-positive value, and nothing to a constant lot', () => {
    expect(summarizeLot([...normals('z', 20, 0, 1)]).fits.map((f) => f.dist)).toEqual(['normal']);
    const constant = summarizeLot(new Array(20).fill(4.7e3));
    expect(constant.fits).toEqual([]);
    expect(constant.sd).toBe(0);
  });
});

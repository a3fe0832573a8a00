import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createStream } from '../random/createStream.js';
import { applyPartSpreadInPlace, partQuantile, partRange, preparePartSpread } from './partSpread.js';
import type { SpreadSpec } from './spreadTypes.js';

const N = 200_000;
function sample(spread: SpreadSpec, tolerance: number, value = 1000): Float64Array {
  const p = preparePartSpread({ value, tolerance, spread });
  const u = new Float64Array(N);
  createStream('spread-test', spread.kind).fillOpen(u, N);
  const out = new Float64Array(N);
  applyPartSpreadInPlace(p, u, out, N);
  return out;
}
function moments(x: Float64Array): { mean: number; sd: number } {
  let m = 0;
  for (const v of x) m += v;
  m /= x.length;
  let ss = 0;
  for (const v of x) ss += (v - m) ** 2;
  return { mean: m, sd: Math.sqrt(ss / (x.length - 1)) };
}

// Reference values from jstat (independent statistics library) unless stated.
describe('part spreads: quantiles and moments against jstat', () => {
  it('normal: tolerance = 3σ by default, k configurable', () => {
    const p = preparePartSpread({ value: 1000, tolerance: 6, spread: { kind: 'normal' } });
    for (const u of [0.001, 0.1, 0.5, 0.9, 0.999]) {
      expect(partQuantile(p, u)).toBeCloseTo(jStat.normal.inv(u, 1000, 20), 5);
    }
    const m = moments(sample({ kind: 'normal', k: 2 }, 6));
    expect(m.mean).toBeCloseTo(1000, 0);
    expect(m.sd / 30).toBeCloseTo(1, 2);
  });

  it('uniform: nominal·(1 ± t/100)', () => {
    const p = preparePartSpread({ value: 1000, tolerance: 5, spread: { kind: 'uniform' } });
    for (const u of [0.01, 0.3, 0.77])
      expect(partQuantile(p, u)).toBeCloseTo(jStat.uniform.inv(u, 950, 1050), 8);
    const m = moments(sample({ kind: 'uniform' }, 5));
    expect(m.sd / Math.sqrt(jStat.uniform.variance(950, 1050))).toBeCloseTo(1, 2);
  });

  it('truncnormal: normal conditioned on ±t, moments per the truncated-normal formula', () => {
    const k = 2;
    const p = preparePartSpread({ value: 1000, tolerance: 4, spread: { kind: 'truncnormal', k } });
    const lo = jStat.normal.cdf(-k, 0, 1);
    const span = jStat.normal.cdf(k, 0, 1) - lo;
    for (const u of [0.01, 0.4, 0.95]) {
      expect(partQuantile(p, u)).toBeCloseTo(1000 + 20 * jStat.normal.inv(lo + u * span, 0, 1), 5);
    }
    // Var of N(0,1) truncated to [-k, k] is 1 − 2kφ(k)/(2Φ(k) − 1) (analytic).
    const varZ = 1 - (2 * k * jStat.normal.pdf(k, 0, 1)) / span;
    const x = sample({ kind: 'truncnormal', k }, 4);
    const m = moments(x);
    expect(m.sd / (20 * Math.sqrt(varZ))).toBeCloseTo(1, 2);
    expect(x.reduce((a, b) => Math.min(a, b))).toBeGreaterThanOrEqual(960);
    expect(x.reduce((a, b) => Math.max(a, b))).toBeLessThanOrEqual(1040);
  });

  it('binned: a gap of ±inner around nominal, normal shape outside it', () => {
    const p = preparePartSpread({ value: 1000, tolerance: 10, spread: { kind: 'binned', inner: 5 } });
    const sigma = 10 / 3; // ohms per percent-point: σ = 10 %/3 of 1000 Ω = 33.3 Ω
    const pa = jStat.normal.cdf(5 / (10 / 3), 0, 1);
    const m = jStat.normal.cdf(3, 0, 1) - pa;
    // Upper half of u maps to the upper band: u = 0.75 → the band's median.
    expect(partQuantile(p, 0.75)).toBeCloseTo(1000 + sigma * 10 * jStat.normal.inv(pa + 0.5 * m, 0, 1), 5);
    expect(partQuantile(p, 0.25)).toBeCloseTo(1000 - sigma * 10 * jStat.normal.inv(pa + 0.5 * m, 0, 1), 5);
    const x = sample({ kind: 'binned', inner: 5 }, 10);
    expect(x.every((v) => Math.abs(v - 1000) >= 50 - 1e-9 && Math.abs(v - 1000) <= 100 + 1e-9)).toBe(true);
    expect(moments(x).mean).toBeCloseTo(1000, -1);
  });

  it('lognormal: median nominal, σ_ln = ln(1 + t/100)/k', () => {
    const s = Math.log(1.1) / 3;
    const p = preparePartSpread({ value: 1000, tolerance: 10, spread: { kind: 'lognormal' } });
    for (const u of [0.005, 0.5, 0.9])
      expect(partQuantile(p, u)).toBeCloseTo(jStat.lognormal.inv(u, Math.log(1000), s), 5);
    const m = moments(sample({ kind: 'lognormal' }, 10));
    expect(m.mean / jStat.lognormal.mean(Math.log(1000), s)).toBeCloseTo(1, 3);
    expect(m.sd / Math.sqrt(jStat.lognormal.variance(Math.log(1000), s))).toBeCloseTo(1, 2);
  });

  it('fixed and zero tolerance give the nominal; empirical resamples the lot evenly', () => {
    expect(sample({ kind: 'fixed' }, 5).every((v) => v === 1000)).toBe(true);
    expect(sample({ kind: 'normal' }, 0).every((v) => v === 1000)).toBe(true);
    const lot = [990, 1010, 1003, 997];
    const x = sample({ kind: 'empirical', values: lot }, 0);
    const counts = lot.map((v) => x.filter((y) => y === v).length);
    for (const c of counts) expect(Math.abs(c / N - 0.25)).toBeLessThan(0.005);
    expect(
      partRange(preparePartSpread({ value: 1000, tolerance: 0, spread: { kind: 'empirical', values: lot } })),
    ).toEqual({
      low: 990,
      high: 1010,
    });
  });

  it('rejects impossible parameters naming the field', () => {
    expect(() =>
      preparePartSpread({ value: 1, tolerance: 5, spread: { kind: 'binned', inner: 5 } }, 'parts.rk'),
    ).toThrow('parts.rk.spread.inner');
    expect(() =>
      preparePartSpread({ value: 1, tolerance: 100, spread: { kind: 'uniform' } }, 'parts.rl1'),
    ).toThrow('parts.rl1.tolerance');
  });
});

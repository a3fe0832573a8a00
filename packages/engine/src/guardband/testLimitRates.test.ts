import jStat from 'jstat';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { suggestGuardBand } from './suggestGuardBand.js';
import { testLimitRates } from './testLimitRates.js';

/**
 * Independent reference: 2-D composite Simpson over the (true value x, measured value m) plane of
 * the joint density jstat.normal.pdf(x; μ, σp)·jstat.normal.pdf(m; x, σm), on the rectangles
 * where a bad part is accepted (x outside spec, m inside test) or a good one rejected.
 */
function simpson2d(
  f: (x: number, m: number) => number,
  x0: number,
  x1: number,
  m0: number,
  m1: number,
  n = 400,
) {
  const w = (i: number) => (i === 0 || i === n ? 1 : i % 2 ? 4 : 2);
  const hx = (x1 - x0) / n;
  const hm = (m1 - m0) / n;
  let s = 0;
  for (let i = 0; i <= n; i++) for (let j = 0; j <= n; j++) s += w(i) * w(j) * f(x0 + i * hx, m0 + j * hm);
  return (s * hx * hm) / 9;
}

describe('testLimitRates', () => {
  const mean = 100;
  const sd = 1;
  const sm = 0.25;
  const spec = { low: 97.5, high: 102.5 };
  const test = { low: 97.8, high: 102.2 };
  const joint = (x: number, m: number) => jStat.normal.pdf(x, mean, sd) * jStat.normal.pdf(m, x, sm);
  const far = 10;

  it('matches a 2-D integration of the joint density built from jstat (independent library)', () => {
    const r = testLimitRates({ process: { mean, sd }, measurementSd: sm, spec, test });
    const faRef =
      simpson2d(joint, mean - far, spec.low, test.low, test.high) +
      simpson2d(joint, spec.high, mean + far, test.low, test.high);
    const frRef =
      simpson2d(joint, spec.low, spec.high, mean - far, test.low) +
      simpson2d(joint, spec.low, spec.high, test.high, mean + far);
    expect(r.falseAccept / faRef).toBeCloseTo(1, 5);
    expect(r.falseReject / frRef).toBeCloseTo(1, 5);
    expect(r.good).toBeCloseTo(jStat.normal.cdf(102.5, mean, sd) - jStat.normal.cdf(97.5, mean, sd), 12);
    expect(r.accepted).toBeCloseTo(
      jStat.normal.cdf(102.2, mean, Math.hypot(sd, sm)) - jStat.normal.cdf(97.8, mean, Math.hypot(sd, sm)),
      12,
    );
  });

  it('agrees with a seeded Monte Carlo of the tester (seedrandom + jstat, independent libraries)', () => {
    const rng = seedrandom('tester');
    const n = 400_000;
    let fa = 0;
    let fr = 0;
    const spec1 = { high: 101.5 };
    const test1 = { high: 101.2 };
    for (let i = 0; i < n; i++) {
      const x = jStat.normal.inv(rng(), mean, sd);
      const m = x + jStat.normal.inv(rng(), 0, 0.5);
      const good = x <= spec1.high;
      const ok = m <= test1.high;
      if (!good && ok) fa++;
      if (good && !ok) fr++;
    }
    const r = testLimitRates({ process: { mean, sd }, measurementSd: 0.5, spec: spec1, test: test1 });
    for (const [got, count] of [
      [r.falseAccept, fa],
      [r.falseReject, fr],
    ] as const) {
      const p = count / n;
      expect(Math.abs(got - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / n));
    }
  });

  it('has no false accepts or rejects with a perfect tester at the spec limits (analytic)', () => {
    const r = testLimitRates({ process: { mean, sd }, measurementSd: 0, spec, test: spec });
    expect(r.falseAccept).toBeLessThan(1e-12);
    expect(r.falseReject).toBeLessThan(1e-12);
  });

  it('refuses impossible input naming the field', () => {
    expect(() => testLimitRates({ process: { mean, sd: 0 }, measurementSd: 0.1, spec, test })).toThrow(
      /process\.sd/,
    );
    expect(() =>
      testLimitRates({ process: { mean, sd }, measurementSd: 0.1, spec, test: { low: 2, high: 1 } }),
    ).toThrow(/test\.high/);
  });
});

describe('suggestGuardBand', () => {
  it('finds the smallest guard band that meets the false-accept target', () => {
    const input = { process: { mean: 100, sd: 1 }, measurementSd: 0.3, spec: { low: 97.5, high: 102.5 } };
    const s = suggestGuardBand(input, 50e-6);
    expect(s.reached).toBe(true);
    expect(s.rates.falseAccept).toBeLessThanOrEqual(50e-6);
    expect(s.rates.falseAccept).toBeGreaterThan(49e-6);
    expect(s.guardBand).toBeGreaterThan(0);
    expect(s.test.low).toBeCloseTo(97.5 + s.guardBand, 12);
    // Less guard band: over the target.
    const tighter = { low: 97.5 + s.guardBand * 0.99, high: 102.5 - s.guardBand * 0.99 };
    expect(testLimitRates({ ...input, test: tighter }).falseAccept).toBeGreaterThan(50e-6);
  });

  it('needs no guard band when the test limits already meet the target', () => {
    const s = suggestGuardBand(
      { process: { mean: 0, sd: 1 }, measurementSd: 0.01, spec: { low: -6, high: 6 } },
      1e-3,
    );
    expect(s.guardBand).toBe(0);
    expect(s.reached).toBe(true);
  });
});

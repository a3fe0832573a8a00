import { describe, expect, it } from 'vitest';
import { harmonicsOfPeriod, harmonicsOfTransfer } from './harmonics.js';
import { lcg } from './testRandom.js';

/** A second, independent transform: the direct DFT sum, Hk = (2/n)·|Σ y_j·e^(−2πijk/n)|. */
function directDft(y: Float64Array, k: number): number {
  let re = 0;
  let im = 0;
  for (let j = 0; j < y.length; j++) {
    re += y[j] * Math.cos((2 * Math.PI * j * k) / y.length);
    im -= y[j] * Math.sin((2 * Math.PI * j * k) / y.length);
  }
  return (2 * Math.hypot(re, im)) / y.length;
}

describe('harmonicsOfTransfer', () => {
  it('gives H2/H1 = b·A/(2a) for a pure quadratic y = a·x + b·x² (analytic: x² = (1 − cos 2θ)/2)', () => {
    for (const [a, b, amp] of [
      [2, 0.1, 1],
      [-30, 0.8, 2.5],
      [55, -3, 0.2],
    ]) {
      const h = harmonicsOfTransfer((x) => a * x + b * x * x, amp);
      expect(h.h2 / h.h1).toBeCloseTo(Math.abs((b * amp) / (2 * a)), 12);
      expect(h.h1).toBeCloseTo(Math.abs(a) * amp, 10);
      expect(h.h3 / h.h1).toBeLessThan(1e-12);
      expect(h.thdPercent).toBeCloseTo(h.h2Percent, 9);
      expect(h.h2Db).toBeCloseTo(20 * Math.log10(Math.abs((b * amp) / (2 * a))), 9);
    }
  });

  it('gives H3/H1 = c·A²/(4a + 3c·A²) for a cubic (analytic: sin³θ = (3 sin θ − sin 3θ)/4)', () => {
    const [a, c, amp] = [10, 0.5, 1.5];
    const h = harmonicsOfTransfer((x) => a * x + c * x ** 3, amp);
    expect(h.h3 / h.h1).toBeCloseTo((c * amp ** 2) / (4 * a + 3 * c * amp ** 2), 12);
  });
});

describe('harmonicsOfPeriod', () => {
  it('agrees with a direct DFT sum on random signals (independent transform)', () => {
    const r = lcg(4);
    for (let t = 0; t < 20; t++) {
      const n = 2 ** (3 + Math.floor(r() * 6));
      const y = Float64Array.from({ length: n }, () => r() - 0.5);
      const h = harmonicsOfPeriod(y);
      expect(h.h1).toBeCloseTo(directDft(y, 1), 12);
      expect(h.h2).toBeCloseTo(directDft(y, 2), 12);
      expect(h.h3).toBeCloseTo(directDft(y, 3), 12);
      let rest = 0;
      for (let k = 2; k < n / 2; k++) rest += directDft(y, k) ** 2;
      expect(h.thdPercent).toBeCloseTo((100 * Math.sqrt(rest)) / directDft(y, 1), 9);
    }
  });
});

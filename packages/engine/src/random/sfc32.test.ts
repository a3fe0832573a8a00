import { describe, expect, it } from 'vitest';
import { createStream } from './createStream.js';

describe('seeded streams (sfc32 seeded through seedrandom alea hash)', () => {
  it('same seed and labels give the same stream; other labels give another', () => {
    const a = createStream('seed', 'draw', 0, 1);
    const b = createStream('seed', 'draw', 0, 1);
    const c = createStream('seed', 'draw', 1, 1);
    const xa = Array.from({ length: 100 }, () => a.nextUint32());
    expect(Array.from({ length: 100 }, () => b.nextUint32())).toEqual(xa);
    expect(Array.from({ length: 100 }, () => c.nextUint32())).not.toEqual(xa);
  });

  it('doubles lie in [0, 1) and open draws in (0, 1), with uniform moments', () => {
    // Uniform(0,1): mean 1/2, variance 1/12 (analytic). n = 1e6: sd of the mean ≈ 2.9e-4.
    const g = createStream('moments');
    const n = 1_000_000;
    let sum = 0;
    let sum2 = 0;
    let lo = 1;
    let hi = 0;
    for (let i = 0; i < n; i++) {
      const u = i % 2 ? g.nextDouble() : g.nextOpen();
      sum += u;
      sum2 += u * u;
      lo = Math.min(lo, u);
      hi = Math.max(hi, u);
    }
    const mean = sum / n;
    expect(lo).toBeGreaterThanOrEqual(0);
    expect(hi).toBeLessThan(1);
    expect(Math.abs(mean - 0.5)).toBeLessThan(2e-3);
    expect(Math.abs(sum2 / n - mean * mean - 1 / 12)).toBeLessThan(1e-3);
  });

  it('nextBelow covers 0..m-1 evenly', () => {
    const g = createStream('below');
    const counts = new Array(7).fill(0);
    for (let i = 0; i < 70_000; i++) counts[g.nextBelow(7)]++;
    for (const c of counts) expect(Math.abs(c - 10_000)).toBeLessThan(500);
  });
});

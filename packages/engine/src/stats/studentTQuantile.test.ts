import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { studentTQuantile } from './studentTQuantile.js';

describe('studentTQuantile', () => {
  it('matches jStat.studentt.inv (an independent implementation from npm) to its accuracy', () => {
    // jStat's own inverse is good to ~1e-8 (it iterates to a looser stopping rule).
    for (const df of [1, 2, 3, 5, 10, 31, 47, 100, 511])
      for (const p of [0.001, 0.025, 0.1, 0.4, 0.6, 0.9, 0.975, 0.999]) {
        const ref = jStat.studentt.inv(p, df);
        expect(Math.abs(studentTQuantile(p, df) - ref)).toBeLessThan(1e-7 * Math.max(1, Math.abs(ref)));
      }
  });

  it('gives the printed table values', () => {
    // Student t table, two-sided 95 % (common textbook tables): 12.706 (1), 2.228 (10), 2.042 (30).
    expect(studentTQuantile(0.975, 1)).toBeCloseTo(12.706, 3);
    expect(studentTQuantile(0.975, 10)).toBeCloseTo(2.228, 3);
    expect(studentTQuantile(0.975, 30)).toBeCloseTo(2.042, 3);
    // Tends to the normal quantile 1.95996 (analytic limit).
    // A 16-digit reference value, from memory: t(0.975, 10) = 2.2281388519649385.
    expect(studentTQuantile(0.975, 10)).toBeCloseTo(2.2281388519649385, 9);
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.95996, 4);
    expect(studentTQuantile(0.5, 7)).toBe(0);
    expect(studentTQuantile(0.025, 10)).toBeCloseTo(-2.228, 3);
  });
});

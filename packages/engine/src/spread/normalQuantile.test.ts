import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { normalCdf } from './normalCdf.js';
import { normalQuantile } from './normalQuantile.js';

describe('normal quantile and CDF against jstat (independent statistics library)', () => {
  it('quantile matches jStat.normal.inv to 1e-8 relative (approximation stated: 1.15e-9)', () => {
    for (const p of [1e-9, 1e-6, 0.00135, 0.02, 0.02425, 0.1, 0.3, 0.5, 0.7, 0.975, 0.99865, 1 - 1e-6]) {
      const ref = jStat.normal.inv(p, 0, 1);
      expect(Math.abs(normalQuantile(p) - ref)).toBeLessThanOrEqual(1e-8 * Math.max(1, Math.abs(ref)));
    }
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
  });

  it('CDF matches jStat.normal.cdf in the centre and tails', () => {
    for (const x of [-8, -6, -5.5, -4, -3, -1, 0, 0.5, 2, 3, 4.9, 5.1, 7]) {
      const ref = jStat.normal.cdf(x, 0, 1);
      expect(Math.abs(normalCdf(x) - ref)).toBeLessThanOrEqual(1e-12 * ref + 1e-15);
    }
    // Φ(-3) = 0.001349898031630 (standard normal table value).
    expect(normalCdf(-3)).toBeCloseTo(0.00134989803163, 14);
  });
});

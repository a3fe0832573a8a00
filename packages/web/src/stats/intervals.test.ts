// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { wilsonInterval } from './wilsonInterval.js';

describe('wilsonInterval', () => {
  it('gives the published upper bound for 0 of 10', () => {
    // Wilson (1927) score interval; 0/10 at 95 % → [0, 0.2775], as tabulated in Newcombe (1998), table I.
    const [lo, hi] = wilsonInterval(0, 10);
    expect(lo).toBe(0);
    expect(hi).toBeCloseTo(0.2775, 4);
  });
  it('matches a hand computation for 81 of 263', () => {
    // Hand-computed with the closed form in Python: [0.2552885, 0.3662096].
    const [lo, hi] = wilsonInterval(81, 263);
    expect(lo).toBeCloseTo(0.2552885198782742, 10);
    expect(hi).toBeCloseTo(0.36620957698280004, 10);
  });
  it('stays inside [0, 1] near a yield of 1', () => {
    const [lo, hi] = wilsonInterval(9990, 10000);
    expect(lo).toBeCloseTo(0.9981600556125619, 10);
    expect(hi).toBeCloseTo(0.9994567140135028, 10);
    expect(wilsonInterval(5, 0)[0]).toBeNaN();
  });
});

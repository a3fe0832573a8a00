// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { commonEdges, rebinHistogram } from './rebinHistogram.js';

describe('commonEdges', () => {
  it('spans every histogram with equal bins', () => {
    expect(
      commonEdges(
        [
          [0, 1, 2],
          [1, 3],
        ],
        4,
      ),
    ).toEqual([0, 0.75, 1.5, 2.25, 3]);
    expect(commonEdges([], 4)).toEqual([]);
  });
});

describe('rebinHistogram', () => {
  it('is the identity on the same edges', () => {
    expect(rebinHistogram([0, 1, 2, 3], [5, 7, 9], [0, 1, 2, 3])).toEqual([5, 7, 9]);
  });
  it('splits counts in proportion to overlap (uniform within a bin)', () => {
    // Hand-computed: bin [0,2) with 10 counts onto [0,1),[1,2) → 5, 5; [2,4) with 4 onto [2,3),[3,4) → 2, 2.
    expect(rebinHistogram([0, 2, 4], [10, 4], [0, 1, 2, 3, 4])).toEqual([5, 5, 2, 2]);
    // Coarsening: [0,1),[1,2) onto [0,2) → sum.
    expect(rebinHistogram([0, 1, 2], [3, 4], [0, 2])).toEqual([7]);
  });
  it('preserves the total inside the target range and drops what lies outside', () => {
    const out = rebinHistogram([0, 1, 2, 3], [6, 6, 6], [0.5, 1.5, 2.5]);
    expect(out).toEqual([6, 6]);
    const inside = rebinHistogram([0, 0.3, 1.1, 2], [3, 8, 9], [0, 0.5, 1, 1.5, 2]);
    expect(inside.reduce((a, b) => a + b, 0)).toBeCloseTo(20, 12);
  });
});

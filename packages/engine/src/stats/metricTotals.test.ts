import { describe, expect, it } from 'vitest';
import { createStream } from '../random/createStream.js';
import { gridFromRange } from './histogramGrid.js';
import { summarizeColumn } from './metricChunk.js';
import { addMetricChunkInPlace, createMetricTotals, totalsSd } from './metricTotals.js';
import { quantileFromBins } from './quantileFromBins.js';

describe('mergeable metric statistics', () => {
  const g = createStream('totals');
  const n = 50_000;
  const x = Float64Array.from({ length: n }, () => 10 + g.nextOpen() ** 3);
  x[7] = NaN;
  const grid = gridFromRange(10, 11);

  it('chunked Chan merge equals the direct two-pass mean and sd', () => {
    const t = createMetricTotals(grid);
    for (let s = 0; s < n; s += 4096) {
      const part = x.subarray(s, Math.min(n, s + 4096));
      addMetricChunkInPlace(t, JSON.parse(JSON.stringify(summarizeColumn(part, part.length, grid))));
    }
    const finite = [...x].filter(Number.isFinite);
    const mean = finite.reduce((a, b) => a + b, 0) / finite.length;
    const sd = Math.sqrt(finite.reduce((a, b) => a + (b - mean) ** 2, 0) / (finite.length - 1));
    expect(t.count).toBe(n - 1);
    expect(t.mean).toBeCloseTo(mean, 12);
    expect(totalsSd(t)).toBeCloseTo(sd, 12);
  });

  it('histogram quantiles are within the stated bound (one bin width) of the exact sample quantiles', () => {
    const t = createMetricTotals(grid);
    addMetricChunkInPlace(t, summarizeColumn(x, n, grid));
    const sorted = [...x].filter(Number.isFinite).sort((a, b) => a - b);
    for (const p of [0.00135, 0.025, 0.5, 0.975, 0.99865]) {
      const exact = sorted[Math.ceil(p * sorted.length) - 1];
      const q = quantileFromBins(t, grid, p);
      expect(q.maxError).toBeLessThanOrEqual(grid.width + 1e-12);
      expect(Math.abs(q.value - exact)).toBeLessThanOrEqual(q.maxError + 1e-12);
    }
  });

  it('values outside the grid land in underflow/overflow and bound the error honestly', () => {
    const narrow = gridFromRange(10.4, 10.6);
    const t = createMetricTotals(narrow);
    addMetricChunkInPlace(t, summarizeColumn(x, n, narrow));
    expect(t.under + t.over).toBeGreaterThan(0);
    const q = quantileFromBins(t, narrow, 0.01);
    expect(q.value).toBeGreaterThanOrEqual(t.min);
    expect(q.maxError).toBeGreaterThan(narrow.width);
  });
});

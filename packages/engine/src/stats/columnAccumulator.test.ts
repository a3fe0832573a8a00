import { describe, expect, it } from 'vitest';
import {
  accumulateColumnInPlace,
  columnAccumulatorResult,
  createColumnAccumulator,
} from './columnAccumulator.js';
import { gridFromRange, type HistogramGrid } from './histogramGrid.js';
import type { MetricChunk } from './metricChunk.js';
import { createStream } from '../random/createStream.js';

/** The plain per-sample definition (shift = first finite value), to hold the fast paths to. */
function reference(x: readonly number[], grid: HistogramGrid): MetricChunk {
  let count = 0;
  let shift = NaN;
  let s1 = 0;
  let s2 = 0;
  let min = Infinity;
  let max = -Infinity;
  let under = 0;
  let over = 0;
  const bins = new Uint32Array(grid.bins);
  for (const v of x) {
    if (!Number.isFinite(v)) continue;
    if (count === 0) shift = v;
    count++;
    s1 += v - shift;
    s2 += (v - shift) * (v - shift);
    min = Math.min(min, v);
    max = Math.max(max, v);
    const b = (v - grid.lo) * (1 / grid.width);
    if (b < 0) under++;
    else if (b >= grid.bins) over++;
    else bins[Math.floor(b)]++;
  }
  const acc = createColumnAccumulator(grid);
  Object.assign(acc, { count, shift, s1, s2, min, max, under, over });
  acc.bins.set(bins);
  return columnAccumulatorResult(acc);
}

function fedInBlocks(blocks: number[][], grid: HistogramGrid): MetricChunk {
  const acc = createColumnAccumulator(grid);
  for (const b of blocks) accumulateColumnInPlace(acc, Float64Array.from(b), b.length);
  return columnAccumulatorResult(acc);
}

describe('accumulateColumnInPlace', () => {
  const grid = gridFromRange(1, 3);
  const cases: Record<string, number[][]> = {
    'blocks of one repeated value (added in one step)': [
      [2, 2, 2, 2],
      [2, 2, 2],
    ],
    'a leading non-finite value, then a repeated value': [[NaN, 2.5, 2.5, 2.5], [2.5]],
    'a repeated block that differs from the shift': [
      [2, 2.25, 2],
      [2.75, 2.75, 2.75],
    ],
    'repeated values outside the grid': [[9, 9, 9], [-4, -4], [9]],
    'a repeated value, then a varying block with a gap': [
      [1.5, 1.5],
      [1.25, NaN, Infinity, 2.9, 1.5],
    ],
    'only non-finite values': [[NaN, NaN], [-Infinity]],
    'an empty block': [[], [2, 2], []],
  };
  for (const [name, blocks] of Object.entries(cases)) {
    it(`matches the per-sample definition bit for bit: ${name}`, () => {
      expect(fedInBlocks(blocks, grid)).toEqual(reference(blocks.flat(), grid));
    });
  }

  it('a repeated value counts every sample in its bin with zero spread', () => {
    const r = fedInBlocks([[2, 2, 2, 2, 2]], grid);
    expect(r).toMatchObject({ count: 5, mean: 2, m2: 0, min: 2, max: 2, under: 0, over: 0, bins: [5] });
  });

  it('matches the per-sample definition on long seeded blocks of every kind of value, in any block sizes', () => {
    // Mostly values inside the grid (the four-samples-per-step path), with values below and above
    // it, NaN, ±Infinity, -0 and 0, and repeats mixed in at random places, so every group of four
    // that falls back to one-by-one is met too. Blocks of 1 to 700 samples (not multiples of 4).
    const g = createStream('accumulator-blocks');
    const zeroGrid = gridFromRange(-1, 1);
    for (const grid of [gridFromRange(1, 3), zeroGrid]) {
      for (let round = 0; round < 20; round++) {
        const values: number[] = [];
        const special = [NaN, Infinity, -Infinity, -0, 0, grid.lo, grid.lo + grid.width * grid.bins, -50, 50];
        // Even rounds: no values off the grid, so the extremes come from the four-sample path.
        const rate = round % 2 === 0 ? 0 : 0.03;
        for (let i = 0; i < 3000; i++) {
          const r = g.nextDouble();
          if (r < rate) values.push(special[g.nextBelow(special.length)]);
          else if (r < rate + 0.03 && values.length > 0) values.push(values[values.length - 1]);
          else values.push(grid.lo + (g.nextDouble() * (1 + 2 * rate) - rate) * grid.width * grid.bins);
        }
        const blocks: number[][] = [];
        for (let at = 0; at < values.length;) {
          const len = 1 + g.nextBelow(700);
          blocks.push(values.slice(at, at + len));
          at += len;
        }
        expect(fedInBlocks(blocks, grid)).toEqual(reference(values, grid));
      }
    }
  });

  it('keeps the extremes exact when many values share one bin position (rounding in x − lo)', () => {
    // x − lo rounds to the same double for every x in (0, 1) here, so every sample ties with the
    // minimum and maximum in bin position while the values differ.
    const grid: HistogramGrid = { lo: -1e20, width: 1e17, bins: 2048 };
    const g = createStream('accumulator-ties');
    const values = Array.from({ length: 1001 }, () => g.nextDouble());
    // A first value far above (below) makes only the minimum (maximum) side tie.
    for (const first of [[], [5e4], [-5e4]]) {
      const xs = [...first, ...values];
      expect(fedInBlocks([xs.slice(0, 333), xs.slice(333)], grid)).toEqual(reference(xs, grid));
    }
    // A new extreme that ties in bin position, at each place in a group of four, the others inside.
    const records = [0.95, 1e6, 5e5, 5e5];
    for (let k = 1; k <= 40; k++) {
      const group = [5e5, 5e5, 5e5, 5e5];
      group[k % 4] = Math.floor(k / 4) % 2 === 0 ? 0.95 - 0.02 * k : 1e6 + 0.1 * k;
      records.push(...group);
    }
    for (let end = 8; end <= records.length; end += 4) {
      expect(fedInBlocks([records.slice(0, end)], grid)).toEqual(reference(records.slice(0, end), grid));
    }
    expect(fedInBlocks([records], grid)).toMatchObject({ min: 0.95 - 0.02 * 40, max: 1e6 + 0.1 * 39 });
  });
});

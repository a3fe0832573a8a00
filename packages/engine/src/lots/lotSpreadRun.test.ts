import jStat from 'jstat';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { mergeChunks, runChunk, runExtras, sampleRows } from '../run/runApi.js';
import type { RunPlan } from '../run/runPlan.js';

const plan: RunPlan = { samples: 20_000, seed: 'lot-run', plan: 'random', chunkSize: 20_000 };

function column(rows: { columns: string[]; rows: Iterable<number[]> }, name: string): number[] {
  const i = rows.columns.indexOf(name);
  return [...rows.rows].map((r) => r[i]!);
}
const meanOf = (x: number[]) => x.reduce((a, b) => a + b, 0) / x.length;
const sdOf = (x: number[]) => {
  const m = meanOf(x);
  return Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1));
};
const corr = (a: number[], b: number[]) => {
  const ma = meanOf(a);
  const mb = meanOf(b);
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i]! - ma) * (b[i]! - mb);
  return s / (a.length - 1) / (sdOf(a) * sdOf(b));
};

describe('a lot used as a spread', () => {
  it("gives a resistor column whose mean and sd are the lot's within Monte Carlo error", () => {
    const rng = seedrandom('rk-lot');
    const lot = Array.from({ length: 300 }, () => jStat.normal.inv(rng(), 468, 6));
    const design = buildTestDesign();
    design.parts.rk = {
      value: 470,
      tolerance: 5,
      spread: { kind: 'empirical', values: lot, lot: { name: 'rk lot' } },
    };
    const rk = column(sampleRows(design, plan, 0), 'rk');
    const n = rk.length;
    expect(Math.abs(meanOf(rk) - meanOf(lot))).toBeLessThan((4 * sdOf(lot)) / Math.sqrt(n));
    // sd of a sample sd ≈ σ/√(2n) for a near-normal parent.
    expect(Math.abs(sdOf(rk) - sdOf(lot))).toBeLessThan((4 * sdOf(lot)) / Math.sqrt(2 * n));
    expect(new Set(rk).size).toBeLessThanOrEqual(300);
  });

  it("draws whole tubes, so the sections' correlation is the lot's own; bit-reproducible", () => {
    const rng = seedrandom('tube-lot');
    const tubes: [number, number, number, number][] = [];
    for (let i = 0; i < 200; i++) {
      const common = jStat.normal.inv(rng(), 0, 0.1);
      const p1 = Math.exp(common + jStat.normal.inv(rng(), 0, 0.03));
      const p2 = Math.exp(common + jStat.normal.inv(rng(), 0, 0.03));
      tubes.push([
        p1,
        p2,
        Math.exp(jStat.normal.inv(rng(), 0, 0.02)),
        Math.exp(jStat.normal.inv(rng(), 0, 0.02)),
      ]);
    }
    const design = buildTestDesign();
    design.tube.spread = { perveanceSd: 10, muSd: 3, sectionCorrelation: 0, lot: { name: 'tubes', tubes } };
    const rows = sampleRows(design, plan, 0);
    const p1 = column(rows, 'perv1');
    const p2 = column(rows, 'perv2');
    const lotCorr = corr(
      tubes.map((t) => t[0]),
      tubes.map((t) => t[1]),
    );
    expect(lotCorr).toBeGreaterThan(0.8);
    expect(Math.abs(corr(p1, p2) - lotCorr)).toBeLessThan(0.02);
    expect(Math.abs(meanOf(p1) - meanOf(tubes.map((t) => t[0])))).toBeLessThan(0.005);
    // Every sampled pair is a tube of the lot.
    const known = new Set(tubes.map((t) => `${t[0]}|${t[1]}`));
    expect(p1.every((v, i) => known.has(`${v}|${p2[i]}`))).toBe(true);
    const small = { ...plan, samples: 2000, chunkSize: 2000 };
    expect(JSON.stringify(runChunk(design, small, 0))).toBe(JSON.stringify(runChunk(design, small, 0)));
  });

  it('applies a pairing rule by redrawing whole tubes from the lot', () => {
    const tubes: [number, number, number, number][] = [
      [1, 1.02, 1, 1],
      [1, 1.4, 1, 1],
      [0.9, 0.91, 1, 1],
    ];
    const design = buildTestDesign();
    design.tube.spread = {
      perveanceSd: 0,
      muSd: 0,
      sectionCorrelation: 0,
      pairing: { quantity: 'ia', within: 5 },
      lot: { name: 'tubes', tubes },
    };
    const rows = sampleRows(design, { ...plan, samples: 3000, chunkSize: 3000 }, 0);
    const p2 = column(rows, 'perv2');
    expect(p2.includes(1.4)).toBe(false);
    expect(p2.includes(1.02) && p2.includes(0.91)).toBe(true);
  });

  it('runs with every analysis on (influence, variance indices, worst case) and a one-tube lot', () => {
    const design = buildTestDesign();
    design.tube.spread = {
      perveanceSd: 10,
      muSd: 3,
      sectionCorrelation: 0.5,
      lot: {
        name: 'tubes',
        tubes: [
          [1.05, 0.97, 1.01, 0.99],
          [0.92, 0.95, 1.02, 1.0],
          [1.1, 1.12, 0.98, 0.97],
        ],
      },
    };
    design.parts.rk = {
      value: 470,
      tolerance: 5,
      spread: { kind: 'empirical', values: [465, 468, 470, 473, 476] },
    };
    const p: RunPlan = { samples: 4000, seed: 'all', plan: 'sobol', chunkSize: 2000 };
    const chunks = [runChunk(design, p, 0), runChunk(design, p, 1)];
    const results = mergeChunks(design, p, chunks, runExtras(design, p));
    expect(results.metrics.balanceDb!.count).toBe(4000);
    expect(Number.isFinite(results.metrics.balanceDb!.sd)).toBe(true);
    expect(results.worstCase).toBeDefined();

    design.tube.spread = { ...design.tube.spread, lot: { name: 'one', tubes: [[1.05, 0.97, 1.01, 0.99]] } };
    const one = sampleRows(design, { ...p, plan: 'random', samples: 100, chunkSize: 100 }, 0);
    expect(new Set(column(one, 'perv2'))).toEqual(new Set([0.97]));
  });
});

import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import type { PartName } from '../design/designSchema.js';
import { INPUTS } from '../model/stageKernel.js';
import { mergeChunks, runChunk } from '../run/runApi.js';
import { chunkCount } from '../run/runPlan.js';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { commonUniforms, partColumn, tubeColumns } from './commonDraws.js';
import { maxFailures } from './rejectBounds.js';
import { countFailures, createSampleJudge } from './sampleJudge.js';
import { plannedDesign, searchPlan } from './searchPlan.js';
import type { PriceTable } from './priceTable.js';

const prices: PriceTable = {
  currency: 'EUR',
  resistors: [
    { kind: 'metal-film', tolerance: 10, price: 0.02 },
    { kind: 'metal-film', tolerance: 5, price: 0.03 },
    { kind: 'metal-film', tolerance: 1, price: 0.09 },
  ],
  tubes: { unmatched: 14, matched: 19 },
};

// Balance is what the classes move: a tight balance spec gives a frontier with several steps.
const design = buildTestDesign({
  tube: { type: '12AX7', spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0.5 } },
  specs: [{ metric: 'balanceDb', min: -0.6, max: 0.6 }],
});
const planned: PartName[] = ['rl1', 'rl2', 'rk'];
const n = 4000;

describe('searchPlan', () => {
  it('equals an exhaustive search over 3 parts × 3 classes on the same draws', () => {
    const targetPpm = 20_000;
    const result = searchPlan(design, {
      prices,
      targetPpm,
      samples: n,
      seed: 'x',
      parts: planned,
      tubes: ['unmatched'],
    });
    // Exhaustive reference: judge all 27 candidates on every sample.
    const judge = createSampleJudge(design);
    const nominal = judge.kernel.nominalInputs();
    const tubes = tubeColumns(design, { kind: 'unmatched' }, 'x', n);
    const allow = maxFailures(targetPpm, n, 0.95);
    let best: { cost: number; classes: number[]; fails: number } | null = null;
    const failsOf = new Map<string, number>();
    const classes = [10, 5, 1];
    for (const a of classes)
      for (const b of classes)
        for (const c of classes) {
          const tol: Record<string, number> = { rl1: a, rl2: b, rk: c };
          const columns = INPUTS.map((id, i) => {
            if (id === 'perv1' || id === 'perv2' || id === 'mu1' || id === 'mu2') return tubes[id];
            const part = design.parts[id as PartName];
            if (!part) return new Float64Array(n).fill(nominal[i]);
            return partColumn(part, tol[id] ?? part.tolerance, commonUniforms('x', 'part', id, n), n);
          });
          const { fails } = countFailures(judge, columns, n, null, Infinity);
          failsOf.set(JSON.stringify([a, b, c]), fails);
          const cost =
            [a, b, c].reduce((s, t) => s + prices.resistors.find((r) => r.tolerance === t)!.price, 0) + 14;
          if (fails <= allow && (best === null || cost < best.cost - 1e-12))
            best = { cost, classes: [a, b, c], fails };
        }
    expect(best).not.toBeNull();
    expect(result.chosen?.cost).toBeCloseTo(best!.cost, 12);
    // Plans of equal cost may tie; the chosen one's count equals the exhaustive count of the same plan.
    const chosen = result.chosen!.assignment.classes;
    expect(result.chosen?.fails).toBe(failsOf.get(JSON.stringify([chosen.rl1, chosen.rl2, chosen.rk])));
    expect(result.chosen!.fails).toBeLessThanOrEqual(allow);
    expect(result.candidates).toBe(27);
    // The frontier is cheaper as it gets looser.
    for (let i = 1; i < result.frontier.length; i++) {
      expect(result.frontier[i].cost).toBeGreaterThan(result.frontier[i - 1].cost);
      expect(result.frontier[i].fails).toBeLessThanOrEqual(result.frontier[i - 1].fails);
    }
  });

  it("the chosen plan's reject rate is confirmed by an ordinary run with another seed", () => {
    const result = searchPlan(design, {
      prices,
      targetPpm: 20_000,
      samples: n,
      seed: 'plan-seed',
      parts: planned,
    });
    const point = result.chosen!;
    const confirm = plannedDesign(design, result, point);
    const plan = {
      samples: 20_000,
      seed: 'confirming-run',
      plan: 'random' as const,
      chunkSize: 10_000,
      analyses: { influence: false, varianceIndices: false, worstCase: false },
    };
    const chunks = Array.from({ length: chunkCount(plan) }, (_v, k) => runChunk(confirm, plan, k));
    const results = mergeChunks(confirm, plan, chunks);
    const confirmPpm = (1 - results.joint.yield) * 1e6;
    // Two independent estimates of one rate agree within 3.29 standard errors of their difference
    // (two-sided 99.9 %, normal approximation to the binomial).
    const p1 = point.fails / point.samples;
    const p2 = confirmPpm / 1e6;
    const se = Math.sqrt((p1 * (1 - p1)) / point.samples + (p2 * (1 - p2)) / plan.samples);
    expect(Math.abs(p1 - p2)).toBeLessThanOrEqual(3.29 * se);
    expect(point.fails).toBeGreaterThan(0);
  });

  it('the reject rate of a single normal part matches the analytic normal probability (jstat as reference)', () => {
    // Only rk varies; spec on a metric monotone in rk over the band is replaced by its own draw:
    // P(|z| > k·a) for a normal part with tolerance t = 3σ judged at a ±(t·a) band is 2(1 − Φ(3a)).
    const t = 5;
    const u = commonUniforms('analytic', 'part', 'rk', 200_000);
    const col = partColumn({ value: 1000, tolerance: t, spread: { kind: 'normal' } }, t, u, u.length);
    const band = 0.04; // ±4 % of 1000 Ω, 2.4 σ
    let out = 0;
    for (const v of col) if (Math.abs(v / 1000 - 1) > band) out++;
    const expected = 2 * (1 - jStat.normal.cdf(band / (t / 100 / 3), 0, 1));
    expect(out / u.length).toBeCloseTo(expected, 3);
  });

  it('names the field for a target the sample count cannot show, and for a missing price', () => {
    expect(() => searchPlan(design, { prices, targetPpm: 10, samples: 1000 })).toThrow(/^samples/);
    expect(() => searchPlan(design, { prices, targetPpm: 0 })).toThrow(/^targetPpm/);
    expect(() => searchPlan(design, { prices, targetPpm: 100, samples: 1.5 })).toThrow(/^samples/);
    expect(() => searchPlan(design, { prices, targetPpm: 100, tubes: [] })).toThrow(/^tubes/);
    expect(() => searchPlan(design, { prices, targetPpm: 100, parts: ['rload9' as PartName] })).toThrow(
      /^parts/,
    );
    expect(() => searchPlan(design, { prices: { ...prices, resistors: [] }, targetPpm: 1000 })).toThrow(
      /^prices.resistors/,
    );
  });
});

import { readFileSync } from 'node:fs';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { CAPACITOR_PARTS } from '../design/designSchema.js';
import { parseDesign } from '../design/parseDesign.js';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { tubeColumns } from './commonDraws.js';
import { comparePairing, modelAcceptance } from './comparePairing.js';
import { partPrice, type PriceTable } from './priceTable.js';
import { createSampleJudge } from './sampleJudge.js';
import { searchPlan } from './searchPlan.js';

const GUITAR = new URL('../../examples/guitar-12ax7-cap-coupled.json', import.meta.url);
const SPLIT_LOAD = new URL('../../examples/guitar-12au7-split-load.json', import.meta.url);

const prices: PriceTable = {
  currency: 'EUR',
  resistors: [
    { kind: 'metal-film', tolerance: 10, price: 0.02 },
    { kind: 'metal-film', tolerance: 5, price: 0.03 },
    { kind: 'metal-film', tolerance: 0, price: 0.5 },
  ],
  tubes: { unmatched: 14, matched: 19 },
};
const design = buildTestDesign({ specs: [{ metric: 'balanceDb', min: -0.5, max: 0.5 }] });

describe('comparePairing', () => {
  const result = comparePairing(
    design,
    prices,
    [
      { kind: 'unmatched' },
      { kind: 'matched', quantity: 'ia', within: 5 },
      { kind: 'binned', quantity: 'ia', width: 5, bins: 7 },
    ],
    { samples: 8000, seed: 't' },
  );
  const [unmatched, matched, binned] = result.outcomes;

  it('matching throws tubes away at the rate the spread model predicts (jstat normal CDF as reference)', () => {
    // X = ln(perv1/perv2) ~ N(0, 2(1−ρ)·ln(1.1)²) with perveanceSd 10 %, ρ 0.5.
    const sd = Math.log(1.1) * Math.sqrt(2 * (1 - 0.5));
    const expected =
      jStat.normal.cdf(Math.log(1.05) / sd, 0, 1) - jStat.normal.cdf(Math.log(0.95) / sd, 0, 1);
    expect(modelAcceptance(design, matched.rule)).toBeCloseTo(expected, 10);
    // Sampled acceptance within 4 binomial standard errors of the model's.
    const draws = matched.samples / matched.acceptance;
    expect(Math.abs(matched.acceptance - expected)).toBeLessThan(
      4 * Math.sqrt((expected * (1 - expected)) / draws),
    );
    expect(matched.tubesThrownPerUnit).toBeCloseTo(1 / matched.acceptance - 1, 10);
  });

  it('unmatched tubes throw nothing away; binning keeps both sections in one bin near nominal', () => {
    expect(unmatched.tubesThrownPerUnit).toBe(0);
    expect(unmatched.acceptance).toBe(1);
    expect(binned.acceptance).toBeLessThan(matched.acceptance);
    expect(binned.modelAcceptance).toBeNull();
    const tubes = tubeColumns(design, binned.rule, 't', 8000);
    const step = Math.log(1.05);
    for (let s = 0; s < 8000; s++) {
      const b1 = Math.round(Math.log(tubes.perv1[s]) / step);
      expect(b1 === Math.round(Math.log(tubes.perv2[s]) / step)).toBe(true);
      expect(Math.abs(b1)).toBeLessThanOrEqual(3);
    }
  });

  it('cost per good unit = (parts + every envelope bought) / yield', () => {
    for (const o of result.outcomes) {
      const perUnit = result.partsCost + 14 * (1 + o.tubesThrownPerUnit);
      expect(o.costPerUnit).toBeCloseTo(perUnit, 9);
      expect(o.costPerGoodUnit).toBeCloseTo(perUnit / (1 - o.fails / o.samples), 9);
    }
  });

  it('names the field when a part has no price', () => {
    expect(() => comparePairing(design, { ...prices, resistors: [] }, [{ kind: 'unmatched' }])).toThrow(
      /^prices.resistors/,
    );
  });
});

describe('comparePairing on a design with capacitors and frequency specs', () => {
  it('prices only the resistors and judges the frequency specs', () => {
    const parsed = parseDesign(JSON.parse(readFileSync(GUITAR, 'utf8')));
    if (!parsed.ok) throw new Error('example does not parse');
    const d = parsed.design;
    expect(d.parts.cout1).toBeDefined();
    expect(d.specs.some((s) => s.frequency !== undefined)).toBe(true);
    const judge = createSampleJudge(d);
    expect(judge.specMetric.every((m) => m >= 0)).toBe(true); // every spec, frequency ones too, has its column
    const r = comparePairing(d, prices, [{ kind: 'unmatched' }], { samples: 500, seed: 'caps' });
    const resistors = Object.entries(d.parts).filter(
      ([name, p]) => p && !(CAPACITOR_PARTS as readonly string[]).includes(name),
    );
    const expected = resistors.reduce(
      (sum, [, p]) => sum + partPrice(prices, 'metal-film', p!.tolerance)!,
      0,
    );
    expect(r.partsCost).toBeCloseTo(expected, 12);
  });
});

describe('production studies on a split-load design', () => {
  it('refuse pairing (one section) and plan with unmatched tubes only', () => {
    const parsed = parseDesign(JSON.parse(readFileSync(SPLIT_LOAD, 'utf8')));
    if (!parsed.ok) throw new Error('split-load example does not parse');
    const d = parsed.design;
    expect(() => comparePairing(d, prices, [{ kind: 'unmatched' }])).toThrow(
      /^designId: .*one triode section/,
    );
    expect(() => searchPlan(d, { prices, targetPpm: 1000, tubes: ['matched'] })).toThrow(/^tubes: /);
    const plan = searchPlan(d, { prices, targetPpm: 5000, samples: 2000 });
    expect(plan.frontier.every((p) => p.assignment.tube === 'unmatched')).toBe(true);
  });
});

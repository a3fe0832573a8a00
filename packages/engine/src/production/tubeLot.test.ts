import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createStream } from '../random/createStream.js';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { comparePairing, modelAcceptance } from './comparePairing.js';
import type { PriceTable } from './priceTable.js';
import { lotAcceptance, prepareLot, type TubeLot } from './tubeLot.js';

const prices: PriceTable = {
  currency: 'EUR',
  resistors: [
    { kind: 'metal-film', tolerance: 10, price: 0.02 },
    { kind: 'metal-film', tolerance: 0, price: 0.5 },
  ],
  tubes: { unmatched: 14, matched: 19 },
};

/** A lot of `n` envelopes drawn from the test design's tube spread (perveance 10 %, ρ 0.5), Ia in mA. */
function modelLot(n: number): TubeLot {
  const g = createStream('lot', 'test');
  const s = Math.log(1.1);
  const rho = 0.5;
  const sections = Array.from({ length: n }, () => {
    // Normal quantiles from jstat, so the lot does not share the engine's quantile code.
    const z1 = jStat.normal.inv(g.nextOpen(), 0, 1);
    const z2 = jStat.normal.inv(g.nextOpen(), 0, 1);
    return [1.2 * Math.exp(s * z1), 1.2 * Math.exp(s * (rho * z1 + Math.sqrt(1 - rho * rho) * z2))] as const;
  });
  return { quantity: 'ia', sections };
}

describe('tube lots', () => {
  it('turns measured sections into multipliers of the median section', () => {
    const ia = prepareLot({
      quantity: 'ia',
      sections: [
        [1, 2],
        [3, 4],
      ],
    });
    expect(Array.from(ia.perv1)).toEqual([0.4, 1.2]); // median 2.5
    expect(Number.isNaN(ia.mu1[0])).toBe(true);
    const gm = prepareLot({ quantity: 'gm', sections: [[4, 1]] });
    expect(gm.perv1[0]).toBeCloseTo(Math.pow(4 / 2.5, 1.5), 12);
    expect(() => prepareLot({ quantity: 'ia', sections: [] })).toThrow(/^lot.sections/);
    expect(() => prepareLot({ quantity: 'ia', sections: [[1, -1]] })).toThrow(/^lot.sections.0/);
  });

  it('a lot drawn from the spread model keeps the share the model predicts (jstat normal as reference)', () => {
    const design = buildTestDesign({ specs: [{ metric: 'balanceDb', min: -1, max: 1 }] });
    const rule = { kind: 'matched', quantity: 'ia', within: 5 } as const;
    const lot = modelLot(20_000);
    const exact = lotAcceptance(prepareLot(lot), rule);
    const model = modelAcceptance(design, rule)!;
    expect(Math.abs(exact - model)).toBeLessThan(4 * Math.sqrt((model * (1 - model)) / 20_000));
    // Sampling envelopes from the lot keeps about the lot's own share.
    const r = comparePairing(design, prices, [{ kind: 'unmatched' }, rule], { samples: 6000, lot });
    expect(r.lotSize).toBe(20_000);
    const matched = r.outcomes[1];
    expect(matched.lotAcceptance).toBe(exact);
    const draws = matched.samples / matched.acceptance;
    expect(Math.abs(matched.acceptance - exact)).toBeLessThan(4 * Math.sqrt((exact * (1 - exact)) / draws));
    expect(r.outcomes[0].tubesThrownPerUnit).toBe(0);
  });

  it('a lot of perfectly matched envelopes throws nothing away', () => {
    const design = buildTestDesign();
    const lot: TubeLot = {
      quantity: 'gm',
      sections: [
        [1.6, 1.6],
        [1.5, 1.5],
        [1.7, 1.7],
      ],
    };
    const r = comparePairing(design, prices, [{ kind: 'matched', quantity: 'gm', within: 1 }], {
      samples: 500,
      lot,
    });
    expect(r.outcomes[0].tubesThrownPerUnit).toBe(0);
    expect(r.outcomes[0].lotAcceptance).toBe(1);
  });
});

describe('stored lots (whole-tube multipliers)', () => {
  const tubes = [
    [1.02, 0.97, 1.01, 0.99],
    [0.9, 0.92, 1.03, 1.02],
    [1.1, 1.04, 0.98, 1.0],
  ];
  it('keeps both quantities of each envelope as stored', () => {
    const p = prepareLot({ quantity: 'multipliers', tubes });
    expect([...p.perv1]).toEqual([1.02, 0.9, 1.1]);
    expect([...p.mu2]).toEqual([0.99, 1.02, 1.0]);
    // By hand, |perv1/perv2 − 1|: 1.02/0.97 → 5.2 %, 0.9/0.92 → 2.2 %, 1.1/1.04 → 5.8 %; one of three within 5 %.
    expect(lotAcceptance(p, { kind: 'matched', quantity: 'ia', within: 5 })).toBeCloseTo(1 / 3, 15);
    // mu is measured too: 1.01/0.99, 1.03/1.02 and 0.98/1.0 are all within 5 %.
    expect(lotAcceptance(p, { kind: 'matched', quantity: 'mu', within: 5 })).toBe(1);
    expect(() => prepareLot({ quantity: 'multipliers', tubes: [[1, 1, 1]] })).toThrow(/lot\.tubes\.0/);
    expect(() => prepareLot({ quantity: 'multipliers', tubes: [] })).toThrow(/lot\.tubes/);
  });

  it('draws every sampled tube from the lot, mu included', () => {
    const r = comparePairing(buildTestDesign(), prices, [{ kind: 'unmatched' }], {
      samples: 400,
      seed: 'stored',
      lot: { quantity: 'multipliers', tubes },
    });
    expect(r.lotSize).toBe(3);
    expect(r.outcomes[0]!.lotAcceptance).toBe(1);
  });
});

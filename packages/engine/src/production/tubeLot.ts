import { envelopeAccepted, type EnvelopeRule } from './envelopeRule.js';

/**
 * A measured lot of dual triodes: one quantity (Ia, gm or mu, any unit) of each section of each
 * envelope. Studies draw envelopes from the lot (with replacement) instead of the spread model
 * for that quantity; the other quantity still comes from the model.
 *
 * @example { quantity: 'ia', sections: [[1.21, 1.18], [1.05, 1.12]] } // mA
 */
export type TubeLot = { quantity: 'ia' | 'gm' | 'mu'; sections: readonly (readonly [number, number])[] };

/** A lot turned into section multipliers (value over the lot's median section). */
export type PreparedLot = {
  quantity: 'ia' | 'gm' | 'mu';
  perv1: Float64Array;
  perv2: Float64Array;
  mu1: Float64Array;
  mu2: Float64Array;
};

/**
 * Multipliers of each envelope of the lot, relative to the median section: Ia ∝ perveance at
 * equal grid-cathode voltage, gm ∝ perveance^(2/3) (so perveance ∝ gm^(3/2)), mu as measured.
 * The multipliers of the quantity not measured are NaN (taken from the model). Throws RangeError
 * naming `lot.sections` for an empty lot or a value that is not a positive number.
 *
 * @example prepareLot({ quantity: 'ia', sections: [[1, 1.1]] }).perv2[0] // 1.1 / 1.05
 */
export function prepareLot(lot: TubeLot): PreparedLot {
  const n = lot.sections.length;
  if (n === 0) throw new RangeError('lot.sections must hold at least one envelope');
  const all: number[] = [];
  lot.sections.forEach(([a, b], i) => {
    if (!(a > 0 && b > 0 && Number.isFinite(a) && Number.isFinite(b)))
      throw new RangeError(`lot.sections.${i} must be two positive numbers`);
    all.push(a, b);
  });
  all.sort((x, y) => x - y);
  const median = (all[(all.length - 1) >> 1] + all[all.length >> 1]) / 2;
  const scale = (v: number) => (lot.quantity === 'gm' ? Math.pow(v / median, 1.5) : v / median);
  const col = (k: 0 | 1, measured: boolean) =>
    Float64Array.from(lot.sections, (s) => (measured ? scale(s[k]) : NaN));
  const isMu = lot.quantity === 'mu';
  return {
    quantity: lot.quantity,
    perv1: col(0, !isMu),
    perv2: col(1, !isMu),
    mu1: col(0, isMu),
    mu2: col(1, isMu),
  };
}

/**
 * Exact share of the lot's envelopes a rule keeps (the multipliers not measured count as 1).
 *
 * @example lotAcceptance(prepareLot(lot), { kind: 'matched', quantity: 'ia', within: 5 })
 */
export function lotAcceptance(lot: PreparedLot, rule: EnvelopeRule): number {
  let kept = 0;
  const or1 = (v: number) => (Number.isNaN(v) ? 1 : v);
  for (let k = 0; k < lot.perv1.length; k++) {
    if (envelopeAccepted(rule, or1(lot.perv1[k]), or1(lot.perv2[k]), or1(lot.mu1[k]), or1(lot.mu2[k])))
      kept++;
  }
  return kept / lot.perv1.length;
}

import { envelopeAccepted, type EnvelopeRule } from './envelopeRule.js';

/**
 * A measured lot of dual triodes: one quantity (Ia, gm or mu, any unit) of each section of each
 * envelope. Studies draw envelopes from the lot (with replacement) instead of the spread model
 * for that quantity; the other quantity still comes from the model.
 *
 * @example { quantity: 'ia', sections: [[1.21, 1.18], [1.05, 1.12]] } // mA
 */
export type TubeLot =
  | { quantity: 'ia' | 'gm' | 'mu'; sections: readonly (readonly [number, number])[] }
  /**
   * A stored lot: per envelope the spread multipliers [perv1, perv2, mu1, mu2] of its sections,
   * relative to the catalog model (as the lot upload converts them). Both quantities are measured.
   */
  | { quantity: 'multipliers'; tubes: readonly (readonly number[])[] };

/** A lot turned into section multipliers (NaN where the lot did not measure a quantity). */
export type PreparedLot = {
  quantity: TubeLot['quantity'];
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
  if (lot.quantity === 'multipliers') return prepareMultipliers(lot.tubes);
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

/** A stored lot's multipliers as they are (they are already relative to the model). */
function prepareMultipliers(tubes: readonly (readonly number[])[]): PreparedLot {
  if (tubes.length === 0) throw new RangeError('lot.tubes must hold at least one envelope');
  tubes.forEach((t, i) => {
    if (t.length !== 4 || !t.every((v) => v > 0 && Number.isFinite(v)))
      throw new RangeError(`lot.tubes.${i} must be four positive numbers [perv1, perv2, mu1, mu2]`);
  });
  const col = (k: number) => Float64Array.from(tubes, (t) => t[k]!);
  return { quantity: 'multipliers', perv1: col(0), perv2: col(1), mu1: col(2), mu2: col(3) };
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

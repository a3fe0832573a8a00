/**
 * How the two sections of one envelope are accepted for the stage:
 * - unmatched: every envelope is used as it comes.
 * - matched: |q1/q2 − 1| ≤ within (percent), q the measured quantity of each section.
 * - binned: each section is sorted into bins of `width` percent on ln q (bins centred on the
 *   nominal, `bins` of them); an envelope is used when both sections land in the same bin. Unlike
 *   matching, this also bounds how far the pair sits from nominal (± bins·width/2 %).
 * Quantities come from the section multipliers: Ia ∝ perveance at equal grid-cathode voltage,
 * gm ∝ perveance^(2/3) at equal current (3/2-power law), mu is the mu multiplier (as the engine's
 * pairing rule, see sectionsPaired).
 *
 * @example { kind: 'binned', quantity: 'ia', width: 10, bins: 5 }
 */
export type EnvelopeRule =
  | { kind: 'unmatched' }
  | { kind: 'matched'; quantity: 'ia' | 'gm' | 'mu'; within: number }
  | { kind: 'binned'; quantity: 'ia' | 'gm' | 'mu'; width: number; bins: number };

/** The rule's quantity of one section from its perveance and mu multipliers. */
function quantity(q: 'ia' | 'gm' | 'mu', perv: number, mu: number): number {
  if (q === 'mu') return mu;
  return q === 'ia' ? perv : Math.pow(perv, 2 / 3);
}

/**
 * Whether an envelope with these section multipliers passes the rule.
 *
 * @example envelopeAccepted({ kind: 'matched', quantity: 'ia', within: 10 }, 1.05, 1, 1, 1) // true
 */
export function envelopeAccepted(
  rule: EnvelopeRule,
  perv1: number,
  perv2: number,
  mu1: number,
  mu2: number,
): boolean {
  if (rule.kind === 'unmatched') return true;
  const q1 = quantity(rule.quantity, perv1, mu1);
  const q2 = quantity(rule.quantity, perv2, mu2);
  if (rule.kind === 'matched') return Math.abs(q1 / q2 - 1) <= rule.within / 100;
  const step = Math.log(1 + rule.width / 100);
  const b1 = Math.round(Math.log(q1) / step);
  const b2 = Math.round(Math.log(q2) / step);
  const half = Math.floor(rule.bins / 2);
  return b1 === b2 && Math.abs(b1) <= half;
}

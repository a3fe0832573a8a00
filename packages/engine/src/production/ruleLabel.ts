import type { EnvelopeRule } from './envelopeRule.js';

const Q: Record<'ia' | 'gm' | 'mu', string> = { ia: 'Ia', gm: 'gm', mu: 'mu' };

/**
 * A pairing strategy in words.
 *
 * @example ruleLabel({ kind: 'matched', quantity: 'ia', within: 10 }) // "Matched: Ia within ± 10 %"
 */
export function ruleLabel(rule: EnvelopeRule): string {
  if (rule.kind === 'unmatched') return 'Unmatched';
  if (rule.kind === 'matched') return `Matched: ${Q[rule.quantity]} within ± ${rule.within} %`;
  return `Binned: ${Q[rule.quantity]}, ${rule.bins} bins of ${rule.width} %`;
}

import { describe, expect, it } from 'vitest';
import { ruleLabel } from './ruleLabel.js';

describe('ruleLabel', () => {
  it('says each pairing strategy in words', () => {
    expect(ruleLabel({ kind: 'unmatched' })).toBe('Unmatched');
    expect(ruleLabel({ kind: 'matched', quantity: 'gm', within: 10 })).toBe('Matched: gm within ± 10 %');
    expect(ruleLabel({ kind: 'binned', quantity: 'ia', width: 5, bins: 7 })).toBe(
      'Binned: Ia, 7 bins of 5 %',
    );
  });
});

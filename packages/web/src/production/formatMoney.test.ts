import { describe, expect, it } from 'vitest';
import { formatMoney } from './formatMoney.js';

describe('formatMoney', () => {
  it('formats prices with their currency, three decimals below 0.1', () => {
    expect(formatMoney(16.76, 'EUR')).toBe('16.76 EUR');
    expect(formatMoney(0.045, 'EUR')).toBe('0.045 EUR');
    expect(formatMoney(Infinity, 'EUR')).toBe('—');
    expect(formatMoney(null, 'EUR')).toBe('—');
  });
});

// @vitest-environment node
import { describe, expect, it } from 'vitest';
import {
  formatCount,
  formatPercent,
  formatPpm,
  formatSi,
  formatSig,
  formatYield,
  MINUS,
} from './formatSi.js';

describe('formatSig', () => {
  it('rounds to significant figures and trims trailing zeros', () => {
    expect(formatSig(27.4381)).toBe('27.4');
    expect(formatSig(1.5)).toBe('1.5');
    expect(formatSig(0.012345, 2)).toBe('0.012');
    expect(formatSig(-3.14159, 4)).toBe(`${MINUS}3.142`);
    expect(formatSig(180, 2)).toBe('180');
    expect(formatSig(123456, 2)).toBe('120000');
  });
  it('switches to exponent form for very large and very small values', () => {
    expect(formatSig(1.234e7)).toBe('1.23e7');
    expect(formatSig(-2e-6)).toBe(`${MINUS}2e-6`);
  });
  it('shows non-finite values plainly', () => {
    expect(formatSig(NaN)).toBe('—');
    expect(formatSig(Infinity)).toBe('∞');
    expect(formatSig(0)).toBe('0');
  });
});

describe('formatSi', () => {
  // Prefix names and factors: SI brochure (BIPM, 9th edition), table 7.
  it('chooses the prefix that keeps the mantissa in [1, 1000)', () => {
    expect(formatSi(4700, 'Ω')).toBe('4.7 kΩ');
    expect(formatSi(100_000, 'Ω')).toBe('100 kΩ');
    expect(formatSi(1_000_000, 'Ω')).toBe('1 MΩ');
    expect(formatSi(0.00123, 'A')).toBe('1.23 mA');
    expect(formatSi(1.6e-3, 'S')).toBe('1.6 mS');
    expect(formatSi(2.2e-9, 'F')).toBe('2.2 nF');
    expect(formatSi(47e-6, 'F')).toBe('47 µF');
    expect(formatSi(300, 'V')).toBe('300 V');
    expect(formatSi(-150, 'V')).toBe(`${MINUS}150 V`);
  });
  it('carries rounding into the next prefix', () => {
    expect(formatSi(999.96, 'V')).toBe('1 kV');
    expect(formatSi(0.99996, 'A')).toBe('1 A');
  });
  it('never prefixes dB or unitless values', () => {
    expect(formatSi(-0.0123, 'dB')).toBe(`${MINUS}0.0123 dB`);
    expect(formatSi(27.43)).toBe('27.4');
  });
  it('respects the digits argument', () => {
    expect(formatSi(1.23456e-3, 'W', 5)).toBe('1.2346 mW');
    expect(formatSi(0.18, 'W', 2)).toBe('180 mW');
  });
  it('handles non-finite input', () => {
    expect(formatSi(NaN, 'V')).toBe('— V');
    expect(formatSi(Infinity, 'Ω')).toBe('∞ Ω');
  });
});

describe('yield and reject rate', () => {
  it('formats percentages', () => {
    expect(formatPercent(0.9987, 2)).toBe('99.87 %');
    expect(formatPercent(-0.05)).toBe(`${MINUS}5.0 %`);
  });
  it('keeps two significant figures of the reject share', () => {
    expect(formatYield(0.95)).toBe('95.0 %');
    expect(formatYield(0.99987)).toBe('99.987 %');
    expect(formatYield(1)).toBe('100 %');
    expect(formatYield(1 - 1e-12)).toBe('100 %'); // an interval's upper bound a rounding error below 1
    expect(formatYield(0.9999996)).toBe('99.999960 %');
  });
  it('groups PPM and counts', () => {
    expect(formatPpm(1234.4)).toBe('1,234 PPM');
    expect(formatPpm(13.49)).toBe('13 PPM');
    expect(formatPpm(0.27)).toBe('0.27 PPM');
    expect(formatCount(100000)).toBe('100,000');
  });
});

import { describe, expect, it } from 'vitest';
import { parseCapacitance, parseResistance, parseValue } from './parseValue.js';
import { formatEngineering, formatRkm } from './formatValue.js';
import { E_SERIES } from './eSeries.js';
import { toleranceFromLetter, letterForTolerance, TOLERANCE_LETTERS } from './toleranceLetters.js';

describe('parseValue', () => {
  // Codes and meanings as in IEC 60062 (RKM code: the multiplier letter marks the decimal point).
  it.each([
    ['4k7', 4700],
    ['1M5', 1.5e6],
    ['220R', 220],
    ['R47', 0.47],
    ['4R7', 4.7],
    ['1M', 1e6],
    ['100k', 1e5],
    ['2.2k', 2200],
    ['4700', 4700],
    ['4.7e3', 4700],
    ['10 kΩ', 1e4],
    ['1G', 1e9],
  ])('reads resistance %s (IEC 60062)', (text, ohms) => {
    expect(parseResistance(text)).toBeCloseTo(ohms, 9);
  });

  it.each([
    ['470n', 470e-9],
    ['4n7', 4.7e-9],
    ['2u2', 2.2e-6],
    ['2µ2', 2.2e-6],
    ['100p', 100e-12],
    ['470nF', 470e-9],
    ['p47', 0.47e-12],
  ])('reads capacitance %s (IEC 60062)', (text, farads) => {
    expect(parseCapacitance(text) / farads).toBeCloseTo(1, 12);
  });

  it.each(['', 'abc', '4x7', '4k7k', '-100', '0', 'k', '1..2k', 'NaN', 'Infinity'])(
    'rejects %j with a message naming it',
    (text) => {
      const r = parseValue(text, 'resistance');
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toContain(`"${text}"`);
    },
  );

  it('throws for non-positive numbers', () => {
    expect(() => parseResistance(-5)).toThrow(/-5/);
    expect(() => parseResistance(Number.NaN)).toThrow();
  });
});

describe('formatRkm', () => {
  // Round trip of IEC 60062 RKM codes: parse then format gives the same code back.
  it.each(['4k7', '1M5', '220R', 'R47', '4R7', '1M', '100k', '10k2', '4k87', '1k', '47R', '2G2'])(
    'round-trips resistance %s (IEC 60062)',
    (code) => {
      expect(formatRkm(parseResistance(code), 'resistance')).toBe(code);
    },
  );
  it.each(['4n7', '470n', '2u2', '100p', '1u', '10m'])('round-trips capacitance %s (IEC 60062)', (code) => {
    expect(formatRkm(parseCapacitance(code), 'capacitance')).toBe(code);
  });
  it('round-trips every E192 value from 0.1 Ω to 10 GΩ through its RKM code (IEC 60062, IEC 60063)', () => {
    for (let exp = -1; exp <= 9; exp++)
      for (const m of E_SERIES.E192) {
        const ohms = Number((m * 10 ** exp).toPrecision(3));
        const code = formatRkm(ohms, 'resistance');
        expect(code).toMatch(/^\d*[RkMG]\d*$/);
        expect(parseResistance(code)).toBe(ohms);
      }
  });

  it('formats engineering notation', () => {
    expect(formatEngineering(4700, 'resistance')).toBe('4.7 kΩ');
    expect(formatEngineering(470e-9, 'capacitance')).toBe('470 nF');
    expect(formatEngineering(2.2e-6, 'capacitance')).toBe('2.2 µF');
  });
});

describe('tolerance letters', () => {
  it('maps IEC 60062 letters to percent', () => {
    expect(TOLERANCE_LETTERS).toEqual({ B: 0.1, C: 0.25, D: 0.5, F: 1, G: 2, J: 5, K: 10, M: 20 });
    expect(toleranceFromLetter('j')).toBe(5);
    expect(toleranceFromLetter('Z')).toBeUndefined();
    expect(letterForTolerance(1)).toBe('F');
  });
});

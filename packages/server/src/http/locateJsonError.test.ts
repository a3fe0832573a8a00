import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { locateJsonError } from './locateJsonError.js';

describe('locateJsonError', () => {
  it('finds the place where a JSON text breaks', () => {
    expect(locateJsonError('{"a": }')).toEqual({ position: 6, line: 1, column: 7 });
    expect(locateJsonError('{"a": 1')).toEqual({ position: 7, line: 1, column: 8 });
    expect(locateJsonError('nope')).toEqual({ position: 1, line: 1, column: 2 });
    expect(locateJsonError('{\n  "a": 1,\n  "b": tru\n}')).toMatchObject({ line: 3, column: 11 });
    expect(locateJsonError('[1, 2,]')).toMatchObject({ position: 6 });
    expect(locateJsonError('{"a": 01}')).toMatchObject({ position: 7 });
    expect(locateJsonError('"\\x"')).toMatchObject({ position: 2 });
    expect(locateJsonError('')).toMatchObject({ position: 0 });
    expect(locateJsonError('{} x')).toMatchObject({ position: 3 });
  });

  // Independent reference: the built-in JSON.parse (ECMA-262 §25.5.1) decides validity.
  it('agrees with JSON.parse on what is valid, for generated texts', () => {
    const valid = (s: string): boolean => {
      try {
        JSON.parse(s);
        return true;
      } catch {
        return false;
      }
    };
    fc.assert(
      fc.property(fc.json(), (s) => locateJsonError(s) === null),
      { seed: 11, numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.json(), fc.nat(), fc.string({ maxLength: 3 }), (s, at, junk) => {
        const k = at % (s.length + 1);
        const broken = s.slice(0, k) + junk + s.slice(k);
        expect(locateJsonError(broken) === null).toBe(valid(broken));
      }),
      { seed: 12, numRuns: 1000 },
    );
  });
});

/**
 * IEC 60062 tolerance code letters and their tolerance in percent (±).
 *
 * @example
 * TOLERANCE_LETTERS.J; // 5
 */
export const TOLERANCE_LETTERS = { B: 0.1, C: 0.25, D: 0.5, F: 1, G: 2, J: 5, K: 10, M: 20 } as const;

/** One of the letters in {@link TOLERANCE_LETTERS}. */
export type ToleranceLetter = keyof typeof TOLERANCE_LETTERS;

/**
 * Tolerance in percent for an IEC 60062 letter (case-insensitive), or undefined.
 *
 * @example
 * toleranceFromLetter('f'); // 1
 */
export function toleranceFromLetter(letter: string): number | undefined {
  const key = letter.trim().toUpperCase();
  return key in TOLERANCE_LETTERS ? TOLERANCE_LETTERS[key as ToleranceLetter] : undefined;
}

/**
 * The IEC 60062 letter for a tolerance in percent, or undefined if it has none.
 *
 * @example
 * letterForTolerance(10); // 'K'
 */
export function letterForTolerance(percent: number): ToleranceLetter | undefined {
  for (const [k, v] of Object.entries(TOLERANCE_LETTERS)) if (v === percent) return k as ToleranceLetter;
  return undefined;
}

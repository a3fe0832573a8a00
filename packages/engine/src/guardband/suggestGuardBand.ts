import { testLimitRates, type TestLimitInput, type TestLimitRates } from './testLimitRates.js';

/** A guard band and the test limits and rates it gives. */
export type GuardBandSuggestion = {
  /** Distance each test limit sits inside its spec limit (quantity's unit); negative = outside. */
  guardBand: number;
  test: { low?: number; high?: number };
  rates: TestLimitRates;
  /** False when even a guard band of 6 measurement sd (or half the spec width) misses the target. */
  reached: boolean;
};

/**
 * The smallest guard band g ≥ 0 (test limits = spec limits moved inwards by g) whose false-accept
 * rate is at most `targetFalseAccept` (a fraction). The false-accept rate falls monotonically as
 * g grows, so g is found by bisection between 0 and min(6·σm, half the spec width).
 *
 * @example suggestGuardBand({ process: { mean: 0, sd: 1 }, measurementSd: 0.2, spec: { low: -2, high: 2 } }, 100e-6).guardBand
 */
export function suggestGuardBand(
  input: Omit<TestLimitInput, 'test'>,
  targetFalseAccept: number,
): GuardBandSuggestion {
  if (!(targetFalseAccept > 0 && targetFalseAccept < 1)) {
    throw new RangeError('targetFalseAccept must be between 0 and 1');
  }
  const { spec } = input;
  const limitsAt = (g: number) => ({
    ...(spec.low !== undefined ? { low: spec.low + g } : {}),
    ...(spec.high !== undefined ? { high: spec.high - g } : {}),
  });
  const at = (g: number) => testLimitRates({ ...input, test: limitsAt(g) });
  const width = spec.low !== undefined && spec.high !== undefined ? spec.high - spec.low : Infinity;
  let hi = Math.min(6 * input.measurementSd, width / 2 - 1e-9 * Math.abs(width));
  const zero = at(0);
  if (zero.falseAccept <= targetFalseAccept || !(hi > 0)) {
    const g = 0;
    return { guardBand: g, test: limitsAt(g), rates: zero, reached: zero.falseAccept <= targetFalseAccept };
  }
  const top = at(hi);
  if (top.falseAccept > targetFalseAccept)
    return { guardBand: hi, test: limitsAt(hi), rates: top, reached: false };
  let lo = 0;
  for (let i = 0; i < 50 && hi - lo > 1e-9 * input.measurementSd; i++) {
    const mid = (lo + hi) / 2;
    if (at(mid).falseAccept > targetFalseAccept) lo = mid;
    else hi = mid;
  }
  return { guardBand: hi, test: limitsAt(hi), rates: at(hi), reached: true };
}

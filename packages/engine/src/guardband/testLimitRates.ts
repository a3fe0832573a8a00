import { normalCdf } from '../spread/normalCdf.js';

/** A one- or two-sided interval; a missing bound is open (±∞). */
export type Limits = { low?: number; high?: number };

/** End-of-line test of one quantity: true values normal, each measurement adds normal error. */
export type TestLimitInput = {
  /** True (process) distribution of the quantity: mean and sd, in the quantity's unit. */
  process: { mean: number; sd: number };
  /** Standard deviation of the measurement error (same unit); 0 = a perfect tester. */
  measurementSd: number;
  /** Spec limits: a part is good when its true value is inside. */
  spec: Limits;
  /** Test limits: a part is accepted when its measured value is inside. */
  test: Limits;
};

/** Rates as fractions of all parts tested (multiply by 1e6 for PPM). */
export type TestLimitRates = {
  /** Bad part accepted: P(true outside spec, measured inside test limits). */
  falseAccept: number;
  /** Good part rejected: P(true inside spec, measured outside test limits). */
  falseReject: number;
  /** P(true value inside spec). */
  good: number;
  /** P(measured value inside test limits). */
  accepted: number;
  /** False accepts among accepted parts: the escape rate the customer sees. */
  escapeRate: number;
};

/** Simpson intervals per smooth piece (accuracy ~1e-12 on these integrands). */
const PIECES = 2000;
/** The process density is integrated over mean ± 12 sd. */
const SPAN = 12;

/**
 * False-accept and false-reject rates of a test with normal measurement error on a normal
 * process: one-dimensional integrals over the true value x of φ(x)·P(accept | x), where
 * P(accept | x) = Φ((U−x)/σm) − Φ((L−x)/σm), by composite Simpson on pieces split at the spec
 * limits (so each piece has a smooth integrand).
 *
 * @example testLimitRates({ process: { mean: 0, sd: 1 }, measurementSd: 0.3, spec: { low: -3, high: 3 }, test: { low: -3, high: 3 } })
 */
export function testLimitRates(input: TestLimitInput): TestLimitRates {
  check(input);
  const { process, measurementSd: sm, spec, test } = input;
  const { mean, sd } = process;
  const tl = test.low ?? -Infinity;
  const th = test.high ?? Infinity;
  const good =
    normalCdf(((spec.high ?? Infinity) - mean) / sd) - normalCdf(((spec.low ?? -Infinity) - mean) / sd);
  const ts = Math.hypot(sd, sm);
  const accepted = normalCdf((th - mean) / ts) - normalCdf((tl - mean) / ts);
  const rates = (falseAccept: number, falseReject: number): TestLimitRates => ({
    falseAccept,
    falseReject,
    good,
    accepted,
    escapeRate: accepted > 0 ? falseAccept / accepted : 0,
  });
  if (sm === 0) {
    // A perfect tester: the rates are masses of the intervals where spec and test limits differ.
    const mass = (a: number, b: number) =>
      b > a ? normalCdf((b - mean) / sd) - normalCdf((a - mean) / sd) : 0;
    const both = mass(Math.max(tl, spec.low ?? -Infinity), Math.min(th, spec.high ?? Infinity));
    return rates(Math.max(0, accepted - both), Math.max(0, good - both));
  }
  const accept = (x: number) => normalCdf((th - x) / sm) - normalCdf((tl - x) / sm);
  const density = (x: number) => Math.exp(-0.5 * ((x - mean) / sd) ** 2) / (sd * Math.sqrt(2 * Math.PI));
  const lo = mean - SPAN * sd;
  const hi = mean + SPAN * sd;
  const sl = Math.min(hi, Math.max(lo, spec.low ?? -Infinity));
  const sh = Math.min(hi, Math.max(lo, spec.high ?? Infinity));
  const cuts = [lo, sl, sh, hi];
  let falseAccept = 0;
  let falseReject = 0;
  for (let k = 0; k + 1 < cuts.length; k++) {
    const a = cuts[k];
    const b = cuts[k + 1];
    if (!(b > a)) continue;
    const inside = (a + b) / 2 >= sl && (a + b) / 2 <= sh;
    const f = inside ? (x: number) => density(x) * (1 - accept(x)) : (x: number) => density(x) * accept(x);
    const v = simpson(f, a, b, PIECES);
    if (inside) falseReject += v;
    else falseAccept += v;
  }
  return rates(falseAccept, falseReject);
}

function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

function check(input: TestLimitInput): void {
  const { process, measurementSd, spec, test } = input;
  if (!Number.isFinite(process.mean)) throw new RangeError('process.mean must be a finite number');
  if (!(process.sd > 0 && Number.isFinite(process.sd))) throw new RangeError('process.sd must be positive');
  if (!(measurementSd >= 0 && Number.isFinite(measurementSd))) {
    throw new RangeError('measurementSd must be zero or positive');
  }
  for (const [name, l] of [
    ['spec', spec],
    ['test', test],
  ] as const) {
    if (l.low === undefined && l.high === undefined) throw new RangeError(`${name} needs low or high`);
    if (l.low !== undefined && l.high !== undefined && !(l.low < l.high)) {
      throw new RangeError(`${name}.high must be above ${name}.low`);
    }
  }
}

import { MAX_SPREAD_K } from '../limits.js';
import { normalCdf } from './normalCdf.js';
import { normalQuantile } from './normalQuantile.js';
import type { PartSpec } from './spreadTypes.js';

/**
 * A part spread with its constants worked out once, so the per-sample transform is a tight loop.
 * `sigma` is the relative standard deviation of the underlying normal (tolerance/(100·k)).
 */
export type PartSpread = {
  readonly kind: 'normal' | 'uniform' | 'truncnormal' | 'binned' | 'lognormal' | 'fixed' | 'empirical';
  /** Nominal value (ohms or any unit). */
  readonly nominal: number;
  /** False when every draw gives the nominal (fixed, zero tolerance, one distinct measured value). */
  readonly varied: boolean;
  readonly sigma: number;
  /** truncnormal/binned: lower CDF bound of the kept region; binned: Φ(inner/σ). */
  readonly pLow: number;
  /** truncnormal/binned: CDF mass of the kept region (binned: one side). */
  readonly pSpan: number;
  /** uniform: half width, relative. lognormal: log-space σ. */
  readonly scale: number;
  /** empirical: measured values sorted ascending. */
  readonly values: Float64Array;
  /** Tolerance as a fraction (t/100). */
  readonly tol: number;
};

const EMPTY = new Float64Array(0);

/**
 * Prepares a part spread. Rules (tolerance t in percent, k default 3):
 * - normal: x = nominal·(1 + σz), σ = t/(100k), so the tolerance is kσ.
 * - uniform: x uniform on nominal·(1 ± t/100).
 * - truncnormal: the normal above, truncated at ±t (z in [-k, k]).
 * - binned: the normal above truncated at ±t, with the parts within ±inner % removed (a gap around
 *   nominal: the tighter class was sorted out of this lot).
 * - lognormal: ln x normal, median = nominal, σ_ln = ln(1 + t/100)/k, so nominal·(1+t/100) is +kσ.
 * - fixed: always nominal. empirical: resampled uniformly from the measured values (nominal ignored).
 * Throws RangeError naming the field for impossible parameters.
 *
 * @example preparePartSpread({ value: 100e3, tolerance: 5, spread: { kind: 'normal' } }) // σ = 1.667 %
 */
export function preparePartSpread(part: PartSpec, field = 'part'): PartSpread {
  const t = part.tolerance;
  const nominal = part.value;
  const s = part.spread;
  if (!(t >= 0 && t < 100)) throw new RangeError(`${field}.tolerance must be 0 <= t < 100 (got ${t})`);
  const base = { nominal, sigma: 0, pLow: 0, pSpan: 1, scale: 0, values: EMPTY, tol: t / 100 };
  if (s.kind === 'empirical') {
    const values = Float64Array.from(s.values).sort();
    if (values.length === 0 || !values.every(Number.isFinite)) {
      throw new RangeError(`${field}.spread.values must hold at least one finite value`);
    }
    return { ...base, kind: 'empirical', values, varied: values[0] !== values[values.length - 1] };
  }
  if (s.kind === 'fixed' || t === 0) return { ...base, kind: 'fixed', varied: false };
  if (s.kind === 'uniform') return { ...base, kind: 'uniform', varied: true, scale: t / 100 };
  const k = s.k ?? 3;
  if (!(k > 0 && k <= MAX_SPREAD_K)) throw new RangeError(`${field}.spread.k must be in (0, 10] (got ${k})`);
  const sigma = t / 100 / k;
  if (s.kind === 'normal') return { ...base, kind: 'normal', varied: true, sigma };
  if (s.kind === 'lognormal') {
    return { ...base, kind: 'lognormal', varied: true, scale: Math.log(1 + t / 100) / k };
  }
  if (s.kind === 'truncnormal') {
    const pLow = normalCdf(-k);
    return { ...base, kind: 'truncnormal', varied: true, sigma, pLow, pSpan: normalCdf(k) - pLow };
  }
  if (!(s.inner >= 0 && s.inner < t)) {
    throw new RangeError(`${field}.spread.inner must be 0 <= inner < tolerance (got ${s.inner})`);
  }
  const pLow = normalCdf(s.inner / 100 / sigma);
  return { ...base, kind: 'binned', varied: true, sigma, pLow, pSpan: normalCdf(k) - pLow };
}

/**
 * Value of the spread at probability u in (0, 1): its quantile function, monotone in u (so Latin
 * hypercube and Sobol strata map to value strata).
 *
 * @example partQuantile(preparePartSpread({ value: 1000, tolerance: 3, spread: { kind: 'normal' } }), 0.5) // 1000
 */
export function partQuantile(p: PartSpread, u: number): number {
  switch (p.kind) {
    case 'normal':
      return p.nominal * (1 + p.sigma * normalQuantile(u));
    case 'uniform':
      return p.nominal * (1 + p.scale * (2 * u - 1));
    case 'truncnormal':
      return p.nominal * (1 + p.sigma * normalQuantile(p.pLow + u * p.pSpan));
    case 'binned':
      return p.nominal * (1 + p.sigma * binnedZ(p.pLow, p.pSpan, u));
    case 'lognormal':
      return p.nominal * Math.exp(p.scale * normalQuantile(u));
    case 'empirical':
      return p.values[Math.min(p.values.length - 1, Math.floor(u * p.values.length))];
    case 'fixed':
      return p.nominal;
  }
}

/** Standard score for a binned part: each side of the gap carries half the probability. */
function binnedZ(pLow: number, pSpan: number, u: number): number {
  return u < 0.5 ? -normalQuantile(pLow + (1 - 2 * u) * pSpan) : normalQuantile(pLow + (2 * u - 1) * pSpan);
}

/**
 * In place: out[s] = partQuantile(p, u[s]) for s < n. The kind switch sits outside the loops, and
 * each loop is its own small function so the optimiser inlines the quantile into it (a
 * non-inlined call returning a double would allocate per sample).
 */
export function applyPartSpreadInPlace(p: PartSpread, u: Float64Array, out: Float64Array, n: number): void {
  switch (p.kind) {
    case 'normal':
      return normalColumn(p.nominal, p.sigma, 0, 1, u, out, n);
    case 'truncnormal':
      return normalColumn(p.nominal, p.sigma, p.pLow, p.pSpan, u, out, n);
    case 'lognormal':
      return lognormalColumn(p.nominal, p.scale, u, out, n);
    case 'uniform':
      return uniformColumn(p.nominal, p.scale, u, out, n);
    case 'binned':
      return binnedColumn(p.nominal, p.sigma, p.pLow, p.pSpan, u, out, n);
    case 'empirical':
      return empiricalColumn(p.values, u, out, n);
    case 'fixed':
      out.fill(p.nominal, 0, n);
  }
}

function normalColumn(
  nom: number,
  sigma: number,
  pLow: number,
  pSpan: number,
  u: Float64Array,
  out: Float64Array,
  n: number,
): void {
  for (let s = 0; s < n; s++) out[s] = nom * (1 + sigma * normalQuantile(pLow + u[s] * pSpan));
}

function lognormalColumn(nom: number, scale: number, u: Float64Array, out: Float64Array, n: number): void {
  for (let s = 0; s < n; s++) out[s] = nom * Math.exp(scale * normalQuantile(u[s]));
}

function uniformColumn(nom: number, half: number, u: Float64Array, out: Float64Array, n: number): void {
  for (let s = 0; s < n; s++) out[s] = nom * (1 + half * (2 * u[s] - 1));
}

function binnedColumn(
  nom: number,
  sigma: number,
  pLow: number,
  pSpan: number,
  u: Float64Array,
  out: Float64Array,
  n: number,
): void {
  for (let s = 0; s < n; s++) {
    const v = u[s];
    const lower = v < 0.5;
    // One quantile call site, so it is inlined (two sites in a ternary were not: a heap number per draw).
    const z = normalQuantile(lower ? pLow + (1 - 2 * v) * pSpan : pLow + (2 * v - 1) * pSpan);
    out[s] = nom * (1 + sigma * (lower ? -z : z));
  }
}

function empiricalColumn(values: Float64Array, u: Float64Array, out: Float64Array, n: number): void {
  const len = values.length;
  for (let s = 0; s < n; s++) out[s] = values[Math.min(len - 1, Math.floor(u[s] * len))];
}

/**
 * Extreme values of the part for worst-case corners and the tornado chart: the tolerance bounds
 * nominal·(1 ± t/100) (lognormal: nominal·(1+t/100)^±1), the measured min/max for a lot.
 */
export function partRange(p: PartSpread): { low: number; high: number } {
  switch (p.kind) {
    case 'empirical':
      return { low: p.values[0], high: p.values[p.values.length - 1] };
    case 'fixed':
      return { low: p.nominal, high: p.nominal };
    case 'lognormal':
      return { low: p.nominal / (1 + p.tol), high: p.nominal * (1 + p.tol) };
    default:
      return { low: p.nominal * (1 - p.tol), high: p.nominal * (1 + p.tol) };
  }
}

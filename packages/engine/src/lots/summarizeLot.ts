import { andersonDarlingNormal, type AndersonDarlingResult } from './andersonDarling.js';
import { binnedVerdict, type BinnedVerdict } from './binnedVerdict.js';
import { ksDistanceNormal } from './ksDistance.js';

/** A fitted distribution and how well it fits. */
export type LotFit = {
  dist: 'normal' | 'lognormal';
  /** normal: mean and sd of x; lognormal: mean and sd of ln x. */
  mu: number;
  sigma: number;
  ad: AndersonDarlingResult;
  /** Kolmogorov–Smirnov distance to the fitted distribution (0..1). */
  ks: number;
  /** The fit is not rejected at the 5 % level. */
  plausible: boolean;
};

/** What the lot page shows: moments, quantiles, a histogram, two fits and the binned verdict. */
export type LotSummary = {
  count: number;
  mean: number;
  sd: number;
  min: number;
  max: number;
  quantiles: { p: number; value: number }[];
  histogram: { lo: number; width: number; counts: number[] };
  /** Empty when the lot is too small (n < 8) or constant; lognormal only for positive values. */
  fits: LotFit[];
  binned: BinnedVerdict | null;
};

const PROBS = [0.001, 0.01, 0.05, 0.25, 0.5, 0.75, 0.95, 0.99, 0.999];

/**
 * Summary statistics of one measured quantity of a lot (any unit). Quantiles interpolate between
 * order statistics (the "type 7" rule). Histogram bins follow the Freedman–Diaconis width, 5 to 60 bins.
 *
 * @example summarizeLot([4690, 4702, 4711, ...]).fits[0].ad.pValue
 */
export function summarizeLot(values: ArrayLike<number>): LotSummary {
  const x = Float64Array.from(values).sort();
  const n = x.length;
  if (n === 0) throw new RangeError('a lot needs at least one value');
  let mean = 0;
  for (let i = 0; i < n; i++) mean += x[i];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (x[i] - mean) ** 2;
  const sd = n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
  const q = (p: number) => quantileSorted(x, p);
  const fits: LotFit[] = [];
  if (n >= 8 && sd > 0) {
    fits.push(fit('normal', x));
    if (x[0] > 0) fits.push(fit('lognormal', x.map(Math.log)));
  }
  return {
    count: n,
    mean,
    sd,
    min: x[0],
    max: x[n - 1],
    quantiles: PROBS.map((p) => ({ p, value: q(p) })),
    histogram: histogram(x, q(0.75) - q(0.25)),
    fits,
    binned: n >= 8 && sd > 0 ? binnedVerdict(x, mean, sd) : null,
  };
}

function fit(dist: LotFit['dist'], v: Float64Array): LotFit {
  const n = v.length;
  let mu = 0;
  for (let i = 0; i < n; i++) mu += v[i];
  mu /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (v[i] - mu) ** 2;
  const sigma = Math.sqrt(ss / (n - 1));
  const ad = andersonDarlingNormal(v);
  return { dist, mu, sigma, ad, ks: ksDistanceNormal(v, mu, sigma), plausible: ad.pValue >= 0.05 };
}

/**
 * Quantile of an ascending array at probability p, linear between order statistics (type 7).
 *
 * @example quantileSorted(Float64Array.of(1, 2, 3, 4), 0.5) // 2.5
 */
export function quantileSorted(x: Float64Array, p: number): number {
  const h = (x.length - 1) * p;
  const i = Math.floor(h);
  return i + 1 < x.length ? x[i] + (h - i) * (x[i + 1] - x[i]) : x[x.length - 1];
}

function histogram(x: Float64Array, iqr: number): LotSummary['histogram'] {
  const n = x.length;
  const lo = x[0];
  const span = x[n - 1] - lo;
  if (!(span > 0)) return { lo, width: 1, counts: [n] };
  const fd = iqr > 0 ? (2 * iqr) / Math.cbrt(n) : span / 10;
  const bins = Math.min(60, Math.max(5, Math.ceil(span / fd)));
  const width = span / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) counts[Math.min(bins - 1, Math.floor((x[i] - lo) / width))]++;
  return { lo, width, counts };
}

import type { Sfc32 } from '../random/sfc32.js';
import { normalQuantile } from './normalQuantile.js';
import type { TubeSpreadSpec } from './spreadTypes.js';

/** Attempts per sample before a pairing rule gives up and keeps the last draw (counted as a failure). */
export const MAX_PAIRING_ATTEMPTS = 1000;

/**
 * Tube section spread, prepared. Each section's plate-current scale (perveance) and mu are
 * lognormal multipliers with median 1: perv = exp(sP·z), sP = ln(1 + perveanceSd/100), so +1σ is
 * exactly 1 + perveanceSd/100 and a multiplier never goes negative. Section 2 is joined to
 * section 1 by a Gaussian copula: z2 = ρ·z1 + √(1-ρ²)·e, separately for perveance and for mu.
 */
export type TubeSpreadModel = {
  readonly sPerv: number;
  readonly sMu: number;
  readonly rho: number;
  readonly rhoC: number;
  /** Pairing: quantity compared and the allowed relative mismatch (fraction); null = unpaired. */
  readonly pairing: { quantity: 'ia' | 'gm' | 'mu'; within: number } | null;
  /**
   * A measured lot drawn whole, or null: `tubes` holds 4 numbers per tube (perv1, perv2, mu1,
   * mu2); `sorted` each of the four columns ascending (marginal quantiles and ranges).
   */
  readonly lot: {
    readonly count: number;
    readonly tubes: Float64Array;
    readonly sorted: readonly Float64Array[];
  } | null;
};

/** Counts of the pairing rule's rejection sampling: acceptance rate = samples / draws. */
export type PairingTally = { samples: number; draws: number; failures: number };

/**
 * Prepares a tube spread. Throws RangeError naming the field for out-of-range values.
 *
 * @example prepareTubeSpread({ perveanceSd: 10, muSd: 3, sectionCorrelation: 0.5 })
 */
export function prepareTubeSpread(spec: TubeSpreadSpec, field = 'tube.spread'): TubeSpreadModel {
  const { perveanceSd, muSd, sectionCorrelation: rho } = spec;
  if (!(perveanceSd >= 0 && perveanceSd < 100)) throw new RangeError(`${field}.perveanceSd must be 0..100`);
  if (!(muSd >= 0 && muSd < 100)) throw new RangeError(`${field}.muSd must be 0..100`);
  if (!(rho >= 0 && rho <= 1)) throw new RangeError(`${field}.sectionCorrelation must be 0..1`);
  const pairing = spec.pairing;
  if (pairing && !(pairing.within > 0 && pairing.within < 100)) {
    throw new RangeError(`${field}.pairing.within must be > 0 and < 100`);
  }
  return {
    sPerv: Math.log(1 + perveanceSd / 100),
    sMu: Math.log(1 + muSd / 100),
    rho,
    rhoC: Math.sqrt(1 - rho * rho),
    pairing: pairing ? { quantity: pairing.quantity, within: pairing.within / 100 } : null,
    lot: spec.lot ? prepareTubeLot(spec.lot.tubes, field) : null,
  };
}

function prepareTubeLot(
  rows: readonly (readonly number[])[],
  field: string,
): NonNullable<TubeSpreadModel['lot']> {
  const count = rows.length;
  if (count === 0) throw new RangeError(`${field}.lot.tubes must hold at least one tube`);
  const tubes = new Float64Array(4 * count);
  rows.forEach((r, i) => {
    if (r.length !== 4 || !r.every((v) => v > 0 && Number.isFinite(v))) {
      throw new RangeError(`${field}.lot.tubes.${i} must be four positive multipliers`);
    }
    tubes.set(r, 4 * i);
  });
  const sorted = [0, 1, 2, 3].map((c) => Float64Array.from(rows, (r) => r[c]).sort());
  return { count, tubes, sorted };
}

/**
 * In place: one whole tube per sample from a measured lot, tube index floor(u·count) (one uniform
 * column, so a run stays bit-reproducible for a given seed). A pairing rule redraws the index from
 * `redraw` (one uniform per attempt) until the tube passes, up to MAX_PAIRING_ATTEMPTS.
 *
 * @example fillTubeFromLotInPlace(model, u, n, out, redraw, tally)
 */
export function fillTubeFromLotInPlace(
  t: TubeSpreadModel,
  u: Float64Array,
  n: number,
  out: { perv1: Float64Array; perv2: Float64Array; mu1: Float64Array; mu2: Float64Array },
  redraw: Sfc32 | null,
  tally: PairingTally,
): void {
  const lot = t.lot!;
  const { count, tubes } = lot;
  for (let s = 0; s < n; s++) placeTube(tubes, Math.min(count - 1, Math.floor(u[s] * count)), out, s);
  tally.samples += n;
  tally.draws += n;
  if (redraw === null || t.pairing === null) return;
  for (let s = 0; s < n; s++) {
    if (pairedAt(t, out.perv1, out.perv2, out.mu1, out.mu2, s)) continue;
    let ok = false;
    for (let attempt = 1; attempt < MAX_PAIRING_ATTEMPTS && !ok; attempt++) {
      tally.draws++;
      redraw.fillOpen(FOUR, 1);
      placeTube(tubes, Math.min(count - 1, Math.floor(FOUR[0] * count)), out, s);
      ok = pairedAt(t, out.perv1, out.perv2, out.mu1, out.mu2, s);
    }
    if (!ok) tally.failures++;
  }
}

function placeTube(
  tubes: Float64Array,
  i: number,
  out: { perv1: Float64Array; perv2: Float64Array; mu1: Float64Array; mu2: Float64Array },
  s: number,
): void {
  out.perv1[s] = tubes[4 * i];
  out.perv2[s] = tubes[4 * i + 1];
  out.mu1[s] = tubes[4 * i + 2];
  out.mu2[s] = tubes[4 * i + 3];
}

/**
 * Whether two sections pass the pairing rule: |q1/q2 − 1| <= within. For 'mu' q is the mu
 * multiplier. For 'ia' and 'gm' the exact quantities would need a DC solve per candidate, so they
 * are approximated from the perveance multipliers: at equal grid-cathode voltage the plate current
 * scales with perveance, and under a 3/2-power law at equal current gm scales as perveance^(2/3).
 */
export function sectionsPaired(
  t: TubeSpreadModel,
  perv1: number,
  perv2: number,
  mu1: number,
  mu2: number,
): boolean {
  const pr = t.pairing;
  if (pr === null) return true;
  let ratio: number;
  if (pr.quantity === 'mu') ratio = mu1 / mu2;
  else if (pr.quantity === 'ia') ratio = perv1 / perv2;
  else ratio = Math.pow(perv1 / perv2, 2 / 3);
  return Math.abs(ratio - 1) <= pr.within;
}

/**
 * In place: fills the four section multipliers for samples 0..n-1 from four uniform columns
 * (null = that spread is zero, multiplier 1). When a pairing rule rejects a pair and `redraw` is
 * given, the whole envelope is drawn again from `redraw` (four uniforms per attempt, in sample
 * order, so the result is deterministic) until it passes or MAX_PAIRING_ATTEMPTS is reached.
 * With `redraw` null the rule is not applied (used for variance-based indices, which need
 * independent inputs).
 *
 * Acceptance rate (reported per run as results.pairing.acceptanceRate): for 'ia' it is
 * P(|e^X − 1| <= within) with X = ln(perv1/perv2) ~ N(0, 2(1−ρ)·sP²); for 'gm' the same with
 * X scaled by 2/3, for 'mu' with sMu. Example: perveanceSd 10 %, ρ = 0.5, 'ia' within 15 %
 * accepts about 88 % of envelopes (measured 0.884 on the bench design); ρ = 0, within 5 % about
 * 29 %. Each rejected envelope costs four more uniforms and one more tube draw, nothing else.
 */
export function fillTubeInPlace(
  t: TubeSpreadModel,
  u: {
    perv1: Float64Array | null;
    perv2: Float64Array | null;
    mu1: Float64Array | null;
    mu2: Float64Array | null;
  },
  n: number,
  out: { perv1: Float64Array; perv2: Float64Array; mu1: Float64Array; mu2: Float64Array },
  redraw: Sfc32 | null,
  tally: PairingTally,
): void {
  const { perv1: o1, perv2: o2, mu1: o3, mu2: o4 } = out;
  sectionPairInPlace(t.sPerv, t.rho, t.rhoC, u.perv1, u.perv2, o1, o2, n);
  sectionPairInPlace(t.sMu, t.rho, t.rhoC, u.mu1, u.mu2, o3, o4, n);
  tally.samples += n;
  tally.draws += n;
  if (redraw === null || t.pairing === null) return;
  // Second pass in sample order, so the redraw stream is consumed deterministically. Kept out of
  // the first loop so that loop has no rarely-taken branch (which would deoptimise it).
  for (let s = 0; s < n; s++) {
    if (pairedAt(t, o1, o2, o3, o4, s)) continue;
    redrawEnvelope(t, redraw, out, s, tally);
  }
}

/**
 * sectionsPaired for sample s of the four multiplier columns. Columns and index as arguments, not
 * the four doubles: a non-inlined call would box each double argument (a heap number per sample).
 */
function pairedAt(
  t: TubeSpreadModel,
  perv1: Float64Array,
  perv2: Float64Array,
  mu1: Float64Array,
  mu2: Float64Array,
  s: number,
): boolean {
  const pr = t.pairing;
  if (pr === null) return true;
  let ratio: number;
  if (pr.quantity === 'mu') ratio = mu1[s] / mu2[s];
  else if (pr.quantity === 'ia') ratio = perv1[s] / perv2[s];
  else ratio = Math.pow(perv1[s] / perv2[s], 2 / 3);
  return Math.abs(ratio - 1) <= pr.within;
}

/** In place: one quantity's section multipliers from two uniform columns (null = no spread). */
function sectionPairInPlace(
  sd: number,
  rho: number,
  rhoC: number,
  u1: Float64Array | null,
  u2: Float64Array | null,
  o1: Float64Array,
  o2: Float64Array,
  n: number,
): void {
  if (u1 === null || u2 === null) {
    o1.fill(1, 0, n);
    o2.fill(1, 0, n);
    return;
  }
  // Three passes with one quantile call site each, so each is inlined (see normalQuantile).
  for (let s = 0; s < n; s++) o1[s] = normalQuantile(u1[s]);
  for (let s = 0; s < n; s++) o2[s] = Math.exp(sd * (rho * o1[s] + rhoC * normalQuantile(u2[s])));
  for (let s = 0; s < n; s++) o1[s] = Math.exp(sd * o1[s]);
}

/** Scratch for one envelope's four uniforms. */
const FOUR = new Float64Array(4);

/** Draws envelope s again (four uniforms per attempt) until it passes the pairing rule. */
function redrawEnvelope(
  t: TubeSpreadModel,
  redraw: Sfc32,
  out: { perv1: Float64Array; perv2: Float64Array; mu1: Float64Array; mu2: Float64Array },
  s: number,
  tally: PairingTally,
): void {
  const { sPerv, sMu, rho, rhoC } = t;
  for (let attempt = 1; attempt < MAX_PAIRING_ATTEMPTS; attempt++) {
    tally.draws++;
    // fillOpen gives the same values as four nextOpen calls, without a heap number per call.
    redraw.fillOpen(FOUR, 4);
    const a = normalQuantile(FOUR[0]);
    const e = normalQuantile(FOUR[1]);
    const b = normalQuantile(FOUR[2]);
    const f = normalQuantile(FOUR[3]);
    const p1 = Math.exp(sPerv * a);
    const p2 = Math.exp(sPerv * (rho * a + rhoC * e));
    const m1 = Math.exp(sMu * b);
    const m2 = Math.exp(sMu * (rho * b + rhoC * f));
    out.perv1[s] = p1;
    out.perv2[s] = p2;
    out.mu1[s] = m1;
    out.mu2[s] = m2;
    if (pairedAt(t, out.perv1, out.perv2, out.mu1, out.mu2, s)) return;
  }
  tally.failures++;
}

/** Extreme multipliers used for worst-case corners and the tornado chart: exp(±3·s) (±3σ). */
export function tubeRange(s: number): { low: number; high: number } {
  return { low: Math.exp(-3 * s), high: Math.exp(3 * s) };
}

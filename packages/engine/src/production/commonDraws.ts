import type { PartName, ResolvedDesign, ResolvedPart } from '../design/designSchema.js';
import { createStream } from '../random/createStream.js';
import { normalQuantile } from '../spread/normalQuantile.js';
import { applyPartSpreadInPlace, preparePartSpread } from '../spread/partSpread.js';
import { MAX_PAIRING_ATTEMPTS, prepareTubeSpread } from '../spread/tubeSpread.js';
import { envelopeAccepted, type EnvelopeRule } from './envelopeRule.js';
import type { PreparedLot } from './tubeLot.js';

/** Section multiplier columns of n envelopes, and how many envelopes were drawn to fill them. */
export type TubeColumns = {
  perv1: Float64Array;
  perv2: Float64Array;
  mu1: Float64Array;
  mu2: Float64Array;
  /** Envelopes drawn (≥ n): draws − n were thrown away by the rule. */
  draws: number;
  /** Samples whose rule was never met within MAX_PAIRING_ATTEMPTS (the last draw is kept). */
  failures: number;
};

/**
 * One uniform column of n draws for a purpose (`label`), from the seed. Every production study
 * takes its standardized draws from here, so the same (seed, label) gives the same column for
 * every candidate: common random numbers.
 *
 * @example commonUniforms('plan-1', 'part', 'rk', 20_000)
 */
export function commonUniforms(seed: string, ...labelsAndN: [...(string | number)[], number]): Float64Array {
  const n = labelsAndN[labelsAndN.length - 1] as number;
  const labels = labelsAndN.slice(0, -1) as (string | number)[];
  const out = new Float64Array(n);
  createStream(seed, 'production', ...labels).fillOpen(out, n);
  return out;
}

/**
 * The values (ohms) of a part for n samples from one uniform column: the part's spread kind at
 * `tolerance` percent. Calling it with the same column for two classes rescales the same
 * standardized draws. A binned part keeps its sorted-out band in proportion to the tolerance.
 *
 * @example partColumn(design.parts.rk, 1, u, 20_000) // Float64Array of Rk values at ±1 %
 */
export function partColumn(
  part: ResolvedPart,
  tolerance: number,
  u: Float64Array,
  n: number,
  field = 'part',
): Float64Array {
  const spread =
    part.spread.kind === 'binned' && part.tolerance > 0
      ? { ...part.spread, inner: (part.spread.inner * tolerance) / part.tolerance }
      : part.spread;
  const prepared = preparePartSpread({ value: part.value, tolerance, spread }, field);
  const out = new Float64Array(n);
  applyPartSpreadInPlace(prepared, u, out, n);
  return out;
}

/**
 * Tube section multipliers of n envelopes under an envelope rule. Each sample's first envelope
 * comes from fixed columns of the seed (so every rule starts from the same tubes); an envelope the
 * rule refuses is replaced by further draws from one redraw stream, in sample order. Same
 * lognormal/copula model as the run's tube spread (see fillTubeInPlace). With a `lot`, the measured
 * quantity of each envelope comes from the lot instead (one envelope drawn with replacement).
 *
 * @example tubeColumns(design, { kind: 'matched', quantity: 'ia', within: 10 }, 'seed', 20_000).draws
 */
export function tubeColumns(
  design: ResolvedDesign,
  rule: EnvelopeRule,
  seed: string,
  n: number,
  lot: PreparedLot | null = null,
): TubeColumns {
  const t = prepareTubeSpread({ ...design.tube.spread, pairing: undefined }, 'tube.spread');
  const ua = commonUniforms(seed, 'tube', 'perv1', n);
  const ue = commonUniforms(seed, 'tube', 'perv2', n);
  const ub = commonUniforms(seed, 'tube', 'mu1', n);
  const uf = commonUniforms(seed, 'tube', 'mu2', n);
  const redraw = createStream(seed, 'production', 'tube', 'redraw');
  const four = new Float64Array(4);
  const out: TubeColumns = {
    perv1: new Float64Array(n),
    perv2: new Float64Array(n),
    mu1: new Float64Array(n),
    mu2: new Float64Array(n),
    draws: 0,
    failures: 0,
  };
  const len = lot ? lot.perv1.length : 0;
  for (let s = 0; s < n; s++) {
    let pick = ua[s];
    let a = normalQuantile(ua[s]);
    let e = normalQuantile(ue[s]);
    let b = normalQuantile(ub[s]);
    let f = normalQuantile(uf[s]);
    for (let attempt = 1; ; attempt++) {
      out.draws++;
      let p1 = Math.exp(t.sPerv * a);
      let p2 = Math.exp(t.sPerv * (t.rho * a + t.rhoC * e));
      let m1 = Math.exp(t.sMu * b);
      let m2 = Math.exp(t.sMu * (t.rho * b + t.rhoC * f));
      if (lot) {
        // An envelope of the lot, drawn with replacement; what it did not measure stays modelled.
        const k = Math.min(len - 1, Math.floor(pick * len));
        if (lot.quantity !== 'mu') [p1, p2] = [lot.perv1[k], lot.perv2[k]];
        if (lot.quantity === 'mu' || lot.quantity === 'multipliers') [m1, m2] = [lot.mu1[k], lot.mu2[k]];
      }
      out.perv1[s] = p1;
      out.perv2[s] = p2;
      out.mu1[s] = m1;
      out.mu2[s] = m2;
      if (envelopeAccepted(rule, p1, p2, m1, m2)) break;
      if (attempt >= MAX_PAIRING_ATTEMPTS) {
        out.failures++;
        break;
      }
      redraw.fillOpen(four, 4);
      pick = four[0];
      a = normalQuantile(four[0]);
      e = normalQuantile(four[1]);
      b = normalQuantile(four[2]);
      f = normalQuantile(four[3]);
    }
  }
  return out;
}

/** The design's parts that are present, in the document's order. */
export function presentParts(design: ResolvedDesign): PartName[] {
  return (Object.keys(design.parts) as PartName[]).filter((k) => design.parts[k] !== undefined);
}

import { CAPACITOR_PARTS, type PartName, type ResolvedDesign } from '../design/designSchema.js';
import { normalCdf } from '../spread/normalCdf.js';
import { prepareTubeSpread } from '../spread/tubeSpread.js';
import { DEFAULT_RESISTOR_KIND } from '../values/resistorKinds.js';
import { tubeColumns } from './commonDraws.js';
import type { EnvelopeRule } from './envelopeRule.js';
import { partPrice, type PriceTable } from './priceTable.js';
import { rejectPpm } from './rejectBounds.js';
import { countFailures, createSampleJudge } from './sampleJudge.js';
import { studyColumns } from './studyColumns.js';
import { lotAcceptance, prepareLot, type TubeLot } from './tubeLot.js';

/** One pairing strategy's outcome. Money in the price table's currency, per unit built. */
export type PairingOutcome = {
  rule: EnvelopeRule;
  fails: number;
  samples: number;
  rejectPpm: number;
  lowPpm: number;
  highPpm: number;
  /** Share of envelopes the rule keeps (samples / envelopes drawn). */
  acceptance: number;
  /** Acceptance from the spread model in closed form, where there is one (matched rule), else null. */
  modelAcceptance: number | null;
  /** With a lot: the exact share of the lot's envelopes the rule keeps; else null. */
  lotAcceptance: number | null;
  /** Envelopes thrown away by the rule per unit built (drawn − used, per sample). */
  tubesThrownPerUnit: number;
  /** Parts at their design tolerance plus every envelope bought (used and thrown), per unit built. */
  costPerUnit: number;
  /** costPerUnit divided by the yield (1 − reject rate): what one good unit costs. */
  costPerGoodUnit: number;
};

/** A pairing comparison of one design. */
export type PairingComparison = {
  samples: number;
  seed: string;
  /** Price of the resistors at their tolerance classes (capacitors are not in the price table). */
  partsCost: number;
  /** Envelopes in the lot the tubes came from; null = the design's spread model. */
  lotSize: number | null;
  outcomes: PairingOutcome[];
};

/**
 * Compares envelope rules for one design on common draws: the same parts and the same first
 * envelopes for every rule, so differences come from the rules. Tubes are bought unmatched
 * (prices.tubes.unmatched) and sorted in house; a refused envelope is counted as thrown away.
 * With `options.lot` the envelopes come from a measured lot instead of the spread model.
 * Throws RangeError naming the field when a part has no price.
 *
 * @example comparePairing(design, prices, [{ kind: 'unmatched' }, { kind: 'matched', quantity: 'ia', within: 10 }])
 */
export function comparePairing(
  design: ResolvedDesign,
  prices: PriceTable,
  rules: readonly EnvelopeRule[],
  options: { samples?: number; seed?: string; lot?: TubeLot } = {},
): PairingComparison {
  if (design.topology === 'split-load')
    throw new RangeError('designId: a split-load design uses one triode section; pairing does not apply');
  const lot = options.lot ? prepareLot(options.lot) : null;
  const n = options.samples ?? 20_000;
  const seed = options.seed ?? 'pairing';
  let partsCost = 0;
  for (const [name, part] of Object.entries(design.parts)) {
    // The price table lists resistors; capacitors are not in the parts cost.
    if (!part || (CAPACITOR_PARTS as readonly string[]).includes(name)) continue;
    const kind = part.kind ?? DEFAULT_RESISTOR_KIND;
    const price = partPrice(prices, kind, part.tolerance);
    if (price === null)
      throw new RangeError(
        `prices.resistors: no ${kind} class at ${part.tolerance} % or tighter (part ${name as PartName})`,
      );
    partsCost += price;
  }
  const judge = createSampleJudge(design);
  const nominal = judge.kernel.nominalInputs();
  const outcomes = rules.map((rule) => {
    const tubes = tubeColumns(design, rule, seed, n, lot);
    const { fails } = countFailures(judge, studyColumns(design, tubes, nominal, seed, n), n, null, Infinity);
    const r = rejectPpm(fails, n);
    const envelopesPerUnit = tubes.draws / n;
    const costPerUnit = partsCost + prices.tubes.unmatched * envelopesPerUnit;
    const yieldFraction = 1 - fails / n;
    return {
      rule,
      fails,
      samples: n,
      rejectPpm: r.ppm,
      lowPpm: r.low,
      highPpm: r.high,
      acceptance: n / tubes.draws,
      modelAcceptance: lot ? null : modelAcceptance(design, rule),
      lotAcceptance: lot ? lotAcceptance(lot, rule) : null,
      tubesThrownPerUnit: envelopesPerUnit - 1,
      costPerUnit,
      costPerGoodUnit: yieldFraction > 0 ? costPerUnit / yieldFraction : Infinity,
    };
  });
  return { samples: n, seed, partsCost, lotSize: lot ? lot.perv1.length : null, outcomes };
}

/**
 * Share of envelopes a matched rule keeps, from the spread model: with X = ln(q1/q2) normal with
 * sd σ·√(2(1−ρ)) (σ the log-sd of the quantity: perveance for Ia, ⅔ of it for gm, mu's for mu),
 * P(|e^X − 1| ≤ w) = Φ(ln(1+w)/sd) − Φ(ln(1−w)/sd). Null for other rules.
 *
 * @example modelAcceptance(design, { kind: 'matched', quantity: 'ia', within: 15 }) // ≈ 0.88 at 10 %, ρ 0.5
 */
export function modelAcceptance(design: ResolvedDesign, rule: EnvelopeRule): number | null {
  if (rule.kind === 'unmatched') return 1;
  if (rule.kind !== 'matched') return null;
  const t = prepareTubeSpread({ ...design.tube.spread, pairing: undefined });
  const s = rule.quantity === 'mu' ? t.sMu : rule.quantity === 'ia' ? t.sPerv : (2 / 3) * t.sPerv;
  const sd = s * Math.sqrt(2 * (1 - t.rho));
  if (sd === 0) return 1;
  const w = rule.within / 100;
  return normalCdf(Math.log(1 + w) / sd) - normalCdf(Math.log(1 - w) / sd);
}

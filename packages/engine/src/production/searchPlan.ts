import type { PartName, ResolvedDesign } from '../design/designSchema.js';
import { INPUTS } from '../model/stageKernel.js';
import { DEFAULT_RESISTOR_KIND, type ResistorKind } from '../values/resistorKinds.js';
import { applyPlan, type MatchRule, type PlanAssignment, type TubeOption } from './applyPlan.js';
import { commonUniforms, partColumn, tubeColumns } from './commonDraws.js';
import { classesFor, type PriceTable, type ToleranceClass } from './priceTable.js';
import { maxFailures, rejectPpm } from './rejectBounds.js';
import { countFailures, createHardSamples, createSampleJudge } from './sampleJudge.js';

/** Parts planned when the caller names none: the six every design has. */
export const DEFAULT_PLAN_PARTS: readonly PartName[] = ['rl1', 'rl2', 'rk', 'rt', 'rg1', 'rg2'];
/** Rule a supplier-matched tube meets when the design names none (common practice, no source). */
export const DEFAULT_MATCH_RULE: MatchRule = { quantity: 'ia', within: 10 };
/** Most candidate plans one search may enumerate. */
export const MAX_PLAN_CANDIDATES = 250_000;
/** Reject-rate targets (PPM) the frontier is traced at, besides the caller's own. */
const LADDER_PPM = [
  200_000, 100_000, 50_000, 20_000, 10_000, 5000, 2000, 1000, 500, 200, 100, 50, 20, 10, 5, 2, 1,
];

/** Options of a plan search. PPM = rejects per million units. */
export type PlanSearchOptions = {
  prices: PriceTable;
  /** Target reject rate, PPM: met when the upper end of the Wilson interval is at or below it. */
  targetPpm: number;
  /** Two-sided confidence of the interval (default 0.95). */
  confidence?: number;
  /** Common samples every candidate is judged on (default 20 000). */
  samples?: number;
  seed?: string;
  /** Parts to plan (default the six of every design). */
  parts?: readonly PartName[];
  /** Tube options to consider (default both). */
  tubes?: readonly TubeOption[];
  /** Rule of a matched tube (default the design's pairing rule, else Ia within 10 %). */
  matchRule?: MatchRule;
};

/** One evaluated plan: price per unit, reject rate (PPM) with its interval. */
export type PlanPoint = {
  assignment: PlanAssignment;
  /** Parts plus tube, per unit built, in the price table's currency. */
  cost: number;
  fails: number;
  samples: number;
  rejectPpm: number;
  lowPpm: number;
  highPpm: number;
  /** Tightest frontier target (PPM) this plan is the cheapest for. */
  targetPpm: number;
};

/** What a plan search found. */
export type PlanSearchResult = {
  targetPpm: number;
  confidence: number;
  samples: number;
  seed: string;
  matchRule: MatchRule;
  /** Currency of every cost (the price table's). */
  currency: string;
  parts: { name: PartName; kind: ResistorKind; classes: ToleranceClass[] }[];
  /** Cheapest plan meeting the target, or null when no candidate does. */
  chosen: PlanPoint | null;
  /** Cheapest plan per frontier target, cost ascending (reject rate descending). */
  frontier: PlanPoint[];
  candidates: number;
  /** Candidates judged (most stop after a few samples). */
  judged: number;
  kernelEvaluations: number;
};

/**
 * Finds the cheapest assignment of tolerance classes to parts (and tube option) whose reject rate
 * meets the target, and the cost-versus-reject-rate frontier. Every candidate is judged on the same
 * standardized draws (common random numbers: one uniform column per part, rescaled per class; one
 * set of tube envelopes per option), so candidates differ only by their classes. Candidates are
 * visited in order of cost; one is judged until it has more failures than the loosest unmet
 * target allows (then it cannot meet that target nor any tighter), or to the end, when it is the
 * cheapest plan for every unmet target its count meets. Samples that failed before are judged first,
 * so most candidates stop after a handful of kernel evaluations. The answer equals judging every
 * candidate on every sample (a test checks it against an exhaustive search).
 * Throws RangeError naming the field for unusable input.
 *
 * @example searchPlan(design, { prices, targetPpm: 1000 }).chosen?.assignment
 */
export function searchPlan(design: ResolvedDesign, options: PlanSearchOptions): PlanSearchResult {
  const n = options.samples ?? 20_000;
  const confidence = options.confidence ?? 0.95;
  const seed = options.seed ?? 'plan';
  const matchRule = options.matchRule ?? design.tube.spread.pairing ?? DEFAULT_MATCH_RULE;
  const tubes =
    options.tubes ??
    (design.topology === 'split-load' ? (['unmatched'] as const) : (['unmatched', 'matched'] as const));
  const plannable = (k: PartName) => {
    const kind = design.parts[k]?.spread.kind;
    return kind !== undefined && kind !== 'fixed' && kind !== 'empirical';
  };
  const names = options.parts ?? DEFAULT_PLAN_PARTS.filter(plannable);
  if (!(options.targetPpm > 0 && options.targetPpm < 1e6))
    throw new RangeError('targetPpm must be > 0 and < 1000000');
  if (!Number.isInteger(n) || n < 1 || n > 10_000_000)
    throw new RangeError('samples must be an integer 1..10000000');
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('confidence must be > 0 and < 1');
  if (tubes.length === 0) throw new RangeError('tubes must name at least one option');
  if (design.topology === 'split-load' && tubes.some((t) => t !== 'unmatched'))
    throw new RangeError('tubes: a split-load design uses one triode section; there is no pair to match');
  const parts = names.map((name) => {
    const part = design.parts[name];
    if (!part) throw new RangeError(`parts: the design has no part '${name}'`);
    if (part.spread.kind === 'fixed' || part.spread.kind === 'empirical')
      throw new RangeError(
        `parts.${name}.spread: a ${part.spread.kind} part has no tolerance class to choose`,
      );
    const kind = part.kind ?? DEFAULT_RESISTOR_KIND;
    const classes = classesFor(options.prices, kind);
    if (classes.length === 0) throw new RangeError(`prices.resistors: no price for ${kind} (part ${name})`);
    return { name, kind, classes, part };
  });
  let candidates = tubes.length;
  for (const p of parts) candidates *= p.classes.length;
  if (candidates > MAX_PLAN_CANDIDATES)
    throw new RangeError(`parts: ${candidates} candidate plans (at most ${MAX_PLAN_CANDIDATES})`);

  const allowUser = maxFailures(options.targetPpm, n, confidence);
  if (allowUser < 0) {
    // Smallest sample count that can show the target: double, then bisect.
    let lo = n;
    let need = n * 2;
    while (maxFailures(options.targetPpm, need, confidence) < 0) [lo, need] = [need, need * 2];
    while (need - lo > 1) {
      const mid = Math.floor((lo + need) / 2);
      if (maxFailures(options.targetPpm, mid, confidence) < 0) lo = mid;
      else need = mid;
    }
    throw new RangeError(
      `samples: ${n} samples cannot show ${options.targetPpm} PPM at this confidence (even with no reject); use at least ${need}`,
    );
  }
  const ladder = [...new Set([...LADDER_PPM.filter((t) => t >= options.targetPpm / 10), options.targetPpm])]
    .sort((a, b) => b - a)
    .map((ppm) => ({ ppm, allow: maxFailures(ppm, n, confidence), point: null as PlanPoint | null }))
    .filter((t) => t.allow >= 0);

  // Columns: one per part and class from one uniform column per part; tube envelopes per option.
  const inputIndex = (id: string) => INPUTS.indexOf(id as (typeof INPUTS)[number]);
  const base = createSampleJudge(design);
  const nominal = base.kernel.nominalInputs();
  const fixedColumns: Float64Array[] = INPUTS.map((id, i) => {
    const part = design.parts[id as PartName];
    if (part && !names.includes(id as PartName)) {
      return partColumn(part, part.tolerance, commonUniforms(seed, 'part', id, n), n, `parts.${id}`);
    }
    return new Float64Array(n).fill(nominal[i]);
  });
  const classColumns = parts.map((p) => {
    const u = commonUniforms(seed, 'part', p.name, n);
    return p.classes.map((c) => partColumn(p.part, c.tolerance, u, n, `parts.${p.name}`));
  });
  const tubeCols = tubes.map((t) =>
    tubeColumns(design, t === 'matched' ? { kind: 'matched', ...matchRule } : { kind: 'unmatched' }, seed, n),
  );
  const tubePrice = tubes.map((t) => options.prices.tubes[t]);

  // Every candidate as a mixed-radix index (tube option last), sorted by cost; ties keep index order.
  const radix = [...parts.map((p) => p.classes.length), tubes.length];
  const digits = (index: number): number[] =>
    radix.map((r) => {
      const d = index % r;
      index = Math.floor(index / r);
      return d;
    });
  const costOf = (d: number[]) =>
    parts.reduce((sum, p, i) => sum + p.classes[d[i]].price, 0) + tubePrice[d[parts.length]];
  const order = Array.from({ length: candidates }, (_v, i) => ({ i, cost: costOf(digits(i)) }));
  order.sort((a, b) => a.cost - b.cost || a.i - b.i);

  const hard = createHardSamples(n);
  const columns = fixedColumns.slice();
  const tubeInputs = ['perv1', 'perv2', 'mu1', 'mu2'] as const;
  let next = 0;
  let judged = 0;
  for (const cand of order) {
    while (next < ladder.length && ladder[next].point !== null) next++;
    if (next >= ladder.length) break;
    const d = digits(cand.i);
    parts.forEach((p, k) => (columns[inputIndex(p.name)] = classColumns[k][d[k]]));
    const tc = tubeCols[d[parts.length]];
    for (const id of tubeInputs) columns[inputIndex(id)] = tc[id];
    judged++;
    const { fails, evaluated } = countFailures(base, columns, n, hard, ladder[next].allow);
    if (evaluated < n) continue;
    const assignment: PlanAssignment = {
      classes: Object.fromEntries(parts.map((p, k) => [p.name, p.classes[d[k]].tolerance])),
      tube: tubes[d[parts.length]],
    };
    const r = rejectPpm(fails, n, confidence);
    for (let j = next; j < ladder.length && fails <= ladder[j].allow; j++) {
      ladder[j].point = {
        assignment,
        cost: cand.cost,
        fails,
        samples: n,
        rejectPpm: r.ppm,
        lowPpm: r.low,
        highPpm: r.high,
        targetPpm: ladder[j].ppm,
      };
    }
  }
  const byAssignment = new Map<string, PlanPoint>();
  for (const t of ladder) if (t.point) byAssignment.set(JSON.stringify(t.point.assignment), t.point);
  const frontier = [...byAssignment.values()].sort((a, b) => a.cost - b.cost);
  const chosen = ladder.find((t) => t.ppm === options.targetPpm)?.point ?? null;
  return {
    targetPpm: options.targetPpm,
    confidence,
    samples: n,
    seed,
    matchRule,
    currency: options.prices.currency,
    parts: parts.map(({ name, kind, classes }) => ({ name, kind, classes })),
    chosen,
    frontier,
    candidates,
    judged,
    kernelEvaluations: base.evaluations,
  };
}

/**
 * The design a confirming run should use for a plan point: the plan applied (see applyPlan).
 *
 * @example plannedDesign(design, result, result.chosen!)
 */
export function plannedDesign(
  design: ResolvedDesign,
  result: PlanSearchResult,
  point: PlanPoint,
): ResolvedDesign {
  return applyPlan(design, point.assignment, result.matchRule);
}

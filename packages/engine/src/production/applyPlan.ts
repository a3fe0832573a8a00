import type { Design, PartName, ResolvedDesign } from '../design/designSchema.js';

/** Whether the stage's tube is bought unmatched or with its sections matched. */
export type TubeOption = 'unmatched' | 'matched';

/**
 * A plan: tolerance class (percent) per planned part, and the tube option. Parts not listed keep
 * the design's tolerance.
 *
 * @example { classes: { rl1: 1, rl2: 1, rk: 5 }, tube: 'matched' }
 */
export type PlanAssignment = { classes: Partial<Record<PartName, number>>; tube: TubeOption };

/** The pairing rule a supplier-matched tube meets (quantity and percent). */
export type MatchRule = { quantity: 'ia' | 'gm' | 'mu'; within: number };

/**
 * The design with the plan applied: each listed part at its class's tolerance (a binned part's
 * sorted-out band scaled with it), and the tube's pairing rule set to `matchRule` for a matched
 * tube or removed for an unmatched one. Works on the document as written or resolved; the input
 * is not changed.
 *
 * @example applyPlan(design, { classes: { rk: 1 }, tube: 'unmatched' }, { quantity: 'ia', within: 10 })
 */
export function applyPlan<D extends Design | ResolvedDesign>(
  design: D,
  plan: PlanAssignment,
  matchRule: MatchRule,
): D {
  const parts: Record<string, unknown> = { ...design.parts };
  for (const [name, tolerance] of Object.entries(plan.classes)) {
    const part = design.parts[name as PartName];
    if (!part || tolerance === undefined) continue;
    const spread =
      part.spread.kind === 'binned' && part.tolerance > 0
        ? { ...part.spread, inner: (part.spread.inner * tolerance) / part.tolerance }
        : part.spread;
    parts[name] = { ...part, tolerance, spread };
  }
  const { pairing: _old, ...spread } = design.tube.spread;
  const tubeSpread = plan.tube === 'matched' ? { ...spread, pairing: { ...matchRule } } : spread;
  return { ...design, parts, tube: { ...design.tube, spread: tubeSpread } } as D;
}

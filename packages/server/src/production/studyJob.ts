import {
  applyAgeing,
  comparePairing,
  searchPlan,
  type AgeingScenario,
  type EnvelopeRule,
  type PlanSearchOptions,
  type PriceTable,
  type ResolvedDesign,
  type TubeLot,
} from '@sigmatail/engine';

/** One production study, as plain data (it crosses to a pool thread). */
export type StudyInput =
  | { kind: 'plan'; design: ResolvedDesign; options: PlanSearchOptions }
  | {
      kind: 'pairing';
      design: ResolvedDesign;
      prices: PriceTable;
      rules: EnvelopeRule[];
      options: { samples?: number; seed?: string; lot?: TubeLot };
    }
  | {
      kind: 'ageing';
      design: ResolvedDesign;
      scenario: AgeingScenario;
      options: { samples?: number; seed?: string; lot?: TubeLot };
    };

/**
 * Runs a study. A RangeError (the engine naming a bad field) comes back as `{ rangeError }`,
 * because an Error's class does not survive the trip from a thread.
 */
export function studyJob(input: StudyInput): { result: unknown } | { rangeError: string } {
  try {
    if (input.kind === 'plan') return { result: searchPlan(input.design, input.options) };
    if (input.kind === 'pairing')
      return { result: comparePairing(input.design, input.prices, input.rules, input.options) };
    return { result: applyAgeing(input.design, input.scenario, input.options) };
  } catch (err) {
    if (err instanceof RangeError) return { rangeError: err.message };
    throw err;
  }
}

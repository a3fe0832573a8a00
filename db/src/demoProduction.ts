import { parseDesign, searchPlan, type PriceTable } from '@sigmatail/engine';

/** The demo workshop's price table. Every price is invented. */
export const DEMO_PRICES: PriceTable = {
  currency: 'EUR',
  resistors: [
    { kind: 'metal-film', tolerance: 5, price: 0.04 },
    { kind: 'metal-film', tolerance: 2, price: 0.06 },
    { kind: 'metal-film', tolerance: 1, price: 0.09 },
    { kind: 'metal-film', tolerance: 0.5, price: 0.24 },
    { kind: 'carbon-film', tolerance: 5, price: 0.02 },
    { kind: 'carbon-film', tolerance: 2, price: 0.05 },
    { kind: 'carbon-comp', tolerance: 10, price: 0.12 },
    { kind: 'carbon-comp', tolerance: 5, price: 0.3 },
  ],
  tubes: { unmatched: 16.5, matched: 22 },
};

/** The demo plan: the demo guitar design (the engine's example) planned to this reject rate. */
export const DEMO_PLAN_DESIGN = 'Combo 40 phase splitter';
export const DEMO_PLAN_TARGET = { targetPpm: 500, confidence: 0.95, samples: 20_000, seed: 'demo-plan' };

/**
 * The demo plan's search result for a design document (about 0.1 s of engine time; the seed
 * computes it only when the workshop has no plan yet).
 */
export function demoPlanResult(document: unknown) {
  const parsed = parseDesign(document);
  if (!parsed.ok) return null;
  return searchPlan(parsed.design, { prices: DEMO_PRICES, ...DEMO_PLAN_TARGET });
}

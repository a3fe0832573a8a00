// Production planning: prices, tolerance plans, pairing strategies and ageing (pure).
export * from './priceTable.js';
export * from './envelopeRule.js';
export * from './ruleLabel.js';
export * from './applyPlan.js';
export * from './rejectBounds.js';
export * from './commonDraws.js';
export * from './tubeLot.js';
export * from './sampleJudge.js';
export * from './searchPlan.js';
export * from './comparePairing.js';
export * from './ageingScenario.js';
export * from './applyAgeing.js';

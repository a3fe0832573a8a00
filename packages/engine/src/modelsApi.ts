// Models barrel: values, tube catalog and triode model, bias point, small signal, design format.
export * from './values/parseValue.js';
export * from './values/formatValue.js';
export * from './values/toleranceLetters.js';
export * from './tubes/tubeTypes.js';
export * from './tubes/korenTriode.js';
export * from './tubes/tubeCatalog.js';
export * from './model/metrics.js';
export * from './model/biasSolver.js';
export * from './model/closedFormGains.js';
export * from './model/reducedNodalGains.js';
export * from './model/stageEvaluator.js';
export {
  INPUTS,
  createStageKernel,
  usesFrequencyAnalysis,
  type InputId,
  type StageKernel,
} from './model/stageKernel.js';
export * from './design/designSchema.js';
export * from './design/parseDesign.js';
export * from './design/migrateDesign.js';
export * from './values/eSeries.js';
export * from './model/stagePoint.js';
export * from './model/trimRl2.js';
export * from './model/ratingWarnings.js';
export * from './model/nominalResults.js';
export * from './model/nominalFrequencyResponse.js';
export * from './model/harmonics.js';
export * from './model/largeSignal.js';
export * from './model/largeSignalReport.js';
export * from './model/acResponse.js';
export * from './model/complexSolve.js';
export * from './model/nodalGains.js';
export * from './model/denseSolve.js';
export * from './model/biasPredictor.js';
export * from './design/designJsonSchema.js';
export * from './design/exampleDesign.js';

/** Uncertainty: Latin hypercube draws of uncertain inputs, intervals, paired comparisons and PRCC (issue 13). */
export * from './schema.ts';
export { mix64, splitMix64At, streamSeed, uniformAt } from './splitmix64.ts';
export { latinHypercube, seededPermutation, hypercubePoint, type LatinHypercube } from './latinHypercube.ts';
export { normalQuantile, normalCdf } from './normal.ts';
export { distributionQuantile, distributionMedian, lognormalSigma } from './quantiles.ts';
export { applyDraw, applyParameter } from './applyDraw.ts';
export {
  type OutcomeReader,
  prepareDraws,
  parameterValues,
  evaluateDraw,
  evaluateDrawRange,
  evaluateOptionUnderDraw,
  runDraw,
  runDrawRange,
  readDraw,
  type PreparedDraws,
  type DrawResult,
  type DrawRun,
  type DrawRange,
} from './drawOutcomes.ts';
export { drawRangeOnPool, uncertaintyOnPool, drawTasks, DRAWS_PER_TASK, type DrawMapOptions } from './drawsOnPool.ts';
export { sortedQuantile, intervalOf, probabilityLower, probabilityLowest, type Interval } from './summaries.ts';
export { ranks, partialRankCorrelations } from './prcc.ts';
export {
  COMPARED_OUTCOMES,
  SAMPLING,
  summariseDraws,
  withDrawSettings,
  type UncertaintyRun,
  type OptionUncertainty,
  type SensitivityEntry,
  type UncertaintyResults,
} from './ensemble.ts';

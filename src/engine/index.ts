/** The Mixwise engine: pure TypeScript, no platform imports. */
export * from './scenario.ts';
export * from './results.ts';
export { validateScenario, parseScenarioText, fieldRuleBroken, ScenarioError, type ValidationResult } from './validation.ts';
export { formatProblem, formatPath, type Problem } from './problems.ts';
export { calibrateTransmission, calibrationProblem, LARGEST_TRANSMISSION_RATE_PER_DAY, type Calibration } from './calibration.ts';
export { reproductionNumber, reproductionAtUnitTransmission } from './reproductionNumber.ts';
export { initialStateOf, initialSusceptibleOf } from './initialState.ts';
export { runScenario, runScenarioOnPool, runScenarioSummary, runScenarioSummaryOnPool, assembleResults, referenceIndexOf, reciprocityBySetting, compareWithReference } from './run.ts';
export { scenarioRevision } from './revision.ts';
export { WorkerPool, PoolCancelled, mapInline, mapPrepared, type MapOptions, type CancelSignal } from './pool/pool.ts';
export { JOBS, optionBuffers, type Job, type JobName, type ContextOf, type TaskOf, type ResultOf } from './pool/jobs.ts';
export { serveJobs } from './pool/serve.ts';
export type { PoolEndpoint, PoolRequest, PoolReply, WorkerSide } from './pool/protocol.ts';
export { effectiveContactMatrix, reciprocityCheck, correctReciprocity, RECIPROCITY_TOLERANCE } from './contacts.ts';
export { phaseAt, changeDays, measuresConstant } from './phases.ts';
export {
  growthRateFromR,
  reproductionNumberFromGrowthRate,
  generationIntervalTransform,
  doublingTimeDays,
  halvingTimeDays,
  periodsOf,
  type Periods,
} from './growth.ts';
export { prepareScenario, type PreparedScenario } from './prepare.ts';
export { simulateOption, type SeriesDetail, type OptionRunSettings } from './simulate.ts';
export { finalSizeByBand } from './finalSize.ts';
export { perronRoot, PerronRootNotSettled } from './perronRoot.ts';
export { RunRefused } from './runRefusal.ts';
export { integratorStepsSoFar } from './integrator.ts';
export * from './healthcare/index.ts';
export * from './vaccination/index.ts';
export { totalOverBands, weightedBandSum } from './bandTotals.ts';
export {
  DEFAULT_LIFE_TABLE,
  lifeTableSchema,
  remainingLifeExpectancyAt,
  remainingLifeExpectancyByBand,
  bandMidAges,
  yearsOfLifeLostByBand,
  type LifeTable,
} from './lifeExpectancy.ts';
export * from './uncertainty/index.ts';
export * from './fitting/index.ts';

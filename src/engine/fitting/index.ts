/**
 * Growth-rate fitting from daily case counts: CSV import, Poisson / negative-binomial regression
 * on day with a profile-likelihood interval, doubling time, and R0 for the scenario's model.
 */
export { parseCaseCountsCsv, formatCsvProblem, type CsvProblem, type CaseCsvResult } from './caseCountsCsv.ts';
export { dailyTotals, type CaseRow, type CaseSeries, type DailyCounts } from './caseSeries.ts';
export { isoDateToEpochDay, epochDayToIsoDate } from './isoDate.ts';
export {
  fitGrowth,
  OVERDISPERSION_THRESHOLD,
  type CountModel,
  type FitGrowthOptions,
  type FitGrowthResult,
  type FitProblem,
  type FittedPoint,
  type GrowthFit,
} from './fitGrowth.ts';
export { r0FromFit, type R0FromFit, type R0FromFitResult } from './r0FromFit.ts';
export { growthStatus, timeScales, type GrowthStatus, type TimeScales } from './timeScales.ts';
export { CHI_SQUARE_1_DF_95 } from './profileInterval.ts';
export { measuresRatioForOption, measuresRatioOfPhase, type MeasuresRatio, type MeasuresRatioResult } from './measuresRatio.ts';
export { caseDayDate, fitRecordMatches, fitRecordOf, type FitRecordInput } from './fitRecord.ts';
export { placeOnScenarioDays, type DayOrigin, type DayPlacement, type PlacementResult } from './scenarioDays.ts';
export { fitCaseCounts, type CaseCountFit, type CaseCountFitRequest, type CaseCountFitResult, type WindowEnd } from './fitCaseCounts.ts';
export { fitRecordSchema, type FitRecord } from './fitRecordSchema.ts';

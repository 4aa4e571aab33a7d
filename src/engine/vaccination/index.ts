/** Vaccination: campaigns, dose plans, priority orders and the coverage needed for R < 1. */
export { campaignSchema, doseStepSchema, type Campaign, type CampaignInput } from './schema.ts';
export { dosePlan, dosesByBandUntil, type DosePiece } from './dosePlan.ts';
export { ORDER_TEMPLATES, ADULT_AGE_YEARS, priorityFromTemplate, perCapitaInfectionShare, type OrderTemplate } from './orders.ts';
export { allocateDoses, coverageNeededForRBelowOne, type CoverageNeeded } from './coverage.ts';
export { relativeRiskGivenInfection } from './prepareCampaign.ts';
export { parseGroupSpec, groupSpecOf, groupProblems, groupPermutationFor, tenYearGroups, namedGroups } from './orderGroups.ts';
export {
  ORDER_OUTCOMES,
  evaluateOrder,
  priorityOf,
  type OrderOutcome,
  type OrderOutcomes,
  type OrderEvaluation,
  type OrderSearchJob,
} from './orderEvaluation.ts';
export { prepareOrderSearch, orderSearchJobOf, type OrderSearchRequest, type PreparedOrderSearch, type OrderEvaluationContext } from './orderJob.ts';
export {
  searchOrders,
  inThreadEvaluator,
  builtInPermutations,
  EXHAUSTIVE_LIMIT,
  DEFAULT_SEARCH_BUDGET,
  DEFAULT_SEARCH_SETTINGS,
  type OrderEvaluator,
  type OrderSearchSettings,
  type OrderSearchResult,
  type RankedOrder,
  type BuiltInOrder,
  type SearchProgress,
  type SearchControl,
} from './orderSearch.ts';
export { poolEvaluator } from './orderPool.ts';
export { orderComparisonOf, topOrdersUnderDraws, type OrderComparison, type ComparedOrder } from './orderComparison.ts';
export { prepareOrderDraws, orderValuesUnderDraw, orderShares, type OrderDrawsContext, type PreparedOrderDraws, type OrderDrawResult, type OrderShares } from './orderDraws.ts';
export { ordersInfo, type OrdersInfo } from './ordersInfo.ts';

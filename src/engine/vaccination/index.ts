/** Vaccination: campaigns, dose plans, priority orders and the coverage needed for R < 1. */
export { campaignSchema, doseStepSchema, type Campaign, type CampaignInput } from './schema.ts';
export { dosePlan, dosesByBandUntil, type DosePiece } from './dosePlan.ts';
export { ORDER_TEMPLATES, ADULT_AGE_YEARS, priorityFromTemplate, perCapitaInfectionShare, type OrderTemplate } from './orders.ts';
export { allocateDoses, coverageNeededForRBelowOne, type CoverageNeeded } from './coverage.ts';
export { relativeRiskGivenInfection } from './prepare.ts';

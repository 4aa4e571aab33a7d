/** The cautions every printed report carries (DESIGN.md section 6), and the model's limits in plain words. */

export const CAUTION =
  'Scenario projections under stated assumptions, not forecasts; decisions rest with the responsible public-health authority and local rules.';

export const CAUTION_PARAGRAPHS = [
  'These are scenario projections under stated assumptions, not forecasts. They show what the model gives if its inputs and the measures described hold; they do not say what will happen.',
  'Results depend on inputs the user must check against local data: population, contacts, disease and severity parameters, and hospital capacity. The assumptions table lists every input and where it comes from.',
  'Decisions rest with the responsible public-health authority and local rules. This report is one input among others, such as surveillance data, feasibility, costs and wider effects of the measures.',
];

export const MODEL_LIMITS = [
  'The model is deterministic: it gives one average course for each option, with no chance events. Early on, or in small populations, real outbreaks can fade out or grow faster by chance.',
  'People mix at random within each age band and setting; there is no geography, no household or school structure beyond the contact matrices, and no travel into or out of the region.',
  'Behaviour changes only as the phases entered say; people do not react to the epidemic by themselves, and the measures are assumed to be followed as stated.',
  'Immunity after infection is complete and lasts for the whole horizon; there is no waning, no new variant, and no vaccination unless the scenario includes it.',
  'Parameter uncertainty is not shown: each number is a single value under the stated inputs, not a range. Small differences between options may not be meaningful.',
];

/** The last limit when the report gives intervals from uncertainty draws. */
export const DRAWS_LIMIT =
  'The ranges cover only the inputs listed as uncertain, over the distributions stated; the model itself and the other inputs are taken as given, so the true uncertainty is wider. Small differences between options may still not be meaningful.';

/** The model's limits, with the one on uncertainty as it applies to this report. */
export function modelLimits(withDraws: boolean): string[] {
  return withDraws ? [...MODEL_LIMITS.slice(0, -1), DRAWS_LIMIT] : [...MODEL_LIMITS];
}

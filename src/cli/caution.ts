/** The caution every report with numbers carries (DESIGN.md section 6). */
export const CAUTION =
  'Scenario projections under stated assumptions, not forecasts; decisions rest with the responsible public-health authority and local rules.';

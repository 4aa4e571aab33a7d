/**
 * What every option of a scenario shares: band parameters, the calibrated transmission rate
 * (calibration.ts), R0, the initial state and the delay weights. Computed once per scenario.
 */
import { type Calibration, calibrateTransmission } from './calibration.ts';
import { type Periods, periodsOf } from './growth.ts';
import { delayKernel } from './healthcare/kernels.ts';
import { type PreparedHealthcare, prepareHealthcare } from './healthcare/prepareHealthcare.ts';
import { initialStateOf } from './initialState.ts';
import { type PreparedCampaign, prepareCampaign } from './vaccination/prepareCampaign.ts';
import { remainingLifeExpectancyByBand } from './lifeExpectancy.ts';
import type { Scenario } from './scenario.ts';
import { type StateLayout, stateLayout } from './seir.ts';
import { type BandParameters, bandParameters } from './transmission.ts';

export interface PreparedScenario {
  scenario: Scenario;
  bands: BandParameters;
  periods: Periods;
  layout: StateLayout;
  /** Transmission rate per contact (dimensionless probability scale, per contact). */
  beta: number;
  /** Basic reproduction number (fully susceptible, no measures). */
  r0: number;
  /** State on day 0 (persons). */
  initialState: Float64Array;
  /** Susceptibles on day 0 by band (persons). */
  initialSusceptible: Float64Array;
  /** Infections placed on day 0 by band (persons). */
  seeds: Float64Array;
  /** IFR by band, fraction. */
  infectionFatalityRatio: Float64Array;
  /** Daily infection-to-death delay weights over the horizon, tail trimmed (healthcare/kernels.ts). */
  deathDelayWeights: Float64Array;
  /** Hospital ratios and kernels; null when the scenario has no `healthcare` section. */
  healthcare: PreparedHealthcare | null;
  /** Vaccination campaigns by name, with their dose plans. */
  campaigns: Map<string, PreparedCampaign>;
  /** Remaining life expectancy at each band's mid-age, years (lifeExpectancy.ts). */
  remainingLifeExpectancy: Float64Array;
}

/** Prepares a validated scenario; `calibration` is the one `validateScenario` returned, computed here when absent. */
export function prepareScenario(s: Scenario, calibration?: Calibration): PreparedScenario {
  const bp = bandParameters(s);
  const periods = periodsOf(s);
  const layout = stateLayout(bp.bands, periods.latentStages, periods.infectiousStages);
  const initialState = initialStateOf(s, layout);
  const initialSusceptible = initialState.slice(layout.susceptible, layout.susceptible + bp.bands);
  const { beta, r0 } = calibration ?? calibrateTransmission(s, bp);
  return {
    scenario: s,
    bands: bp,
    periods,
    layout,
    beta,
    r0,
    initialState,
    initialSusceptible,
    seeds: Float64Array.from(s.initialState.infectedPersons),
    infectionFatalityRatio: Float64Array.from(s.severity.infectionFatalityRatio),
    deathDelayWeights: delayKernel(s.severity.deathDelay, s.horizonDays),
    healthcare: prepareHealthcare(s),
    campaigns: new Map(s.vaccinationCampaigns.map((c) => [c.name, prepareCampaign(c, bp.population, s.horizonDays)])),
    remainingLifeExpectancy: remainingLifeExpectancyByBand(s),
  };
}

/**
 * What every option of a scenario shares: band parameters, the calibrated transmission rate,
 * R0, the initial state and the delay weights. Computed once per scenario.
 *
 * beta calibration (R is linear in beta, so beta = R_target / rho(K at beta = 1)):
 * - from R0: K at the disease-free state, everyone susceptible, no measures;
 * - from a doubling time T_d: r = ln 2 / T_d, R = 1 / M(r) (growth.ts, Euler-Lotka), taken as the
 *   R of the initial state (initial susceptibles) with no measures in force.
 */
import { dailyDelayWeights } from './distributions.ts';
import { type Periods, reproductionNumberFromGrowthRate } from './growth.ts';
import { type PreparedHealthcare, prepareHealthcare } from './healthcare/prepare.ts';
import { type PreparedCampaign, prepareCampaign } from './vaccination/prepare.ts';
import { remainingLifeExpectancyByBand } from './lifeExpectancy.ts';
import { dominantEigenvalue, nextGenerationMatrixInto } from './ngm.ts';
import type { Scenario } from './scenario.ts';
import type { Problem } from './validation.ts';
import { type StateLayout, stateLayout } from './seir.ts';
import { type BandParameters, bandParameters, transmissionMatrixInto } from './transmission.ts';

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
  /** Daily infection-to-death delay weights over the horizon. */
  deathDelayWeights: Float64Array;
  /** Hospital ratios and kernels; null when the scenario has no `healthcare` section. */
  healthcare: PreparedHealthcare | null;
  /** Vaccination campaigns by name, with their dose plans. */
  campaigns: Map<string, PreparedCampaign>;
  /** Remaining life expectancy at each band's mid-age, years (lifeExpectancy.ts). */
  remainingLifeExpectancy: Float64Array;
}

export function periodsOf(s: Scenario): Periods {
  const d = s.disease;
  return {
    latentPeriodDays: d.latentPeriodDays,
    infectiousPeriodDays: d.infectiousPeriodDays,
    latentStages: d.latentStages,
    infectiousStages: d.infectiousStages,
  };
}

/**
 * Day-0 state: S = N (1 - immune) - seeds, R = N immune, seeds in the first latent or infectious
 * stage; with vaccination blocks, everyone unvaccinated (U = N).
 */
export function initialStateOf(s: Scenario, L: StateLayout): Float64Array {
  const y = new Float64Array(L.size);
  const init = s.initialState;
  for (let i = 0; i < L.bands; i++) {
    const n = s.populationPersons[i];
    const immune = n * (init.priorImmunityFraction?.[i] ?? 0);
    const seed = init.infectedPersons[i];
    y[L.susceptible + i] = Math.max(0, n - immune - seed);
    y[L.recovered + i] = immune;
    y[(init.infectedCompartment === 'latent' ? L.latent : L.infectious) + i] = seed;
    if (L.unvaccinated >= 0) y[L.unvaccinated + i] = n;
  }
  return y;
}

/** R for transmission rate 1 (per contact) at the given susceptibles, with no measures. */
function reproductionPerUnitBeta(s: Scenario, bp: BandParameters, susceptible: Float64Array): number {
  const n = bp.bands;
  const m = transmissionMatrixInto(new Float64Array(n * n), s, bp, 1, null);
  return dominantEigenvalue(nextGenerationMatrixInto(new Float64Array(n * n), m, susceptible, s.disease.infectiousPeriodDays), n);
}

/** beta and R0 of a scenario; beta is not finite when the target R cannot be reached (see `calibrationProblem`). */
export function calibrateTransmission(s: Scenario, bp: BandParameters, periods: Periods, initialSusceptible: Float64Array): { beta: number; r0: number } {
  const perBetaFull = reproductionPerUnitBeta(s, bp, bp.population);
  const t = s.disease.transmission;
  let beta: number;
  if (t.kind === 'r0') {
    beta = t.r0 / perBetaFull;
  } else {
    const rTarget = reproductionNumberFromGrowthRate(Math.LN2 / t.doublingTimeDays, periods);
    beta = rTarget / reproductionPerUnitBeta(s, bp, initialSusceptible);
  }
  return { beta, r0: beta * perBetaFull };
}

/** Above this many infections per day caused by one infectious person, rates are out of any real range. */
export const LARGEST_TRANSMISSION_RATE_PER_DAY = 1e4;

/**
 * A target R0 (or doubling time) needs some transmission to scale. When the contacts,
 * susceptibilities, infectiousness and populations allow none, beta cannot be found; when they
 * allow only vanishing transmission in one place and ordinary contacts elsewhere, the calibrated
 * beta makes some rate absurdly large (one infectious person infecting more than
 * LARGEST_TRANSMISSION_RATE_PER_DAY people a day), which no integrator can follow. Both are
 * input mistakes: returns the problem, or null.
 */
export function calibrationProblem(s: Scenario): Problem | null {
  const bp = bandParameters(s);
  const periods = periodsOf(s);
  const layout = stateLayout(bp.bands, periods.latentStages, periods.infectiousStages);
  const initialSusceptible = initialStateOf(s, layout).slice(layout.susceptible, layout.susceptible + bp.bands);
  const { beta } = calibrateTransmission(s, bp, periods, initialSusceptible);
  const t = s.disease.transmission;
  const path = t.kind === 'r0' ? 'disease.transmission.r0' : 'disease.transmission.doublingTimeDays';
  const value = String(t.kind === 'r0' ? t.r0 : t.doublingTimeDays);
  if (!(Number.isFinite(beta) && beta > 0)) {
    return { path, rule: 'cannot be reached: the contact matrices, populations and susceptibilities allow (almost) no transmission', value };
  }
  const n = bp.bands;
  const m = transmissionMatrixInto(new Float64Array(n * n), s, bp, beta, null);
  let largest = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) largest = Math.max(largest, m[i * n + j] * bp.population[i]);
  if (!(largest <= LARGEST_TRANSMISSION_RATE_PER_DAY)) {
    return {
      path,
      rule: `cannot be reached with these contacts: it would make one infectious person infect over ${LARGEST_TRANSMISSION_RATE_PER_DAY.toLocaleString('en')} people a day somewhere (check contact matrices and susceptibilities for values far out of range)`,
      value,
    };
  }
  return null;
}

export function prepareScenario(s: Scenario): PreparedScenario {
  const bp = bandParameters(s);
  const periods = periodsOf(s);
  const layout = stateLayout(bp.bands, periods.latentStages, periods.infectiousStages);
  const initialState = initialStateOf(s, layout);
  const initialSusceptible = initialState.slice(layout.susceptible, layout.susceptible + bp.bands);
  const { beta, r0 } = calibrateTransmission(s, bp, periods, initialSusceptible);
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
    deathDelayWeights: dailyDelayWeights(s.severity.deathDelay.meanDays, s.severity.deathDelay.shape, s.horizonDays),
    healthcare: prepareHealthcare(s),
    campaigns: new Map(s.vaccinationCampaigns.map((c) => [c.name, prepareCampaign(c, bp.population, s.horizonDays)])),
    remainingLifeExpectancy: remainingLifeExpectancyByBand(s),
  };
}

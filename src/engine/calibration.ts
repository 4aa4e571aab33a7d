/**
 * The transmission rate beta that gives the scenario's target R, and whether that target can be
 * reached at all. Runs once per validated scenario: `validateScenario` returns the calibration
 * and `prepareScenario` takes it.
 *
 * R is linear in beta, so beta = R_target / R(beta = 1) (reproductionNumber.ts):
 * - from R0: R at the disease-free state, everyone susceptible, no measures;
 * - from a doubling time T_d: r = ln 2 / T_d, R = 1 / M(r) (growth.ts, Euler-Lotka), taken as the
 *   R of the initial state (initial susceptibles) with no measures in force.
 */
import { periodsOf, reproductionNumberFromGrowthRate } from './growth.ts';
import { initialSusceptibleOf } from './initialState.ts';
import type { Problem } from './problems.ts';
import { reproductionAtUnitTransmission } from './reproductionNumber.ts';
import type { Scenario } from './scenario.ts';
import { type BandParameters, bandParameters, transmissionMatrixInto } from './transmission.ts';

export interface Calibration {
  /** Transmission rate per contact; not finite when the target R cannot be reached (see `calibrationProblem`). */
  beta: number;
  /** Basic reproduction number (fully susceptible, no measures). */
  r0: number;
}

/** beta and R0 of a scenario. */
export function calibrateTransmission(s: Scenario, bands: BandParameters = bandParameters(s)): Calibration {
  const perBetaFull = reproductionAtUnitTransmission(s, bands, null, bands.population);
  const t = s.disease.transmission;
  let beta: number;
  if (t.kind === 'r0') {
    beta = t.r0 / perBetaFull;
  } else {
    const rTarget = reproductionNumberFromGrowthRate(Math.LN2 / t.doublingTimeDays, periodsOf(s));
    beta = rTarget / reproductionAtUnitTransmission(s, bands, null, initialSusceptibleOf(s));
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
export function calibrationProblem(s: Scenario, calibration: Calibration, bands: BandParameters = bandParameters(s)): Problem | null {
  const { beta } = calibration;
  const t = s.disease.transmission;
  const path = t.kind === 'r0' ? 'disease.transmission.r0' : 'disease.transmission.doublingTimeDays';
  const value = String(t.kind === 'r0' ? t.r0 : t.doublingTimeDays);
  if (!(Number.isFinite(beta) && beta > 0)) {
    return { path, rule: 'cannot be reached: the contact matrices, populations and susceptibilities allow (almost) no transmission', value };
  }
  const n = bands.bands;
  const m = transmissionMatrixInto(new Float64Array(n * n), s, bands, beta, null);
  let largest = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) largest = Math.max(largest, m[i * n + j] * bands.population[i]);
  if (!(largest <= LARGEST_TRANSMISSION_RATE_PER_DAY)) {
    return {
      path,
      rule: `cannot be reached with these contacts: it would make one infectious person infect over ${LARGEST_TRANSMISSION_RATE_PER_DAY.toLocaleString('en')} people a day somewhere (check contact matrices and susceptibilities for values far out of range)`,
      value,
    };
  }
  return null;
}

/**
 * R of a transmission matrix M at susceptibles S: the spectral radius of the next-generation
 * matrix K = D diag(S) M (ngm.ts; Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873),
 * D the mean infectious period (days). R is linear in the transmission rate beta, so R at
 * beta = 1 ("unit transmission") is what calibration, the measures ratio and the priority orders
 * start from: R(beta) = beta * R(1).
 */
import { nextGenerationMatrixInto, spectralRadius } from './ngm.ts';
import type { Phase, Scenario } from './scenario.ts';
import { type BandParameters, transmissionMatrixInto } from './transmission.ts';

/**
 * rho(D diag(S) M), certified to a relative 1e-12 by the Collatz-Wielandt bracket (perronRoot.ts is
 * the fallback inside `spectralRadius`). When `perronVector` (length n) is given it receives the
 * right Perron vector of K, normalised to sum 1.
 */
export function reproductionNumber(transmission: Float64Array, susceptible: ArrayLike<number>, infectiousPeriodDays: number, perronVector?: Float64Array): number {
  const n = susceptible.length;
  const k = nextGenerationMatrixInto(new Float64Array(n * n), transmission, susceptible, infectiousPeriodDays);
  const vector = perronVector ?? new Float64Array(n);
  vector.fill(1 / n);
  return spectralRadius(k, n, vector, new Float64Array(n), 1e-12);
}

/** R at transmission rate 1 (per contact) under `phase` (null: no measures) at susceptibles S. */
export function reproductionAtUnitTransmission(s: Scenario, bands: BandParameters, phase: Phase | null, susceptible: ArrayLike<number>, perronVector?: Float64Array): number {
  const n = bands.bands;
  const m = transmissionMatrixInto(new Float64Array(n * n), s, bands, 1, phase);
  return reproductionNumber(m, susceptible, s.disease.infectiousPeriodDays, perronVector);
}

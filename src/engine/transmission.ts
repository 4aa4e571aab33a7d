/**
 * The transmission matrix of a phase: M_ij = beta * u_i * C_ij * h_j * (1 - c) / N_j
 * (per day, per susceptible in band i, per infectious person in band j), so that the force of
 * infection is lambda_i = sum_j M_ij I_j (per day), as in DESIGN.md section 2:
 *   lambda_i(t) = beta u_i sum_j C_ij(t) h_j I_j(t) / N_j,
 * with c the case-isolation cut of infectiousness. A band with no people contributes nothing.
 */
import { effectiveContactsOfPhasesInto } from './contacts.ts';
import type { Phase, Scenario } from './scenario.ts';

/** Band-level inputs the transmission matrix needs, resolved once per scenario. */
export interface BandParameters {
  bands: number;
  population: Float64Array;
  /** u_i, relative susceptibility. */
  susceptibility: Float64Array;
  /** h_j, relative infectiousness. */
  infectiousness: Float64Array;
}

export function bandParameters(s: Scenario): BandParameters {
  const n = s.ageBands.length;
  return {
    bands: n,
    population: Float64Array.from(s.populationPersons),
    susceptibility: Float64Array.from(s.disease.relativeSusceptibility ?? new Array<number>(n).fill(1)),
    infectiousness: Float64Array.from(s.disease.relativeInfectiousness ?? new Array<number>(n).fill(1)),
  };
}

/** Writes M (row-major n x n, per day) for `phase` and transmission rate beta into `out`. */
export function transmissionMatrixInto(out: Float64Array, s: Scenario, bp: BandParameters, beta: number, phase: Phase | null): Float64Array {
  return transmissionMatrixOfPhasesInto(out, s, bp, beta, phase === null ? [] : [phase]);
}

/**
 * M under several phases in force at once (contacts.ts `effectiveContactsOfPhasesInto`); case
 * isolation cuts compound: the share of infectiousness kept is prod_p (1 - c_p).
 */
export function transmissionMatrixOfPhasesInto(out: Float64Array, s: Scenario, bp: BandParameters, beta: number, phases: readonly Phase[]): Float64Array {
  const n = bp.bands;
  effectiveContactsOfPhasesInto(out, s.settings, n, phases);
  let keep = 1;
  for (const phase of phases) keep *= 1 - phase.caseIsolation;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const nj = bp.population[j];
      out[i * n + j] = nj > 0 ? (beta * bp.susceptibility[i] * out[i * n + j] * bp.infectiousness[j] * keep) / nj : 0;
    }
  }
  return out;
}

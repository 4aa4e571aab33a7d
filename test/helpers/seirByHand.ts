/**
 * The age-structured SEIR model with Erlang stages written out again from its equations
 * (DESIGN.md section 2), independently of the engine's right-hand side and transmission matrix,
 * for the tests that solve it with odex and compare with the engine. For band i:
 *   lambda_i = sum_j M_ij I_j,  M_ij = beta u_i (prod (1 - c)) C_ij h_j / N_j,
 *   dS/dt = -lambda S, dE_1/dt = lambda S - a_E E_1, dE_k/dt = a_E (E_(k-1) - E_k),
 *   dI_1/dt = a_E E_kE - a_I I_1, dI_k/dt = a_I (I_(k-1) - I_k), dR/dt = a_I I_kI, dX/dt = lambda S,
 * a_E = k_E / T_E, a_I = k_I / T_I (Erlang stages; Anderson & May 1991, Infectious Diseases of
 * Humans; Wearing, Rohani & Keeling 2005, PLoS Med 2:e174). X counts infections since day 0.
 * State, stage-major: S (n), E_1..E_kE (n each), I_1..I_kI (n each), R (n), X (n).
 */
import type { Phase, Scenario } from '../../src/engine/scenario.ts';
import { contactsUnder } from './byHand.ts';

export function seirByHand(s: Scenario) {
  const n = s.ageBands.length;
  const N = s.populationPersons;
  const kE = s.disease.latentStages;
  const kI = s.disease.infectiousStages;
  const aE = kE / s.disease.latentPeriodDays;
  const aI = kI / s.disease.infectiousPeriodDays;
  const u = s.disease.relativeSusceptibility ?? N.map(() => 1);
  const h = s.disease.relativeInfectiousness ?? N.map(() => 1);
  const E = n;
  const I = n * (1 + kE);
  const R = n * (1 + kE + kI);
  const X = n * (2 + kE + kI);
  const size = n * (3 + kE + kI);

  /** Day 0: seeds in the first latent or the first infectious stage, the rest susceptible. */
  const initialState = (): number[] => {
    const y = new Array<number>(size).fill(0);
    const seedsAt = s.initialState.infectedCompartment === 'latent' ? E : I;
    for (let i = 0; i < n; i++) {
      y[i] = N[i] - s.initialState.infectedPersons[i];
      y[seedsAt + i] = s.initialState.infectedPersons[i];
    }
    return y;
  };

  /** M_ij, infections per day in band i per infectious person of band j and susceptible of band i. */
  const forceOfInfection = (beta: number, phases: Phase | null | readonly Phase[]): number[][] => {
    const inForce: readonly Phase[] = phases === null ? [] : 'fromDay' in phases ? [phases] : phases;
    const keep = inForce.reduce((k, ph) => k * (1 - ph.caseIsolation), 1);
    return contactsUnder(s, inForce).map((row, i) => row.map((c, j) => (N[j] > 0 ? (beta * u[i] * keep * c * h[j]) / N[j] : 0)));
  };

  const infectiousOf = (y: readonly number[], j: number): number => {
    let sum = 0;
    for (let k = 0; k < kI; k++) sum += y[I + k * n + j];
    return sum;
  };

  /** The right-hand side under a fixed force-of-infection matrix, in odex's form. */
  const rhs = (M: readonly (readonly number[])[]) => (_t: number, y: number[]): number[] => {
    const dy = new Array<number>(size).fill(0);
    const infectious = Array.from({ length: n }, (_, j) => infectiousOf(y, j));
    for (let i = 0; i < n; i++) {
      let lambda = 0;
      for (let j = 0; j < n; j++) lambda += M[i][j] * infectious[j];
      const infection = lambda * y[i];
      dy[i] = -infection;
      dy[X + i] = infection;
      for (let k = 0; k < kE; k++) dy[E + k * n + i] = (k === 0 ? infection : aE * y[E + (k - 1) * n + i]) - aE * y[E + k * n + i];
      for (let k = 0; k < kI; k++) dy[I + k * n + i] = (k === 0 ? aE * y[E + (kE - 1) * n + i] : aI * y[I + (k - 1) * n + i]) - aI * y[I + k * n + i];
      dy[R + i] = aI * y[I + (kI - 1) * n + i];
    }
    return dy;
  };

  /** Band i of a state: susceptibles, infected (latent and infectious), infectious, infections since day 0. */
  const band = (y: readonly number[], i: number) => {
    let latent = 0;
    for (let k = 0; k < kE; k++) latent += y[E + k * n + i];
    const infectious = infectiousOf(y, i);
    return { susceptible: y[i], infected: latent + infectious, infectious, cumulative: y[X + i] };
  };

  return { size, initialState, forceOfInfection, rhs, band };
}

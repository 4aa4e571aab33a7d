/**
 * Age-stratified SEIR right-hand side with Erlang stages, frequency dependent.
 *
 * For band i, with k_E latent stages (rate a_E = k_E / T_E each) and k_I infectious stages
 * (rate a_I = k_I / T_I each), I_i = sum of its infectious stages, and M the phase's transmission
 * matrix (transmission.ts):
 *
 *   lambda_i = sum_j M_ij I_j                       force of infection, per day
 *   dS_i/dt   = -lambda_i S_i
 *   dE1_i/dt  = lambda_i S_i - a_E E1_i,   dEk_i/dt = a_E (E(k-1)_i - Ek_i)
 *   dI1_i/dt  = a_E EkE_i - a_I I1_i,      dIk_i/dt = a_I (I(k-1)_i - Ik_i)
 *   dR_i/dt   = a_I IkI_i
 *   dX_i/dt   = lambda_i S_i               cumulative infections (a counter, not a state of people)
 *
 * Persons in S + E + I + R are conserved: the flows cancel exactly.
 * Units: persons, days. The state vector is compartment-major: block c holds band 0..n-1.
 */

/** Where each compartment's block of n bands starts in the state vector. */
export interface StateLayout {
  bands: number;
  latentStages: number;
  infectiousStages: number;
  /** Offset of S; E stage k at latent + k*n; I stage k at infectious + k*n. */
  susceptible: number;
  latent: number;
  infectious: number;
  recovered: number;
  cumulative: number;
  size: number;
}

export function stateLayout(bands: number, latentStages: number, infectiousStages: number): StateLayout {
  const latent = bands;
  const infectious = latent + latentStages * bands;
  const recovered = infectious + infectiousStages * bands;
  const cumulative = recovered + bands;
  return { bands, latentStages, infectiousStages, susceptible: 0, latent, infectious, recovered, cumulative, size: cumulative + bands };
}

/** Persons infectious (all stages) in band i. */
export function infectiousIn(y: Float64Array, L: StateLayout, i: number): number {
  let sum = 0;
  for (let k = 0; k < L.infectiousStages; k++) sum += y[L.infectious + k * L.bands + i];
  return sum;
}

/** Persons infected, latent or infectious (E + I), in band i. */
export function infectedIn(y: Float64Array, L: StateLayout, i: number): number {
  let sum = 0;
  for (let k = 0; k < L.latentStages; k++) sum += y[L.latent + k * L.bands + i];
  return sum + infectiousIn(y, L, i);
}

/**
 * Builds the right-hand side for a layout and periods. `transmission` (n x n, per day) is read at
 * every call, so the caller may overwrite it between phases. No allocation per call.
 */
export function seirRightHandSide(L: StateLayout, latentPeriodDays: number, infectiousPeriodDays: number, transmission: Float64Array) {
  const n = L.bands;
  const aE = L.latentStages / latentPeriodDays;
  const aI = L.infectiousStages / infectiousPeriodDays;
  const infectious = new Float64Array(n);
  const lastE = L.latent + (L.latentStages - 1) * n;
  const lastI = L.infectious + (L.infectiousStages - 1) * n;
  return (_t: number, y: Float64Array, dydt: Float64Array): void => {
    for (let j = 0; j < n; j++) infectious[j] = infectiousIn(y, L, j);
    for (let i = 0; i < n; i++) {
      let lambda = 0;
      const row = i * n;
      for (let j = 0; j < n; j++) lambda += transmission[row + j] * infectious[j];
      const flow = lambda * y[L.susceptible + i];
      dydt[L.susceptible + i] = -flow;
      dydt[L.latent + i] = flow - aE * y[L.latent + i];
      for (let k = 1; k < L.latentStages; k++) {
        const at = L.latent + k * n + i;
        dydt[at] = aE * (y[at - n] - y[at]);
      }
      dydt[L.infectious + i] = aE * y[lastE + i] - aI * y[L.infectious + i];
      for (let k = 1; k < L.infectiousStages; k++) {
        const at = L.infectious + k * n + i;
        dydt[at] = aI * (y[at - n] - y[at]);
      }
      dydt[L.recovered + i] = aI * y[lastI + i];
      dydt[L.cumulative + i] = flow;
    }
  };
}

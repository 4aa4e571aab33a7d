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
 * With a vaccination campaign (doses v_i per day, efficacy e against infection, mean delay to
 * protection delta), three more compartments of people and three counters join:
 *   W  vaccinated, not yet protected (susceptible as usual)
 *   P  vaccinated and protected: leaky, risk cut to (1 - e); all-or-nothing, the failures (risk 1)
 *   V  fully immune by vaccine (all-or-nothing only)
 *   U  counter of unvaccinated persons; Xp counter of infections in P; Q counter of doses given to
 *      people who were no longer susceptible (latent, infectious or recovered).
 * Doses reach the unvaccinated whatever their infection history, so a share S_i / U_i of them
 * lands on susceptibles:
 *   dS_i/dt = -lambda_i S_i - v_i S_i / U_i
 *   dW_i/dt = v_i S_i / U_i - lambda_i W_i - W_i / delta
 *   leaky:  dP_i/dt = W_i / delta - (1 - e) lambda_i P_i
 *   all-or-nothing: dP_i/dt = (1 - e) W_i / delta - lambda_i P_i,  dV_i/dt = e W_i / delta
 *   new infections lambda_i (S_i + W_i + s P_i), s = 1 - e (leaky) or 1 (all-or-nothing)
 *   dU_i/dt = -v_i,  dXp_i/dt = s lambda_i P_i,  dQ_i/dt = v_i (1 - S_i / U_i)
 *
 * Persons in S + W + P + V + E + I + R are conserved: the flows cancel exactly.
 * Infection flows use max(0, .) of S, W, P and I: the integrator's error control lets an empty
 * compartment dip below zero by about its absolute tolerance, and with R > 1 such a dip would
 * otherwise seed an exponentially growing "negative epidemic". Stage exits use the values as
 * they are, so a dip decays back to zero; conservation is untouched.
 * Units: persons, days. The state vector is compartment-major: block c holds band 0..n-1.
 */

import { rowTimes } from './dot.ts';

/** Where each compartment's block of n bands starts in the state vector (-1: not in this model). */
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
  /** Vaccination blocks (all -1 without a campaign). */
  waiting: number;
  protectedSusceptible: number;
  vaccineImmune: number;
  unvaccinated: number;
  protectedInfections: number;
  dosesToNonSusceptible: number;
  /** Blocks that hold people (the rest are counters): S, E.., I.., R and W, P, V when present. */
  peopleBlocks: number[];
  /**
   * Components 0..active-1 are the ones the right-hand side reads (S, E, I, and W, P, U); the
   * others (R, X, V, Xp, Q) it only writes, so the integrator need not form their stage values.
   */
  active: number;
  size: number;
}

export function stateLayout(bands: number, latentStages: number, infectiousStages: number, vaccination = false): StateLayout {
  const latent = bands;
  const infectious = latent + latentStages * bands;
  // The blocks the right-hand side reads come first (S, E.., I.., and W, P, U with vaccination),
  // then those it only writes (R, X, and V, Xp, Q): see `active`.
  let next = infectious + infectiousStages * bands;
  const take = (): number => {
    const at = next;
    next += bands;
    return at;
  };
  const waiting = vaccination ? take() : -1;
  const protectedSusceptible = vaccination ? take() : -1;
  const unvaccinated = vaccination ? take() : -1;
  const active = next;
  const recovered = take();
  const cumulative = take();
  const vaccineImmune = vaccination ? take() : -1;
  const protectedInfections = vaccination ? take() : -1;
  const dosesToNonSusceptible = vaccination ? take() : -1;
  const people = [0, ...Array.from({ length: latentStages + infectiousStages }, (_, k) => latent + k * bands), recovered];
  if (vaccination) people.push(waiting, protectedSusceptible, vaccineImmune);
  return {
    bands,
    latentStages,
    infectiousStages,
    susceptible: 0,
    latent,
    infectious,
    recovered,
    cumulative,
    waiting,
    protectedSusceptible,
    vaccineImmune,
    unvaccinated,
    protectedInfections,
    dosesToNonSusceptible,
    peopleBlocks: people,
    active,
    size: next,
  };
}

/** Vaccine properties the right-hand side needs. */
export interface VaccineEffect {
  efficacyAgainstInfection: number;
  protection: 'leaky' | 'allOrNothing';
  delayToProtectionDays: number;
}

/** Relative risk of infection of a person in P: 1 - e (leaky) or 1 (all-or-nothing failures). */
export function protectedRisk(v: VaccineEffect): number {
  return v.protection === 'leaky' ? 1 - v.efficacyAgainstInfection : 1;
}

/**
 * Builds the right-hand side for a layout and periods. `transmission` (n x n, per day) and
 * `doseRates` (n, doses per day; only read with vaccination) are read at every call, so the caller
 * may overwrite them between segments. No allocation per call.
 *
 * `counters` false (only without vaccination): the state is the first `L.active` components
 * (S, E, I) and R and X are not integrated. They are linear invariants of the system,
 * R = N - S - E - I and X = S(0) - S, which a Runge-Kutta method keeps exactly (up to rounding:
 * every stage is a linear combination of the same derivatives), so they are read from S, E, I
 * instead, and the integrator carries 3n instead of 5n components (one stage of each kind).
 */
export function seirRightHandSide(
  L: StateLayout,
  latentPeriodDays: number,
  infectiousPeriodDays: number,
  transmission: Float64Array,
  vaccine: VaccineEffect | null = null,
  doseRates: Float64Array = new Float64Array(L.bands),
  counters = true,
) {
  const n = L.bands;
  const aE = L.latentStages / latentPeriodDays;
  const aI = L.infectiousStages / infectiousPeriodDays;
  const infectious = new Float64Array(n);
  const lastE = L.latent + (L.latentStages - 1) * n;
  const lastI = L.infectious + (L.infectiousStages - 1) * n;
  const vaccinated = vaccine !== null && L.waiting >= 0;
  if (!counters && L.waiting >= 0) throw new Error('the vaccination counters must be integrated');
  const risk = vaccine === null ? 1 : protectedRisk(vaccine);
  const protect = vaccine === null ? 0 : 1 / vaccine.delayToProtectionDays;
  const leaky = vaccine?.protection !== 'allOrNothing';
  const efficacy = vaccine?.efficacyAgainstInfection ?? 0;
  // Offsets as locals: the right-hand side is the innermost loop of every run.
  const { susceptible: oS, latent: oE, infectious: oI, recovered: oR, cumulative: oX, latentStages: kE, infectiousStages: kI } = L;
  const { waiting: oW, protectedSusceptible: oP, vaccineImmune: oV, unvaccinated: oU, protectedInfections: oXp, dosesToNonSusceptible: oQ } = L;
  return (_t: number, y: Float64Array, dydt: Float64Array): void => {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < kI; k++) sum += y[oI + k * n + j];
      infectious[j] = sum > 0 ? sum : 0;
    }
    for (let i = 0; i < n; i++) {
      const lambda = rowTimes(transmission, i * n, infectious, n);
      const s = y[oS + i];
      const susceptible = s > 0 ? s : 0;
      let flow = lambda * susceptible;
      if (vaccinated) {
        const w = Math.max(0, y[oW + i]);
        const p = Math.max(0, y[oP + i]);
        const u = y[oU + i];
        const v = u > 0 ? doseRates[i] : 0;
        const share = u > 0 ? Math.min(1, susceptible / u) : 0;
        const toWaiting = v * share;
        const protecting = protect * w;
        const protectedFlow = risk * lambda * p;
        dydt[oS + i] = -flow - toWaiting;
        dydt[oW + i] = toWaiting - lambda * w - protecting;
        dydt[oP + i] = (leaky ? protecting : (1 - efficacy) * protecting) - protectedFlow;
        dydt[oV + i] = leaky ? 0 : efficacy * protecting;
        dydt[oU + i] = -v;
        dydt[oXp + i] = protectedFlow;
        dydt[oQ + i] = v - toWaiting;
        flow += lambda * w + protectedFlow;
      } else {
        dydt[oS + i] = -flow;
      }
      dydt[oE + i] = flow - aE * y[oE + i];
      for (let k = 1; k < kE; k++) {
        const at = oE + k * n + i;
        dydt[at] = aE * (y[at - n] - y[at]);
      }
      dydt[oI + i] = aE * y[lastE + i] - aI * y[oI + i];
      for (let k = 1; k < kI; k++) {
        const at = oI + k * n + i;
        dydt[at] = aI * (y[at - n] - y[at]);
      }
      if (counters) {
        dydt[oR + i] = aI * y[lastI + i];
        dydt[oX + i] = flow;
      }
    }
  };
}

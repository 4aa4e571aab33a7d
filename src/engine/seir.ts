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
 * protection delta), three more compartments of people join:
 *   W  vaccinated, not yet protected (susceptible as usual)
 *   P  vaccinated and protected: leaky, risk cut to (1 - e); all-or-nothing, the failures (risk 1)
 *   V  fully immune by vaccine (all-or-nothing only; always 0 with leaky protection)
 * and U, the unvaccinated persons, Xp, the infections in P, and Q, the doses given to people who
 * were no longer susceptible (latent, infectious or recovered). Doses reach the unvaccinated
 * whatever their infection history, so a share S_i / U_i of them lands on susceptibles:
 *   dS_i/dt = -lambda_i S_i - v_i S_i / U_i
 *   dW_i/dt = v_i S_i / U_i - lambda_i W_i - W_i / delta
 *   leaky:  dP_i/dt = W_i / delta - (1 - e) lambda_i P_i
 *   all-or-nothing: dP_i/dt = (1 - e) W_i / delta - lambda_i P_i,  dV_i/dt = e W_i / delta
 *   new infections lambda_i (S_i + W_i + s P_i), s = 1 - e (leaky) or 1 (all-or-nothing)
 *   dU_i/dt = -v_i,  dXp_i/dt = s lambda_i P_i,  dQ_i/dt = v_i (1 - S_i / U_i)
 *
 * Persons in S + W + P + V + E + I + R are conserved: the flows cancel exactly. Summing the
 * equations also gives d(S + W + P + V)/dt = -lambda (S + W + s P) = -dX/dt. So with a campaign,
 * as without, R and X are not integrated (`counters`):
 *   R_i = N_i - (S + W + P + V + E + I)_i,   X_i = (S + W + P + V)_i(0) - (S + W + P + V)_i(t),
 * and V is integrated only for all-or-nothing protection. U is piecewise linear in t
 * (vaccination/unvaccinated.ts) and read at the stage time. The integrated state is then
 * S, E.., I.., W, P (read by the right-hand side) and Xp, Q, V (quadratures, only written). Xp and
 * Q are held in units of 1% of the band's population (`quadratureUnits`), the rest in persons.
 * Infection flows use max(0, .) of S, W, P and I: the integrator's error control lets an empty
 * compartment dip below zero by about its absolute tolerance, and with R > 1 such a dip would
 * otherwise seed an exponentially growing "negative epidemic". Stage exits use the values as
 * they are, so a dip decays back to zero; conservation is untouched.
 * Units: persons, days. The state vector is compartment-major: block c holds band 0..n-1.
 */

import { rowTimes } from './dot.ts';
import { Unvaccinated } from './vaccination/unvaccinated.ts';

/** Where each compartment's block of n bands starts in the state vector (-1: not in this model). */
export interface StateLayout {
  bands: number;
  latentStages: number;
  infectiousStages: number;
  /** Offset of S; E stage k at latent + k*n; I stage k at infectious + k*n. */
  susceptible: number;
  latent: number;
  infectious: number;
  /** R and X: only without vaccination (with it they follow from the other blocks, see above). */
  recovered: number;
  cumulative: number;
  /** Vaccination blocks (all -1 without a campaign; V only with all-or-nothing protection). */
  waiting: number;
  protectedSusceptible: number;
  vaccineImmune: number;
  protectedInfections: number;
  dosesToNonSusceptible: number;
  /** Blocks that hold people (the rest are counters): S, E.., I.., and R, or W, P and V when present. */
  peopleBlocks: number[];
  /**
   * Components 0..active-1 are the ones the right-hand side reads (S, E, I, and W, P); the others
   * (R, X, or Xp, Q, V) it only writes, so the integrator need not form their stage values.
   */
  active: number;
  size: number;
}

/** The layout without vaccination (`protection` null) or with a campaign of that protection type. */
export function stateLayout(bands: number, latentStages: number, infectiousStages: number, protection: VaccineEffect['protection'] | null = null): StateLayout {
  const latent = bands;
  const infectious = latent + latentStages * bands;
  const vaccination = protection !== null;
  // The blocks the right-hand side reads come first (S, E.., I.., and W, P with vaccination),
  // then those it only writes (R, X without vaccination; Xp, Q, V with it): see `active`.
  let next = infectious + infectiousStages * bands;
  const take = (): number => {
    const at = next;
    next += bands;
    return at;
  };
  const waiting = vaccination ? take() : -1;
  const protectedSusceptible = vaccination ? take() : -1;
  const active = next;
  const recovered = vaccination ? -1 : take();
  const cumulative = vaccination ? -1 : take();
  const protectedInfections = vaccination ? take() : -1;
  const dosesToNonSusceptible = vaccination ? take() : -1;
  const vaccineImmune = protection === 'allOrNothing' ? take() : -1;
  const people = [0, ...Array.from({ length: latentStages + infectiousStages }, (_, k) => latent + k * bands)];
  if (recovered >= 0) people.push(recovered);
  if (vaccination) people.push(waiting, protectedSusceptible);
  if (vaccineImmune >= 0) people.push(vaccineImmune);
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
    protectedInfections,
    dosesToNonSusceptible,
    peopleBlocks: people,
    active,
    size: next,
  };
}

/**
 * Persons per unit of the quadratures Xp and Q in each band: 1% of the band's population (1 person
 * in an empty band). The integrator's absolute tolerance (1e-6 in the state's units) then stands
 * for 1e-8 of the band on them rather than 1e-6 persons. They are read only next to quantities of
 * the band's size (infections of the protected against all infections, for deaths and admissions;
 * doses to non-susceptibles against all doses), whose errors are controlled relative to the band
 * (S is near N_i for most of a run). Counted in persons, Xp and Q of a band that has just started
 * receiving doses are below 1e-3 for a day, and their error estimate rejected the first step of
 * most dose-plan segments (16 of the demo campaign's 140 steps).
 */
export function quadratureUnits(population: ArrayLike<number>): Float64Array {
  return Float64Array.from(population, (persons) => (persons > 0 ? persons / 100 : 1));
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
 * `doses` (dose rates and the unvaccinated; only read with vaccination) are read at every call, so
 * the caller may change them between segments. No allocation per call.
 *
 * `counters` false (only without vaccination): the state is the first `L.active` components
 * (S, E, I) and R and X are not integrated. They are linear invariants of the system,
 * R = N - S - E - I and X = S(0) - S, which a Runge-Kutta method keeps exactly (up to rounding:
 * every stage is a linear combination of the same derivatives), so they are read from S, E, I
 * instead, and the integrator carries 3n instead of 5n components (one stage of each kind). With
 * vaccination the layout has no R and X blocks at all (see above).
 */
export function seirRightHandSide(
  L: StateLayout,
  latentPeriodDays: number,
  infectiousPeriodDays: number,
  transmission: Float64Array,
  vaccine: VaccineEffect | null = null,
  doses: Unvaccinated | null = null,
  counters = true,
) {
  const n = L.bands;
  const aE = L.latentStages / latentPeriodDays;
  const aI = L.infectiousStages / infectiousPeriodDays;
  const infectious = new Float64Array(n);
  const lastE = L.latent + (L.latentStages - 1) * n;
  const lastI = L.infectious + (L.infectiousStages - 1) * n;
  const vaccinated = vaccine !== null && L.waiting >= 0;
  if (vaccinated && (doses === null || (vaccine.protection === 'allOrNothing') !== L.vaccineImmune >= 0)) {
    throw new Error('a vaccination right-hand side needs the doses and a layout for its protection type');
  }
  const unvaccinated = doses ?? new Unvaccinated([]);
  const writeCounters = counters && L.recovered >= 0;
  const risk = vaccine === null ? 1 : protectedRisk(vaccine);
  const protect = vaccine === null ? 0 : 1 / vaccine.delayToProtectionDays;
  const leaky = vaccine?.protection !== 'allOrNothing';
  const efficacy = vaccine?.efficacyAgainstInfection ?? 0;
  // Offsets as locals: the right-hand side is the innermost loop of every run.
  const { susceptible: oS, latent: oE, infectious: oI, recovered: oR, cumulative: oX, latentStages: kE, infectiousStages: kI } = L;
  const { waiting: oW, protectedSusceptible: oP, vaccineImmune: oV, protectedInfections: oXp, dosesToNonSusceptible: oQ } = L;
  const { rates, atStart } = unvaccinated;
  const perUnit = quadratureUnits(unvaccinated.population).map((unit) => 1 / unit);
  return (t: number, y: Float64Array, dydt: Float64Array): void => {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < kI; k++) sum += y[oI + k * n + j];
      infectious[j] = sum > 0 ? sum : 0;
    }
    const sinceStart = t - unvaccinated.fromDay;
    for (let i = 0; i < n; i++) {
      const lambda = rowTimes(transmission, i * n, infectious, n);
      const s = y[oS + i];
      const susceptible = s > 0 ? s : 0;
      let flow = lambda * susceptible;
      if (vaccinated) {
        const w = Math.max(0, y[oW + i]);
        const p = Math.max(0, y[oP + i]);
        const u = atStart[i] - rates[i] * sinceStart;
        const v = u > 0 ? rates[i] : 0;
        const share = u > 0 ? Math.min(1, susceptible / u) : 0;
        const toWaiting = v * share;
        const protecting = protect * w;
        const protectedFlow = risk * lambda * p;
        dydt[oS + i] = -flow - toWaiting;
        dydt[oW + i] = toWaiting - lambda * w - protecting;
        if (leaky) {
          dydt[oP + i] = protecting - protectedFlow;
        } else {
          dydt[oP + i] = (1 - efficacy) * protecting - protectedFlow;
          dydt[oV + i] = efficacy * protecting;
        }
        dydt[oXp + i] = perUnit[i] * protectedFlow;
        dydt[oQ + i] = perUnit[i] * (v - toWaiting);
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
      if (writeCounters) {
        dydt[oR + i] = aI * y[lastI + i];
        dydt[oX + i] = flow;
      }
    }
  };
}

/**
 * Coverage needed for R < 1: the smallest number of doses, given instantly on day 0 in the
 * campaign's priority order, after which the next-generation matrix's R on day 0 (under the
 * option's day-0 measures) drops below 1.
 *
 * Doses on day 0 reach the unvaccinated whatever their state, so a share S_i / N_i of band i's
 * doses d_i lands on susceptibles, and protection (leaky or all-or-nothing alike, in expectation)
 * removes a fraction e of them: S_eff,i = S_i (1 - e d_i / N_i). R(T) falls as the dose total T
 * grows, so T is found by bisection. Doses count as protecting at once (no delay): this is a
 * planning figure for the order, not a date.
 */
import { phaseAt } from '../phases.ts';
import type { PreparedScenario } from '../prepare.ts';
import { reproductionNumber } from '../reproductionNumber.ts';
import { optionPath, rootOrRefusal } from '../runRefusal.ts';
import type { PolicyOption } from '../scenario.ts';
import { transmissionMatrixInto } from '../transmission.ts';
import type { Campaign } from './schema.ts';

/** Doses by band when `total` doses go out in priority order (proportional to eligible people within a group). */
export function allocateDoses(c: Campaign, population: ArrayLike<number>, total: number): Float64Array {
  const n = population.length;
  const given = new Float64Array(n);
  let left = total;
  for (const group of c.priority) {
    if (left <= 0) break;
    let eligible = 0;
    for (const b of group) eligible += (c.uptakeCeiling[b] ?? 0) * population[b];
    if (eligible <= 0) continue;
    const take = Math.min(left, eligible);
    for (const b of group) given[b] += (take * (c.uptakeCeiling[b] ?? 0) * population[b]) / eligible;
    left -= take;
  }
  return given;
}

export interface CoverageNeeded {
  /** Doses needed; 0 when R is already below 1; null when even the full ceilings do not get there. */
  doses: number | null;
  /** doses / population, fraction. */
  populationFraction: number | null;
  /** R on day 0 with all ceilings met in this order. */
  reproductionNumberAtCeiling: number;
}

export function coverageNeededForRBelowOne(p: PreparedScenario, option: PolicyOption, c: Campaign): CoverageNeeded {
  const n = p.bands.bands;
  const population = p.bands.population;
  const m = transmissionMatrixInto(new Float64Array(n * n), p.scenario, p.bands, p.beta, phaseAt(option, 0));
  const effective = new Float64Array(n);
  const at = optionPath(p.scenario.options, option.name);
  const rAfter = (total: number): number => {
    const doses = allocateDoses(c, population, total);
    for (let i = 0; i < n; i++) {
      const s = p.initialSusceptible[i];
      effective[i] = population[i] > 0 ? s * (1 - (c.efficacyAgainstInfection * doses[i]) / population[i]) : 0;
    }
    return rootOrRefusal(() => reproductionNumber(m, effective, p.periods.infectiousPeriodDays), at, option.name, "with the campaign's doses given on day 0 (coverage needed for R < 1)");
  };
  let ceiling = 0;
  for (let i = 0; i < n; i++) ceiling += (c.uptakeCeiling[i] ?? 0) * population[i];
  const totalPopulation = population.reduce((a, b) => a + b, 0);
  const atCeiling = rAfter(ceiling);
  if (rAfter(0) < 1) return { doses: 0, populationFraction: 0, reproductionNumberAtCeiling: atCeiling };
  if (atCeiling >= 1) return { doses: null, populationFraction: null, reproductionNumberAtCeiling: atCeiling };
  let lo = 0;
  let hi = ceiling;
  for (let iter = 0; iter < 100 && hi - lo > 1e-9 * ceiling; iter++) {
    const mid = 0.5 * (lo + hi);
    if (rAfter(mid) < 1) hi = mid;
    else lo = mid;
  }
  return { doses: hi, populationFraction: hi / totalPopulation, reproductionNumberAtCeiling: atCeiling };
}

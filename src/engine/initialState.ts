/**
 * Day 0 of a scenario: S = N (1 - immune) - seeds (floored at 0), R = N immune (where the layout
 * has R), the seeds in the first latent or infectious stage; nobody vaccinated yet.
 */
import type { Scenario } from './scenario.ts';
import type { StateLayout } from './seir.ts';

/** Persons immune on day 0 in band i. */
function immuneOnDayZero(s: Scenario, i: number): number {
  return s.populationPersons[i] * (s.initialState.priorImmunityFraction?.[i] ?? 0);
}

/** Susceptibles on day 0 by band (persons). */
export function initialSusceptibleOf(s: Scenario): Float64Array {
  return Float64Array.from(s.populationPersons, (n, i) => {
    const immune = immuneOnDayZero(s, i);
    const seed = s.initialState.infectedPersons[i];
    return Math.max(0, n - immune - seed);
  });
}

/** The whole day-0 state vector in `layout` (persons). */
export function initialStateOf(s: Scenario, layout: StateLayout): Float64Array {
  const y = new Float64Array(layout.size);
  const init = s.initialState;
  y.set(initialSusceptibleOf(s), layout.susceptible);
  for (let i = 0; i < layout.bands; i++) {
    if (layout.recovered >= 0) y[layout.recovered + i] = immuneOnDayZero(s, i);
    y[(init.infectedCompartment === 'latent' ? layout.latent : layout.infectious) + i] = init.infectedPersons[i];
  }
  return y;
}

/**
 * Built-in priority orders for a campaign. Each returns groups of band indices, first group first.
 * "Adult" means a band whose lower age bound is 20 years or more (our convention, stated in the
 * app's model notes).
 */
import type { PreparedScenario } from '../prepare.ts';
import { reproductionAtUnitTransmission } from '../reproductionNumber.ts';

export const ADULT_AGE_YEARS = 20;

export type OrderTemplate = 'oldestFirst' | 'youngestAdultsFirst' | 'mostContactsFirst' | 'evenAcrossAdults';

/** Plain names and one-line descriptions for the app and the CLI. */
export const ORDER_TEMPLATES: readonly { id: OrderTemplate; label: string; description: string }[] = [
  { id: 'oldestFirst', label: 'Oldest first', description: 'One band at a time, from the oldest band down.' },
  { id: 'youngestAdultsFirst', label: 'Youngest adults first', description: 'Adults from the youngest band up (most contacts), then the under-20s.' },
  { id: 'mostContactsFirst', label: 'Most contacts first', description: 'Bands ranked by their per-person share of the next-generation matrix eigenvector (who gets infected most in the growing epidemic).' },
  { id: 'evenAcrossAdults', label: 'Even spread across adults', description: 'All adult bands at once in proportion to eligible people, then the under-20s.' },
];

function bandsBy(lowerAges: readonly number[], keep: (age: number) => boolean, ascending: boolean): number[] {
  const idx = lowerAges.map((_, i) => i).filter((i) => keep(lowerAges[i]));
  return idx.sort((a, b) => (ascending ? lowerAges[a] - lowerAges[b] : lowerAges[b] - lowerAges[a]));
}

/**
 * Right Perron vector of K at the disease-free state without measures, per person:
 * v_i / N_i, the relative chance that a person in band i is infected in the growing epidemic.
 */
export function perCapitaInfectionShare(p: PreparedScenario): Float64Array {
  const v = new Float64Array(p.bands.bands);
  reproductionAtUnitTransmission(p.scenario, p.bands, null, p.bands.population, v);
  return v.map((x, i) => (p.bands.population[i] > 0 ? x / p.bands.population[i] : 0));
}

/** The priority groups of a template for the prepared scenario's bands. */
export function priorityFromTemplate(template: OrderTemplate, p: PreparedScenario): number[][] {
  const ages = p.scenario.ageBands.map((b) => b.lowerAgeYears);
  const adult = (a: number) => a >= ADULT_AGE_YEARS;
  const young = bandsBy(ages, (a) => !adult(a), false);
  switch (template) {
    case 'oldestFirst':
      return bandsBy(ages, () => true, false).map((b) => [b]);
    case 'youngestAdultsFirst':
      return [...bandsBy(ages, adult, true), ...young].map((b) => [b]);
    case 'evenAcrossAdults': {
      const adults = bandsBy(ages, adult, true);
      return [...(adults.length > 0 ? [adults] : []), ...young.map((b) => [b])];
    }
    case 'mostContactsFirst': {
      const share = perCapitaInfectionShare(p);
      return ages.map((_, i) => i).sort((a, b) => share[b] - share[a] || a - b).map((b) => [b]);
    }
  }
}

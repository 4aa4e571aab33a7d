/**
 * Seeded daily count series for the fit's speed and agreement tests (test helper, not engine
 * code): short and long, growing and falling, with and without a weekday pattern, Poisson-like
 * and strongly overdispersed (NB2 draws, seededRandom.ts).
 */
import type { FitGrowthOptions } from '../../../src/engine/fitting/fitGrowth.ts';
import { expectedCounts, SeededRandom } from './seededRandom.ts';

export interface ReferenceSeries {
  name: string;
  day: number[];
  count: number[];
  options: FitGrowthOptions;
}

/** Weekday reporting factors of the weekly series (invented). */
export const WEEKDAY_FACTORS = [1, 0.8, 0.9, 1.1, 1.2, 0.6, 0.5];

const daysUpTo = (n: number): number[] => Array.from({ length: n }, (_, t) => t);
const negativeBinomialSeries = (seed: number, means: number[], alpha: number): number[] => {
  const rng = new SeededRandom(seed);
  return means.map((m) => rng.negativeBinomial(m, alpha));
};

/** A long overdispersed series: n days, mean 20 e^{2t/n} times the weekday factor, NB2 α = 2. */
export function longOverdispersedSeries(n: number): ReferenceSeries {
  return {
    name: `${n.toLocaleString('en')} days, weekday pattern, alpha 2`,
    day: daysUpTo(n),
    count: negativeBinomialSeries(12345 + n, expectedCounts(n, 20, 2 / n, WEEKDAY_FACTORS), 2),
    options: { family: 'negativeBinomial', dayOfWeek: true },
  };
}

/** The series the agreement test compares against the slow path's values. */
export function referenceSeries(): ReferenceSeries[] {
  const short = negativeBinomialSeries(101, expectedCounts(28, 40, 0.06), 0.1);
  return [
    { name: '28 days, alpha 0.1, negative binomial', day: daysUpTo(28), count: short, options: { family: 'negativeBinomial' } },
    { name: '28 days, alpha 0.1, Poisson', day: daysUpTo(28), count: short, options: { family: 'poisson' } },
    {
      name: '120 days, weekday pattern, alpha 0.5',
      day: daysUpTo(120),
      count: negativeBinomialSeries(202, expectedCounts(120, 30, 0.02, WEEKDAY_FACTORS), 0.5),
      options: { family: 'negativeBinomial', dayOfWeek: true },
    },
    { name: '45 days falling, alpha 0.8', day: daysUpTo(45), count: negativeBinomialSeries(303, expectedCounts(45, 200, -0.04), 0.8), options: { family: 'negativeBinomial' } },
    { name: '2,000 days, alpha 1.5', day: daysUpTo(2000), count: negativeBinomialSeries(404, expectedCounts(2000, 20, 0.001), 1.5), options: { family: 'negativeBinomial' } },
    { name: '6 days of few cases, alpha 2', day: daysUpTo(6), count: negativeBinomialSeries(505, expectedCounts(6, 1.5, 0.1), 2), options: { family: 'negativeBinomial' } },
    { name: '500 days near a million cases a day, alpha 0.01', day: daysUpTo(500), count: negativeBinomialSeries(606, expectedCounts(500, 1e6, 0.001), 0.01), options: { family: 'negativeBinomial' } },
    longOverdispersedSeries(10000),
  ];
}

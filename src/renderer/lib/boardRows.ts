/**
 * The rows of the options board: what each shows, how it is formatted, and which way is
 * better (for shading by change against the reference option; null = not shaded).
 * Only formats and compares engine results; computes no model quantity.
 */
import type { OptionResults } from '../../engine/results.ts';
import {
  formatDoublingOrHalving,
  formatGrowthRate,
  formatPercent,
  formatPersons,
  formatR,
  formatSignedPercent,
  formatSignedPersons,
  avertedShare,
} from './format.ts';

export interface BoardRow {
  id: string;
  label: string;
  hint: string;
  /** The number compared with the reference (and put in data-value for tests). */
  value(o: OptionResults): number;
  text(o: OptionResults, reference: OptionResults): string;
  detail?(o: OptionResults, reference: OptionResults): string;
  lowerIsBetter: boolean | null;
  /** Rows that are themselves a comparison are blank in the reference column. */
  comparison?: boolean;
}

export const BOARD_ROWS: BoardRow[] = [
  {
    id: 'rStart',
    label: 'R at start',
    hint: 'Reproduction number on day 0 under the measures in force (next-generation matrix)',
    value: (o) => o.rStart,
    text: (o) => formatR(o.rStart),
    lowerIsBetter: true,
  },
  {
    id: 'growth',
    label: 'Growth at start',
    hint: 'Exponential growth rate on day 0, per day; and the doubling or halving time',
    value: (o) => o.growthRatePerDay,
    text: (o) => formatGrowthRate(o.growthRatePerDay),
    detail: (o) => formatDoublingOrHalving(o.doublingTimeDays, o.halvingTimeDays),
    lowerIsBetter: true,
  },
  {
    id: 'peakDay',
    label: 'Peak day',
    hint: 'Day on which the most people are infected (latent or infectious)',
    value: (o) => o.peakDay,
    text: (o) => `day ${o.peakDay}`,
    lowerIsBetter: null,
  },
  {
    id: 'peakPrevalence',
    label: 'Peak prevalence',
    hint: 'Share of the population infected on the peak day (persons below)',
    value: (o) => o.peakPrevalence,
    text: (o) => formatPercent(o.peakPrevalence),
    detail: (o) => `${formatPersons(o.peakInfectedPersons)} persons`,
    lowerIsBetter: true,
  },
  {
    id: 'infections',
    label: 'Infections',
    hint: 'Persons infected by the end of the horizon, including the initial infections',
    value: (o) => o.infections,
    text: (o) => formatPersons(o.infections),
    lowerIsBetter: true,
  },
  {
    id: 'attackRate',
    label: 'Attack rate',
    hint: 'Infections divided by the population',
    value: (o) => o.attackRate,
    text: (o) => formatPercent(o.attackRate),
    lowerIsBetter: true,
  },
  {
    id: 'deaths',
    label: 'Deaths',
    hint: 'Deaths eventually caused by the infections in the horizon (IFR by band)',
    value: (o) => o.deaths,
    text: (o) => formatPersons(o.deaths),
    lowerIsBetter: true,
  },
  {
    id: 'infectionsAverted',
    label: 'Infections averted',
    hint: 'Reference option minus this option (positive = fewer infections)',
    value: (o) => o.infections,
    text: (o, ref) => formatSignedPersons(ref.infections - o.infections),
    detail: (o, ref) => `${formatSignedPercent(avertedShare(o.infections, ref.infections))} of reference`,
    lowerIsBetter: true,
    comparison: true,
  },
  {
    id: 'deathsAverted',
    label: 'Deaths averted',
    hint: 'Reference option minus this option (positive = fewer deaths)',
    value: (o) => o.deaths,
    text: (o, ref) => formatSignedPersons(ref.deaths - o.deaths),
    detail: (o, ref) => `${formatSignedPercent(avertedShare(o.deaths, ref.deaths))} of reference`,
    lowerIsBetter: true,
    comparison: true,
  },
];

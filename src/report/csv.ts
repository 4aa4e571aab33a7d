/**
 * CSV exports (RFC 4180: comma separator, CRLF line ends, a field quoted when it holds a comma,
 * quote or line break, quotes doubled). Numbers are written at full precision (JavaScript's
 * shortest round-trip form), so a CSV read back gives the engine's numbers exactly. An empty
 * cell means "none" (e.g. no doubling time when the epidemic is not growing).
 */
import type { OptionResults, ScenarioResults } from '../engine/results.ts';

type Field = string | number | boolean | null;

function csvField(value: Field): string {
  if (value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function csvLines(rows: readonly Field[][]): string {
  return rows.map((row) => row.map(csvField).join(',')).join('\r\n') + '\r\n';
}

const OPTION_COLUMNS: [string, (o: OptionResults, reference: OptionResults) => Field][] = [
  ['r_start', (o) => o.rStart],
  ['growth_rate_per_day', (o) => o.growthRatePerDay],
  ['doubling_time_days', (o) => o.doublingTimeDays],
  ['halving_time_days', (o) => o.halvingTimeDays],
  ['peak_day', (o) => o.peakDay],
  ['peak_infected_persons', (o) => o.peakInfectedPersons],
  ['peak_prevalence', (o) => o.peakPrevalence],
  ['infections', (o) => o.infections],
  ['attack_rate', (o) => o.attackRate],
  ['deaths', (o) => o.deaths],
  ['deaths_averted', (o, ref) => o.comparison?.deathsAverted ?? ref.deaths - o.deaths],
  ['final_size_attack_rate', (o) => o.finalSize?.attackRate ?? null],
];

const HOSPITAL_COLUMNS: [string, (o: OptionResults) => Field][] = [
  ['hospital_admissions', (o) => o.healthcare?.admissions ?? null],
  ['icu_admissions', (o) => o.healthcare?.icuAdmissions ?? null],
  ['peak_ward_occupancy', (o) => o.healthcare?.ward.peakOccupancy ?? null],
  ['peak_ward_day', (o) => o.healthcare?.ward.peakDay ?? null],
  ['ward_days_over_capacity', (o) => o.healthcare?.ward.daysOverCapacity ?? null],
  ['peak_icu_occupancy', (o) => o.healthcare?.icu.peakOccupancy ?? null],
  ['peak_icu_day', (o) => o.healthcare?.icu.peakDay ?? null],
  ['icu_days_over_capacity', (o) => o.healthcare?.icu.daysOverCapacity ?? null],
  ['icu_first_day_over_capacity', (o) => o.healthcare?.icu.firstDayOverCapacity ?? null],
  ['icu_days_over_surge_capacity', (o) => o.healthcare?.icu.daysOverSurgeCapacity ?? null],
];

const VACCINATION_COLUMNS: [string, (o: OptionResults) => Field][] = [
  ['vaccine_doses', (o) => o.vaccination?.doses ?? 0],
  ['deaths_averted_per_1000_doses', (o) => o.comparison?.deathsAvertedPer1000Doses ?? null],
  ['infections_averted_per_1000_doses', (o) => o.comparison?.infectionsAvertedPer1000Doses ?? null],
];

/**
 * The policy options table, one row per option: `option`, `reference` (true for the reference
 * option), the outcomes (rates per day, times in days, fractions 0-1, persons), hospital columns
 * when any option has hospital results, vaccination columns when any option has a campaign, then attack rate and deaths by age band
 * (`attack_rate <band>`, `deaths <band>`).
 */
export function optionsTableCsv(results: ScenarioResults): string {
  const reference = results.options[results.referenceIndex];
  const hospital = results.options.some((o) => o.healthcare !== null);
  const vaccination = results.options.some((o) => o.vaccination !== null);
  const header: Field[] = [
    'option',
    'reference',
    ...OPTION_COLUMNS.map(([name]) => name),
    ...(hospital ? HOSPITAL_COLUMNS.map(([name]) => name) : []),
    ...(vaccination ? VACCINATION_COLUMNS.map(([name]) => name) : []),
    ...results.ageBands.map((band) => `attack_rate ${band}`),
    ...results.ageBands.map((band) => `deaths ${band}`),
  ];
  const rows = results.options.map((o, k): Field[] => [
    o.name,
    k === results.referenceIndex,
    ...OPTION_COLUMNS.map(([, value]) => value(o, reference)),
    ...(hospital ? HOSPITAL_COLUMNS.map(([, value]) => value(o)) : []),
    ...(vaccination ? VACCINATION_COLUMNS.map(([, value]) => value(o)) : []),
    ...o.attackRateByBand,
    ...o.deathsByBand,
  ]);
  return csvLines([header, ...rows]);
}

/** Daily quantities written by `dailySeriesCsv`, with their units (see `DailySeries`). */
export const DAILY_QUANTITIES = {
  susceptible: 'persons susceptible at the start of the day',
  prevalence: 'persons infected (latent or infectious) on the day',
  incidence: 'new infections during the day, persons (day 0 includes the initial infections)',
  doses: 'vaccine doses given during the day, persons (options with a campaign only)',
  deaths: 'deaths during the day, persons (all bands only)',
  rt: 'R(t), dominant eigenvalue of the next-generation matrix on the day (all bands only)',
  hospital_admissions: 'hospital admissions during the day, persons (all bands only)',
  icu_admissions: 'admissions needing ICU during the day, persons (all bands only)',
  ward_occupancy: 'ward beds in use, mean over the day (all bands only)',
  icu_occupancy: 'ICU beds in use, mean over the day (all bands only)',
} as const;

export type DailyQuantity = keyof typeof DAILY_QUANTITIES;

/**
 * The daily series in long format: one line per option, day, band and quantity, columns
 * `option, day, band, quantity, value`. By-band quantities (susceptible, prevalence, incidence,
 * and doses for options with a vaccination campaign) have one line per band (the band's label)
 * and one for their sum over bands (band `all`); the others exist for all bands only. Days: 0..H for susceptible, prevalence and R(t); 0..H-1 for
 * quantities counted during a day. Lines are ordered by option, quantity, band, day.
 */
export function dailySeriesCsv(results: ScenarioResults): string {
  const lines: Field[][] = [['option', 'day', 'band', 'quantity', 'value']];
  for (const o of results.options) {
    const s = o.series;
    const byBand = (quantity: DailyQuantity, values: Float64Array, dayCount: number): void => {
      for (let i = 0; i < s.bands; i++) {
        for (let d = 0; d < dayCount; d++) lines.push([o.name, d, results.ageBands[i], quantity, values[d * s.bands + i]]);
      }
      for (let d = 0; d < dayCount; d++) {
        let total = 0;
        for (let i = 0; i < s.bands; i++) total += values[d * s.bands + i];
        lines.push([o.name, d, 'all', quantity, total]);
      }
    };
    const allBands = (quantity: DailyQuantity, values: Float64Array): void => {
      for (let d = 0; d < values.length; d++) lines.push([o.name, d, 'all', quantity, values[d]]);
    };
    byBand('susceptible', s.susceptible, s.days + 1);
    byBand('prevalence', s.prevalence, s.days + 1);
    byBand('incidence', s.incidence, s.days);
    if (o.vaccination !== null) byBand('doses', s.doses, s.days);
    allBands('deaths', s.deaths);
    allBands('rt', s.rt);
    if (o.healthcare !== null) {
      allBands('hospital_admissions', o.healthcare.series.admissions);
      allBands('icu_admissions', o.healthcare.series.icuAdmissions);
      allBands('ward_occupancy', o.healthcare.series.wardOccupancy);
      allBands('icu_occupancy', o.healthcare.series.icuOccupancy);
    }
  }
  return csvLines(lines);
}

/**
 * The one CSV writer of Mixwise (app exports, `mixwise report --format csv` and
 * `mixwise run --format csv`). RFC 4180 body: comma separator, CRLF line ends, a field quoted when
 * it holds a comma, quote or line break, quotes doubled.
 *
 * Every file starts with a header block of lines beginning with "#" (documented in README.md):
 * what the file is, the scenario fingerprint and program version, the caution, the units and the
 * precision. Readers skip it with their comment option (e.g. `comment="#"`).
 *
 * Numbers carry `CSV_SIGNIFICANT_DIGITS` significant digits (whole numbers exactly): far finer than
 * the model's inputs are known, and short enough to read. An empty cell means the outcome does not
 * apply to the option (no hospital section, no campaign) or there is none (e.g. no doubling time
 * when the epidemic is not growing).
 */
import type { ScenarioResults, ScenarioSummary } from '../engine/index.ts';
import { CAUTION } from './cautions.ts';
import { drawFacts, uncertainParameterRows, type DrawSummary } from './drawSummary.ts';
import { appliesTo, BAND_OUTCOMES, outcomeDatum, outcomesFor, type Outcome } from './outcomes.ts';
import { dateOfDay } from './numberFormat.ts';

type Field = string | number | boolean | null;

/** Significant digits of every non-integer number in a CSV export. */
export const CSV_SIGNIFICANT_DIGITS = 6;

/** Where the numbers come from, for the header block. */
export interface CsvSource {
  /** Full SHA-256 fingerprint of the scenario and program version (`scenarioFingerprint`). */
  fingerprint: string;
  appVersion: string;
}

/** A number at the stated precision: whole numbers as they are, others to 6 significant digits. */
export function csvNumber(x: number): string {
  if (!Number.isFinite(x)) return '';
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(CSV_SIGNIFICANT_DIGITS)));
}

function csvField(value: Field): string {
  if (value === null) return '';
  const text = typeof value === 'number' ? csvNumber(value) : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function csvLines(rows: readonly Field[][]): string {
  return rows.map((row) => row.map(csvField).join(',')).join('\r\n') + '\r\n';
}

const oneLine = (text: string) => text.replace(/[\r\n]+/g, ' ');

/** The "#" lines at the top of every export. */
export function csvHeaderBlock(what: string, results: ScenarioSummary, source: CsvSource, units: string, more: readonly string[] = []): string {
  const reference = results.options[results.referenceIndex]?.name ?? '';
  const lines = [
    `Mixwise ${what}: ${results.title}`,
    `Scenario fingerprint: ${source.fingerprint} (SHA-256 of the scenario and mixwise ${source.appVersion})`,
    CAUTION,
    `Reference option: ${reference}`,
    units,
    `Numbers: ${CSV_SIGNIFICANT_DIGITS} significant digits (whole numbers exact). Empty cell: does not apply, or none.`,
    ...more,
  ];
  return lines.map((line) => `# ${oneLine(line)}\r\n`).join('');
}

/**
 * The policy options table, one row per option: `option`, `reference` (true for the reference
 * option), then every outcome of the catalogue (src/report/outcomes.ts) that applies to some
 * option, under its CSV column name, then the by-band outcomes as `<column> <band label>`.
 * With uncertainty draws: each outcome with an interval is followed by `<column>_low` and
 * `<column>_high`, then `chance_lower_than_reference_<column>` and `chance_lowest_<column>` (shares
 * of draws, 0-1) come before the by-band outcomes, and the header block says how the draws were taken.
 */
export function optionsTableCsv(results: ScenarioSummary, source: CsvSource, draws?: DrawSummary): string {
  const outcomes = outcomesFor(results);
  const bands = BAND_OUTCOMES.filter((b) => results.options.some((o) => appliesTo(b, o)));
  const summary = draws?.summary;
  const intervalOf = (e: Outcome, k: number) => summary?.options[k]?.intervals[e.key] ?? null;
  const withInterval = (e: Outcome) => e.kind !== 'date' && results.options.some((_, k) => intervalOf(e, k) !== null);
  const first = summary?.options[0];
  const better = first === undefined ? [] : Object.keys(first.probabilityBetterThanReference);
  const best = first === undefined ? [] : Object.keys(first.probabilityBest);
  const column = (key: string) => outcomesFor(results).find((e) => e.key === key)?.column ?? key;
  const header: Field[] = [
    'option',
    'reference',
    ...outcomes.flatMap((e) => (withInterval(e) ? [e.column, `${e.column}_low`, `${e.column}_high`] : [e.column])),
    ...better.map((key) => `chance_lower_than_reference_${column(key)}`),
    ...best.map((key) => `chance_lowest_${column(key)}`),
    ...bands.flatMap((b) => results.ageBands.map((band) => `${b.column} ${band}`)),
  ];
  const rows = results.options.map((o, k): Field[] => [
    o.name,
    k === results.referenceIndex,
    ...outcomes.flatMap((e): Field[] => {
      const value = appliesTo(e, o) ? outcomeDatum(e, o, results) : null;
      if (!withInterval(e)) return [value];
      const interval = appliesTo(e, o) ? intervalOf(e, k) : null;
      return [value, interval?.low ?? null, interval?.high ?? null];
    }),
    ...better.map((key) => summary?.options[k]?.probabilityBetterThanReference[key] ?? null),
    ...best.map((key) => summary?.options[k]?.probabilityBest[key] ?? null),
    ...bands.flatMap((b) => (appliesTo(b, o) ? b.read(o, results) : results.ageBands.map(() => null))),
  ]);
  const units =
    'Units: rates per day; times in days; day numbers from day 0 (the scenario\'s first day); dates ISO 8601 (YYYY-MM-DD); prevalence, attack rates and shares as fractions 0-1; ' +
    'counts in persons (beds, doses); averted = reference minus option.';
  const drawLines =
    draws === undefined
      ? []
      : [
          ...drawFacts(draws.summary.uncertainty),
          '_low and _high: the bounds of that interval of the draws; the value itself is the run at the stated inputs. chance_: share of draws (0-1), the same draws for every option.',
          ...uncertainParameterRows(draws.parameters).map(([name, distribution, from]) => `Uncertain input ${name}: ${distribution}; source: ${from}`),
          ...draws.summary.uncertainty.notes,
        ];
  return csvHeaderBlock('policy options table', results, source, units, drawLines) + csvLines([header, ...rows]);
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
 * and one for their sum over bands (band `all`); the others exist for all bands only. Days: 0..H
 * for susceptible, prevalence and R(t); 0..H-1 for quantities counted during a day. Lines are
 * ordered by option, quantity, band, day. When the scenario has a start date, a `date` column
 * (ISO 8601) follows `day`.
 */
export function dailySeriesCsv(results: ScenarioResults, source: CsvSource): string {
  const start = results.startDate;
  const dayFields = (d: number): Field[] => (start === null ? [d] : [d, dateOfDay(start, d)]);
  const lines: Field[][] = [['option', ...(start === null ? ['day'] : ['day', 'date']), 'band', 'quantity', 'value']];
  for (const o of results.options) {
    const s = o.series;
    const byBand = (quantity: DailyQuantity, values: Float64Array, dayCount: number): void => {
      for (let i = 0; i < s.bands; i++) {
        for (let d = 0; d < dayCount; d++) lines.push([o.name, ...dayFields(d), results.ageBands[i], quantity, values[d * s.bands + i]]);
      }
      for (let d = 0; d < dayCount; d++) {
        let total = 0;
        for (let i = 0; i < s.bands; i++) total += values[d * s.bands + i];
        lines.push([o.name, ...dayFields(d), 'all', quantity, total]);
      }
    };
    const allBands = (quantity: DailyQuantity, values: Float64Array): void => {
      for (let d = 0; d < values.length; d++) lines.push([o.name, ...dayFields(d), 'all', quantity, values[d]]);
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
  const units = `Quantities: ${Object.entries(DAILY_QUANTITIES).map(([q, meaning]) => `${q} = ${meaning}`).join('; ')}.`;
  return csvHeaderBlock('daily series', results, source, units) + csvLines(lines);
}

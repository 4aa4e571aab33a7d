/**
 * Plausibility bounds of the scenario file. Each is far outside any real use, and inside the
 * range where the arithmetic stays finite: a contact of 1e200 or a population of 1e308 makes the
 * next-generation matrix overflow, a latent period of 1e-5 days or a multiplier of 1e20 makes
 * the rates too stiff to integrate, a delay shape of 1e306 overflows the gamma function. The
 * schema (scenario.ts) states them, so they appear in docs/scenario.schema.json and every
 * breach is reported at its JSON path before any linear algebra runs. All are common practice
 * (orders of magnitude beyond observed values), not taken from a source.
 */
import { z } from 'zod';

/** A bound as people read it: 1000, 0.1, 1e10. */
function shown(x: number): string {
  return x >= 1e6 ? x.toExponential().replace('e+', 'e') : String(x);
}

/** A number in [min, max], with the unit in the message: `must be at most 1000 contacts per day`. */
export function between(min: number, max: number, unit: string): z.ZodNumber {
  const inUnit = (x: number): string => `${shown(x)}${unit === '' ? '' : ` ${unit}`}`;
  return z
    .number({ message: 'must be a number' })
    .min(min, { message: min === 0 ? 'must be >= 0' : `must be at least ${inUnit(min)}` })
    .max(max, { message: `must be at most ${inUnit(max)}` });
}

/** A number in (0, max]. */
export function aboveZero(max: number, unit: string): z.ZodNumber {
  return z
    .number({ message: 'must be a number' })
    .gt(0, { message: 'must be > 0' })
    .max(max, { message: `must be at most ${shown(max)}${unit === '' ? '' : ` ${unit}`}` });
}

/** Contacts per day between one person and one age band: diaries record dozens, rarely hundreds. */
export const MAX_CONTACTS_PER_DAY = 1000;

/** Persons in one age band: more than the world's population. */
export const MAX_POPULATION_PERSONS = 1e10;

/** Relative susceptibility or infectiousness of a band against the reference of 1. */
export const MAX_RELATIVE_FACTOR = 100;

/** A phase's multiplier on a setting's contacts, or an age factor: 100 times usual contacts. */
export const MAX_CONTACT_MULTIPLIER = 100;

/** Mean latent and infectious periods, days: from under three hours to a year. */
export const MIN_PERIOD_DAYS = 0.1;
export const MAX_PERIOD_DAYS = 365;

/** Erlang stages of the latent or the infectious period: 20 already makes the period almost fixed (a coefficient of variation of 22%). */
export const MAX_ERLANG_STAGES = 20;

/** Days a scenario runs: ten years. */
export const MAX_HORIZON_DAYS = 3650;

/** Basic reproduction number. */
export const MAX_R0 = 100;

/** Doubling time before any measure, days: from six hours to almost no growth. */
export const MIN_DOUBLING_TIME_DAYS = 0.25;
export const MAX_DOUBLING_TIME_DAYS = 10_000;

/** Mean of a delay or length of stay, days. */
export const MAX_DELAY_MEAN_DAYS = 1000;

/** Shape of a gamma delay: from very skewed (0.1) to almost fixed (1000, a coefficient of variation of 3%). */
export const MIN_DELAY_SHAPE = 0.1;
export const MAX_DELAY_SHAPE = 1000;

/** Vaccine doses given in one day: more than the world's population. */
export const MAX_DOSES_PER_DAY = 1e10;

/** Mean delay from a dose to protection, days (the lower bound of 1 day is the integrator's, see vaccination/schema.ts). */
export const MAX_DELAY_TO_PROTECTION_DAYS = 365;

/** Lower age bound of a band, years. */
export const MAX_AGE_YEARS = 150;

/** Beds of one kind. */
export const MAX_BEDS = 1e9;

/** Day numbers of phases and dose steps: about 270 years, far beyond the longest horizon. */
export const MAX_DAY_NUMBER = 100_000;

/**
 * A trigger's level when it counts persons (daily admissions, ward or ICU occupancy): the
 * population bound. Levels per 100,000 population cannot exceed 100,000 (validation.ts).
 */
export const MAX_TRIGGER_LEVEL_PERSONS = MAX_POPULATION_PERSONS;
export const MAX_TRIGGER_LEVEL_PER_100K = 100_000;

/**
 * Values of an uncertain parameter's distribution (low, high, mode, mean, median, the ends of a
 * 95% range), in the unit of the input it sets or scales: R, days or a factor. The bounds of the
 * inputs themselves are far inside (R0 100, periods 365 days, doubling time 10,000 days); a draw
 * that breaks one of those is refused when the drawn scenario is checked.
 */
export const MAX_DISTRIBUTION_VALUE = 1e6;
/** A lognormal's geometric standard deviation: 100 puts its central 95% over a factor of 7e7. */
export const MAX_GEOMETRIC_SD = 100;
/** Latin hypercube draws in one run: a cluster's day of work. */
export const MAX_DRAWS = 10_000_000;

/** Remaining life expectancy in a life table, years (ages in it are bounded by MAX_AGE_YEARS). */
export const MAX_REMAINING_YEARS = 150;
/** Rows of a life table: one per year of age up to MAX_AGE_YEARS and then some. */
export const MAX_LIFE_TABLE_ROWS = 1000;

/**
 * Calendar date of day 0, ISO 8601: from the Gregorian calendar's first full century to four
 * centuries ahead. Later dates plus the longest horizon would pass year 9999, beyond YYYY-MM-DD.
 */
export const EARLIEST_START_DATE = '1600-01-01';
export const LATEST_START_DATE = '2399-12-31';

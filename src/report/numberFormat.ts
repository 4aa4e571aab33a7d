/**
 * The one number formatter of Mixwise, in two styles:
 *
 * - `screen` (the app): grouped thousands, millions shortened ("1.26 M"), a true minus sign
 *   (U+2212), percentages with a thin space ("12.3 %"), growth as "%/day", units written out.
 * - `print` (the printed report, the CLI tables and Markdown): fixed and locale-independent,
 *   ASCII only (hyphen-minus, "12.3%"), whole persons written in full ("1,263,456"), so the same
 *   scenario prints the same text on every machine and tests can find numbers in the page.
 *
 * `formatValue` formats a number by its kind (see `ValueKind`), so an outcome and an interval
 * around it are written the same way. Non-finite numbers print as an en dash.
 */

export type NumberStyle = 'screen' | 'print';

/**
 * What a number is, which decides how it is written:
 * - `count`: persons, beds, doses, patient-days (whole units; screen shortens millions)
 * - `change`: a signed count (averted quantities: positive = fewer than the reference)
 * - `fraction`: a share 0-1, written as a percentage
 * - `ratePerDay`: an exponential growth rate per day
 * - `days`: a duration in days (one decimal unless whole)
 * - `day`: a day number of the horizon (day 0 = the scenario's first day), followed by its calendar
 *   date in brackets when the scenario's start date is known (`ValueContext`)
 * - `ratio`: a dimensionless ratio such as R, two decimals (a unit such as "per 1,000 doses" may follow)
 * - `date`: a day number of the horizon written as its calendar date (ISO 8601) when the scenario's
 *   start date is known (`ValueContext`), else as a day
 */
export type ValueKind = 'count' | 'change' | 'fraction' | 'ratePerDay' | 'days' | 'day' | 'ratio' | 'date';

/** Shown for a number that is not finite. */
export const NOT_A_NUMBER = '–';

const SCREEN_MINUS = '\u2212';
const screenGrouped = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** Groups the digits of a whole number in thousands with ASCII signs: 1234567 -> "1,234,567". */
export function groupThousands(whole: number): string {
  const rounded = Math.round(whole);
  const sign = rounded < 0 ? '-' : '';
  return sign + Math.abs(rounded).toFixed(0).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** Number formatting in one style; every method returns `NOT_A_NUMBER` for a non-finite input. */
export interface NumberFormatter {
  readonly style: NumberStyle;
  /** A plain decimal with `digits` decimals. */
  decimal(x: number, digits: number): string;
  /** R and other ratios: two decimals ("1.23"). */
  r(x: number): string;
  /** Persons, beds or doses, whole: screen "12,345" / "1.26 M", print "12,345" / "1,263,456". */
  persons(x: number): string;
  /** A signed count: screen "−1,234" / "+56" / "±0", print "-1,234" / "+56" / "0". */
  signedPersons(x: number): string;
  /** A fraction as a percentage: screen "12.3 %" (tiny shares with two significant digits), print "12.3%". */
  percent(fraction: number, digits?: number): string;
  /** A signed relative change as a percentage: screen "−23.4 %", print "-23.4%". */
  signedPercent(relative: number | null): string;
  /** Growth rate per day: screen "+14.7 %/day", print "+0.147". */
  growthRate(perDay: number): string;
  /** A duration in days: screen "8.3 days", print "8.3" (whole numbers without decimals). */
  days(x: number): string;
  /** Doubling or halving time: screen "doubles in 4.7 days", print "4.7" / "halves in 9.3"; "flat" when neither. */
  doublingOrHalving(doubling: number | null, halving: number | null): string;
  /** A day of the horizon: screen "day 45", print "45". */
  day(x: number): string;
  /** A multiplier on contacts as a percentage of usual: 0 -> "0%", 0.333 -> "33.3%" (print); screen adds a space. */
  multiplier(x: number): string;
  /** Beds in use against beds available: screen "4,311 / 110 beds", print "4,311 / 110". */
  bedsAgainstCapacity(inUse: number, capacity: number): string;
}

function finite(format: (x: number) => string): (x: number) => string {
  return (x) => (Number.isFinite(x) ? format(x) : NOT_A_NUMBER);
}

function wholeOrOneDecimal(x: number): string {
  return Number.isInteger(x) ? x.toFixed(0) : x.toFixed(1);
}

function multiplierPercent(x: number): string {
  const percent = 100 * x;
  const digits = Number.isInteger(Math.round(percent * 10) / 10) ? 0 : 1;
  return percent.toFixed(digits);
}

const screenPercent = finite((fraction: number) => {
  const pct = fraction * 100;
  if (pct !== 0 && Math.abs(pct) < 0.001) return pct > 0 ? '< 0.001 %' : `> ${SCREEN_MINUS}0.001 %`;
  if (pct !== 0 && Math.abs(pct) < 0.1) return `${pct.toPrecision(2)} %`.replace('-', SCREEN_MINUS);
  return `${pct.toFixed(1)} %`.replace('-', SCREEN_MINUS);
});

const screenPersons = finite((x: number) => {
  if (Math.abs(x) >= 1e6) return `${(x / 1e6).toFixed(2)} M`.replace('-', SCREEN_MINUS);
  return screenGrouped.format(Math.round(x)).replace('-', SCREEN_MINUS);
});

/** The app's style. */
export const screen: NumberFormatter = {
  style: 'screen',
  decimal: (x, digits) => finite((v) => v.toFixed(digits).replace('-', SCREEN_MINUS))(x),
  r: finite((x) => x.toFixed(2)),
  persons: screenPersons,
  signedPersons: finite((x) => `${x > 0.5 ? '+' : x < -0.5 ? SCREEN_MINUS : '±'}${screenPersons(Math.abs(x))}`),
  percent: (fraction, digits) => (digits === undefined ? screenPercent(fraction) : finite((f) => `${(100 * f).toFixed(digits)} %`.replace('-', SCREEN_MINUS))(fraction)),
  signedPercent: (relative) => {
    if (relative === null || !Number.isFinite(relative)) return NOT_A_NUMBER;
    const pct = relative * 100;
    return `${pct > 0.05 ? '+' : pct < -0.05 ? SCREEN_MINUS : '±'}${Math.abs(pct).toFixed(1)} %`;
  },
  growthRate: finite((perDay) => `${perDay >= 0 ? '+' : SCREEN_MINUS}${Math.abs(perDay * 100).toFixed(1)} %/day`),
  days: finite((x) => `${x.toFixed(1)} days`),
  doublingOrHalving: (doubling, halving) => {
    if (doubling !== null) return `doubles in ${screen.days(doubling)}`;
    if (halving !== null) return `halves in ${screen.days(halving)}`;
    return 'flat';
  },
  day: finite((x) => `day ${x.toFixed(0)}`),
  multiplier: finite((x) => `${multiplierPercent(x)} %`),
  bedsAgainstCapacity: (inUse, capacity) => `${screen.persons(inUse)} / ${screen.persons(capacity)} beds`,
};

/** The printed style (report, CLI tables, Markdown). */
export const print: NumberFormatter = {
  style: 'print',
  decimal: (x, digits) => finite((v) => v.toFixed(digits))(x),
  r: finite((x) => x.toFixed(2)),
  persons: finite(groupThousands),
  signedPersons: finite((x) => (Math.round(x) > 0 ? `+${groupThousands(x)}` : groupThousands(x))),
  percent: (fraction, digits = 1) => finite((f) => `${(100 * f).toFixed(digits)}%`)(fraction),
  signedPercent: (relative) => {
    if (relative === null || !Number.isFinite(relative)) return NOT_A_NUMBER;
    const text = `${(100 * relative).toFixed(1)}%`;
    return relative > 0 && text !== '0.0%' ? `+${text}` : text;
  },
  growthRate: finite((perDay) => {
    const text = perDay.toFixed(3);
    return perDay > 0 && text !== '0.000' ? `+${text}` : text;
  }),
  days: finite(wholeOrOneDecimal),
  doublingOrHalving: (doubling, halving) => {
    if (doubling !== null) return print.decimal(doubling, 1);
    if (halving !== null) return `halves in ${print.decimal(halving, 1)}`;
    return 'flat';
  },
  day: finite((x) => x.toFixed(0)),
  multiplier: finite((x) => `${multiplierPercent(x)}%`),
  bedsAgainstCapacity: (inUse, capacity) => `${print.persons(inUse)} / ${print.persons(capacity)}`,
};

/** The formatter of a style. */
export function numberFormatter(style: NumberStyle): NumberFormatter {
  return style === 'screen' ? screen : print;
}

/** How a value is written besides its kind. */
export interface ValueFormat {
  kind: ValueKind;
  /** Follows counts, changes and ratios on screen (e.g. "persons", "beds", "per 1,000 doses"); in print the unit belongs in the row label. */
  unit?: string;
  /** Decimals of a ratio (default 2). */
  digits?: number;
}

/** What some kinds need besides the number. */
export interface ValueContext {
  /** The scenario's day 0 as an ISO 8601 date ("2026-03-01"), for `date`. */
  startDate?: string | null;
}

const DAY_MS = 86_400_000;

/** The calendar date of day `day` after `startDate` (both ISO 8601, UTC); null when the start date is not a date. */
export function dateOfDay(startDate: string, day: number): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(startDate);
  if (m === null || !Number.isInteger(day)) return null;
  const start = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  const back = new Date(start);
  if (back.getUTCMonth() !== Number(m[2]) - 1 || back.getUTCDate() !== Number(m[3])) return null;
  return new Date(start + day * DAY_MS).toISOString().slice(0, 10);
}

/** A day axis's title: "Day", or "Day (day 0 = 2026-03-01)" when the scenario has a start date. */
export function dayAxisTitle(word: string, startDate: string | null | undefined): string {
  return startDate === null || startDate === undefined ? word : `${word} (day 0 = ${startDate})`;
}

/** A number written by its kind in the given style. */
export function formatValue(format: ValueFormat, value: number, style: NumberStyle, context: ValueContext = {}): string {
  const { kind, unit = '', digits = 2 } = format;
  const f = numberFormatter(style);
  if (!Number.isFinite(value)) return NOT_A_NUMBER;
  const withUnit = (text: string) => (style === 'screen' && unit !== '' ? `${text} ${unit}` : text);
  switch (kind) {
    case 'count':
      return withUnit(f.persons(value));
    case 'change':
      return withUnit(f.signedPersons(value));
    case 'fraction':
      return f.percent(value);
    case 'ratePerDay':
      return f.growthRate(value);
    case 'days':
      return style === 'screen' ? `${wholeOrOneDecimal(value)} ${value === 1 ? 'day' : 'days'}` : f.days(value);
    case 'day': {
      // With a start date a day also shows its date: screen "day 45 (2026-04-15)", print "45 (2026-04-15)".
      const date = context.startDate == null ? null : dateOfDay(context.startDate, value);
      return date === null ? f.day(value) : `${f.day(value)} (${date})`;
    }
    case 'ratio':
      return withUnit(f.decimal(value, digits));
    case 'date': {
      const date = context.startDate == null ? null : dateOfDay(context.startDate, value);
      return date ?? f.day(value);
    }
  }
}

/** A central value with a range around it (e.g. the median and a 90 % interval of several runs). */
export interface Interval {
  median: number;
  low: number;
  high: number;
}

/**
 * The bounds of an interval, written like its value without unit: screen "1,100–1,400", print
 * "1,100 to 1,400". Days are written as day numbers only (the value beside them carries the date).
 */
export function formatRange(format: ValueFormat, interval: Interval, style: NumberStyle, context: ValueContext = {}): string {
  const bare = (x: number) => formatValue({ ...format, unit: '' }, x, style, format.kind === 'day' ? {} : context);
  const low = bare(interval.low);
  const high = bare(interval.high);
  // An en dash between signed numbers ("−195–−7") reads as a minus: signed ranges say "to" (common practice).
  const signed = /^[+−-]/.test(low) || /^[+−-]/.test(high);
  return style === 'screen' && !signed ? `${low}–${high}` : `${low} to ${high}`;
}

/** An interval written like its value: screen "1,234 persons (1,100–1,400)", print "1,234 (1,100 to 1,400)". */
export function formatInterval(format: ValueFormat, interval: Interval, style: NumberStyle, context: ValueContext = {}): string {
  return `${formatValue(format, interval.median, style, context)} (${formatRange(format, interval, style, context)})`;
}

/** A short chart axis value: 0, 950, 12k, 1.5M (same in both styles). */
export function formatAxisValue(x: number): string {
  if (!Number.isFinite(x)) return NOT_A_NUMBER;
  const a = Math.abs(x);
  if (a >= 1e6) return `${trimZeros((x / 1e6).toFixed(a >= 1e7 ? 0 : 1))}M`;
  if (a >= 1e4) return `${trimZeros((x / 1e3).toFixed(0))}k`;
  if (a >= 1e3) return `${trimZeros((x / 1e3).toFixed(1))}k`;
  if (a === 0 || a >= 10) return trimZeros(x.toFixed(0));
  return trimZeros(x.toPrecision(2));
}

/** Relative change of `value` against `reference`: (v − ref) / |ref|; 0 when both are 0, null when only ref is. */
export function relativeChange(value: number, reference: number): number | null {
  return reference === 0 ? (value === 0 ? 0 : null) : (value - reference) / Math.abs(reference);
}

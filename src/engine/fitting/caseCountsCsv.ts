/**
 * Import of daily case counts from CSV text (RFC 4180 style, with the relaxations below).
 *
 * Columns: a time column (`date` as ISO YYYY-MM-DD, or `day` as a whole day number), a `count`
 * column (alias `cases`) and an optional `band` column (age-band label). With a header row the
 * columns are found by name, in any order; without one (first line starts with a date or a number)
 * they are taken as time, count[, band].
 * Tolerated: comma or semicolon delimiter (semicolon when the first line has one), a UTF-8 byte
 * order mark, CRLF/LF/CR line ends, blank lines, double-quoted fields (no line breaks inside).
 * Rejected, each with its line, column and rule: missing, non-numeric, non-integer or negative
 * counts; bad dates; a date column mixing dates and day numbers; duplicate day (and band) rows;
 * rows with the wrong number of fields; a date (or day number) earlier than the row before, or more
 * than MAX_GAP_DAYS after it (a mistyped year would otherwise pass as a long flat stretch);
 * files of more than MAX_DATA_ROWS rows. All problems are collected (the first MAX_LISTED_PROBLEMS
 * are listed), not only the first. The text is read line by line, never recursively, so any
 * length up to the limit is safe. Dates become day numbers counted from the earliest date in the
 * file (day 0).
 */
import type { CaseRow, CaseSeries } from './caseSeries.ts';
import { epochDayToIsoDate, isoDateToEpochDay } from './isoDate.ts';

export interface CsvProblem {
  /** 1-based line number in the file, or null for a problem with the file as a whole. */
  line: number | null;
  /** Column name as the file spells it (or the role, e.g. `count`), or null. */
  column: string | null;
  /** The rule broken, e.g. `must be >= 0`. */
  rule: string;
  /** The offending text, when there is one. */
  value?: string;
}

export type CaseCsvResult = { ok: true; series: CaseSeries } | { ok: false; problems: CsvProblem[] };

/** `line 7, column "count": must be >= 0, got "-3"`. */
export function formatCsvProblem(p: CsvProblem): string {
  const where = [p.line === null ? 'file' : `line ${p.line}`, p.column === null ? null : `column "${p.column}"`]
    .filter((s) => s !== null)
    .join(', ');
  return p.value === undefined ? `${where}: ${p.rule}` : `${where}: ${p.rule}, got "${p.value}"`;
}

/** Splits one line into fields; `"a;b"` keeps its delimiter and `""` inside quotes is a quote. */
function splitFields(line: string, delimiter: string): string[] {
  const fields: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === delimiter) {
      fields.push(field.trim());
      field = '';
    } else field += ch;
  }
  fields.push(field.trim());
  return fields;
}

/** Most data rows read: 25 years of daily counts for 21 age bands, far more than any fit uses. */
export const MAX_DATA_ROWS = 200_000;
/**
 * Longest gap between consecutive dates, days. Reporting pauses over holidays last days, not
 * months (common practice); a longer gap is almost always a mistyped year or month.
 */
export const MAX_GAP_DAYS = 28;
/** Problems listed one per line before the rest are counted in one closing line. */
export const MAX_LISTED_PROBLEMS = 20;

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const WHOLE = /^[+-]?\d+$/;
const TIME_NAMES = ['date', 'day'];
const COUNT_NAMES = ['count', 'cases'];
const BAND_NAMES = ['band'];

/** The rule a count breaks, or null when it is a whole number >= 0. */
function countRule(text: string): string | null {
  if (text === '') return 'is missing (must be a whole number >= 0)';
  if (!NUMBER.test(text)) return 'must be a number';
  const v = Number(text);
  if (!Number.isInteger(v)) return 'must be a whole number';
  if (v < 0) return 'must be >= 0';
  if (!Number.isSafeInteger(v)) return 'must be below 2^53';
  return null;
}

interface Layout {
  time: number;
  count: number;
  band: number | null;
  names: string[];
  kind: 'date' | 'day' | 'auto';
  width: number;
}

/** Finds the columns by header names, or null (with problems pushed) when the header is unusable. */
function layoutFromHeader(header: string[], line: number, problems: CsvProblem[]): Layout | null {
  const lower = header.map((h) => h.toLowerCase());
  const find = (names: string[]): number[] => lower.flatMap((h, i) => (names.includes(h) ? [i] : []));
  const time = find(TIME_NAMES);
  const count = find(COUNT_NAMES);
  const band = find(BAND_NAMES);
  lower.forEach((h, i) => {
    if (![...TIME_NAMES, ...COUNT_NAMES, ...BAND_NAMES].includes(h)) {
      problems.push({ line, column: header[i], rule: 'is not a known column (expected date or day, count or cases, optional band)' });
    }
  });
  if (time.length !== 1) problems.push({ line, column: 'date', rule: 'header must have exactly one date or day column' });
  if (count.length !== 1) problems.push({ line, column: 'count', rule: 'header must have exactly one count (or cases) column' });
  if (band.length > 1) problems.push({ line, column: 'band', rule: 'header must have at most one band column' });
  if (problems.length > 0) return null;
  return {
    time: time[0],
    count: count[0],
    band: band.length === 1 ? band[0] : null,
    names: header,
    kind: lower[time[0]] === 'date' ? 'date' : 'day',
    width: header.length,
  };
}

interface TimedRow {
  time: number;
  line: number;
}

/**
 * Rows must run forward in time (rows of one day, e.g. one per band, may follow each other) with
 * no gap over MAX_GAP_DAYS. Each row is compared with the last row that was in order, so one
 * mistyped date gives one problem, not two.
 */
function orderProblems(rows: readonly TimedRow[], dates: boolean, column: string): CsvProblem[] {
  const problems: CsvProblem[] = [];
  const show = (t: number): string => (dates ? epochDayToIsoDate(t) : String(t));
  let previous: TimedRow | null = null;
  for (const row of rows) {
    if (previous !== null && row.time < previous.time) {
      problems.push({ line: row.line, column, rule: `must not be earlier than the ${dates ? 'date' : 'day'} on line ${previous.line} (${show(previous.time)}); sort the rows by ${dates ? 'date' : 'day'}`, value: show(row.time) });
      continue;
    }
    if (previous !== null && row.time - previous.time > MAX_GAP_DAYS) {
      problems.push({
        line: row.line,
        column,
        rule: `is ${row.time - previous.time} days after the ${dates ? 'date' : 'day'} on line ${previous.line} (${show(previous.time)}); gaps over ${MAX_GAP_DAYS} days are refused (check for a mistyped ${dates ? 'year or month' : 'day number'})`,
        value: show(row.time),
      });
    }
    previous = row;
  }
  return problems;
}

/** The first MAX_LISTED_PROBLEMS problems, and one line counting the rest. */
function listed(problems: CsvProblem[]): CsvProblem[] {
  if (problems.length <= MAX_LISTED_PROBLEMS) return problems;
  const rest = problems.length - MAX_LISTED_PROBLEMS;
  return [...problems.slice(0, MAX_LISTED_PROBLEMS), { line: null, column: null, rule: `has ${rest} more problem${rest === 1 ? '' : 's'} not listed` }];
}

/**
 * Parses case-count CSV text. Returns the rows (day numbers from the earliest date) or every
 * problem found, each naming its line, column and rule. Good rows are never silently dropped:
 * either the whole file is accepted or the problems are listed.
 */
export function parseCaseCountsCsv(text: string): CaseCsvResult {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const problems: CsvProblem[] = [];
  const content = lines.map((l, i) => ({ text: l, line: i + 1 })).filter((l) => !/^[\s,;"]*$/.test(l.text));
  if (content.length === 0) return { ok: false, problems: [{ line: null, column: null, rule: 'has no data rows' }] };

  const delimiter = content[0].text.includes(';') ? ';' : ',';
  const first = splitFields(content[0].text, delimiter);
  const headerless = isoDateToEpochDay(first[0]) !== null || WHOLE.test(first[0]);
  const layout: Layout | null = headerless
    ? { time: 0, count: 1, band: first.length >= 3 ? 2 : null, names: ['date', 'count', 'band'], kind: 'auto', width: Math.min(first.length, 3) }
    : layoutFromHeader(first, content[0].line, problems);
  if (layout === null) return { ok: false, problems };
  const dataLines = headerless ? content : content.slice(1);
  if (dataLines.length === 0) return { ok: false, problems: [{ line: null, column: null, rule: 'has a header but no data rows' }] };
  if (dataLines.length > MAX_DATA_ROWS) {
    return { ok: false, problems: [{ line: null, column: null, rule: `must have at most ${MAX_DATA_ROWS.toLocaleString('en')} data rows (has ${dataLines.length.toLocaleString('en')}); keep the weeks you fit` }] };
  }

  const timeName = layout.names[layout.time];
  const countName = layout.names[layout.count];
  let kind = layout.kind;
  const parsed: { time: number; count: number; band: string | null; line: number }[] = [];
  for (const { text: raw, line } of dataLines) {
    const fields = splitFields(raw, delimiter);
    if (fields.length !== layout.width) {
      problems.push({ line, column: null, rule: `must have ${layout.width} fields separated by "${delimiter}" (has ${fields.length})`, value: raw });
      continue;
    }
    const timeText = fields[layout.time];
    const isDate = isoDateToEpochDay(timeText) !== null;
    if (kind === 'auto') kind = isDate ? 'date' : 'day';
    let time: number | null = null;
    if (kind === 'date') {
      time = isoDateToEpochDay(timeText);
      if (time === null) problems.push({ line, column: timeName, rule: 'must be a calendar date written YYYY-MM-DD', value: timeText });
    } else if (WHOLE.test(timeText)) time = Number(timeText);
    else problems.push({ line, column: timeName, rule: isDate ? 'must be a whole day number (the column holds day numbers, not dates)' : 'must be a whole day number', value: timeText });
    const countText = fields[layout.count];
    const rule = countRule(countText);
    if (rule !== null) problems.push(countText === '' ? { line, column: countName, rule } : { line, column: countName, rule, value: countText });
    const band = layout.band === null ? null : fields[layout.band];
    if (band === '') problems.push({ line, column: layout.names[layout.band as number], rule: 'must not be empty' });
    if (time !== null && rule === null && band !== '') parsed.push({ time, count: Number(countText), band, line });
  }

  problems.push(...orderProblems(parsed, kind === 'date', timeName));
  const seen = new Map<string, number>();
  for (const r of parsed) {
    const key = `${r.time}\u0000${r.band ?? ''}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      const what = r.band === null ? 'this day' : `this day and band "${r.band}"`;
      problems.push({ line: r.line, column: timeName, rule: `repeats ${what} (first given on line ${earlier})` });
    } else seen.set(key, r.line);
  }
  if (problems.length > 0) return { ok: false, problems: listed(problems) };

  const origin = kind === 'date' ? parsed.reduce((m, r) => Math.min(m, r.time), Infinity) : 0;
  const rows: CaseRow[] = parsed.map((r) => ({ day: r.time - origin, count: r.count, band: r.band, line: r.line }));
  return { ok: true, series: { rows, startDate: kind === 'date' ? epochDayToIsoDate(origin) : null, hasBands: layout.band !== null } };
}

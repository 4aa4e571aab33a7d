/**
 * Arguments of `mixwise report FILE [--out PATH] [--format html|csv|pdf] [--series]
 * [--paper A4|Letter] [--landscape] [--orders OPTION [--minimise OUTCOME] [--groups SPEC]
 * [--top K] [--workers N]]`. Without --format, the format follows the --out file's
 * extension (.pdf, .csv), else HTML. Mistakes are `CliError`s with exit code `usage`.
 */
import { PAPERS, type Orientation, type Paper } from '../report/index.ts';
import { onlyFile, splitWords, usageError } from './words.ts';

export const REPORT_FORMATS = ['html', 'csv', 'pdf'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];

export interface ReportArgs {
  file: string;
  out: string | null;
  format: ReportFormat;
  /** CSV only: the daily series (long format) instead of the options table. */
  series: boolean;
  paper: Paper;
  orientation: Orientation;
  /** HTML and PDF: include the order comparison of this search (`--orders OPTION` and the search's own options). */
  orders: ReportOrders | null;
}

export interface ReportOrders {
  option: string;
  outcome: string;
  groups: string | null;
  top: number | undefined;
  workers: number | null;
}

const VALUE_OPTIONS = ['--out', '--format', '--paper', '--orders', '--minimise', '--groups', '--top', '--workers'];
const ORDER_SEARCH_OPTIONS = ['--minimise', '--groups', '--top', '--workers'];

function wholeNumber(name: string, text: string | undefined, min: number): number | undefined {
  if (text === undefined) return undefined;
  const x = Number(text);
  if (!(Number.isInteger(x) && x >= min)) throw usageError(`${name} must be a whole number >= ${min}, got ${JSON.stringify(text)}`);
  return x;
}

function ordersOf(values: Map<string, string>, format: ReportFormat): ReportOrders | null {
  const option = values.get('--orders');
  if (option === undefined) {
    const stray = ORDER_SEARCH_OPTIONS.find((o) => values.has(o));
    if (stray !== undefined) throw usageError(`${stray} goes with --orders OPTION`);
    return null;
  }
  if (format === 'csv') throw usageError('--orders goes with an HTML or PDF report');
  return {
    option,
    outcome: values.get('--minimise') ?? 'deaths',
    groups: values.get('--groups') ?? null,
    top: wholeNumber('--top', values.get('--top'), 1),
    workers: wholeNumber('--workers', values.get('--workers'), 1) ?? null,
  };
}
const FLAGS = ['--series', '--landscape'];

function formatFromOut(out: string | null): ReportFormat {
  const lower = out?.toLowerCase() ?? '';
  if (lower.endsWith('.pdf')) return 'pdf';
  if (lower.endsWith('.csv')) return 'csv';
  return 'html';
}

export function parseReportArgs(words: readonly string[]): ReportArgs {
  const { positional, values, flags } = splitWords('report', words, { values: VALUE_OPTIONS, flags: FLAGS });
  const file = onlyFile('report', positional);
  const out = values.get('--out') ?? null;
  const format = values.get('--format') ?? formatFromOut(out);
  if (!(REPORT_FORMATS as readonly string[]).includes(format)) throw usageError(`--format must be one of ${REPORT_FORMATS.join(', ')}, got ${JSON.stringify(format)}`);
  if (format === 'pdf' && out === null) throw usageError('a PDF report needs --out FILE.pdf');
  const series = flags.has('--series');
  if (series && format !== 'csv') throw usageError('--series goes with --format csv');
  const paper = values.get('--paper') ?? 'A4';
  if (!(PAPERS as readonly string[]).includes(paper)) throw usageError(`--paper must be one of ${PAPERS.join(', ')}, got ${JSON.stringify(paper)}`);
  return {
    file,
    out,
    format: format as ReportFormat,
    series,
    paper: paper as Paper,
    orientation: flags.has('--landscape') ? 'landscape' : 'portrait',
    orders: ordersOf(values, format as ReportFormat),
  };
}

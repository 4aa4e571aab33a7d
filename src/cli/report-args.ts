/**
 * Arguments of `mixwise report FILE [--out PATH] [--format html|csv|pdf] [--series]
 * [--paper A4|Letter] [--landscape]`. Without --format, the format follows the --out file's
 * extension (.pdf, .csv), else HTML. Mistakes are `CliError`s with exit code `usage`.
 */
import { PAPERS, type Orientation, type Paper } from '../report/index.ts';
import { CliError, EXIT_CODES } from './errors.ts';

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
}

const VALUE_OPTIONS = ['--out', '--format', '--paper'];
const FLAGS = ['--series', '--landscape'];

function usageError(message: string): CliError {
  return new CliError(`${message} (see mixwise --help)`, EXIT_CODES.usage);
}

function formatFromOut(out: string | null): ReportFormat {
  const lower = out?.toLowerCase() ?? '';
  if (lower.endsWith('.pdf')) return 'pdf';
  if (lower.endsWith('.csv')) return 'csv';
  return 'html';
}

export function parseReportArgs(words: readonly string[]): ReportArgs {
  const positional: string[] = [];
  const values = new Map<string, string>();
  const flags = new Set<string>();
  for (let k = 0; k < words.length; k++) {
    const word = words[k];
    if (word === '--') {
      positional.push(...words.slice(k + 1));
      break;
    }
    if (!word.startsWith('-') || word === '-') {
      positional.push(word);
      continue;
    }
    const eq = word.indexOf('=');
    const name = eq >= 0 ? word.slice(0, eq) : word;
    if (FLAGS.includes(name)) {
      if (eq >= 0) throw usageError(`option ${name} takes no value`);
      flags.add(name);
      continue;
    }
    if (!VALUE_OPTIONS.includes(name)) throw usageError(`unknown option ${name} for 'report'`);
    if (values.has(name)) throw usageError(`option ${name} given twice`);
    const value = eq >= 0 ? word.slice(eq + 1) : words[++k];
    if (value === undefined || value === '') throw usageError(`option ${name} needs a value`);
    values.set(name, value);
  }
  if (positional.length === 0) throw usageError(`'report' needs a scenario FILE`);
  if (positional.length > 1) throw usageError(`'report' takes one FILE, got ${positional.length} (${positional.slice(1).join(' ')})`);

  const out = values.get('--out') ?? null;
  const format = values.get('--format') ?? formatFromOut(out);
  if (!(REPORT_FORMATS as readonly string[]).includes(format)) throw usageError(`--format must be one of ${REPORT_FORMATS.join(', ')}, got ${JSON.stringify(format)}`);
  if (format === 'pdf' && out === null) throw usageError('a PDF report needs --out FILE.pdf');
  const series = flags.has('--series');
  if (series && format !== 'csv') throw usageError('--series goes with --format csv');
  const paper = values.get('--paper') ?? 'A4';
  if (!(PAPERS as readonly string[]).includes(paper)) throw usageError(`--paper must be one of ${PAPERS.join(', ')}, got ${JSON.stringify(paper)}`);
  return {
    file: positional[0],
    out,
    format: format as ReportFormat,
    series,
    paper: paper as Paper,
    orientation: flags.has('--landscape') ? 'landscape' : 'portrait',
  };
}

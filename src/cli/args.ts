/**
 * Command-line arguments -> a command. Long options only, as `--name value` or `--name=value`.
 * Any mistake is a `CliError` with exit code `usage` and a one-line message (words.ts).
 */
import { onlyFile, splitWords, usageError } from './words.ts';

export const OUTPUT_FORMATS = ['table', 'md', 'csv', 'json'] as const;
export type OutputFormat = (typeof OUTPUT_FORMATS)[number];

export type Command =
  | { kind: 'help' }
  | { kind: 'version' }
  | { kind: 'run'; file: string; format: OutputFormat; out: string | null; workers: number | null; draws: DrawOptions }
  | { kind: 'merge'; files: string[]; format: OutputFormat; out: string | null }
  | { kind: 'check'; file: string };

/** `--draws N`, `--seed S` (override the scenario's uncertainty section) and `--draw-range A:B` (a slice of the draws). */
export interface DrawOptions {
  draws?: number;
  seed?: number;
  range?: { from: number; to: number };
}

/** Options each command accepts (each takes one value). */
const VALUE_OPTIONS: Record<'run' | 'merge' | 'check', readonly string[]> = {
  run: ['--format', '--out', '--workers', '--draws', '--seed', '--draw-range'],
  merge: ['--format', '--out'],
  check: [],
};

function wholeNumber(option: string, text: string, least: number): number {
  const value = /^\d+$/.test(text) ? Number(text) : Number.NaN;
  if (!(Number.isSafeInteger(value) && value >= least)) throw usageError(`${option} must be a whole number >= ${least}, got ${JSON.stringify(text)}`);
  return value;
}

function drawOptions(values: Map<string, string>): DrawOptions {
  const options: DrawOptions = {};
  const draws = values.get('--draws');
  const seed = values.get('--seed');
  const range = values.get('--draw-range');
  if (draws !== undefined) options.draws = wholeNumber('--draws', draws, 2);
  if (seed !== undefined) options.seed = wholeNumber('--seed', seed, 0);
  if (range !== undefined) {
    const m = /^(\d+):(\d+)$/.exec(range);
    if (m === null || !(Number(m[1]) < Number(m[2]))) throw usageError(`--draw-range must be A:B with whole numbers A < B (draws A to B-1), got ${JSON.stringify(range)}`);
    options.range = { from: Number(m[1]), to: Number(m[2]) };
  }
  return options;
}

function isOutputFormat(value: string): value is OutputFormat {
  return (OUTPUT_FORMATS as readonly string[]).includes(value);
}

export function parseArgs(argv: readonly string[]): Command {
  if (argv.includes('--help') || argv.includes('-h') || argv[0] === 'help') return { kind: 'help' };
  if (argv.includes('--version')) return { kind: 'version' };
  const [command, ...rest] = argv;
  if (command === undefined) throw usageError('no command given');
  if (command === 'run') {
    const { positional, values } = splitWords('run', rest, { values: VALUE_OPTIONS.run });
    const format = values.get('--format') ?? 'table';
    if (!isOutputFormat(format)) throw usageError(`--format must be one of ${OUTPUT_FORMATS.join(', ')}, got ${JSON.stringify(format)}`);
    const workers = values.get('--workers');
    if (workers !== undefined && !/^[1-9][0-9]{0,2}$/.test(workers)) throw usageError(`--workers must be a whole number from 1 to 999, got ${JSON.stringify(workers)}`);
    return { kind: 'run', file: onlyFile('run', positional), format, out: values.get('--out') ?? null, workers: workers === undefined ? null : Number(workers), draws: drawOptions(values) };
  }
  if (command === 'merge') {
    const { positional, values } = splitWords('merge', rest, { values: VALUE_OPTIONS.merge });
    const format = values.get('--format') ?? 'json';
    if (!isOutputFormat(format)) throw usageError(`--format must be one of ${OUTPUT_FORMATS.join(', ')}, got ${JSON.stringify(format)}`);
    if (positional.length === 0) throw usageError("'merge' needs the part files written by 'run --draw-range'");
    return { kind: 'merge', files: positional, format, out: values.get('--out') ?? null };
  }
  if (command === 'check') {
    const { positional } = splitWords('check', rest, { values: VALUE_OPTIONS.check });
    return { kind: 'check', file: onlyFile('check', positional) };
  }
  if (command.startsWith('-')) throw usageError(`unknown option ${command}`);
  throw usageError(`unknown command ${JSON.stringify(command)}`);
}

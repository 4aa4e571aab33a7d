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
  | { kind: 'run'; file: string; format: OutputFormat; out: string | null; workers: number | null }
  | { kind: 'check'; file: string };

/** Options each command accepts (each takes one value). */
const VALUE_OPTIONS: Record<'run' | 'check', readonly string[]> = {
  run: ['--format', '--out', '--workers'],
  check: [],
};

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
    return { kind: 'run', file: onlyFile('run', positional), format, out: values.get('--out') ?? null, workers: workers === undefined ? null : Number(workers) };
  }
  if (command === 'check') {
    const { positional } = splitWords('check', rest, { values: VALUE_OPTIONS.check });
    return { kind: 'check', file: onlyFile('check', positional) };
  }
  if (command.startsWith('-')) throw usageError(`unknown option ${command}`);
  throw usageError(`unknown command ${JSON.stringify(command)}`);
}

/**
 * Command-line arguments -> a command. Long options only, as `--name value` or `--name=value`.
 * Any mistake is a `CliError` with exit code `usage` and a one-line message.
 */
import { CliError, EXIT_CODES } from './errors.ts';

export const OUTPUT_FORMATS = ['table', 'md', 'csv', 'json'] as const;
export type OutputFormat = (typeof OUTPUT_FORMATS)[number];

export type Command =
  | { kind: 'help' }
  | { kind: 'version' }
  | { kind: 'run'; file: string; format: OutputFormat; out: string | null }
  | { kind: 'check'; file: string };

/** Options each command accepts (each takes one value). */
const VALUE_OPTIONS: Record<'run' | 'check', readonly string[]> = {
  run: ['--format', '--out'],
  check: [],
};

function usageError(message: string): CliError {
  return new CliError(`${message} (see mixwise --help)`, EXIT_CODES.usage);
}

function isOutputFormat(value: string): value is OutputFormat {
  return (OUTPUT_FORMATS as readonly string[]).includes(value);
}

/** Splits the words after the command into positional arguments and option values. */
function splitWords(command: 'run' | 'check', words: readonly string[]): { positional: string[]; options: Map<string, string> } {
  const positional: string[] = [];
  const options = new Map<string, string>();
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
    if (!VALUE_OPTIONS[command].includes(name)) throw usageError(`unknown option ${name} for '${command}'`);
    if (options.has(name)) throw usageError(`option ${name} given twice`);
    let value: string | undefined;
    if (eq >= 0) value = word.slice(eq + 1);
    else {
      value = words[k + 1];
      k++;
    }
    if (value === undefined || value === '') throw usageError(`option ${name} needs a value`);
    options.set(name, value);
  }
  return { positional, options };
}

function onlyFile(command: 'run' | 'check', positional: readonly string[]): string {
  if (positional.length === 0) throw usageError(`'${command}' needs a scenario FILE`);
  if (positional.length > 1) throw usageError(`'${command}' takes one FILE, got ${positional.length} (${positional.slice(1).join(' ')})`);
  return positional[0];
}

export function parseArgs(argv: readonly string[]): Command {
  if (argv.includes('--help') || argv.includes('-h') || argv[0] === 'help') return { kind: 'help' };
  if (argv.includes('--version')) return { kind: 'version' };
  const [command, ...rest] = argv;
  if (command === undefined) throw usageError('no command given');
  if (command === 'run') {
    const { positional, options } = splitWords('run', rest);
    const format = options.get('--format') ?? 'table';
    if (!isOutputFormat(format)) throw usageError(`--format must be one of ${OUTPUT_FORMATS.join(', ')}, got ${JSON.stringify(format)}`);
    return { kind: 'run', file: onlyFile('run', positional), format, out: options.get('--out') ?? null };
  }
  if (command === 'check') {
    const { positional } = splitWords('check', rest);
    return { kind: 'check', file: onlyFile('check', positional) };
  }
  if (command.startsWith('-')) throw usageError(`unknown option ${command}`);
  throw usageError(`unknown command ${JSON.stringify(command)}`);
}

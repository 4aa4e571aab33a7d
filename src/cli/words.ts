/**
 * The command-line word splitter every command shares. Long options only: `--name value` or
 * `--name=value` for options that take a value, bare `--name` for flags; `--` ends the options
 * (every later word is positional, even one starting with a dash); a lone `-` is positional.
 * Mistakes are `CliError`s with exit code `usage` and a one-line message.
 */
import { CliError, EXIT_CODES } from './errors.ts';

/** A usage mistake, pointing the user to the help text. */
export function usageError(message: string): CliError {
  return new CliError(`${message} (see mixwise --help)`, EXIT_CODES.usage);
}

/** The options a command accepts. */
export interface WordRules {
  /** Options that take one value. */
  values: readonly string[];
  /** Options that take no value. */
  flags?: readonly string[];
}

export interface SplitWords {
  positional: string[];
  /** Value of each value option given (each at most once, never empty). */
  values: Map<string, string>;
  /** Flags given. */
  flags: Set<string>;
}

/** Splits the words after `command` into positional arguments, option values and flags. */
export function splitWords(command: string, words: readonly string[], rules: WordRules): SplitWords {
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
    if (rules.flags?.includes(name)) {
      if (eq >= 0) throw usageError(`option ${name} takes no value`);
      flags.add(name);
      continue;
    }
    if (!rules.values.includes(name)) throw usageError(`unknown option ${name} for '${command}'`);
    if (values.has(name)) throw usageError(`option ${name} given twice`);
    const value = eq >= 0 ? word.slice(eq + 1) : words[++k];
    if (value === undefined || value === '') throw usageError(`option ${name} needs a value`);
    values.set(name, value);
  }
  return { positional, values, flags };
}

/** The one scenario FILE a command takes, from its positional words. */
export function onlyFile(command: string, positional: readonly string[]): string {
  if (positional.length === 0) throw usageError(`'${command}' needs a scenario FILE`);
  if (positional.length > 1) throw usageError(`'${command}' takes one FILE, got ${positional.length} (${positional.slice(1).join(' ')})`);
  return positional[0];
}

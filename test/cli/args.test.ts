import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../src/cli/args.ts';
import { CliError, EXIT_CODES } from '../../src/cli/errors.ts';

function usageMessage(argv: string[]): string {
  try {
    parseArgs(argv);
  } catch (err) {
    expect(err).toBeInstanceOf(CliError);
    expect((err as CliError).exitCode).toBe(EXIT_CODES.usage);
    return (err as CliError).message;
  }
  throw new Error(`expected a usage error for ${argv.join(' ')}`);
}

describe('parseArgs', () => {
  it('reads run with its defaults and both option spellings', () => {
    expect(parseArgs(['run', 'a.json'])).toEqual({ kind: 'run', file: 'a.json', format: 'table', out: null, workers: null, draws: {} });
    expect(parseArgs(['run', '--format', 'csv', 'a.json', '--out', 'o.csv'])).toEqual({ kind: 'run', file: 'a.json', format: 'csv', out: 'o.csv', workers: null, draws: {} });
    expect(parseArgs(['run', 'a.json', '--format=md', '--out=x.md'])).toEqual({ kind: 'run', file: 'a.json', format: 'md', out: 'x.md', workers: null, draws: {} });
    expect(parseArgs(['run', '--', '--odd-name.json'])).toMatchObject({ file: '--odd-name.json' });
  });

  it('reads check, help and version', () => {
    expect(parseArgs(['check', 'a.json'])).toEqual({ kind: 'check', file: 'a.json' });
    expect(parseArgs(['--help'])).toEqual({ kind: 'help' });
    expect(parseArgs(['run', '-h'])).toEqual({ kind: 'help' });
    expect(parseArgs(['--version'])).toEqual({ kind: 'version' });
  });

  it('rejects mistakes with a one-line message naming the problem', () => {
    expect(usageMessage([])).toMatch(/no command/);
    expect(usageMessage(['--bogus'])).toMatch(/unknown option --bogus/);
    expect(usageMessage(['simulate', 'a.json'])).toMatch(/unknown command "simulate"/);
    expect(usageMessage(['run'])).toMatch(/needs a scenario FILE/);
    expect(usageMessage(['run', 'a.json', 'b.json'])).toMatch(/takes one FILE/);
    expect(usageMessage(['run', 'a.json', '--colour'])).toMatch(/unknown option --colour for 'run'/);
    expect(usageMessage(['run', 'a.json', '--format', 'xml'])).toMatch(/--format must be one of table, md, csv, json, got "xml"/);
    expect(usageMessage(['run', 'a.json', '--format'])).toMatch(/--format needs a value/);
    expect(usageMessage(['run', 'a.json', '--out='])).toMatch(/--out needs a value/);
    expect(usageMessage(['run', 'a.json', '--format', 'csv', '--format', 'md'])).toMatch(/given twice/);
    expect(usageMessage(['check', 'a.json', '--format', 'json'])).toMatch(/unknown option --format for 'check'/);
    for (const argv of [[], ['--bogus'], ['run'], ['run', 'a', '--x']]) expect(usageMessage(argv)).not.toContain('\n');
  });
});

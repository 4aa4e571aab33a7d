/** The shared word splitter (src/cli/words.ts) and the one atomic writer (src/cli/files.ts). */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CliError, EXIT_CODES } from '../../src/cli/errors.ts';
import { writeFileAtomically } from '../../src/cli/files.ts';
import { onlyFile, splitWords } from '../../src/cli/words.ts';
import { tempDir } from './helpers.ts';

const RULES = { values: ['--out', '--paper'], flags: ['--landscape'] };

function usageMessage(run: () => unknown): string {
  try {
    run();
  } catch (err) {
    expect(err).toBeInstanceOf(CliError);
    expect((err as CliError).exitCode).toBe(EXIT_CODES.usage);
    return (err as CliError).message;
  }
  throw new Error('expected a usage error');
}

describe('splitWords', () => {
  it('takes values as `--name value` or `--name=value`, flags bare, and everything after `--` as positional', () => {
    const split = splitWords('report', ['a.json', '--out', 'x.pdf', '--paper=Letter', '--landscape', '-', '--', '--odd'], RULES);
    expect(split.positional).toEqual(['a.json', '-', '--odd']);
    expect([...split.values]).toEqual([
      ['--out', 'x.pdf'],
      ['--paper', 'Letter'],
    ]);
    expect([...split.flags]).toEqual(['--landscape']);
  });

  it('rejects unknown options, values on flags, repeats and missing values, naming the option', () => {
    expect(usageMessage(() => splitWords('report', ['--colour'], RULES))).toMatch(/^unknown option --colour for 'report' \(see mixwise --help\)$/);
    expect(usageMessage(() => splitWords('report', ['--landscape=yes'], RULES))).toMatch(/option --landscape takes no value/);
    expect(usageMessage(() => splitWords('report', ['--out', 'a', '--out=b'], RULES))).toMatch(/option --out given twice/);
    expect(usageMessage(() => splitWords('report', ['--out'], RULES))).toMatch(/option --out needs a value/);
    expect(usageMessage(() => splitWords('report', ['--paper='], RULES))).toMatch(/option --paper needs a value/);
  });

  it('onlyFile wants exactly one positional word', () => {
    expect(onlyFile('run', ['a.json'])).toBe('a.json');
    expect(usageMessage(() => onlyFile('run', []))).toMatch(/'run' needs a scenario FILE/);
    expect(usageMessage(() => onlyFile('run', ['a', 'b', 'c']))).toMatch(/'run' takes one FILE, got 3 \(b c\)/);
  });
});

describe('writeFileAtomically', () => {
  it('writes text and bytes exactly, leaving no temporary file', () => {
    const dir = tempDir();
    writeFileAtomically(join(dir, 'a.txt'), 'héllo\n');
    const bytes = new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x00, 0xff]);
    writeFileAtomically(join(dir, 'b.pdf'), bytes);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('héllo\n');
    expect(new Uint8Array(readFileSync(join(dir, 'b.pdf')))).toEqual(bytes);
    expect(readdirSync(dir).sort()).toEqual(['a.txt', 'b.pdf']);
  });

  it('says in plain words why a write failed', () => {
    const path = join(tempDir(), 'missing', 'b.pdf');
    let error: unknown;
    try {
      writeFileAtomically(path, new Uint8Array([1]));
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(CliError);
    expect((error as CliError).exitCode).toBe(EXIT_CODES.fileError);
    expect((error as CliError).message).toBe(`cannot write ${path}: no such file or folder`);
  });
});

/**
 * The installed command (node bin/mixwise.mjs) as a child process: exit codes and one-line
 * messages for every kind of mistake, never a stack trace.
 */
import { execFile } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO, ROOT, demoJson, writeTemp } from './helpers.ts';

const BIN = join(ROOT, 'bin/mixwise.mjs');

interface Finished {
  code: number;
  stdout: string;
  stderr: string;
}

function mixwise(...args: string[]): Promise<Finished> {
  return new Promise((resolve) => {
    execFile(process.execPath, [BIN, ...args], { cwd: ROOT }, (err, stdout, stderr) => {
      const code = err === null ? 0 : typeof err.code === 'number' ? err.code : -1;
      resolve({ code, stdout, stderr });
    });
  });
}

/** One line on stderr, starting "mixwise: ", no stack frames, nothing on stdout. */
function expectOneLineError(result: Finished, code: number, pattern: RegExp): void {
  expect(result.code).toBe(code);
  expect(result.stdout).toBe('');
  expect(result.stderr).toMatch(/^mixwise: [^\n]+\n$/);
  expect(result.stderr).toMatch(pattern);
  expect(result.stderr).not.toMatch(/\n\s+at /);
}

describe.concurrent('bin/mixwise.mjs', () => {
  it('--help prints the usage and exits 0', async () => {
    const r = await mixwise('--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/mixwise run FILE \[--format table\|md\|csv\|json\] \[--out PATH\]/);
    expect(r.stdout).toMatch(/mixwise check FILE/);
  });

  it('--version prints the package version', async () => {
    const version = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).version;
    const r = await mixwise('--version');
    expect(r).toEqual({ code: 0, stdout: `mixwise ${version}\n`, stderr: '' });
  });

  it('run prints the options table for the demo', async () => {
    const r = await mixwise('run', DEMO, '--format', 'json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).options).toHaveLength(5);
  });

  it('no command: exit 1', async () => {
    expectOneLineError(await mixwise(), 1, /no command given/);
  });

  it('unknown flag: exit 1', async () => {
    expectOneLineError(await mixwise('run', DEMO, '--fast'), 1, /unknown option --fast/);
  });

  it('unknown command: exit 1', async () => {
    expectOneLineError(await mixwise('simulate', DEMO), 1, /unknown command "simulate"/);
  });

  it('bad --format value: exit 1', async () => {
    expectOneLineError(await mixwise('run', DEMO, '--format', 'pdf'), 1, /--format must be one of/);
  });

  it('missing file: exit 3', async () => {
    expectOneLineError(await mixwise('run', 'no-such-scenario.json'), 3, /cannot read no-such-scenario\.json: no such file or folder/);
  });

  it('a folder instead of a file: exit 3', async () => {
    expectOneLineError(await mixwise('check', join(ROOT, 'resources')), 3, /is a folder, not a file/);
  });

  it('invalid JSON: exit 2', async () => {
    const file = writeTemp('broken.json', '{ "format": ');
    expectOneLineError(await mixwise('run', file), 2, /broken\.json: \(file\) must be valid JSON/);
  });

  it('output folder missing: exit 3', async () => {
    expectOneLineError(await mixwise('run', DEMO, '--out', join(ROOT, 'no-such-folder', 'x.csv')), 3, /cannot write/);
  });

  it('check of an invalid scenario: problems on stdout, exit 2', async () => {
    const bad = demoJson();
    bad.disease.latentPeriodDays = -3;
    const file = writeTemp('bad.json', bad);
    const r = await mixwise('check', file);
    expect(r.code).toBe(2);
    expect(r.stdout).toContain(`${file}: disease.latentPeriodDays must be at least 0.1 days, got -3`);
    expect(r.stderr).toBe('');
  });
});

/**
 * A next-generation matrix whose R cannot be pinned down after R0 calibrated: `check` names the
 * phase when it can foresee it, and `run` / `report` end in one line naming the option and the
 * day, with the invalid-scenario exit code (2), never "internal error" (4).
 */
import { describe, expect, it } from 'vitest';
import { mainAsync } from '../../src/cli/main.ts';
import { reportCommand } from '../../src/cli/report.ts';
import { EXIT_CODES } from '../../src/cli/errors.ts';
import { immuneHubLeavingOddContacts, phaseLeavingOddContacts } from '../helpers/unsettledRoots.ts';
import { runCli, writeTemp, type Captured } from './helpers.ts';

const CAUSE = String.raw`the largest eigenvalue of the next-generation matrix could not be pinned down \(it lies between [^)]+\); look for contacts, setting multipliers or age factors many orders of magnitude from the rest \(such as 1e-300\)`;

async function runAsync(...argv: string[]): Promise<Captured> {
  let stdout = '';
  let stderr = '';
  const code = await mainAsync(argv, { out: (t) => void (stdout += t), err: (t) => void (stderr += t) });
  return { code, stdout, stderr };
}

describe('an R that cannot be pinned down after calibration', () => {
  it('check refuses the phase that leaves it, with its path and the invalid-scenario code', () => {
    const file = writeTemp('phase.json', phaseLeavingOddContacts());
    const r = runCli('check', file);
    expect(r.code).toBe(EXIT_CODES.invalidScenario);
    expect(r.stdout.split('\n')).toEqual([
      expect.stringMatching(new RegExp(`^${file.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}: options\\[1\\]\\.phases\\[0\\] \\(option "ordinary contacts shut"\\) must give measures R can be computed under: with everyone susceptible ${CAUSE}$`)),
      `${file} is not valid: 1 problem`,
      '',
    ]);
    // run refuses the same file before any option runs.
    const run = runCli('run', file);
    expect(run.code).toBe(EXIT_CODES.invalidScenario);
    expect(run.stderr).toMatch(/^mixwise: .*options\[1\]\.phases\[0\] .* with everyone susceptible the largest eigenvalue/);
  });

  it.each([
    ['run on this thread', () => ['run'], false],
    ['run on worker threads', () => ['run', '--workers', '2'], true],
  ])('%s refuses it in one line naming the option and the day, with the invalid-scenario code', async (_name, argv, pooled) => {
    const input = immuneHubLeavingOddContacts();
    const file = writeTemp('day0.json', { ...input, options: [...(input.options ?? []), { name: 'second', phases: [] }] });
    expect(runCli('check', file).code).toBe(EXIT_CODES.ok);
    const r = pooled ? await runAsync(...argv(), file) : runCli(...argv(), file);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(new RegExp(`^mixwise: [^\\n]*day0\\.json: options\\[0\\] \\(option "as usual"\\) must give measures R can be computed under: on day 0 ${CAUSE}\\n$`));
    expect(r.code).toBe(EXIT_CODES.invalidScenario);
  });

  it('report refuses it the same way', { timeout: 60_000 }, async () => {
    const file = writeTemp('day0.json', immuneHubLeavingOddContacts());
    let stderr = '';
    const code = await reportCommand({ out: () => undefined, err: (t) => void (stderr += t) }, [file, '--format', 'csv']);
    expect(stderr).toMatch(new RegExp(`^mixwise: [^\\n]*day0\\.json: options\\[0\\] \\(option "as usual"\\) must give measures R can be computed under: on day 0 ${CAUSE}\\n$`));
    expect(code).toBe(EXIT_CODES.invalidScenario);
  });
});

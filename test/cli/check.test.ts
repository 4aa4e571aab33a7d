/** `mixwise check`: the "valid" line, each problem with its path, exit codes. */
import { describe, expect, it } from 'vitest';
import { DEMO, demoJson, runCli, writeTemp } from './helpers.ts';

describe('mixwise check', () => {
  it('says the demo is valid and exits 0', () => {
    const { code, stdout, stderr } = runCli('check', DEMO);
    expect(code).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toBe(
      `${DEMO} is valid: "Tessarine Valley (fictional): options for the coming wave", 16 age bands, 4 settings, 5 policy options, 365 days\n`,
    );
  });

  it('prints each problem on its own line with path, rule and value, then a count, and exits 2', () => {
    const bad = demoJson();
    bad.populationPersons[3] = -12;
    bad.horizonDays = 0;
    delete bad.title;
    const file = writeTemp('bad.json', bad);
    const { code, stdout } = runCli('check', file);
    expect(code).toBe(2);
    const lines = stdout.trimEnd().split('\n');
    expect(lines).toContain(`${file}: populationPersons[3] must be >= 0, got -12`);
    expect(lines).toContain(`${file}: horizonDays must be >= 1, got 0`);
    expect(lines).toContain(`${file}: title is required (text)`);
    expect(lines.at(-1)).toBe(`${file} is not valid: 3 problems`);
  });

  it('reports rules that tie fields together', () => {
    const bad = demoJson();
    bad.settings[2].contactsPerDay.pop();
    bad.options[3].phases[0].ageFactors[0].bands = [16];
    const file = writeTemp('bad.json', bad);
    const { code, stdout } = runCli('check', file);
    expect(code).toBe(2);
    expect(stdout).toContain(`${file}: settings[2].contactsPerDay must have 16 rows (one per age band), got 15 rows`);
    expect(stdout).toContain(`${file}: options[3].phases[0].ageFactors[0].bands[0] must be a band index below 16, got 16`);
    expect(stdout.trimEnd().split('\n').at(-1)).toBe(`${file} is not valid: 2 problems`);
  });

  it('reports invalid JSON as one problem', () => {
    const file = writeTemp('broken.json', '{"format": "mixwise-scenario",');
    const { code, stdout } = runCli('check', file);
    expect(code).toBe(2);
    expect(stdout).toMatch(/^.*broken\.json: \(file\) must be valid JSON; at line \d+, column \d+ it [^\n]*\n.*broken\.json is not valid: 1 problem\n$/);
  });

  it('accepts a UTF-8 byte-order mark', () => {
    const file = writeTemp('bom.json', `\uFEFF${JSON.stringify(demoJson())}`);
    expect(runCli('check', file).code).toBe(0);
  });

  it('adds a note for a contact matrix that does not balance, but stays valid', () => {
    const scenario = demoJson();
    scenario.settings[1].contactsPerDay[2][3] *= 2;
    const file = writeTemp('lopsided.json', scenario);
    const { code, stdout } = runCli('check', file);
    expect(code).toBe(0);
    expect(stdout).toContain(`${file}: note: contacts in setting "school" are not reciprocal (used as given): largest imbalance 50.0% between bands 10-14 and 15-19`);
  });
});

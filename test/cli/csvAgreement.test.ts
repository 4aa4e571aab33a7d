/**
 * One CSV writer: `mixwise run --format csv` and `mixwise report --format csv` write the same
 * table, headed by the same fingerprint; the JSON of `mixwise run` carries every outcome of the
 * catalogue under its key, with the catalogue's value.
 */
import { describe, expect, it } from 'vitest';
import packageJson from '../../package.json' with { type: 'json' };
import { mainAsync } from '../../src/cli/main.ts';
import { scenarioFingerprintSync } from '../../src/cli/nodeFingerprint.ts';
import { runScenario } from '../../src/engine/index.ts';
import { scenarioFingerprint } from '../../src/report/fingerprint.ts';
import { BAND_OUTCOMES, OUTCOMES, outcomeDatum } from '../../src/report/outcomes.ts';
import { demoScenario } from '../helpers/demo.ts';
import { DEMO, demoJson, runCli, writeTemp } from './helpers.ts';

async function cli(...argv: string[]): Promise<string> {
  let stdout = '';
  const code = await mainAsync(argv, { out: (t) => void (stdout += t), err: () => undefined });
  expect(code).toBe(0);
  return stdout;
}

describe('mixwise run and mixwise report write the same CSV', () => {
  it.each([
    ['the demo', DEMO],
    ['the demo without a hospital section, compared with its fourth option', writeTemp('no-beds.json', (({ healthcare: _dropped, ...rest }) => ({ ...rest, referenceOption: 'Shield 70+' }))(demoJson()))],
  ])('for %s', async (_what, file) => {
    const fromRun = await cli('run', file, '--format', 'csv');
    const fromReport = await cli('report', file, '--format', 'csv');
    expect(fromRun).toBe(fromReport);
    expect(fromRun).toMatch(/^# Mixwise policy options table: /);
  });

  it('computes the fingerprint synchronously (Node) exactly as Web Crypto does', async () => {
    const scenario = demoScenario();
    expect(scenarioFingerprintSync(scenario, packageJson.version)).toBe(await scenarioFingerprint(scenario, packageJson.version));
    expect(scenarioFingerprintSync(scenario, '0.0.0')).not.toBe(scenarioFingerprintSync(scenario, packageJson.version));
  });
});

describe('catalogue keys are the JSON keys of mixwise run --format json', () => {
  const json = JSON.parse(runCli('run', DEMO, '--format', 'json').stdout);
  const results = runScenario(demoScenario());

  it('each option has name, every outcome key, every by-band key and its measure details, and nothing else', () => {
    const expected = ['name', ...OUTCOMES.map((e) => e.key), ...BAND_OUTCOMES.map((b) => b.key), 'triggers', 'rByPhase', 'measureBurden'].sort();
    for (const option of json.options) expect(Object.keys(option).sort()).toEqual(expected);
  });

  it('each key holds the value the catalogue reads from the engine', () => {
    results.options.forEach((o, k) => {
      for (const e of OUTCOMES) expect(json.options[k][e.key], e.key).toBe(outcomeDatum(e, o, results));
      for (const b of BAND_OUTCOMES) expect(json.options[k][b.key], b.key).toEqual(b.read(o, results));
    });
  });
});

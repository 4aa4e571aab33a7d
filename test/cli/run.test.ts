/**
 * `mixwise run`: the JSON shape asked for by issue 2, agreement with the engine's results,
 * the text formats (each ending with the caution) and atomic --out.
 */
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../src/report/cautions.ts';
import { runScenario } from '../../src/engine/index.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { DEMO, demoJson, runCli, tempDir, writeTemp } from './helpers.ts';

const OPTION_KEYS = [
  'name', 'rStart', 'growthRatePerDay', 'doublingTimeDays', 'peakDay', 'peakPrevalence',
  'infections', 'attackRate', 'attackRateByBand', 'deaths', 'deathsByBand',
];

function demoResults() {
  const v = validateScenario(demoJson());
  if (!v.ok) throw new Error('demo scenario must be valid');
  return runScenario(v.scenario);
}

describe('mixwise run --format json', () => {
  const { code, stdout, stderr } = runCli('run', DEMO, '--format', 'json');
  const report = JSON.parse(stdout);

  it('exits 0 with JSON on stdout and nothing on stderr', () => {
    expect(code).toBe(0);
    expect(stderr).toBe('');
  });

  it('has the shape of issue 2', () => {
    expect(Object.keys(report)).toEqual(expect.arrayContaining(['title', 'ageBands', 'r0', 'options']));
    expect(typeof report.title).toBe('string');
    expect(report.ageBands).toHaveLength(16);
    expect(report.ageBands[0]).toBe('0-4');
    expect(typeof report.r0).toBe('number');
    expect(report.options.map((o: { name: string }) => o.name)).toEqual([
      'No measures', 'Schools closed 8 weeks', 'Work contacts halved', 'Shield 70+', 'Vaccinate oldest first',
    ]);
    for (const option of report.options) {
      expect(Object.keys(option)).toEqual(expect.arrayContaining(OPTION_KEYS));
      for (const key of ['rStart', 'growthRatePerDay', 'peakDay', 'peakPrevalence', 'infections', 'attackRate', 'deaths']) {
        expect(Number.isFinite(option[key]), key).toBe(true);
      }
      expect(option.doublingTimeDays === null || option.doublingTimeDays > 0).toBe(true);
      expect(option.attackRateByBand).toHaveLength(16);
      expect(option.deathsByBand).toHaveLength(16);
      for (const a of [option.attackRate, option.peakPrevalence, ...option.attackRateByBand]) {
        expect(a).toBeGreaterThanOrEqual(0);
        expect(a).toBeLessThanOrEqual(1);
      }
    }
  });

  it('carries the engine numbers unchanged', () => {
    const results = demoResults();
    expect(report.r0).toBe(results.r0);
    results.options.forEach((o, k) => {
      const row = report.options[k];
      expect(row.rStart).toBe(o.rStart);
      expect(row.growthRatePerDay).toBe(o.growthRatePerDay);
      expect(row.doublingTimeDays).toBe(o.doublingTimeDays);
      expect(row.peakDay).toBe(o.peakDay);
      expect(row.attackRate).toBe(o.attackRate);
      expect(row.attackRateByBand).toEqual(o.attackRateByBand);
      expect(row.deaths).toBe(o.deaths);
      expect(row.deathsByBand).toEqual(o.deathsByBand);
    });
  });

  it('writes doublingTimeDays as null (not missing) when an option is not growing', () => {
    const scenario = demoJson();
    scenario.options.push({
      name: 'Strict measures',
      phases: [{ fromDay: 0, toDay: 365, settingMultipliers: { home: 0.3, school: 0, work: 0.1, other: 0.1 } }],
    });
    const out = runCli('run', writeTemp('strict.json', scenario), '--format', 'json');
    expect(out.code).toBe(0);
    const strict = JSON.parse(out.stdout).options.at(-1);
    expect(strict.rStart).toBeLessThan(1);
    expect(strict).toHaveProperty('doublingTimeDays', null);
    expect(strict.growthRatePerDay).toBeLessThan(0);
  });
});

describe('mixwise run, text formats', () => {
  it.each(['table', 'md'])('--format %s lists every option and ends with the caution', (format) => {
    const { code, stdout } = runCli('run', DEMO, '--format', format);
    expect(code).toBe(0);
    for (const name of ['No measures', 'Schools closed 8 weeks', 'Work contacts halved', 'Shield 70+']) expect(stdout).toContain(name);
    const lastLine = stdout.trimEnd().split('\n').at(-1) ?? '';
    expect(lastLine).toContain(CAUTION);
  });

  it('table is the default format', () => {
    expect(runCli('run', DEMO).stdout).toBe(runCli('run', DEMO, '--format', 'table').stdout);
  });

  it('--format csv has a header and one row per option with the JSON numbers', () => {
    const { stdout } = runCli('run', DEMO, '--format', 'csv');
    const lines = stdout.trimEnd().split('\r\n').filter((line) => !line.startsWith('#'));
    expect(lines).toHaveLength(1 + 5);
    const header = lines[0].split(',');
    expect(header.slice(0, 4)).toEqual(['option', 'reference', 'r_start', 'growth_rate_per_day']);
    expect(header).toContain('attack_rate 75+');
    const json = JSON.parse(runCli('run', DEMO, '--format', 'json').stdout);
    const row = lines[3].split(',');
    expect(row[0]).toBe('Work contacts halved');
    // CSV numbers carry 6 significant digits (stated in its "#" header block).
    expect(Number(row[header.indexOf('attack_rate')])).toBe(Number(json.options[2].attackRate.toPrecision(6)));
    expect(Number(row[header.indexOf('deaths 75+')])).toBe(Number(json.options[2].deathsByBand[15].toPrecision(6)));
  });

  it('notes contact matrices that are not reciprocal', () => {
    const scenario = demoJson();
    scenario.settings[0].contactsPerDay[0][1] *= 1.5;
    const { stdout } = runCli('run', writeTemp('lopsided.json', scenario));
    expect(stdout).toMatch(/setting "home" are not reciprocal.*33\.3% between bands 0-4 and 5-9/);
    expect(runCli('run', DEMO).stdout).not.toMatch(/not reciprocal/);
  });
});

describe('mixwise run on a published worked example', () => {
  // Independent anchor for the whole path file -> engine -> JSON: the two-band example of
  // shared/CHECKS.md items 5-6. Next-generation matrix K = [[1.8, 0.3], [0.9, 1.2]], R0 = 2.1
  // (Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873); multi-group final size
  // z = (0.886884, 0.647720), overall 0.707511 (Ma & Earn 2006, Bull Math Biol 68:679; Andreasen
  // 2011, Bull Math Biol 73:2305) [derived].
  it('prints R0 = 2.1 and the final-size attack rates', () => {
    const scenario = {
      format: 'mixwise-scenario', version: 1, title: 'two bands',
      ageBands: [{ label: 'child', lowerAgeYears: 0 }, { label: 'adult', lowerAgeYears: 18 }],
      populationPersons: [250, 750],
      settings: [{ name: 'all', contactsPerDay: [[18, 9], [3, 12]] }],
      disease: { transmission: { kind: 'r0', r0: 2.1 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
      severity: { infectionFatalityRatio: [0.001, 0.01], source: 'test value' },
      initialState: { infectedPersons: [1e-6, 3e-6] },
      horizonDays: 2000,
      options: [{ name: 'none' }],
    };
    const out = runCli('run', writeTemp('two-band.json', scenario), '--format', 'json');
    expect(out.code).toBe(0);
    const report = JSON.parse(out.stdout);
    expect(report.r0).toBeCloseTo(2.1, 12);
    expect(report.options[0].attackRateByBand[0]).toBeCloseTo(0.886884, 5);
    expect(report.options[0].attackRateByBand[1]).toBeCloseTo(0.64772, 5);
    expect(report.options[0].attackRate).toBeCloseTo(0.707511, 5);
    // Deaths = sum of IFR x infections: 0.001 x 250 z_1 + 0.01 x 750 z_2.
    expect(report.options[0].deaths).toBeCloseTo(0.001 * 250 * 0.886884 + 0.01 * 750 * 0.64772, 3);
  });
});

describe('mixwise run --out', () => {
  it('writes the file, prints nothing and leaves no temporary file', () => {
    const dir = tempDir();
    const target = join(dir, 'options.md');
    const { code, stdout } = runCli('run', DEMO, '--format', 'md', '--out', target);
    expect(code).toBe(0);
    expect(stdout).toBe('');
    expect(readFileSync(target, 'utf8')).toBe(runCli('run', DEMO, '--format', 'md').stdout);
    expect(readdirSync(dir)).toEqual(['options.md']);
  });

  it('replaces an existing file', () => {
    const dir = tempDir();
    const target = join(dir, 'options.json');
    writeFileSync(target, 'old');
    expect(runCli('run', DEMO, '--format', 'json', '--out', target).code).toBe(0);
    expect(JSON.parse(readFileSync(target, 'utf8')).options).toHaveLength(5);
  });

  it('keeps an existing file when the scenario is invalid', () => {
    const dir = tempDir();
    const target = join(dir, 'options.csv');
    writeFileSync(target, 'earlier results');
    const bad = demoJson();
    bad.horizonDays = 0;
    const out = runCli('run', writeTemp('bad.json', bad), '--out', target);
    expect(out.code).toBe(2);
    expect(readFileSync(target, 'utf8')).toBe('earlier results');
  });

  it('fails with exit 3 and one line when the folder does not exist', () => {
    const target = join(tempDir(), 'missing', 'options.md');
    const out = runCli('run', DEMO, '--out', target);
    expect(out.code).toBe(3);
    expect(out.stderr).toMatch(/^mixwise: cannot write .*options\.md: no such file or folder\n$/);
    expect(existsSync(target)).toBe(false);
  });
});

describe('mixwise run, invalid scenario', () => {
  it('lists every problem with its path on stderr and exits 2', () => {
    const bad = demoJson();
    bad.populationPersons[3] = -12;
    bad.options[1].phases[0].settingMultipliers = { gym: 0 };
    const file = writeTemp('bad.json', bad);
    const out = runCli('run', file);
    expect(out.code).toBe(2);
    expect(out.stdout).toBe('');
    const lines = out.stderr.trimEnd().split('\n');
    expect(lines.length).toBeGreaterThanOrEqual(1);
    expect(out.stderr).toContain(`mixwise: ${file}: populationPersons[3] must be >= 0, got -12`);
  });
});

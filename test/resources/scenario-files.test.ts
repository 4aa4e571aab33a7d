/**
 * The bundled scenario files and the published JSON Schema:
 * - docs/scenario.schema.json is what the zod schema exports today (run `npm run schema` if not);
 * - resources/demo-scenario.json is what scripts/make-demo.ts builds;
 * - every bundled scenario validates against the JSON Schema (checked with ajv, an independent
 *   JSON Schema validator) and against `validateScenario`;
 * - the demo keeps the properties its notes promise (invented pyramid, reciprocal matrices,
 *   10-15 contacts a day, IFR from Brazeau et al. 2022).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Ajv2020 from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { formatProblem } from '../../src/engine/problems.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { scenarioJsonSchema, scenarioJsonSchemaText } from '../../scripts/scenario-json-schema.ts';
import { demoScenarioText, POPULATION_75_PLUS_SPLIT } from '../../scripts/demo-scenario.ts';

const root = fileURLToPath(new URL('../../', import.meta.url));
const read = (rel: string): string => readFileSync(`${root}${rel}`, 'utf8');

/** Every resources/*.json that declares itself a scenario file. */
function bundledScenarios(): { file: string; json: Record<string, unknown> }[] {
  return readdirSync(`${root}resources`)
    .filter((f) => f.endsWith('.json'))
    .map((f) => ({ file: f, json: JSON.parse(read(`resources/${f}`)) as Record<string, unknown> }))
    .filter(({ json }) => json.format === 'mixwise-scenario');
}

function compileSchema() {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  return ajv.compile(JSON.parse(read('docs/scenario.schema.json')) as object);
}

describe('docs/scenario.schema.json', () => {
  it('is up to date with the zod schema (run `npm run schema` to refresh)', () => {
    expect(read('docs/scenario.schema.json')).toBe(scenarioJsonSchemaText());
  });

  it('is draft 2020-12 and describes the top-level fields', () => {
    const schema = scenarioJsonSchema();
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.required).toEqual(expect.arrayContaining(['format', 'version', 'title', 'ageBands', 'options']));
  });

  it('rejects a file that misses a required field or has a wrong type', () => {
    const validate = compileSchema();
    const demo = JSON.parse(read('resources/demo-scenario.json')) as Record<string, unknown>;
    const { title: _dropped, ...noTitle } = demo;
    expect(validate(noTitle)).toBe(false);
    expect(validate({ ...demo, horizonDays: 'a year' })).toBe(false);
    expect(validate({ ...demo, format: 'some-other-format' })).toBe(false);
  });
});

describe('bundled scenario files', () => {
  const scenarios = bundledScenarios();

  it('include the demo scenario', () => {
    expect(scenarios.map((s) => s.file)).toContain('demo-scenario.json');
  });

  it.each(scenarios.map((s) => [s.file, s.json] as const))('%s validates against the JSON Schema', (_file, json) => {
    const validate = compileSchema();
    const ok = validate(json);
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  it.each(scenarios.map((s) => [s.file, s.json] as const))('%s passes validateScenario', (_file, json) => {
    const result = validateScenario(json);
    expect(result.ok ? [] : result.problems.map(formatProblem)).toEqual([]);
  });
});

describe('resources/demo-scenario.json', () => {
  const demo = JSON.parse(read('resources/demo-scenario.json'));
  const n = 16;
  const population: number[] = demo.populationPersons;
  const total = population.reduce((a, b) => a + b, 0);
  const matrix = (name: string): number[][] => demo.settings.find((s: { name: string }) => s.name === name).contactsPerDay;

  it('is exactly what scripts/make-demo.ts writes', () => {
    expect(read('resources/demo-scenario.json')).toBe(demoScenarioText());
  });

  it('has 16 five-year bands 0-4 ... 75+ and a population of 1-2 million', () => {
    expect(demo.ageBands.map((b: { label: string }) => b.label)).toEqual([
      '0-4', '5-9', '10-14', '15-19', '20-24', '25-29', '30-34', '35-39',
      '40-44', '45-49', '50-54', '55-59', '60-64', '65-69', '70-74', '75+',
    ]);
    expect(demo.ageBands.map((b: { lowerAgeYears: number }) => b.lowerAgeYears)).toEqual(Array.from({ length: n }, (_, i) => 5 * i));
    expect(total).toBeGreaterThan(1e6);
    expect(total).toBeLessThan(2e6);
    expect(demo.notes).toMatch(/fictional/);
    expect(demo.notes).toMatch(/invented for demonstration/);
  });

  it('has the four settings, each exactly reciprocal (N_i C_ij = N_j C_ji)', () => {
    expect(demo.settings.map((s: { name: string }) => s.name)).toEqual(['home', 'school', 'work', 'other']);
    for (const setting of demo.settings as { contactsPerDay: number[][] }[]) {
      const c = setting.contactsPerDay;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const a = population[i] * c[i][j];
          const b = population[j] * c[j][i];
          expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(a, b));
        }
      }
    }
  });

  it('gives about 10-15 contacts per person per day in all', () => {
    let contacts = 0;
    for (const setting of demo.settings as { contactsPerDay: number[][] }[]) {
      setting.contactsPerDay.forEach((row, i) => (contacts += population[i] * row.reduce((a, b) => a + b, 0)));
    }
    const mean = contacts / total;
    expect(mean).toBeGreaterThanOrEqual(10);
    expect(mean).toBeLessThanOrEqual(15);
  });

  it('has the intended shape per setting', () => {
    const home = matrix('home');
    const school = matrix('school');
    const work = matrix('work');
    // Home: a 5-9-year-old sees parents (30-44) more than young adults (15-24).
    expect(Math.min(home[1][6], home[1][7], home[1][8])).toBeGreaterThan(Math.max(home[1][3], home[1][4]));
    // School: pupils 5-19 mostly meet their own band.
    for (const i of [1, 2, 3]) {
      for (let j = 0; j < n; j++) if (j !== i) expect(school[i][i]).toBeGreaterThan(5 * school[i][j]);
    }
    // Work: nobody under 15 or over 69 works.
    for (const i of [0, 1, 2, 14, 15]) expect(work[i].every((x) => x === 0)).toBe(true);
  });

  it('uses the IFR of Brazeau et al. 2022 by band, 75+ as the population-weighted mean of 75-79 ... 90+', () => {
    // Brazeau NF et al. 2022, Estimating the COVID-19 infection fatality ratio accounting for
    // seroreversion using statistical modelling, Commun Med 2:54, Table 2: IFR % for 0-4 ... 90+.
    const percent = [0, 0.01, 0.01, 0.02, 0.03, 0.04, 0.07, 0.1, 0.16, 0.25, 0.4, 0.62, 0.96, 1.5, 2.34, 3.66, 5.71, 8.9, 17.36];
    const ifr: number[] = demo.severity.infectionFatalityRatio;
    for (let i = 0; i < 15; i++) expect(ifr[i]).toBeCloseTo(percent[i] / 100, 12);
    const split = POPULATION_75_PLUS_SPLIT;
    expect(split.reduce((a, b) => a + b, 0)).toBe(population[15]);
    const weighted = split.reduce((sum, persons, k) => sum + persons * percent[15 + k], 0) / population[15] / 100;
    expect(Math.abs(ifr[15] - weighted)).toBeLessThan(1e-7);
    expect(ifr[15]).toBeGreaterThan(0.0366);
    expect(ifr[15]).toBeLessThan(0.1736);
    expect(demo.severity.source).toMatch(/Brazeau.*2022.*Commun Med 2:54/);
  });

  it('has R0 2.5, latent 3 days, infectious 5 days, 20 latent seeds among adults, 365 days', () => {
    expect(demo.disease.transmission).toEqual({ kind: 'r0', r0: 2.5 });
    expect(demo.disease.latentPeriodDays).toBe(3);
    expect(demo.disease.infectiousPeriodDays).toBe(5);
    expect(demo.disease.source).toMatch(/[Ii]llustrative/);
    const seeds: number[] = demo.initialState.infectedPersons;
    expect(seeds.reduce((a, b) => a + b, 0)).toBe(20);
    seeds.forEach((x, i) => (i < 4 || i > 12 ? expect(x).toBe(0) : undefined));
    expect(demo.initialState.infectedCompartment).toBe('latent');
    expect(demo.horizonDays).toBe(365);
  });

  it('offers no measures, an 8-week school closure, halved work contacts and shielding of 70+', () => {
    const byName = new Map(demo.options.map((o: { name: string }) => [o.name, o]));
    expect(demo.options.length).toBeGreaterThanOrEqual(4);
    expect(byName.get('No measures')).toMatchObject({ phases: [] });
    expect(byName.get('Schools closed 8 weeks')).toMatchObject({
      phases: [{ settingMultipliers: { school: 0, home: 1.2 } }],
    });
    const school = (byName.get('Schools closed 8 weeks') as { phases: { fromDay: number; toDay: number }[] }).phases[0];
    expect(school.toDay - school.fromDay).toBe(56);
    expect(byName.get('Work contacts halved')).toMatchObject({ phases: [{ settingMultipliers: { work: 0.5 } }] });
    expect(byName.get('Shield 70+')).toMatchObject({
      phases: [{ ageFactors: [{ setting: 'work', bands: [14, 15] }, { setting: 'other', bands: [14, 15] }] }],
    });
  });
});

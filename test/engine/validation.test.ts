/** Scenario validation: every problem names its path, the rule and the value. */
import { describe, expect, it } from 'vitest';
import { formatProblem } from '../../src/engine/problems.ts';
import { parseScenarioText, validateScenario } from '../../src/engine/validation.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { demoScenario } from '../helpers/demo.ts';

const demoJson = () => JSON.parse(JSON.stringify(demoScenario())) as Record<string, any>;
const lines = (input: unknown) => {
  const r = validateScenario(input);
  return r.ok ? [] : r.problems.map(formatProblem);
};

describe('validateScenario', () => {
  it('accepts the demo', () => {
    expect(validateScenario(demoJson()).ok).toBe(true);
  });

  it('returns the calibration, which prepareScenario uses instead of calibrating again', () => {
    const r = validateScenario(demoJson());
    if (!r.ok) throw new Error('demo must be valid');
    // R0 = beta x R at unit transmission, so the calibrated pair reproduces the file's R0.
    const t = r.scenario.disease.transmission;
    if (t.kind === 'r0') expect(r.calibration.r0).toBeCloseTo(t.r0, 10);
    expect(prepareScenario(r.scenario).beta).toBeCloseTo(r.calibration.beta, 14);
    const given = { beta: 2 * r.calibration.beta, r0: 2 * r.calibration.r0 };
    const p = prepareScenario(r.scenario, given);
    expect([p.beta, p.r0]).toEqual([given.beta, given.r0]);
  });

  it('names path, rule and value for a negative population', () => {
    const s = demoJson();
    s.populationPersons[3] = -12;
    expect(lines(s)).toEqual(['populationPersons[3] must be >= 0, got -12']);
  });

  it('lists every structural problem at once', () => {
    const s = demoJson();
    s.disease.latentPeriodDays = 0;
    s.severity.infectionFatalityRatio[0] = 1.5;
    s.settings[1].contactsPerDay[2][0] = 'many';
    delete s.title;
    expect(lines(s)).toEqual(expect.arrayContaining([
      'disease.latentPeriodDays must be at least 0.1 days, got 0',
      'severity.infectionFatalityRatio[0] must be a fraction between 0 and 1, got 1.5',
      'settings[1].contactsPerDay[2][0] must be a number, got "many"',
      'title is required (text)',
    ]));
  });

  it('checks sizes against the number of age bands', () => {
    const s = demoJson();
    s.populationPersons.pop();
    s.settings[0].contactsPerDay[4].push(1);
    expect(lines(s)).toEqual([
      'populationPersons must have one entry per age band (16), got 15 entries',
      'settings[0].contactsPerDay[4] must have 16 columns (one per age band), got 17 columns',
    ]);
  });

  it('rejects overlapping phases, unknown settings and out-of-range bands', () => {
    const s = demoJson();
    s.options[1].phases = [
      { fromDay: 10, toDay: 50, settingMultipliers: { school: 0 } },
      { fromDay: 40, toDay: 60, settingMultipliers: { church: 0 }, ageFactors: [{ setting: 'work', bands: [16], factor: 0.5 }] },
    ];
    expect(lines(s)).toEqual([
      'options[1].phases[1].fromDay must not overlap phases[0] (which runs to day 50), got 40',
      'options[1].phases[1].settingMultipliers.church must name a setting of the scenario (home, school, work, other), got "church"',
      'options[1].phases[1].ageFactors[0].bands[0] must be a band index below 16, got 16',
    ]);
  });

  it('rejects duplicate option names, an unknown reference and a phase that ends before it starts', () => {
    const s = demoJson();
    s.options[2].name = s.options[1].name;
    s.referenceOption = 'Nothing';
    s.options[1].phases = [{ fromDay: 30, toDay: 30 }];
    expect(lines(s)).toEqual([
      'options[1].phases[0].toDay must be after fromDay (30), got 30',
      `options[2].name must be unique, got ${JSON.stringify(s.options[1].name)}`,
      'referenceOption must name one of the options, got "Nothing"',
    ]);
  });

  it('rejects more initial infections than non-immune people', () => {
    const s = demoJson();
    s.initialState.infectedPersons[0] = s.populationPersons[0] + 1;
    expect(lines(s)[0]).toMatch(/^initialState\.infectedPersons\[0\] must not exceed the band's non-immune population/);
  });

  it('refuses a population below one person (other than an empty band)', () => {
    const s = demoJson();
    s.populationPersons[2] = 1e-200;
    expect(lines(s)).toEqual(['populationPersons[2] must be 0 or at least 1 person, got 1e-200']);
  });

  it('refuses an R0 that no transmission can reach, naming the field', () => {
    const s = demoJson();
    for (const setting of s.settings) setting.contactsPerDay = setting.contactsPerDay.map((row: number[]) => row.map(() => 0));
    expect(lines(s)).toEqual(['disease.transmission.r0 cannot be reached: the contact matrices, populations and susceptibilities allow (almost) no transmission, got 2.5']);
  });

  it('reports bad JSON as one problem, not a stack trace', () => {
    const r = parseScenarioText('{"format": ');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(formatProblem(r.problems[0])).toMatch(/^\(file\) must be valid JSON/);
  });

  it('accepts a UTF-8 byte-order mark', () => {
    expect(parseScenarioText('\ufeff' + JSON.stringify(demoJson())).ok).toBe(true);
  });
});

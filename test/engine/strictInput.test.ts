/**
 * Strict reading of scenario files: one test per defect found by feeding Mixwise careless and
 * hostile files. Each bad file must be refused with one line per problem naming its JSON path.
 */
import { describe, expect, it } from 'vitest';
import { formatProblem, parseScenarioText, validateScenario } from '../../src/engine/index.ts';
import { MAX_LISTED_PROBLEMS } from '../../src/engine/validation.ts';
import { closestName } from '../../src/engine/strictInput.ts';
import { applyParameter } from '../../src/engine/uncertainty/applyDraw.ts';
import { demoJson } from '../cli/helpers.ts';

function problemsOf(input: unknown): string[] {
  const r = typeof input === 'string' ? parseScenarioText(input) : validateScenario(input);
  if (r.ok) throw new Error('expected the scenario to be refused');
  return r.problems.map(formatProblem);
}

describe('unknown and contradictory fields', () => {
  it('refuses a misspelt field and suggests the right one (latentStage used to run with one stage)', () => {
    const s = demoJson();
    s.disease.latentStage = 20;
    expect(problemsOf(s)).toEqual(['disease.latentStage is not a known field (did you mean "latentStages"?)']);
    const t = demoJson();
    t.Title = 'x';
    t.options[0].phase = [];
    expect(problemsOf(t)).toEqual(['Title is not a known field (did you mean "title"?)', 'options[0].phase is not a known field (did you mean "phases"?)']);
  });

  it('lists the known fields when none is near', () => {
    const s = demoJson();
    s.initialState.zzzzzzzz = 1;
    expect(problemsOf(s)).toEqual(['initialState.zzzzzzzz is not a known field (known here: infectedPersons, infectedCompartment, priorImmunityFraction)']);
    expect(closestName('icuBed', ['wardBeds', 'icuBeds'])).toBe('icuBeds');
    expect(closestName('x', ['wardBeds'])).toBeNull();
  });

  it('refuses an r0 transmission that also gives a doubling time', () => {
    const s = demoJson();
    s.disease.transmission = { kind: 'r0', r0: 2.5, doublingTimeDays: 3 };
    expect(problemsOf(s)).toEqual(['disease.transmission.doublingTimeDays does not go with kind "r0": it belongs to kind "doublingTime" (give the fields of one form only)']);
  });

  it.each([
    ['admissionDelay', 'admissionDelayByBand'],
    ['wardStay', 'wardStayByBand'],
    ['icuStay', 'icuStayByBand'],
  ])('refuses a common %s given together with %s (the list silently replaced it), naming both', (common, byBand) => {
    const s = demoJson();
    s.healthcare[common] = { meanDays: 9, shape: 2 };
    s.healthcare[byBand] = s.ageBands.map(() => ({ meanDays: 5, shape: 2 }));
    expect(problemsOf(s)).toEqual([`healthcare.${byBand} must not be given together with healthcare.${common}: the list replaces the common delay for every band, so give one of them`]);
    delete s.healthcare[common];
    expect(validateScenario(s).ok).toBe(true);
  });

  it('keeps a by-band delay valid when the read scenario is checked again (the app and the draws re-check what they read)', () => {
    const s = demoJson();
    s.healthcare.wardStayByBand = s.ageBands.map(() => ({ meanDays: 5, shape: 2 }));
    const first = validateScenario(s);
    if (!first.ok) throw new Error(first.problems.map(formatProblem).join('\n'));
    expect(first.scenario.healthcare?.wardStay).toBeUndefined();
    const again = validateScenario(JSON.parse(JSON.stringify(first.scenario)));
    expect(again.ok).toBe(true);
    const scaled = validateScenario(applyParameter(first.scenario, 'wardStayScale', 2));
    if (!scaled.ok) throw new Error(scaled.problems.map(formatProblem).join('\n'));
    expect(scaled.scenario.healthcare?.wardStayByBand?.[0].meanDays).toBe(10);
    expect(scaled.scenario.healthcare?.wardStay).toBeUndefined();
  });

  it('refuses a lognormal given both a 95% range and a geometric standard deviation, naming both', () => {
    const s = demoJson();
    s.uncertainty = { draws: 10, parameters: [{ name: 'ifrScale', distribution: { kind: 'lognormal', median: 1, range95: [0.5, 2], geometricSd: 1.5 }, source: 'test' }] };
    expect(problemsOf(s)).toEqual(['uncertainty.parameters[0].distribution.geometricSd must not be given together with uncertainty.parameters[0].distribution.range95: give exactly one of them']);
  });

  it('escapes odd field names instead of printing raw control characters', () => {
    const s = demoJson();
    s['bad\u0000\nkey'] = 1;
    const [line] = problemsOf(s);
    expect(line).toBe('["bad\\u0000\\nkey"] is not a known field');
    expect(/[\u0000-\u001f]/.test(line)).toBe(false);
  });
});

describe('repeated bands and reserved names', () => {
  it('refuses a band repeated in an age factor (it applied the factor twice)', () => {
    const s = demoJson();
    s.options[3].phases[0].ageFactors[0].bands = [14, 15, 14];
    expect(problemsOf(s)).toEqual(['options[3].phases[0].ageFactors[0].bands[2] must not repeat a band (already at bands[0]; the factor would apply twice), got 14']);
  });

  it.each(['constructor', 'toString', '__proto__', 'hasOwnProperty'])('refuses a setting named %s, and it as a multiplier key', (name) => {
    const s = demoJson();
    s.settings[3].name = name;
    s.options[1].phases[0].settingMultipliers = { school: 0 };
    expect(problemsOf(s)).toContain(`settings[3].name must not be a name JavaScript objects reserve (constructor, toString, __proto__ ...); choose another, got ${JSON.stringify(name)}`);
    // As a key in the file (JSON.parse makes __proto__ an own key; zod would drop it silently).
    const text = JSON.stringify(demoJson()).replace('"settingMultipliers":{"school":0', `"settingMultipliers":{${JSON.stringify(name)}:0.5,"school":0`);
    expect(problemsOf(text)).toEqual([
      `options[1].phases[0].settingMultipliers.${name} must not be a name JavaScript objects reserve (constructor, toString, __proto__ ...), got ${JSON.stringify(name)}`,
    ]);
  });
});

describe('plausibility bounds, checked before any linear algebra', () => {
  const cases: [string, (s: Record<string, any>) => void, string][] = [
    ['a contact near 1e200 (hung check and run)', (s) => (s.settings[0].contactsPerDay[0][0] = 1e200), 'settings[0].contactsPerDay[0][0] must be at most 1000 contacts per day, got 1e+200'],
    ['a contact of 1e308 (crashed)', (s) => (s.settings[1].contactsPerDay[2][3] = 1e308), 'settings[1].contactsPerDay[2][3] must be at most 1000 contacts per day, got 1e+308'],
    ['a population of 1e308 (crashed)', (s) => (s.populationPersons[0] = 1e308), 'populationPersons[0] must be at most 1e10 persons, got 1e+308'],
    ['a setting multiplier of 1e20 (crashed)', (s) => (s.options[1].phases[0].settingMultipliers.school = 1e20), 'options[1].phases[0].settingMultipliers.school must be at most 100, got 100000000000000000000'],
    ['a latent period of 1e-5 days (crashed)', (s) => (s.disease.latentPeriodDays = 1e-5), 'disease.latentPeriodDays must be at least 0.1 days, got 0.00001'],
    ['a delay shape of 1e306 (NaN deaths)', (s) => (s.severity.deathDelay = { meanDays: 21, shape: 1e306 }), 'severity.deathDelay.shape must be at most 1000, got 1e+306'],
    ['1e20 doses a day (the campaign vanished)', (s) => (s.vaccinationCampaigns[0].schedule[0].dosesPerDay = 1e20), 'vaccinationCampaigns[0].schedule[0].dosesPerDay must be at most 1e10 doses per day, got 100000000000000000000'],
    ['an R0 of 1e6', (s) => (s.disease.transmission.r0 = 1e6), 'disease.transmission.r0 must be at most 100, got 1000000'],
  ];
  it.each(cases)('refuses %s naming the entry', (_label, mutate, expected) => {
    const s = demoJson();
    mutate(s);
    expect(problemsOf(s)).toEqual([expected]);
  });
});

describe('reading the JSON text', () => {
  it('reports 1e999999 as a number too large, not as null', () => {
    const text = JSON.stringify(demoJson()).replace('"horizonDays":365', '"horizonDays":1e999999');
    expect(problemsOf(text)).toEqual(['horizonDays must be a finite number (the file writes a number beyond the double-precision range, about 1.8e308), got Infinity']);
  });

  it('reports a trailing comma in one line with its line and column', () => {
    expect(problemsOf('{\n  "format": "mixwise-scenario",\n}')).toEqual(["(file) must be valid JSON; at line 3, column 1 it has a comma before '}' (remove the trailing comma)"]);
    expect(problemsOf('{"a": [1, 2')).toEqual(["(file) must be valid JSON; at line 1, column 12 it ends before the JSON is complete (missing ']'?)"]);
    expect(problemsOf('{"a": 1 "b": 2}')).toEqual(["(file) must be valid JSON; at line 1, column 9 it needs ',' or '}' here, found '\"' (a missing comma?)"]);
    expect(problemsOf('\u0000{')).toEqual(["(file) must be valid JSON; at line 1, column 1 it has an unexpected U+0000 where a value should be"]);
  });

  it('refuses JSON nested 10,000 levels deep without exhausting the call stack', () => {
    const deep = `${'['.repeat(10_000)}1${']'.repeat(10_000)}`;
    const text = JSON.stringify(demoJson()).replace('"populationPersons":[', `"populationPersons":[${deep},`);
    expect(problemsOf(text)).toEqual(['populationPersons[0][0]... must not nest lists and objects more than 64 levels deep']);
    const object = JSON.parse(`${'{"a":'.repeat(10_000)}1${'}'.repeat(10_000)}`);
    expect(problemsOf(object)).toHaveLength(1);
  });

  it('lists several problems one per line, at most MAX_LISTED_PROBLEMS and a count of the rest', () => {
    const s = demoJson();
    s.settings[0].contactsPerDay = s.settings[0].contactsPerDay.map((row: number[]) => row.map(() => -1));
    const lines = problemsOf(s);
    expect(lines).toHaveLength(MAX_LISTED_PROBLEMS + 1);
    expect(lines[0]).toBe('settings[0].contactsPerDay[0][0] must be >= 0, got -1');
    expect(lines[MAX_LISTED_PROBLEMS]).toBe(`(file) has ${16 * 16 - MAX_LISTED_PROBLEMS} more problems not listed`);
    expect(lines.every((l) => !l.includes('\n'))).toBe(true);
  });
});

describe('plausibility bounds of the newer sections, each naming its entry', () => {
  const uncertainWith = (distribution: unknown) => ({ draws: 10, parameters: [{ name: 'r0', distribution, source: 'test' }] });
  it.each<[string, (s: Record<string, any>) => void, string]>([
    ['a trigger level in persons', (s) => (s.options[1].phases[0].trigger = { quantity: 'dailyAdmissions', onAbove: 1e12, offBelow: 1 }), 'options[1].phases[0].trigger.onAbove must be at most 1e10, got 1000000000000'],
    ['a trigger level per 100,000', (s) => (s.options[1].phases[0].trigger = { quantity: 'infectiousPer100k', onAbove: 150000, offBelow: 1 }), 'options[1].phases[0].trigger.onAbove must be at most 100,000 (per 100,000 population), got 150000'],
    ['a trigger lag', (s) => (s.options[1].phases[0].trigger = { quantity: 'infectiousPer100k', onAbove: 100, offBelow: 1, lagDays: 1e6 }), 'options[1].phases[0].trigger.lagDays must be at most 100000 (a day number), got 1000000'],
    ['a distribution bound', (s) => (s.uncertainty = uncertainWith({ kind: 'uniform', low: 1, high: 1e7 })), 'uncertainty.parameters[0].distribution.high must be at most 1e6, got 10000000'],
    ['a standard deviation', (s) => (s.uncertainty = uncertainWith({ kind: 'normal', mean: 2, sd: 1e300 })), 'uncertainty.parameters[0].distribution.sd must be at most 1e6, got 1e+300'],
    ['a geometric standard deviation', (s) => (s.uncertainty = uncertainWith({ kind: 'lognormal', median: 2, geometricSd: 1e3 })), 'uncertainty.parameters[0].distribution.geometricSd must be at most 100, got 1000'],
    ['a 95% range', (s) => (s.uncertainty = uncertainWith({ kind: 'lognormal', median: 2, range95: [1, 1e9] })), 'uncertainty.parameters[0].distribution.range95[1] must be at most 1e6, got 1000000000'],
    ['the number of draws', (s) => (s.uncertainty = { ...uncertainWith({ kind: 'uniform', low: 2, high: 3 }), draws: 1e8 }), 'uncertainty.draws must be at most 10000000, got 100000000'],
    ['an age in the life table', (s) => (s.lifeTable = { rows: [{ ageYears: 0, remainingYears: 80 }, { ageYears: 1e4, remainingYears: 1 }], source: 'test' }), 'lifeTable.rows[1].ageYears must be at most 150 years, got 10000'],
    ['remaining years in the life table', (s) => (s.lifeTable = { rows: [{ ageYears: 0, remainingYears: 1e300 }], source: 'test' }), 'lifeTable.rows[0].remainingYears must be at most 150 years, got 1e+300'],
    ['the length of the life table', (s) => (s.lifeTable = { rows: Array.from({ length: 1001 }, (_, k) => ({ ageYears: k / 10, remainingYears: 1 })), source: 'test' }), 'lifeTable.rows must have at most 1000 rows, got [{"ageYears":0,"remainingYears":1},{"ageYears":0.1,"remai...'],
    ['an early start date', (s) => (s.startDate = '1599-12-31'), 'startDate must be from 1600-01-01 to 2399-12-31, got "1599-12-31"'],
    ['a late start date (its horizon would pass year 9999)', (s) => (s.startDate = '9999-06-01'), 'startDate must be from 1600-01-01 to 2399-12-31, got "9999-06-01"'],
  ])('refuses %s beyond its bound', (_, change, line) => {
    const s = demoJson();
    change(s);
    expect(problemsOf(s)).toEqual([line]);
  });

  it('accepts values at the bounds', () => {
    const s = demoJson();
    s.startDate = '2399-12-31';
    s.options[1].phases[0].trigger = { quantity: 'infectiousPer100k', onAbove: 100000, offBelow: 0 };
    s.lifeTable = { rows: [{ ageYears: 0, remainingYears: 150 }, { ageYears: 150, remainingYears: 0 }], source: 'test' };
    s.uncertainty = uncertainWith({ kind: 'lognormal', median: 2, geometricSd: 100 });
    const r = validateScenario(s);
    if (!r.ok) throw new Error(r.problems.map(formatProblem).join('\n'));
  });
});


import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText, validateScenario } from '../../src/engine/validation.ts';
import { problemInWords } from '../../src/renderer/lib/problemWords.ts';
import { scenarioSchema, type Scenario } from '../../src/engine/scenario.ts';
import { phaseLeavingOddContacts } from '../helpers/unsettledRoots.ts';

function demo(): Scenario {
  const parsed = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!parsed.ok) throw new Error('demo invalid');
  return parsed.scenario;
}

function problemsOf(s: Scenario): string[] {
  const check = validateScenario(s);
  return check.ok ? [] : check.problems.map((p) => problemInWords(p, s));
}

describe('problems in the words the app shows', () => {
  it('names capacity fields by the table\'s labels', () => {
    const s = demo();
    s.healthcare!.capacity.wardBeds = s.healthcare!.capacity.wardSurgeBeds! + 500;
    const [line] = problemsOf(s);
    expect(line).toMatch(/^Ward beds at full surge must be at least the usual ward beds \(\d+\)/);
    expect(line).not.toMatch(/healthcare|wardBeds/);
  });

  it('names band fields by band label, phases by option, campaign fields in words', () => {
    const s = demo();
    s.populationPersons[2] = -1;
    expect(problemsOf(s)[0]).toBe(`Population ${s.ageBands[2].label} must be >= 0, got -1`);
    const t = demo();
    t.options[1].phases[0].toDay = t.options[1].phases[0].fromDay;
    expect(problemsOf(t)[0]).toContain(`Phase 1 of “${t.options[1].name}”: last day must be after first day`);
    const v = demo();
    v.vaccinationCampaigns[0].efficacyAgainstDeath = 0.1;
    expect(problemsOf(v)[0]).toMatch(/^Efficacy against death must be at least efficacy against infection/);
  });

  it('names a phase or an option whose R cannot be computed by its label, without repeating the option', () => {
    const input = phaseLeavingOddContacts();
    const check = validateScenario(input);
    if (check.ok) throw new Error('expected a refusal');
    const s = scenarioSchema.parse(input);
    expect(problemInWords(check.problems[0], s)).toMatch(/^Phase 1 of “ordinary contacts shut” must give measures R can be computed under: with everyone susceptible the largest eigenvalue/);
    expect(problemInWords({ path: 'options[0]', rule: '(option "as usual") must give measures R can be computed under: on day 0 x' }, s)).toBe('Option “as usual” must give measures R can be computed under: on day 0 x');
  });
});

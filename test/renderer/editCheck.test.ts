import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText } from '../../src/engine/validation.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { checkEdit, editMessages } from '../../src/renderer/lib/editCheck.ts';

function demo(): Scenario {
  const parsed = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!parsed.ok) throw new Error('demo invalid');
  return parsed.scenario;
}

describe('the check an edit passes before it enters the document', () => {
  it('accepts a valid edit and hands back the validated scenario', () => {
    const s = demo();
    s.options[1].phases[0].caseIsolation = 0.4;
    const check = checkEdit(s);
    expect(check.ok).toBe(true);
    if (check.ok) expect(check.scenario.options[1].phases[0].caseIsolation).toBe(0.4);
    expect(editMessages({ ok: true })).toEqual([]);
  });

  it('refuses an invalid edit with each problem as the field path and a message in words', () => {
    const refused = (s: Scenario) => {
      const check = checkEdit(s);
      if (check.ok) throw new Error('edit accepted');
      return check;
    };
    const band = demo();
    band.populationPersons[2] = -1;
    const negative = refused(band);
    expect(negative.problems).toEqual([{ path: 'populationPersons[2]', message: `Population ${band.ageBands[2].label} must be >= 0, got -1` }]);
    const campaign = demo();
    campaign.vaccinationCampaigns[0].efficacyAgainstDeath = 0.1;
    const efficacy = refused(campaign);
    expect(efficacy.problems.map((p) => p.path)).toEqual(['vaccinationCampaigns[0].efficacyAgainstDeath']);
    expect(efficacy.problems[0].message).toMatch(/^Efficacy against death must be at least efficacy against infection/);
    // Messages are for people: no JSON path left in them for a caller to strip.
    for (const p of [...negative.problems, ...efficacy.problems]) expect(p.message).not.toContain(p.path);
    expect(editMessages(efficacy)).toEqual([efficacy.problems[0].message]);
  });
});

import { describe, expect, it } from 'vitest';
import type { PolicyOption } from '../../src/engine/scenario.ts';
import { optionSummaries, optionSummary, phaseWhenText } from '../../src/report/measures.ts';
import { demo } from './helpers.ts';

describe('option summaries', () => {
  const { scenario, results } = demo();
  const summaries = optionSummaries(scenario, results.referenceIndex);

  it('describe each demo option in plain words', () => {
    expect(summaries.map((s) => s.name)).toEqual(scenario.options.map((o) => o.name));
    expect(summaries[0]).toMatchObject({ isReference: true, phases: [], noMeasures: 'No contact measures: contacts as usual for all 365 days.', vaccination: null });
    expect(summaries[1].phases).toEqual([{ when: 'Days 21 to 76 (56 days)', what: 'school contacts 0% of usual (closed); home contacts 120% of usual' }]);
    expect(summaries[2].phases).toEqual([{ when: 'Whole horizon (days 0 to 364)', what: 'work contacts 50% of usual' }]);
    expect(summaries[3].phases[0].what).toBe('work contacts of ages 70-74, 75+ at 25% of usual; other contacts of ages 70-74, 75+ at 25% of usual');
    expect(summaries[1].isReference).toBe(false);
    const vaccinated = summaries.find((s, k) => scenario.options[k].vaccinationCampaign !== undefined);
    expect(vaccinated?.vaccination).toMatch(/^Autumn campaign: from day 30, 6,000 doses a day; from day 90, 12,000 doses a day\. Priority: 75\+, then 70-74, then 65-69, /);
    expect(vaccinated?.vaccination).toContain('Efficacy against infection 50%, against hospital admission 80%, against death 85%, leaky');
  });

  it('cuts phases to the horizon, leaves out phases beyond it, names isolation', () => {
    const option: PolicyOption = {
      name: 'x',
      description: '',
      phases: [
        { fromDay: 400, toDay: 420, settingMultipliers: { work: 0 }, ageFactors: [], caseIsolation: 0 },
        { fromDay: 300, toDay: 500, settingMultipliers: { other: 0.333, home: 1 }, ageFactors: [], caseIsolation: 0.3 },
        { fromDay: 10, toDay: 11, settingMultipliers: {}, ageFactors: [], caseIsolation: 0 },
      ],
    };
    const s = optionSummary(option, scenario, false);
    expect(s.phases).toEqual([
      { when: 'Day 10 only', what: 'no change to contacts' },
      { when: 'Days 300 to 364 (65 days)', what: 'other contacts 33.3% of usual; infectiousness of cases cut by 30% (isolation)' },
    ]);
    expect(phaseWhenText(option.phases[0], 365)).toBeNull();
  });
});

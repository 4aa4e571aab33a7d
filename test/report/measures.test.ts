import { describe, expect, it } from 'vitest';
import type { PolicyOption } from '../../src/engine/scenario.ts';
import { runScenario } from '../../src/engine/index.ts';
import { optionSummaries, optionSummary, phaseWhenText, triggerFiredText } from '../../src/report/measures.ts';
import { outcome, outcomeText } from '../../src/report/outcomes.ts';
import { buildReportHtml } from '../../src/report/reportHtml.ts';
import { demoScenario } from '../helpers/demo.ts';
import type { ReportMeta } from '../../src/report/reportTypes.ts';
import { print } from '../../src/report/numberFormat.ts';
import { demo } from './helpers.ts';

const META: ReportMeta = { appVersion: '1.2.3', generatedAt: new Date(2031, 4, 6, 7, 8), fingerprint: 'f'.repeat(64), paper: 'A4', orientation: 'portrait' };

describe('option summaries', () => {
  const { scenario, results } = demo();
  const summaries = optionSummaries(scenario, results.referenceIndex);

  it('describe each demo option in plain words', () => {
    expect(summaries.map((s) => s.name)).toEqual(scenario.options.map((o) => o.name));
    expect(summaries[0]).toMatchObject({ isReference: true, phases: [], noMeasures: 'No contact measures: contacts as usual for all 365 days.', vaccination: null });
    expect(summaries[1].phases).toEqual([{ when: 'Days 21 to 76 (56 days)', what: 'school contacts 0% of usual (closed); home contacts 120% of usual', rule: null, fired: null, r: null }]);
    expect(summaries[2].phases).toEqual([{ when: 'Whole horizon (days 0 to 364)', what: 'work contacts 50% of usual', rule: null, fired: null, r: null }]);
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
      { when: 'Day 10 only', what: 'no change to contacts', rule: null, fired: null, r: null },
      { when: 'Days 300 to 364 (65 days)', what: 'other contacts 33.3% of usual; infectiousness of cases cut by 30% (isolation)', rule: null, fired: null, r: null },
    ]);
    expect(phaseWhenText(option.phases[0], 365)).toBeNull();
  });
});

describe('triggered phases in words', () => {
  const scenario = demoForTriggers();
  const results = runScenario(scenario);
  const summary = optionSummaries(scenario, 0, results)[1];

  it('says the rule the way an agency writes it', () => {
    expect(summary.phases[0].when).toBe('Whole horizon (days 0 to 364), when triggered');
    expect(summary.phases[0].rule).toBe('in force when ICU occupancy exceeds 80 beds, lifted when it falls below 40 beds, decided each day with a 3-day lag, at least 14 days at a time');
    expect(summary.phases[0].what).toBe('school contacts 0% of usual (closed); work contacts 60% of usual');
  });

  it('says when it fired, from the engine results', () => {
    const t = results.options[1].triggers[0];
    expect(t.switchesOn).toBeGreaterThan(0);
    expect(summary.phases[0].fired).toBe(`came into force ${t.switchesOn === 1 ? 'once' : `${t.switchesOn} times`}, first on day ${t.firstOnDay}, in force ${t.daysInForce} days in all`);
  });

  it('prints the rule and what happened in the report', () => {
    const html = buildReportHtml(scenario, results, META);
    expect(html).toContain('in force when ICU occupancy exceeds 80 beds');
    expect(html).toContain('Measures with a trigger are decided once a day');
    expect(html).toContain(`first on day ${results.options[1].triggers[0].firstOnDay}`);
  });
});

function demoForTriggers() {
  const demo = demoScenario();
  return {
    ...demo,
    options: [
      demo.options[0],
      {
        name: 'Close schools when ICU fills',
        description: '',
        phases: [
          { fromDay: 0, toDay: 365, trigger: { quantity: 'icuOccupancy' as const, onAbove: 80, offBelow: 40, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { school: 0, work: 0.6 }, ageFactors: [], caseIsolation: 0 },
        ],
      },
    ],
  };
}

describe('R under each phase and the contacts removed, in the option summaries', () => {
  const { scenario, results } = demo();
  const summaries = optionSummaries(scenario, results.referenceIndex, results);
  it('gives R at the phase start and at full susceptibility, and the full-closure days by setting', () => {
    const o = results.options[1];
    expect(summaries[1].phases[0].r).toBe(`R ${print.r(o.rByPhase[0].rAtPhaseStart)} on day 21, ${print.r(o.rByPhase[0].rMeasuresOnly)} with everyone susceptible`);
    expect(summaries[1].burden).toBe('Contacts removed over the horizon, in full-closure days of each setting: home -11.2 (contacts added); school 56.0.');
    expect(summaries[0].burden).toBeNull();
  });
});

describe('phase days with the scenario start date', () => {
  it('puts the calendar dates beside the day numbers, across a leap day', () => {
    const phase = { fromDay: 21, toDay: 77, settingMultipliers: {}, ageFactors: [], caseIsolation: 0 };
    // 2028 is a leap year: day 21 after 2028-02-08 is 2028-02-29, day 76 is 2028-04-24.
    expect(phaseWhenText(phase, 365, '2028-02-08')).toBe('Days 21 to 76 (56 days; 2028-02-29 to 2028-04-24)');
    expect(phaseWhenText({ ...phase, fromDay: 0, toDay: 365 }, 365, '2028-02-08')).toBe('Whole horizon (days 0 to 364; 2028-02-08 to 2029-02-06)');
    expect(phaseWhenText({ ...phase, toDay: 22 }, 365, '2028-02-08')).toBe('Day 21 only (2028-02-29)');
    expect(phaseWhenText(phase, 365)).toBe('Days 21 to 76 (56 days)');
  });
});

describe('phase outcomes with the scenario start date', () => {
  it('put the date beside the day R under a phase is read and the day a trigger first acts', () => {
    const { scenario } = demo();
    const dated = { ...scenario, startDate: '2028-02-08' };
    const results = runScenario(dated);
    const k = dated.options.findIndex((o) => o.name === 'Schools closed 8 weeks');
    const summary = optionSummary(dated.options[k], dated, false, results.options[k]);
    // Day 21 after 2028-02-08 is the leap day.
    expect(summary.phases[0].when).toBe('Days 21 to 76 (56 days; 2028-02-29 to 2028-04-24)');
    expect(summary.phases[0].r).toMatch(/^R \d\.\d\d on day 21 \(2028-02-29\), /);
    expect(triggerFiredText({ phase: 0, switchesOn: 2, firstOnDay: 30, daysInForce: 40 } as never, '2027-12-31')).toBe('came into force 2 times, first on day 30 (2028-01-30), in force 40 days in all');
    expect(triggerFiredText({ phase: 0, switchesOn: 1, firstOnDay: 30, daysInForce: 1 } as never)).toBe('came into force once, first on day 30, in force 1 day in all');
    const board = outcomeText(outcome('rUnderMeasures'), results.options[k], results, 'screen');
    expect(board).toMatch(/^from day 21 \(2028-02-29\): \d\.\d\d \(\d\.\d\d\)$/);
  });
});

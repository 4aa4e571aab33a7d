import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/index.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { phaseSpans, thresholdLines, unchartedTriggers } from '../../src/renderer/lib/triggerMarks.ts';
import { demoScenario } from '../helpers/demo.ts';

function withTriggered(): Scenario {
  const demo = demoScenario();
  return {
    ...demo,
    options: [
      {
        name: 'When ICU fills',
        description: '',
        phases: [
          { fromDay: 10, toDay: 40, settingMultipliers: { other: 0.8 }, ageFactors: [], caseIsolation: 0 },
          { fromDay: 0, toDay: 365, trigger: { quantity: 'icuOccupancy', onAbove: 80, offBelow: 40, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { school: 0 }, ageFactors: [], caseIsolation: 0 },
          { fromDay: 0, toDay: 365, trigger: { quantity: 'dailyInfectionsPer100k', onAbove: 500, offBelow: 100, minimumDaysOn: 0, lagDays: 0 }, settingMultipliers: { work: 0.5 }, ageFactors: [], caseIsolation: 0 },
        ],
      },
    ],
  };
}

describe('trigger marks on the curves', () => {
  const scenario = withTriggered();
  const result = runScenario(scenario).options[0];
  const option = scenario.options[0];

  it('shades a fixed phase over its days and a triggered phase where the run had it in force', () => {
    const spans = phaseSpans(option, result);
    expect(spans[0]).toMatchObject({ fromDay: 10, toDay: 40, label: 'When ICU fills · phase 1' });
    const triggered = spans.filter((s) => s.label === 'When ICU fills · phase 2 (triggered)');
    expect(triggered.map((s) => [s.fromDay, s.toDay])).toEqual(result.triggers[0].periods.map((p) => [p.fromDay, p.toDay]));
    expect(triggered.length).toBeGreaterThan(0);
    expect(phaseSpans(option, null).filter((s) => s.label.endsWith('(triggered)'))).toEqual([]);
  });

  it('draws thresholds on the chart of the watched quantity, in its unit', () => {
    expect(thresholdLines(option, 'icuOccupancy', 1e6).map((l) => l.y)).toEqual([80, 40]);
    const total = scenario.populationPersons.reduce((a, b) => a + b, 0);
    expect(thresholdLines(option, 'incidence', total).map((l) => l.y)).toEqual([(500 * total) / 1e5, (100 * total) / 1e5]);
    expect(thresholdLines(option, 'prevalence', total)).toEqual([]);
    expect(unchartedTriggers(option)).toEqual([]);
    expect(unchartedTriggers({ ...option, phases: [{ ...option.phases[1], trigger: { ...option.phases[1].trigger!, quantity: 'infectiousPer100k' } }] })).toEqual(['infectiousPer100k']);
  });
});

/**
 * R under each phase's measures (rByPhase.ts) and the contacts measures remove (measureBurden.ts).
 */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario, ScenarioInput } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';
import { twoBand, valid } from '../helpers/scenarios.ts';

function withOptions(s: Scenario, options: ScenarioInput['options']): Scenario {
  return valid({ ...(s as unknown as ScenarioInput), options, referenceOption: undefined, vaccinationCampaigns: [] });
}

describe('R under each phase', () => {
  it('two-band worked example: halving all contacts halves R0 = 2.1 (Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873)', () => {
    // K = [[1.8, 0.3], [0.9, 1.2]] (shared/CHECKS.md item 6): rho = 1.5 + sqrt(0.09 + 0.27) = 2.1, linear in the contacts.
    const s = withOptions(twoBand({ horizon: 200 }), [{ name: 'half', phases: [{ fromDay: 0, toDay: 200, settingMultipliers: { all: 0.5 } }] }]);
    const [phase] = runScenario(s).options[0].rByPhase;
    expect(phase.rMeasuresOnly).toBeCloseTo(1.05, 9);
    // On day 0 the susceptibles are N minus the seeds (1e-6 and 3e-6 persons): R barely differs.
    expect(phase.rAtPhaseStart).toBeCloseTo(1.05, 6);
    expect(phase.startDay).toBe(0);
  });

  it('a phase starting later sees the susceptibles of its start day, as R(t) does on that day', () => {
    const demo = demoScenario();
    const results = runScenario(withOptions(demo, [demo.options[1]]));
    const o = results.options[0];
    const [phase] = o.rByPhase;
    expect(phase.fromDay).toBe(21);
    // R(t) on day 21 runs under the same (only) phase and the same susceptibles.
    expect(Math.abs(phase.rAtPhaseStart - o.series.rt[21])).toBeLessThan(1e-6 * phase.rAtPhaseStart);
    expect(phase.rAtPhaseStart).toBeLessThan(phase.rMeasuresOnly);
    // Schools shut (and 20% more home contacts) at full susceptibility: below R0, and not the same as R at day 0.
    expect(phase.rMeasuresOnly).toBeLessThan(results.r0);
    expect(Math.abs(o.rStart - results.r0)).toBeLessThan(0.01 * results.r0);
  });

  it('a triggered phase starts where its trigger first fires', () => {
    const demo = demoScenario();
    const o = runScenario(
      withOptions(demo, [
        { name: 'when', phases: [{ fromDay: 0, toDay: 365, trigger: { quantity: 'icuOccupancy', onAbove: 30, offBelow: 10 }, settingMultipliers: { school: 0 } }] },
      ]),
    ).options[0];
    const first = o.triggers[0].firstOnDay!;
    expect(o.rByPhase[0].startDay).toBe(first);
    expect(Math.abs(o.rByPhase[0].rAtPhaseStart - o.series.rt[first])).toBeLessThan(1e-6 * o.series.rt[first]);
  });
});

describe('contacts removed by measures', () => {
  const demo = demoScenario();
  const usual = (setting: string): number => {
    const st = demo.settings.find((x) => x.name === setting)!;
    const N = demo.populationPersons;
    const total = N.reduce((a, b) => a + b, 0);
    return st.contactsPerDay.reduce((acc, row, i) => acc + N[i] * row.reduce((a, b) => a + b, 0), 0) / total;
  };

  it('schools shut for 56 days: 56 full-closure days of school contacts, home contacts up 20% for 56 days', () => {
    const o = runScenario(withOptions(demo, [demo.options[1]])).options[0];
    expect(o.measureBurden.daysUnderMeasures).toBe(56);
    expect(o.measureBurden.fullClosureDays.school).toBeCloseTo(56, 9);
    expect(o.measureBurden.contactDaysRemovedPerPerson.school).toBeCloseTo(56 * usual('school'), 9);
    expect(o.measureBurden.fullClosureDays.home).toBeCloseTo(-0.2 * 56, 9);
    expect(o.measureBurden.fullClosureDays.work).toBe(0);
  });

  it('shielding the two oldest bands at work: removed contacts follow the smaller-factor rule, written out here', () => {
    const o = runScenario(withOptions(demo, [demo.options[3]])).options[0];
    const work = demo.settings.find((x) => x.name === 'work')!;
    const N = demo.populationPersons;
    const total = N.reduce((a, b) => a + b, 0);
    const f = (i: number) => (i === 14 || i === 15 ? 0.25 : 1);
    let removedPerDay = 0;
    work.contactsPerDay.forEach((row, i) => row.forEach((c, j) => (removedPerDay += (N[i] * c * (1 - Math.min(f(i), f(j)))) / total)));
    expect(o.measureBurden.contactDaysRemovedPerPerson.work).toBeCloseTo(365 * removedPerDay, 8);
    expect(o.measureBurden.fullClosureDays.school).toBe(0);
  });

  it('a triggered phase counts only the days it was in force; with a fixed phase under it, the two combine', () => {
    const o = runScenario(
      withOptions(demo, [
        {
          name: 'when',
          phases: [
            { fromDay: 0, toDay: 30, settingMultipliers: { work: 0.5 } },
            { fromDay: 0, toDay: 365, trigger: { quantity: 'icuOccupancy', onAbove: 30, offBelow: 10 }, settingMultipliers: { work: 0.5, school: 0 } },
          ],
        },
      ]),
    ).options[0];
    const inForce = o.triggers[0].daysInForce;
    expect(inForce).toBeGreaterThan(0);
    expect(o.measureBurden.fullClosureDays.school).toBeCloseTo(inForce, 9);
    const overlap = o.triggers[0].periods.reduce((acc, p) => acc + Math.max(0, Math.min(30, p.toDay) - p.fromDay), 0);
    // work: 0.5 alone, 0.25 when both are in force
    expect(o.measureBurden.fullClosureDays.work).toBeCloseTo(0.5 * (30 - overlap) + 0.5 * (inForce - overlap) + 0.75 * overlap, 9);
    expect(o.daysUnderMeasures).toBe(o.measureBurden.daysUnderMeasures);
  });
});

/**
 * `mixwise run --format json` with triggered measures: per option `triggers`, `daysUnderMeasures`,
 * `rByPhase` and `measureBurden` (issues 14 and 16), the engine's numbers as they are.
 */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/index.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { demoJson, runCli, writeTemp } from './helpers.ts';

describe('mixwise run with a triggered option', () => {
  const scenario = demoJson();
  scenario.options.push({
    name: 'Close schools when ICU fills',
    phases: [
      { fromDay: 0, toDay: 365, trigger: { quantity: 'icuOccupancy', onAbove: 80, offBelow: 40, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { school: 0, work: 0.6 } },
    ],
  });
  const path = writeTemp('triggered.json', scenario);
  const { code, stdout, stderr } = runCli('run', path, '--format', 'json');
  const report = JSON.parse(stdout);
  const v = validateScenario(scenario);
  if (!v.ok) throw new Error('scenario must be valid');
  const engine = runScenario(v.scenario).options[5];

  it('reports what the trigger did, with the engine\'s numbers', () => {
    expect(code).toBe(0);
    expect(stderr).toBe('');
    const o = report.options[5];
    expect(o.triggers).toHaveLength(1);
    expect(Object.keys(o.triggers[0])).toEqual(expect.arrayContaining(['phase', 'quantity', 'switchesOn', 'firstOnDay', 'daysInForce']));
    expect(o.triggers[0]).toMatchObject({ phase: 0, quantity: 'icuOccupancy', switchesOn: engine.triggers[0].switchesOn, firstOnDay: engine.triggers[0].firstOnDay, daysInForce: engine.triggers[0].daysInForce });
    expect(o.triggers[0].switchesOn).toBeGreaterThanOrEqual(1);
    expect(o.daysUnderMeasures).toBe(engine.daysUnderMeasures);
    expect(o.switchesOn).toBe(engine.triggers[0].switchesOn);
  });

  it('gives R by phase and the contacts removed by setting', () => {
    const o = report.options[1];
    expect(o.rByPhase).toHaveLength(1);
    expect(Object.keys(o.rByPhase[0])).toEqual(expect.arrayContaining(['fromDay', 'toDay', 'rAtPhaseStart', 'rMeasuresOnly']));
    expect(o.measureBurden.daysUnderMeasures).toBe(56);
    expect(Object.keys(o.measureBurden.contactDaysRemovedPerPerson)).toEqual(['home', 'school', 'work', 'other']);
    expect(report.options[0].rByPhase).toEqual([]);
    expect(report.options[0].triggers).toEqual([]);
    expect(report.options[0].daysUnderMeasures).toBe(0);
  });
});

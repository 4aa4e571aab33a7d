/** The catalogue of outcomes: every entry reads the engine's numbers and is written the same way everywhere. */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/index.ts';
import { BAND_OUTCOMES, NOT_APPLICABLE, OUTCOMES, appliesTo, outcome, outcomeText, outcomesFor, REFERENCE_CELL } from '../../src/report/outcomes.ts';
import { demo } from './helpers.ts';

describe('catalogue of outcomes', () => {
  const { scenario, results } = demo();

  it('has unique keys and CSV columns, camelCase keys and snake_case columns', () => {
    const keys = OUTCOMES.map((e) => e.key);
    const columns = OUTCOMES.map((e) => e.column);
    expect(new Set(keys).size).toBe(keys.length);
    expect(new Set(columns).size).toBe(columns.length);
    for (const e of OUTCOMES) {
      expect(e.key).toMatch(/^[a-z][A-Za-z0-9]*$/);
      expect(e.column).toMatch(/^[a-z][a-z0-9_]*$/);
      if (e.shadeBy !== undefined) expect(outcome(e.shadeBy).lowerIsBetter).not.toBeNull();
    }
  });

  it('every entry reads a finite value from the demo results for some option it applies to', () => {
    // The demo plus one option strict enough to shrink, so halving time has a value too.
    const strict = { name: 'Strict', description: '', phases: [{ fromDay: 0, toDay: scenario.horizonDays, settingMultipliers: { home: 0.3, school: 0, work: 0.1, other: 0.1 }, ageFactors: [], caseIsolation: 0 }] };
    // And one whose measures are switched by a trigger, for the trigger outcomes.
    const triggered = {
      name: 'When ICU fills',
      description: '',
      phases: [
        { fromDay: 0, toDay: scenario.horizonDays, trigger: { quantity: 'icuOccupancy' as const, onAbove: 50, offBelow: 20, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { school: 0 }, ageFactors: [], caseIsolation: 0 },
      ],
    };
    const results = runScenario({ ...scenario, options: [...scenario.options, strict, triggered] });
    for (const e of OUTCOMES) {
      const values = results.options.filter((o) => appliesTo(e, o)).map((o) => e.read(o, results));
      expect(values.some((v) => v !== null && Number.isFinite(v)), e.key).toBe(true);
    }
    for (const b of BAND_OUTCOMES) {
      for (const o of results.options) {
        const values = b.read(o, results);
        expect(values, b.key).toHaveLength(results.ageBands.length);
        expect(values.every(Number.isFinite), b.key).toBe(true);
      }
    }
  });

  it('reads null where an outcome does not apply, and says so in the cell', () => {
    const withoutHospital = { ...scenario, healthcare: undefined };
    const plain = runScenario(withoutHospital);
    expect(outcomesFor(plain).some((e) => e.group === 'hospital')).toBe(false);
    const admissions = outcome('admissions');
    expect(admissions.read(plain.options[0], plain)).toBeNull();
    expect(outcomeText(admissions, plain.options[0], plain, 'screen')).toBe(NOT_APPLICABLE.screen);
    expect(outcomeText(admissions, plain.options[0], plain, 'print')).toBe(NOT_APPLICABLE.print);
    const noCampaign = results.options.find((o) => o.vaccination === null)!;
    expect(outcome('doses').read(noCampaign, results)).toBeNull();
  });

  it('takes averted numbers and the reference from the engine', () => {
    const ref = results.options[results.referenceIndex];
    const other = results.options.find((o) => o !== ref)!;
    const deathsAverted = outcome('deathsAverted');
    expect(deathsAverted.read(other, results)).toBe(other.comparison!.deathsAverted);
    expect(outcomeText(deathsAverted, ref, results, 'print')).toBe(REFERENCE_CELL);
    expect(outcomeText(deathsAverted, other, results, 'print')).not.toBe(REFERENCE_CELL);
  });

  it('writes units on screen: infections carry "persons", beds carry "beds"', () => {
    const o = results.options[0];
    expect(outcomeText(outcome('infections'), o, results, 'screen')).toMatch(/ persons$/);
    expect(outcomeText(outcome('peakIcuOccupancy'), o, results, 'screen')).toMatch(/ beds$/);
    expect(outcomeText(outcome('infections'), o, results, 'print')).toMatch(/^[\d,]+$/);
  });
});

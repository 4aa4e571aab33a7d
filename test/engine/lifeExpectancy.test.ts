/** Years of life lost: life-table interpolation, band mid-ages, the scenario's own table and its validation. */
import { describe, expect, it } from 'vitest';
import { bandMidAges, DEFAULT_LIFE_TABLE, remainingLifeExpectancyAt } from '../../src/engine/lifeExpectancy.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { ScenarioInput } from '../../src/engine/scenario.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { twoBand } from '../helpers/scenarios.ts';

const table = { rows: [{ ageYears: 0, remainingYears: 80 }, { ageYears: 10, remainingYears: 70 }, { ageYears: 50, remainingYears: 30 }], source: 'test table' };

describe('remaining life expectancy', () => {
  it('interpolates linearly between rows and stays flat beyond the ends', () => {
    expect(remainingLifeExpectancyAt(table, 5)).toBeCloseTo(75, 12);
    expect(remainingLifeExpectancyAt(table, 40)).toBeCloseTo(40, 12);
    expect(remainingLifeExpectancyAt(table, 0)).toBe(80);
    expect(remainingLifeExpectancyAt(table, 90)).toBe(30);
  });

  it('takes mid-ages of bands, the open last band as wide as the one before', () => {
    expect(bandMidAges([0, 5, 15, 75])).toEqual([2.5, 10, 45, 105]);
    expect(bandMidAges([30])).toEqual([30]);
  });

  it('has a default table whose ages increase and whose values fall with age after infancy', () => {
    const rows = DEFAULT_LIFE_TABLE.rows;
    for (let k = 1; k < rows.length; k++) {
      expect(rows[k].ageYears).toBeGreaterThan(rows[k - 1].ageYears);
      expect(rows[k].remainingYears).toBeLessThan(rows[k - 1].remainingYears);
    }
  });
});

describe('years of life lost of an option', () => {
  it('is deaths by band times remaining life expectancy at the band mid-age', () => {
    // Bands start at 0 and 18: mid-ages 9 and 27 (the open band as wide as the one before).
    const s = { ...twoBand(), lifeTable: table };
    const o = runScenario(s).options[0];
    const e = [remainingLifeExpectancyAt(table, 9), remainingLifeExpectancyAt(table, 27)];
    expect(e[0]).toBeCloseTo(71, 12);
    expect(e[1]).toBeCloseTo(70 - (17 / 40) * 40, 12);
    expect(o.yearsOfLifeLostByBand[0]).toBeCloseTo(o.deathsByBand[0] * e[0], 9);
    expect(o.yearsOfLifeLost).toBeCloseTo(o.deathsByBand[0] * e[0] + o.deathsByBand[1] * e[1], 9);
  });

  it('uses the default reference table when the scenario has none', () => {
    const o = runScenario(twoBand()).options[0];
    expect(o.yearsOfLifeLostByBand[1]).toBeCloseTo(o.deathsByBand[1] * remainingLifeExpectancyAt(DEFAULT_LIFE_TABLE, 27), 9);
  });

  it('rejects a table whose ages do not increase, naming the row', () => {
    const input = { ...twoBand(), lifeTable: { rows: [{ ageYears: 0, remainingYears: 80 }, { ageYears: 0, remainingYears: 70 }], source: 'x' } } as ScenarioInput;
    const r = validateScenario(input);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toContainEqual({ path: 'lifeTable.rows[1].ageYears', rule: 'must be greater than the row before (0)', value: '0' });
  });

  it('rejects a table without a source and negative years, with JSON paths', () => {
    const input = { ...twoBand(), lifeTable: { rows: [{ ageYears: 0, remainingYears: -1 }], source: '' } } as ScenarioInput;
    const r = validateScenario(input);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      const paths = r.problems.map((p) => p.path);
      expect(paths).toContain('lifeTable.rows[0].remainingYears');
      expect(paths).toContain('lifeTable.source');
    }
  });
});

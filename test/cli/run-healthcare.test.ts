/**
 * `mixwise run --format json`: the hospital fields of issue 4 per option, carried unchanged from
 * the engine, and null when the scenario has no `healthcare` section.
 */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/index.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { DEMO, demoJson, runCli, writeTemp } from './helpers.ts';

const FIELDS = ['peakWardOccupancy', 'peakIcuOccupancy', 'peakIcuDay', 'daysIcuOverCapacity', 'admissions'];

describe('mixwise run --format json, hospital demand', () => {
  it('adds peak ward and ICU occupancy, the ICU peak day, ICU days over capacity and admissions per option', () => {
    const { code, stdout } = runCli('run', DEMO, '--format', 'json');
    expect(code).toBe(0);
    const report = JSON.parse(stdout);
    const v = validateScenario(demoJson());
    if (!v.ok) throw new Error('demo scenario must be valid');
    const results = runScenario(v.scenario);
    results.options.forEach((o, k) => {
      const row = report.options[k];
      expect(Object.keys(row)).toEqual(expect.arrayContaining(FIELDS));
      const h = o.healthcare!;
      expect(row.peakWardOccupancy).toBe(h.ward.peakOccupancy);
      expect(row.peakIcuOccupancy).toBe(h.icu.peakOccupancy);
      expect(row.peakIcuDay).toBe(h.icu.peakDay);
      expect(row.daysIcuOverCapacity).toBe(h.icu.daysOverCapacity);
      expect(row.admissions).toBe(h.admissions);
      expect(row.admissions).toBeGreaterThan(0);
      expect(Number.isInteger(row.peakIcuDay)).toBe(true);
    });
  });

  it('writes null for them when the scenario has no healthcare section', () => {
    const { healthcare: _dropped, ...scenario } = demoJson();
    const { code, stdout } = runCli('run', writeTemp('no-beds.json', scenario), '--format', 'json');
    expect(code).toBe(0);
    for (const row of JSON.parse(stdout).options) for (const field of FIELDS) expect(row).toHaveProperty(field, null);
  });
});

/** Calendar dates: a scenario's optional start date puts dates beside day numbers in every output. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatProblem } from '../../src/engine/problems.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { dateOfDay, dayAxisTitle, formatValue } from '../../src/report/numberFormat.ts';
import { curveCharts } from '../../src/report/charts.ts';
import { runScenario } from '../../src/engine/index.ts';
import { demoJson, runCli, writeTemp } from './helpers.ts';

const dated = (startDate: string) => writeTemp('dated.json', { ...demoJson(), startDate });

describe('dateOfDay', () => {
  it('counts across month, year and leap-year boundaries', () => {
    expect(dateOfDay('2028-02-28', 1)).toBe('2028-02-29');
    expect(dateOfDay('2028-02-28', 2)).toBe('2028-03-01');
    expect(dateOfDay('2027-02-28', 1)).toBe('2027-03-01');
    expect(dateOfDay('2027-12-31', 1)).toBe('2028-01-01');
    expect(dateOfDay('2028-01-01', 366)).toBe('2029-01-01');
    expect(dateOfDay('2028-03-01', 0)).toBe('2028-03-01');
  });

  it('writes a day with its date in both styles once the start date is known', () => {
    expect(formatValue({ kind: 'day' }, 45, 'screen', { startDate: '2026-03-01' })).toBe('day 45 (2026-04-15)');
    expect(formatValue({ kind: 'day' }, 45, 'print', { startDate: '2026-03-01' })).toBe('45 (2026-04-15)');
    expect(formatValue({ kind: 'day' }, 45, 'print')).toBe('45');
  });
});

describe('startDate in the scenario', () => {
  it('is refused unless it is a real calendar date, naming the field', () => {
    for (const bad of ['2026-02-30', '1/3/2026', '2026-3-1']) {
      const r = validateScenario({ ...demoJson(), startDate: bad });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.problems.map(formatProblem)).toEqual([`startDate must be a calendar date written YYYY-MM-DD, got "${bad}"`]);
    }
    expect(validateScenario({ ...demoJson(), startDate: '2028-02-29' }).ok).toBe(true);
  });

  it('titles the day axis of the report\'s curves with the date of day 0', () => {
    const checked = validateScenario({ ...demoJson(), startDate: '2028-02-08' });
    if (!checked.ok) throw new Error('demo with a start date is not valid');
    const charts = curveCharts(runScenario(checked.scenario));
    expect(charts.length).toBeGreaterThan(1);
    for (const chart of charts) expect(chart.svg).toContain('Day (day 0 = 2028-02-08)');
    expect(dayAxisTitle('Day', undefined)).toBe('Day');
  });

  it('is a full-date in the JSON Schema (format "date" and its pattern)', () => {
    const schema = JSON.parse(readFileSync(new URL('../../docs/scenario.schema.json', import.meta.url), 'utf8'));
    const startDate = schema.properties.startDate;
    expect(startDate).toMatchObject({ type: 'string', format: 'date' });
    const pattern = new RegExp(startDate.pattern);
    expect(['2028-02-29', '2026-03-01'].every((d) => pattern.test(d))).toBe(true);
    expect(['2026-3-1', '1/3/2026', '2026-03-01T00:00'].some((d) => pattern.test(d))).toBe(false);
  });

  it('gives peakDate = startDate + peakDay in the JSON, and null without a start date', () => {
    const json = JSON.parse(runCli('run', dated('2028-02-10'), '--format', 'json').stdout);
    expect(json.startDate).toBe('2028-02-10');
    for (const o of json.options) expect(o.peakDate).toBe(dateOfDay('2028-02-10', o.peakDay));
    // The demo peaks weeks after day 0, so the peak date crosses the leap day.
    expect(json.options[0].peakDay).toBeGreaterThan(19);
    const plain = JSON.parse(runCli('run', writeTemp('plain.json', demoJson()), '--format', 'json').stdout);
    expect(plain.startDate).toBeNull();
    expect(plain.options.every((o: { peakDate: unknown }) => o.peakDate === null)).toBe(true);
  });

  it('shows dates beside peak days in the table and Markdown, and a peak_date column in the CSV', () => {
    const path = dated('2026-03-01');
    const json = JSON.parse(runCli('run', path, '--format', 'json').stdout);
    const peak = `${json.options[0].peakDay} (${json.options[0].peakDate})`;
    expect(runCli('run', path, '--format', 'table').stdout).toContain(peak);
    expect(runCli('run', path, '--format', 'md').stdout).toContain(peak);
    const lines = runCli('run', path, '--format', 'csv').stdout.trimEnd().split('\r\n').filter((l) => !l.startsWith('#'));
    const header = lines[0].split(',');
    expect(lines[1].split(',')[header.indexOf('peak_date')]).toBe(json.options[0].peakDate);
    const plainCsv = runCli('run', writeTemp('plain.json', demoJson()), '--format', 'csv').stdout;
    expect(plainCsv).not.toContain('peak_date');
  });
});

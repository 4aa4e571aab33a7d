/**
 * The one fit pipeline (fitCaseCounts): `mixwise fit` and the app's panel (computeFit) give the
 * same numbers; the count model moves to negative binomial on overdispersed counts unless named;
 * dated counts are placed on the scenario's days when it has a start date.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fitCaseCounts, parseCaseCountsCsv, placeOnScenarioDays, validateScenario, type CaseSeries, type Scenario } from '../../../src/engine/index.ts';
import { computeFit } from '../../../src/renderer/lib/fitFromCounts.ts';
import { fitWindowText } from '../../../src/report/fitRecord.ts';
import { DEMO, ROOT, demoJson, runCli, writeTemp } from '../../cli/helpers.ts';

const CASES = join(ROOT, 'resources/example-cases.csv');

function seriesOf(text: string): CaseSeries {
  const parsed = parseCaseCountsCsv(text);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.problems));
  return parsed.series;
}

function scenarioOf(json: Record<string, unknown>): Scenario {
  const checked = validateScenario(json);
  if (!checked.ok) throw new Error(JSON.stringify(checked.problems));
  return checked.scenario;
}

const example = () => seriesOf(readFileSync(CASES, 'utf8'));
const cliJson = (...args: string[]) => {
  const run = runCli('fit', ...args, '--format', 'json');
  expect(run.stderr).toBe('');
  return JSON.parse(run.stdout);
};

/** Daily counts `first` days from `date0`, growing by 8% a day with a weekly bump (deterministic). */
function datedCsv(date0: string, days: number): string {
  const start = Date.parse(`${date0}T00:00:00Z`);
  const rows = Array.from({ length: days }, (_, d) => `${new Date(start + d * 86_400_000).toISOString().slice(0, 10)},${Math.round(5 * Math.exp(0.08 * d)) + (d % 7 === 3 ? 4 : 0)}`);
  return `date,count\n${rows.join('\n')}\n`;
}

describe('one fit for the command line and the app', () => {
  it('gives the same r, R0 and intervals, count model and record window, for a window and a measures option', () => {
    const scenario = scenarioOf(demoJson());
    for (const family of ['auto', 'poisson', 'negativeBinomial'] as const) {
      const flags = family === 'auto' ? [] : ['--family', family === 'poisson' ? 'poisson' : 'negative-binomial'];
      const cli = cliJson(CASES, '--scenario', DEMO, '--from', '4', '--to', '30', '--measures-option', 'Work contacts halved', ...flags);
      const app = computeFit({ series: example(), fileName: 'example-cases.csv', fromDay: 4, toDay: 30, family, dayOfWeek: false, measuresOption: 'Work contacts halved', scenario });
      if (!app.ok) throw new Error(app.problems.join('; '));
      expect(cli.family).toBe(app.value.fit.family);
      expect(cli.growthRatePerDay).toBe(app.value.fit.growthRatePerDay);
      expect(cli.growthRateInterval).toEqual(app.value.fit.growthRateInterval);
      expect(cli.r0).toBe(app.value.r0.r0);
      expect(cli.r0Interval).toEqual(app.value.r0.r0Interval);
      expect(cli.measuresRatio).toBe(app.value.r0.measuresRatio);
      expect(cli.window).toMatchObject({ fromDay: app.value.record.window.fromDay, toDay: app.value.record.window.toDay, fromDate: app.value.record.window.fromDate });
    }
  });

  it('fits overdispersed counts negative-binomially and says so, unless the count model is named', () => {
    const auto = cliJson(CASES, '--scenario', DEMO);
    expect(auto.family).toBe('negativeBinomial');
    expect(auto.dispersion.pearsonRatio).toBeGreaterThan(1.5);
    expect(auto.notes.some((n: string) => n.includes('vary more than Poisson allows') && n.includes('--family poisson'))).toBe(true);
    const poisson = cliJson(CASES, '--scenario', DEMO, '--family', 'poisson');
    expect(poisson.family).toBe('poisson');
    expect(poisson.notes.some((n: string) => n.includes('vary more than Poisson'))).toBe(false);
    expect(runCli('fit', CASES, '--scenario', DEMO).stdout).toMatch(/^Growth-rate fit of .*negative-binomial counts$/m);
  });

  it('keeps Poisson for counts that are not overdispersed', () => {
    const exact = writeTemp('cases.csv', `day,count\n${Array.from({ length: 20 }, (_, d) => `${d},${Math.round(20 * Math.exp(0.05 * d))}`).join('\n')}\n`);
    const json = cliJson(exact, '--scenario', DEMO);
    expect(json.dispersion.pearsonRatio).toBeLessThan(1.5);
    expect(json.family).toBe('poisson');
  });
});

describe('dated counts on the scenario days', () => {
  it('places counts at date − startDate across a leap day and month ends, and the growth rate does not move', () => {
    const text = datedCsv('2028-02-27', 21);
    // 2028 is a leap year: 2028-01-31 + 27 = 2028-02-27, and the file's last date 2028-03-18 is day 47
    // (27 + 2 + 18: 29 February counts); from 2027-12-31 the first date is day 31 + 27 = 58.
    const cases = [
      { start: '2028-01-31', shift: 27, lastDate: '2028-03-18', lastDay: 47 },
      { start: '2027-12-31', shift: 58, lastDate: '2028-03-18', lastDay: 78 },
      { start: '2028-02-27', shift: 0, lastDate: '2028-03-18', lastDay: 20 },
    ];
    const plain = fitCaseCounts({ series: seriesOf(text), scenario: scenarioOf(demoJson()), sourceFile: 'c.csv', family: 'poisson' });
    if (!plain.ok) throw new Error(plain.problems.join('; '));
    expect(plain.value.placement.origin).toBe('firstDateInFile');
    for (const c of cases) {
      const scenario = scenarioOf({ ...demoJson(), startDate: c.start });
      const placed = fitCaseCounts({ series: seriesOf(text), scenario, sourceFile: 'c.csv', family: 'poisson' });
      if (!placed.ok) throw new Error(placed.problems.join('; '));
      const v = placed.value;
      expect(v.placement).toMatchObject({ origin: 'scenarioStartDate', dayZeroDate: c.start, shiftDays: c.shift });
      expect(v.counts.day[0]).toBe(c.shift);
      expect(v.fit.toDay).toBe(c.lastDay);
      expect(v.record.window).toMatchObject({ fromDay: c.shift, toDay: c.lastDay, fromDate: '2028-02-27', toDate: c.lastDate, dayOrigin: 'scenarioStartDate' });
      expect(fitWindowText(v.record)).toContain(`2028-02-27 to ${c.lastDate} (scenario days ${c.shift} to ${c.lastDay})`);
      expect(v.fit.growthRatePerDay).toBeCloseTo(plain.value.fit.growthRatePerDay, 9);
    }
  });

  it('reads window dates against the start date, on the command line too', () => {
    const cases = writeTemp('cases.csv', datedCsv('2027-02-26', 30));
    const scenario = writeTemp('s.json', { ...demoJson(), startDate: '2027-02-01' });
    // Not a leap year: 2027-02-01 + 28 = 2027-03-01.
    const json = cliJson(cases, '--scenario', scenario, '--from', '2027-03-01', '--to', '2027-03-20');
    expect(json.window).toMatchObject({ fromDay: 28, toDay: 47, startDate: '2027-02-01', dayOrigin: 'scenarioStartDate', fromDate: '2027-03-01', toDate: '2027-03-20' });
    expect(json.notes[0]).toBe("Counts are placed on the scenario's days (day 0 = 2027-02-01); the file's first date 2027-02-26 is day 25.");
  });

  it('looks up the measures in force on the scenario day the window starts', () => {
    // The example counts start 2031-03-03; with the start date 2031-02-10 that is day 21, the first day of the school closure.
    const withDate = cliJson(CASES, '--scenario', writeTemp('s.json', { ...demoJson(), startDate: '2031-02-10' }), '--measures-option', 'Schools closed 8 weeks');
    expect(withDate.measures).toMatchObject({ day: 21, phase: { fromDay: 21, toDay: 77 } });
    expect(withDate.measuresRatio).toBeLessThan(1);
    const without = cliJson(CASES, '--scenario', DEMO, '--measures-option', 'Schools closed 8 weeks');
    expect(without.measures).toMatchObject({ day: 0, phase: null });
  });

  it('refuses counts dated before the start date with one line naming the CSV line and the date', () => {
    const text = datedCsv('2028-02-27', 10);
    const refused = placeOnScenarioDays(seriesOf(text), '2028-03-01');
    expect(refused.ok).toBe(false);
    const cases = writeTemp('cases.csv', text);
    const scenario = writeTemp('s.json', { ...demoJson(), startDate: '2028-03-01' });
    const run = runCli('fit', cases, '--scenario', scenario);
    expect(run.code).toBe(2);
    // 2028-02-27, 28 and 29 are lines 2 to 4.
    expect(run.stderr).toBe(
      `mixwise: ${cases}: line 2, column "date": is before the scenario's start date 2028-03-01, so it has no scenario day; lines 2 to 4 are (3 rows); drop those rows or set an earlier start date, got "2028-02-27"\n`,
    );
    const oneRow = runCli('fit', writeTemp('cases.csv', datedCsv('2028-02-29', 10)), '--scenario', scenario);
    expect(oneRow.stderr).toContain('line 2, column "date": is before the scenario\'s start date 2028-03-01, so it has no scenario day; drop those rows');
    expect(oneRow.stderr).toContain('got "2028-02-29"');
  });

  it('takes day numbers as the scenario days, and a window date needs a day 0 with a date', () => {
    const days = writeTemp('cases.csv', `day,count\n${Array.from({ length: 15 }, (_, d) => `${d + 3},${10 + 2 * d}`).join('\n')}\n`);
    const dated = cliJson(days, '--scenario', writeTemp('s.json', { ...demoJson(), startDate: '2026-12-30' }), '--from', '2027-01-02');
    expect(dated.window).toMatchObject({ fromDay: 3, startDate: '2026-12-30', dayOrigin: 'fileDayNumbers', fromDate: '2027-01-02' });
    const undated = runCli('fit', days, '--scenario', DEMO, '--from', '2027-01-02');
    expect(undated.code).toBe(1);
    expect(undated.stderr).toContain('--from must be a day number: the counts file gives day numbers and the scenario has no start date');
  });
});

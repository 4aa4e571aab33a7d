/**
 * An end of the profile interval that cannot be found within the work budget (fitBudget.ts) is
 * reported as not determined, with a one-line reason, by the engine, `mixwise fit` (table and
 * JSON) and the fit record: never a hang, never NaN. The budget of each end's refits is cut to 4
 * likelihood evaluations here (a warm refit needs about 50), so that no refit at a profile point settles.
 */
import { describe, expect, it, vi } from 'vitest';
import { fitGrowth } from '../../../src/engine/fitting/fitGrowth.ts';
import { fitCaseCounts } from '../../../src/engine/fitting/fitCaseCounts.ts';
import { PROFILE_REFITS_PER_SIDE } from '../../../src/engine/fitting/fitBudget.ts';
import { profileLikelihoodInterval } from '../../../src/engine/fitting/profileInterval.ts';
import { DEMO, runCli, writeTemp } from '../../cli/helpers.ts';
import { demoScenario } from '../../helpers/demo.ts';
import { referenceSeries } from './referenceSeries.ts';

vi.mock('../../../src/engine/fitting/fitBudget.ts', async (importOriginal) => ({ ...(await importOriginal<object>()), PROFILE_EVALUATIONS_PER_SIDE: 4 }));

const series = referenceSeries().find((s) => s.name === '120 days, weekday pattern, alpha 0.5');
if (series === undefined) throw new Error('reference series missing');
const REASON = /^(lower|upper) end of the 95% interval for r not determined at r = -?[0-9.]+(e-?[0-9]+)? per day: the refits for this end used up their 4 likelihood evaluations$/;

/** Every number anywhere in `value`, with its path. */
function numbersIn(value: unknown, path = 'fit'): [string, number][] {
  if (typeof value === 'number') return [[path, value]];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => numbersIn(v, `${path}.${k}`));
}

describe('an interval end not determined within the work budget', () => {
  it('is left open with its reason in the fit and its notes, and nothing is NaN', () => {
    const result = fitGrowth({ day: series.day, count: series.count }, series.options);
    if (!result.ok) throw new Error(JSON.stringify(result.problems));
    const fit = result.fit;
    expect(fit.growthRateInterval).toEqual([-Infinity, Infinity]);
    const [lower, upper] = fit.growthRateIntervalNotDetermined;
    expect(lower).toMatch(REASON);
    expect(lower).toMatch(/^lower/);
    expect(upper).toMatch(/^upper/);
    expect(fit.notes).toContain(`The ${lower}; that end is left open.`);
    expect(fit.notes).toContain(`The ${upper}; that end is left open.`);
    expect(fit.notes.some((n) => n.includes('unbounded'))).toBe(false);
    // The estimate itself is the full fit's (its budget is untouched).
    expect(fit.growthRatePerDay).toBeCloseTo(0.016389301213986834, 8);
    expect(numbersIn(fit).filter(([, v]) => Number.isNaN(v))).toEqual([]);
  });

  it('reaches the fit record and R0 as open ends, with the reasons in the method notes', () => {
    const result = fitCaseCounts({ series: { rows: series.day.map((day, i) => ({ day, count: series.count[i], band: null, line: i + 2 })), startDate: null, hasBands: false }, scenario: demoScenario(), sourceFile: 'weekly.csv', family: 'negativeBinomial', dayOfWeek: true });
    if (!result.ok) throw new Error(result.problems.join('; '));
    const { record, r0 } = result.value;
    expect(record.growthRateInterval).toEqual([null, null]);
    expect(record.methodNotes.filter((n) => REASON.test(n.replace(/^The /, '').replace(/; that end is left open\.$/, '')))).toHaveLength(2);
    expect(numbersIn(r0).filter(([, v]) => Number.isNaN(v))).toEqual([]);
  });

  it('is printed as "not determined" by mixwise fit, with the reason as a note, and named in its JSON', () => {
    const csv = writeTemp('weekly.csv', `day,count\n${series.day.map((d, i) => `${d},${series.count[i]}`).join('\n')}\n`);
    const table = runCli('fit', csv, '--scenario', DEMO, '--family', 'negative-binomial', '--day-of-week');
    expect(table.code).toBe(0);
    expect(table.stdout).toMatch(/^Growth rate r: +0\.\d{4} per day \(95% interval not determined to not determined, profile likelihood\)$/m);
    expect(table.stdout).toMatch(/^note: The upper end of the 95% interval for r not determined at r = .* per day: the refits for this end used up their 4 likelihood evaluations; that end is left open\.$/m);
    const json = JSON.parse(runCli('fit', csv, '--scenario', DEMO, '--family', 'negative-binomial', '--day-of-week', '--format', 'json').stdout);
    expect(json.growthRateInterval).toEqual([null, null]);
    expect(json.growthRateIntervalNotDetermined[1]).toMatch(REASON);
  });
});

describe('profile interval search within its refit budget', () => {
  const words = { name: 'r', describe: (v: number) => `r = ${v}` };

  it('gives up on a side after 60 refits when the likelihood is too flat to leave the interval, and says so', () => {
    // D(v) = v² / 10³⁰: the 95% ends are at ±6e15, but the search steps out from a standard error of 1e-30.
    let refits = 0;
    const result = profileLikelihoodInterval(0, 0, 1e-30, (v) => (refits++, -0.5 * v * v * 1e-30), words);
    expect(PROFILE_REFITS_PER_SIDE).toBe(60);
    expect(result.interval).toEqual([-Infinity, Infinity]);
    expect(result.notDetermined).toEqual([
      'lower end of the 95% interval for r not found within 60 refits: the likelihood is too flat or too irregular there',
      'upper end of the 95% interval for r not found within 60 refits: the likelihood is too flat or too irregular there',
    ]);
    expect(refits).toBe(120);
    expect(result.refits).toBe(120);
  });

  it('names the refit that did not settle, and keeps the other side', () => {
    // The upper search steps to 0.3 (inside) then 0.4, where the refit does not settle.
    const profile = (v: number) => (v > 0.35 ? { notSettled: 'out of evaluations' } : -0.5 * ((v - 0.2) / 0.1) ** 2);
    const result = profileLikelihoodInterval(0.2, 0, 0.1, profile, words);
    expect(result.interval[0]).toBeCloseTo(0.2 - 0.1959963984540054, 9);
    expect(result.interval[1]).toBe(Infinity);
    expect(result.notDetermined[0]).toBeNull();
    expect(result.notDetermined[1]).toMatch(/^upper end of the 95% interval for r not determined at r = 0\.4(0*\d)?: out of evaluations$/);
  });

  it('treats a profile value that is not a number as outside the interval, so no end is NaN', () => {
    const result = profileLikelihoodInterval(0, 0, 1, (v) => (Math.abs(v) > 1.5 ? NaN : -0.5 * v * v), words);
    expect(result.interval.every(Number.isFinite)).toBe(true);
    expect(result.interval[1]).toBeGreaterThan(1.5 - 1e-9);
    expect(result.notDetermined).toEqual([null, null]);
  });
});

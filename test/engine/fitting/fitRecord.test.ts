/** The optional `disease.fitRecord`: built from a fit, stored in a scenario, valid, round-trips through JSON. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { dailyTotals, fitGrowth, fitRecordMatches, fitRecordOf, measuresRatioForOption, parseCaseCountsCsv, r0FromFit, type GrowthFit } from '../../../src/engine/fitting/index.ts';
import { periodsOf } from '../../../src/engine/growth.ts';
import { parseScenarioText, validateScenario } from '../../../src/engine/validation.ts';
import { demoScenario } from '../../helpers/demo.ts';

const csv = parseCaseCountsCsv(readFileSync('resources/example-cases.csv', 'utf8'));
if (!csv.ok) throw new Error('example file invalid');
const series = csv.series;

function fitOf(from: number, to: number): GrowthFit {
  const r = fitGrowth(dailyTotals(series), { fromDay: from, toDay: to, family: 'negativeBinomial' });
  if (!r.ok) throw new Error('fit failed');
  return r.fit;
}

describe('fitRecordOf', () => {
  const demo = demoScenario();
  const fit = fitOf(3, 24);
  const r0 = r0FromFit(fit, periodsOf(demo));
  if (!r0.ok) throw new Error('unexpected');
  const record = fitRecordOf({ sourceFile: 'example-cases.csv', startDate: series.startDate, fit, r0: r0.value });

  it('carries window (days and dates), family, r, doubling time and R0 with intervals', () => {
    expect(record.window).toMatchObject({ fromDay: 3, toDay: 24, fromDate: '2031-03-06', toDate: '2031-03-27', daysUsed: 22 });
    expect(record.family).toBe('negativeBinomial');
    expect(record.growthRatePerDay).toBe(fit.growthRatePerDay);
    expect(record.growthRateInterval).toEqual(fit.growthRateInterval);
    expect(record.doublingTimeDays).toBeCloseTo(Math.LN2 / fit.growthRatePerDay, 12);
    expect(record.r0).toBe(r0.value.r0);
    expect(record.dispersion?.negativeBinomialAlpha).toBeGreaterThan(0);
    expect(record.measures).toBeUndefined();
    expect(record.methodNotes.some((n) => n.includes('Euler-Lotka'))).toBe(true);
  });

  it('is valid inside a scenario and survives the file round trip unchanged', () => {
    const scenario = { ...demo, disease: { ...demo.disease, transmission: { kind: 'r0' as const, r0: record.r0 }, fitRecord: record } };
    const checked = validateScenario(scenario);
    expect(checked.ok).toBe(true);
    const reread = parseScenarioText(JSON.stringify(scenario));
    if (!reread.ok) throw new Error(JSON.stringify(reread.problems));
    expect(reread.scenario.disease.fitRecord).toEqual(record);
    expect(fitRecordMatches(reread.scenario.disease.transmission, record)).toBe(true);
    expect(fitRecordMatches({ kind: 'r0', r0: record.r0 * 1.01 }, record)).toBe(false);
    expect(fitRecordMatches({ kind: 'doublingTime' }, record)).toBe(false);
  });

  it('writes unbounded interval ends as null and keeps the measures divided out', () => {
    const wide = { ...fit, growthRateInterval: [fit.growthRateInterval[0], Infinity] as [number, number] };
    const option = demo.options.find((o) => o.phases[0]?.fromDay === 0);
    if (option === undefined) throw new Error('demo has no day-0 measures');
    const ratio = measuresRatioForOption(demo, option.name, 3);
    if (!ratio.ok) throw new Error('unexpected');
    const withMeasures = r0FromFit(wide, periodsOf(demo), ratio.value.ratio);
    if (!withMeasures.ok) throw new Error('unexpected');
    const rec = fitRecordOf({ sourceFile: 'x.csv', startDate: null, fit: wide, r0: withMeasures.value, measures: ratio.value });
    expect(rec.growthRateInterval[1]).toBeNull();
    expect(rec.r0Interval[1]).toBeNull();
    expect(rec.window.fromDate).toBeUndefined();
    expect(rec.measures).toMatchObject({ option: option.name, ratio: ratio.value.ratio, phaseFromDay: 0 });
    expect(rec.measures?.reproductionNumberInWindow).toBeCloseTo(rec.r0 * ratio.value.ratio, 12);
    expect(rec.measuresNote).toContain(option.name);
    expect(JSON.parse(JSON.stringify(rec))).toEqual(rec);
  });

  it('is optional: a scenario without it validates, and a bad one names the field', () => {
    expect(validateScenario(demo).ok).toBe(true);
    const bad = validateScenario({ ...demo, disease: { ...demo.disease, fitRecord: { ...record, r0: -1 } } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems.some((p) => p.path.includes('fitRecord.r0'))).toBe(true);
  });
});

/** The fit record printed under the R0 assumption, per-option colour slots, and the band table's no-wrap labels. */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fitRecordSchema, type FitRecord } from '../../src/engine/fitting/fitRecordSchema.ts';
import { dailyTotals, fitGrowth, fitRecordOf, parseCaseCountsCsv, r0FromFit } from '../../src/engine/fitting/index.ts';
import { periodsOf } from '../../src/engine/growth.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { parameterRows } from '../../src/report/assumptions.ts';
import { countModelText, dispersionText, FIT_SOURCE, fitRecordRows, fitWindowText, intervalText, R0_CHANGED_AFTER_FIT } from '../../src/report/fitRecord.ts';
import { OPTION_COLOURS } from '../../src/report/palette.ts';
import { buildReportHtml } from '../../src/report/reportHtml.ts';
import type { ReportMeta } from '../../src/report/reportTypes.ts';
import { demo } from './helpers.ts';

const META: ReportMeta = { appVersion: '1.2.3', generatedAt: new Date(2031, 4, 6, 7, 8), fingerprint: 'f'.repeat(64), paper: 'A4', orientation: 'portrait' };

/** A record with round numbers, so every printed figure can be written out here. */
function record(overrides: Record<string, unknown> = {}): FitRecord {
  return fitRecordSchema.parse({
    sourceFile: 'ward-counts.csv',
    window: { fromDay: 0, toDay: 34, fromDate: '2031-03-03', toDate: '2031-04-06', daysUsed: 35, cases: 12345 },
    family: 'negativeBinomial',
    dayOfWeek: true,
    growthRatePerDay: 0.1234,
    growthRateInterval: [0.11, null],
    doublingTimeDays: 5.617,
    doublingTimeInterval: [null, 6.3],
    r0: 2.5,
    r0Interval: [2.2, 2.9],
    dispersion: { negativeBinomialAlpha: 0.0456, pearsonRatio: 3.21 },
    measures: { option: 'Work contacts halved', phaseFromDay: 0, phaseToDay: 60, ratio: 0.9196, reproductionNumberInWindow: 2.3 },
    measuresNote: 'Measures of option "Work contacts halved" were in force.',
    ...overrides,
  });
}

function withRecord(r: FitRecord, r0 = r.r0): Scenario {
  const { scenario } = demo();
  return { ...scenario, disease: { ...scenario.disease, transmission: { kind: 'r0', r0 }, fitRecord: r } };
}

describe('fit record rows', () => {
  it('are absent without a record', () => {
    const { scenario, results } = demo();
    expect(fitRecordRows(scenario)).toEqual([]);
    expect(buildReportHtml(scenario, results, META)).not.toContain(FIT_SOURCE);
  });

  it('print file, window, model, r, doubling time and R0 with intervals, and the measures divided out', () => {
    const rows = fitRecordRows(withRecord(record()));
    const byName = Object.fromEntries(rows.map((r) => [r.parameter, r]));
    expect(rows.map((r) => r.parameter)).toEqual([
      'Fit: case-count file',
      'Fit: window',
      'Fit: count model',
      'Fit: growth rate r',
      'Fit: doubling time',
      'Fit: R0',
      'Fit: measures divided out',
    ]);
    expect(byName['Fit: case-count file'].value).toBe('ward-counts.csv');
    expect(byName['Fit: window'].value).toBe('2031-03-03 to 2031-04-06 (days 0 to 34); 35 days used; 12,345 cases');
    expect(byName['Fit: count model'].value).toBe('negative binomial, with day-of-week factors');
    expect(byName['Fit: count model'].smallPrint).toBe(
      'Dispersion: Pearson dispersion ratio of the Poisson fit 3.21 (1 = Poisson variance); negative-binomial alpha 0.0456 (variance = mean + alpha mean^2).',
    );
    expect(byName['Fit: growth rate r'].value).toBe('0.1234 (95% interval 0.1100 to no bound; profile likelihood)');
    expect(byName['Fit: growth rate r'].unit).toBe('per day');
    expect(byName['Fit: doubling time'].value).toBe('5.6 (95% interval no bound to 6.3)');
    expect(byName['Fit: R0'].value).toBe('2.50 (95% interval 2.20 to 2.90)');
    expect(byName['Fit: measures divided out'].value).toBe('option "Work contacts halved" (days 0 to 59): ratio 0.920, R in window 2.30');
    expect(byName['Fit: measures divided out'].smallPrint).toBe('Measures of option "Work contacts halved" were in force.');
    expect(rows.every((r) => r.source === FIT_SOURCE)).toBe(true);
  });

  it('a Poisson fit on day numbers without measures or a doubling time', () => {
    const r = record({
      window: { fromDay: 3, toDay: 20 },
      family: 'poisson',
      dayOfWeek: false,
      doublingTimeDays: null,
      doublingTimeInterval: null,
      measures: undefined,
      measuresNote: '',
      dispersion: undefined,
    });
    expect(fitWindowText(r)).toBe('days 3 to 20');
    expect(countModelText(r)).toBe('Poisson');
    expect(dispersionText(r)).toBe('');
    const rows = fitRecordRows(withRecord(r));
    expect(rows.find((x) => x.parameter === 'Fit: doubling time')?.value).toBe('none (not growing)');
    expect(rows.some((x) => x.parameter === 'Fit: measures divided out')).toBe(false);
    expect(intervalText([null, null], String)).toBe('no bound to no bound');
  });

  it('say "R0 was changed after the fit" when the scenario no longer uses the fitted R0', () => {
    expect(fitRecordRows(withRecord(record())).some((r) => r.parameter === R0_CHANGED_AFTER_FIT)).toBe(false);
    const changed = fitRecordRows(withRecord(record(), 2.7));
    expect(changed[0].parameter).toBe(R0_CHANGED_AFTER_FIT);
    expect(changed[0].value).toContain('the fit gave R0 = 2.50');
    const byDoubling = withRecord(record());
    byDoubling.disease.transmission = { kind: 'doublingTime', doublingTimeDays: 4 };
    expect(fitRecordRows(byDoubling)[0].parameter).toBe(R0_CHANGED_AFTER_FIT);
  });

  it('sit right under the R0 assumption in the parameter table and print in the report with small print', () => {
    const scenario = withRecord(record(), 2.7);
    const results = runScenario(scenario);
    const params = parameterRows(scenario, results).map((r) => r.parameter);
    const at = params.indexOf('Basic reproduction number R0 (target)');
    expect(params[at + 1]).toBe(R0_CHANGED_AFTER_FIT);
    expect(params[at + 2]).toBe('Fit: case-count file');
    const html = buildReportHtml(scenario, results, META);
    expect(html).toContain(`<tr class="fit changed"><td>${R0_CHANGED_AFTER_FIT}</td>`);
    expect(html).toContain('<div class="small-print">Dispersion: Pearson dispersion ratio');
    expect(html).toContain('0.1234 (95% interval 0.1100 to no bound; profile likelihood)');
  });

  it('print a record made from the example counts (a real fit) with its own numbers', () => {
    const parsed = parseCaseCountsCsv(readFileSync('resources/example-cases.csv', 'utf8'));
    if (!parsed.ok) throw new Error('example counts unreadable');
    const fitted = fitGrowth(dailyTotals(parsed.series), { family: 'negativeBinomial' });
    if (!fitted.ok) throw new Error('fit failed');
    const { scenario } = demo();
    const r0 = r0FromFit(fitted.fit, periodsOf(scenario));
    if (!r0.ok) throw new Error('no R0');
    const r = fitRecordOf({ sourceFile: 'example-cases.csv', startDate: parsed.series.startDate, fit: fitted.fit, r0: r0.value });
    const rows = fitRecordRows(withRecord(r));
    expect(rows.find((x) => x.parameter === 'Fit: R0')?.value.startsWith(r.r0.toFixed(2))).toBe(true);
    expect(rows.find((x) => x.parameter === 'Fit: window')?.value).toContain('2031-03-03');
  });
});

describe('report colours and band table', () => {
  const { scenario, results } = demo();

  it('colours options by position by default and by the app\'s colour slots when given', () => {
    const swatchColours = (html: string) => [...html.matchAll(/<ul class="legend">([\s\S]*?)<\/ul>/g)][0][1].match(/stroke="(#[0-9A-F]{6})"/g)!.filter((_, k) => k % 2 === 0);
    const byPosition = swatchColours(buildReportHtml(scenario, results, META));
    expect(byPosition.slice(0, 3)).toEqual(OPTION_COLOURS.slice(0, 3).map((c) => `stroke="${c}"`));
    const slots = [4, 0, 2, 6, 1];
    const bySlot = swatchColours(buildReportHtml(scenario, results, { ...META, colourSlots: slots }));
    expect(bySlot).toEqual(slots.slice(0, results.options.length).map((s) => `stroke="${OPTION_COLOURS[s]}"`));
  });

  it('keeps band labels such as "10-14" on one line', () => {
    const html = buildReportHtml(scenario, results, META);
    expect(html).toContain('.bands tbody th, .bands td { white-space: nowrap; }');
    expect(html).toContain('<th scope="row">10-14</th>');
  });
});

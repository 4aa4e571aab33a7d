/**
 * The printed outputs with uncertainty draws: every catalogue outcome that has an interval prints
 * it beside its value (table, Markdown, HTML; CSV as _low/_high columns), the chance rows, the
 * uncertain inputs with distribution and source, and draws, seed, level, sampling and failed draws.
 * The fingerprint covers them (it hashes the uncertainty section the draws come from).
 */
import { describe, expect, it } from 'vitest';
import { formatReport } from '../../src/cli/format.ts';
import { reportCommand } from '../../src/cli/report.ts';
import { writeTemp } from '../cli/helpers.ts';
import { evaluateDrawRange, prepareDraws, runScenario, summariseDraws, type Scenario } from '../../src/engine/index.ts';
import { catalogueReader, DRAW_OUTCOME_KEYS } from '../../src/report/drawOutcomes.ts';
import { DRAWS_LIMIT } from '../../src/report/cautions.ts';
import { buildReportHtml, csvNumber, optionsTable, print, scenarioFingerprint, type ReportMeta } from '../../src/report/index.ts';
import { outcome } from '../../src/report/outcomes.ts';
import { demoScenario } from '../helpers/demo.ts';

const META: ReportMeta = { appVersion: '1.2.3', generatedAt: new Date(2031, 4, 6, 7, 8), fingerprint: 'f'.repeat(64), paper: 'A4', orientation: 'landscape' };
const SOURCE = { fingerprint: 'f'.repeat(64), appVersion: '1.2.3' };

const scenario: Scenario = {
  ...demoScenario(),
  uncertainty: {
    draws: 8,
    seed: 4,
    intervalLevel: 0.8,
    parameters: [
      { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test range for R0' },
      { name: 'ifrScale', distribution: { kind: 'lognormal', median: 1, range95: [0.6, 1.6] }, source: 'test range for IFR' },
    ],
  },
};
const results = runScenario(scenario);
const p = prepareDraws(scenario);
const summary = summariseDraws(p, evaluateDrawRange(p, 0, 8, catalogueReader), DRAW_OUTCOME_KEYS);
const draws = { summary, parameters: scenario.uncertainty!.parameters };
const deathsCell = (k: number) => {
  const i = summary.options[k].intervals.deaths!;
  return `${print.persons(results.options[k].deaths)} (${print.persons(i.low)} to ${print.persons(i.high)})`;
};

describe('printed outputs with uncertainty draws', () => {
  it('the options table gives every interval of the catalogue beside its value, and the chances', () => {
    const table = optionsTable(results, summary);
    let withInterval = 0;
    for (const row of table.rows.filter((r) => !r.key.startsWith('probability'))) {
      const entry = outcome(row.key);
      results.options.forEach((o, k) => {
        const interval = summary.options[k].intervals[row.key];
        const applies = row.cells[k] !== 'n/a' && row.cells[k] !== 'reference';
        if (interval == null || !applies) return;
        expect(row.cells[k], `${row.key} of ${o.name}`).toMatch(/ \(.+ to .+\)$/);
        expect(row.cells[k].startsWith(optionsTable(results).rows.find((r) => r.key === entry.key)!.cells[k])).toBe(true);
        withInterval++;
      });
    }
    expect(withInterval).toBeGreaterThan(60);
    const better = table.rows.find((r) => r.key === 'probabilityBetterThanReference.deaths')!;
    expect(better.label).toBe('Deaths: chance lower than under the reference');
    expect(better.cells[0]).toBe('reference');
    expect(better.cells[3]).toBe(print.percent(summary.options[3].probabilityBetterThanReference.deaths, 0));
    expect(table.rows.find((r) => r.key === 'probabilityBest.deaths')?.cells).toEqual(summary.options.map((o) => print.percent(o.probabilityBest.deaths, 0)));
    // Without draws nothing changes.
    expect(optionsTable(results).rows.every((r) => r.cells.every((c) => !/ to /.test(c)))).toBe(true);
  });

  it('text and Markdown print intervals, chances, the uncertain inputs and how the draws were taken', () => {
    for (const format of ['table', 'md'] as const) {
      const text = formatReport(results, format, SOURCE, draws);
      for (let k = 0; k < results.options.length; k++) expect(text).toContain(deathsCell(k));
      expect(text).toContain('Deaths: chance lower than under the reference');
      expect(text).toContain('Uncertainty draws: 8 (Latin hypercube sampling, seed 4)');
      expect(text).toContain('Intervals: central 80% of the draws');
      expect(text).toContain('Failed draws: 0');
      expect(text).toContain('uniform from 2 to 3');
      expect(text).toContain('lognormal, median 1, 95% range 0.6 to 1.6');
      expect(text).toContain('test range for IFR');
      expect(formatReport(results, format, SOURCE)).not.toContain('Uncertain inputs');
    }
  });

  it('CSV gives each interval as _low and _high beside its column, and the chances as shares', () => {
    const csv = formatReport(results, 'csv', SOURCE, draws);
    const lines = csv.split('\r\n').filter((l) => l !== '' && !l.startsWith('#'));
    const header = lines[0].split(',');
    const row = lines[2].split(',');
    const at = (column: string) => row[header.indexOf(column)];
    expect(header.indexOf('deaths_low')).toBe(header.indexOf('deaths') + 1);
    expect(at('deaths_low')).toBe(csvNumber(summary.options[1].intervals.deaths!.low));
    expect(at('deaths_high')).toBe(csvNumber(summary.options[1].intervals.deaths!.high));
    expect(at('peak_icu_occupancy_high')).toBe(csvNumber(summary.options[1].intervals.peakIcuOccupancy!.high));
    expect(at('chance_lower_than_reference_deaths')).toBe(csvNumber(summary.options[1].probabilityBetterThanReference.deaths));
    expect(csv).toContain('# Uncertain input r0: uniform from 2 to 3; source: test range for R0\r\n');
    expect(csv).toContain('# Uncertainty draws: 8 (Latin hypercube sampling, seed 4)\r\n');
    expect(formatReport(results, 'csv', SOURCE)).not.toContain('deaths_low');
  });

  it('the HTML report prints intervals, chances, the uncertain inputs and the draws; the fingerprint covers them', async () => {
    const html = buildReportHtml(scenario, results, { ...META, draws: summary });
    for (let k = 0; k < results.options.length; k++) expect(html).toContain(deathsCell(k));
    expect(html).toContain('Deaths: chance lower than under the reference');
    expect(html).toContain('Uncertain inputs');
    expect(html).toContain('test range for R0');
    expect(html).toContain('Uncertainty draws: 8 (Latin hypercube sampling, seed 4)');
    expect(html).toContain(DRAWS_LIMIT);
    const plain = buildReportHtml(scenario, results, META);
    expect(plain).not.toContain(deathsCell(1));
    expect(plain).not.toContain(DRAWS_LIMIT);
    // Another seed or distribution gives other intervals, and another fingerprint.
    const fingerprint = await scenarioFingerprint(scenario, '1.2.3');
    expect(await scenarioFingerprint({ ...scenario, uncertainty: { ...scenario.uncertainty!, seed: 5 } }, '1.2.3')).not.toBe(fingerprint);
    const parameters = [{ ...scenario.uncertainty!.parameters[0], distribution: { kind: 'uniform' as const, low: 2, high: 3.5 } }, scenario.uncertainty!.parameters[1]];
    expect(await scenarioFingerprint({ ...scenario, uncertainty: { ...scenario.uncertainty!, parameters } }, '1.2.3')).not.toBe(fingerprint);
  });

  it('mixwise report runs the draws of a scenario with an uncertainty section and prints them', async () => {
    const file = writeTemp('uncertain.json', scenario);
    let out = '';
    const code = await reportCommand({ out: (t) => void (out += t), err: () => undefined }, [file], { env: {}, now: () => new Date(2031, 0, 1) });
    expect(code).toBe(0);
    for (let k = 0; k < results.options.length; k++) expect(out).toContain(deathsCell(k));
    expect(out).toContain('test range for IFR');
  });
});

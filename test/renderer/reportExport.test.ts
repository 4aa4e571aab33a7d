import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { csvText, exportFileName } from '../../src/renderer/lib/reportDocument.ts';
import { commandForKey } from '../../src/renderer/lib/shortcuts.ts';
import { OPTION_COLOURS } from '../../src/renderer/lib/optionLines.ts';
import { OPTION_COLOURS as REPORT_COLOURS, scenarioFingerprint } from '../../src/report/index.ts';
import { APP_VERSION } from '../../src/renderer/lib/appVersion.ts';
import { runScenario } from '../../src/engine/index.ts';
import { demoScenario } from '../helpers/demo.ts';
import { key } from '../helpers/keys.ts';

describe('exportFileName', () => {
  it('names exports after the document', () => {
    expect(exportFileName('demo-scenario.json', 'report', 'pdf')).toBe('demo-scenario-report.pdf');
    expect(exportFileName('City A.JSON', 'table', 'csv')).toBe('City A-table.csv');
    expect(exportFileName('plan', 'daily-series', 'csv')).toBe('plan-daily-series.csv');
  });

  it('never yields a path or an empty base name', () => {
    expect(exportFileName('a/b\\c:d.json', 'table', 'csv')).toBe('a-b-c-d-table.csv');
    expect(exportFileName('.json', 'report', 'pdf')).toBe('scenario-report.pdf');
    expect(exportFileName(`${'x'.repeat(400)}.json`, 'report', 'pdf').length).toBeLessThanOrEqual(255);
  });
});

describe('csvText', () => {
  it('gives the options table and the daily series of the engine results, headed by the fingerprint', async () => {
    const scenario = demoScenario();
    const results = runScenario(scenario);
    const text = await csvText('table', scenario, results);
    const table = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, comments: '#' });
    expect(table.data.map((r) => r.option)).toEqual(results.options.map((o) => o.name));
    table.data.forEach((r, k) => expect(Math.abs(Number(r.r_start) - results.options[k].rStart)).toBeLessThanOrEqual(5e-6 * results.options[k].rStart));
    expect(text).toContain(`Scenario fingerprint: ${await scenarioFingerprint(scenario, APP_VERSION)}`);
    const series = (await csvText('daily-series', scenario, results)).split('\r\n').find((line) => !line.startsWith('#'));
    expect(series).toBe('option,day,band,quantity,value');
  });
});

describe('report shortcuts and palette', () => {
  it('maps Ctrl+P, Ctrl+Shift+E, Ctrl+E and Alt+5 to the report', () => {
    expect(commandForKey(key('p', { ctrlKey: true }))).toBe('print-report');
    expect(commandForKey(key('P', { metaKey: true }))).toBe('print-report');
    expect(commandForKey(key('E', { ctrlKey: true, shiftKey: true }))).toBe('export-report-pdf');
    expect(commandForKey(key('e', { ctrlKey: true }))).toBe('export-table-csv');
    expect(commandForKey(key('5', { altKey: true }))).toBe('view-report');
    expect(commandForKey(key('e'))).toBeNull();
  });

  it('uses one colour list for the app and the printed report', () => {
    expect(OPTION_COLOURS).toBe(REPORT_COLOURS);
  });
});

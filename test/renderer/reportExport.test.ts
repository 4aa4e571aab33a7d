import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { csvText, exportFileName } from '../../src/renderer/lib/reportDocument.ts';
import { commandForKey } from '../../src/renderer/lib/shortcuts.ts';
import { OPTION_COLOURS } from '../../src/renderer/lib/palette.ts';
import { OPTION_COLOURS as REPORT_COLOURS } from '../../src/report/index.ts';
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
  it('gives the options table and the daily series of the engine results', () => {
    const results = runScenario(demoScenario());
    const table = Papa.parse<Record<string, string>>(csvText('table', results), { header: true, skipEmptyLines: true });
    expect(table.data.map((r) => r.option)).toEqual(results.options.map((o) => o.name));
    expect(table.data.map((r) => Number(r.r_start))).toEqual(results.options.map((o) => o.rStart));
    const series = csvText('daily-series', results).split('\r\n', 1)[0];
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

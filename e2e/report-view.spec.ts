/**
 * The Report view in web mode (the bundle Electron loads), in Debian's chromium: the report in
 * its frame holds the numbers `mixwise run --format json` gives for the demo, formatted as the
 * printed report formats them, and the fingerprint `mixwise report` prints for the same file;
 * the table CSV download parses back to the engine's numbers. A screenshot of the view goes to
 * e2e-artifacts/view-report.png.
 */
import { expect, test, type FrameLocator, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Papa from 'papaparse';
import { shortFingerprint, print } from '../src/report/index.ts';
import { ARTIFACTS, DEMO, mixwise, openApp } from './helpers.ts';


interface JsonOption {
  name: string;
  rStart: number;
  attackRate: number;
  deaths: number;
}

/** The demo's options as the CLI computes them. */
const cliOptions = (): JsonOption[] => (JSON.parse(mixwise('run', DEMO, '--format', 'json')) as { options: JsonOption[] }).options;

/** The full fingerprint `mixwise report` writes into its HTML for the demo. */
function cliFingerprint(): string {
  const match = /<meta name="mixwise-fingerprint" content="([0-9a-f]{64})">/.exec(mixwise('report', DEMO));
  if (match === null) throw new Error('mixwise report printed no fingerprint');
  return match[1];
}

/** Equal up to the last few bits of a double (the browser's V8 and Node's may round a libm call differently). */
/** CSV numbers carry 6 significant digits (stated in the file's "#" header block). */
function expectAtCsvPrecision(shown: number, engine: number, what: string): void {
  expect(Math.abs(shown - engine), `${what}: ${shown} vs ${engine}`).toBeLessThanOrEqual(5e-6 * Math.abs(engine));
}

async function openReportView(page: Page): Promise<{ errors: string[]; report: FrameLocator }> {
  const errors = await openApp(page);
  await page.getByRole('tab', { name: 'Report' }).click();
  await expect(page.getByTestId('report-view')).toHaveAttribute('data-stale', 'false', { timeout: 20_000 });
  const report = page.frameLocator('[data-testid="report-frame"]');
  await expect(report.locator('h1')).toHaveText('Policy options report');
  return { errors, report };
}

/** The cells of one row of the report's options table, in option order. */
async function rowCells(report: FrameLocator, key: string): Promise<string[]> {
  return (await report.locator(`table.options-table tr[data-row="${key}"] td`).allTextContents()).map((t) => t.trim());
}

test('the Report view shows the engine\'s R at start and deaths, and the CLI\'s fingerprint', async ({ page }) => {
  const { errors, report } = await openReportView(page);
  const options = cliOptions();

  await expect(page.getByTestId('caution')).toContainText('not forecasts');
  await expect(report.locator('header .caution')).toContainText('not forecasts');
  expect(await report.locator('table.options-table thead th.option').allTextContents()).toEqual(
    options.map((o, k) => (k === 0 ? `${o.name} (reference)` : o.name)),
  );
  expect(await rowCells(report, 'rStart')).toEqual(options.map((o) => print.r(o.rStart)));
  expect(await rowCells(report, 'deaths')).toEqual(options.map((o) => print.persons(o.deaths)));

  const fingerprint = cliFingerprint();
  const short = shortFingerprint(fingerprint);
  await expect(page.getByTestId('report-fingerprint')).toHaveText(short);
  await expect(page.getByTestId('report-frame')).toHaveAttribute('data-fingerprint', fingerprint);
  await expect(report.locator('header .facts')).toContainText(short);

  await page.screenshot({ path: join(ARTIFACTS, 'view-report.png'), fullPage: false });
  expect(errors).toEqual([]);
});

test('Export table CSV downloads the engine\'s numbers', async ({ page }) => {
  const { errors } = await openReportView(page);
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('report-export-table-csv').click()]);
  expect(download.suggestedFilename()).toBe('demo-scenario-table.csv');
  const text = readFileSync(await download.path(), 'utf8');
  expect(text.startsWith('# Mixwise policy options table: ')).toBe(true);
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, comments: '#' });
  expect(parsed.errors).toEqual([]);

  const options = cliOptions();
  expect(parsed.data.map((row) => row.option)).toEqual(options.map((o) => o.name));
  parsed.data.forEach((row, k) => {
    expectAtCsvPrecision(Number(row.r_start), options[k].rStart, `${options[k].name} r_start`);
    expectAtCsvPrecision(Number(row.attack_rate), options[k].attackRate, `${options[k].name} attack_rate`);
    expectAtCsvPrecision(Number(row.deaths), options[k].deaths, `${options[k].name} deaths`);
  });
  await expect(page.getByTestId('notice')).toContainText('Exported demo-scenario-table.csv');
  expect(errors).toEqual([]);
});

test('paper and orientation change the sheet and the printed page size; the toolbar and shortcuts export too', async ({ page }) => {
  const { errors, report } = await openReportView(page);
  const frame = page.getByTestId('report-frame');
  const portraitWidth = (await frame.boundingBox())?.width ?? 0;

  await page.getByTestId('report-paper-Letter').check();
  await page.getByTestId('report-orientation-landscape').check();
  await expect(frame).toHaveAttribute('srcdoc', /size: Letter landscape;/);
  await expect.poll(async () => (await frame.boundingBox())?.width ?? 0).toBeGreaterThan(portraitWidth * 1.2);
  // The same numbers, now eight option columns per table at most.
  expect(await rowCells(report, 'rStart')).toEqual(cliOptions().map((o) => print.r(o.rStart)));

  // Daily series from the toolbar menu, in long format.
  await page.getByTestId('toolbar-export').click();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('toolbar-export-daily-csv').click()]);
  expect(download.suggestedFilename()).toBe('demo-scenario-daily-series.csv');
  const head = readFileSync(await download.path(), 'utf8').slice(0, 4000).split('\r\n');
  expect(head[0]).toMatch(/^# Mixwise daily series: /);
  expect(head.find((line) => !line.startsWith('#'))).toBe('option,day,band,quantity,value');

  // Shortcuts work while the report itself has focus: Ctrl+E exports the table.
  await report.locator('h1').click();
  const [byKey] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Control+e')]);
  expect(byKey.suggestedFilename()).toBe('demo-scenario-table.csv');
  expect(errors).toEqual([]);
});

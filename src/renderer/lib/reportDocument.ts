/**
 * The report and its exports for the scenario on screen, built with the same code as
 * `mixwise report` (src/report), so the app, the CLI and a printout agree to the character.
 */
import type { OrderComparison, ScenarioResults, Scenario, UncertaintyResults } from '../../engine/index.ts';
import { buildReportHtml, dailySeriesCsv, optionsTableCsv, scenarioFingerprint, shortFingerprint, type Orientation, type Paper } from '../../report/index.ts';
import type { ReportDocument } from '../../shared/hostApi.ts';
import { APP_VERSION } from './appVersion.ts';

export interface ReportSettings {
  paper: Paper;
  orientation: Orientation;
}

export interface BuiltReport extends ReportDocument {
  /** Full SHA-256 fingerprint of the scenario and program version (hex). */
  fingerprint: string;
  /** The short form printed on every page. */
  shortFingerprint: string;
  generatedAt: Date;
}

/**
 * The report for `scenario` and its `results` (results must be the engine's for exactly this scenario).
 * `colourSlots` (the working document's, one per option) makes the printout draw each option in the
 * colour it has in the app; without them options are coloured by position. `orderComparison`, found
 * for exactly this scenario, is printed beside the options table. `draws`, the summary of exactly
 * this scenario's uncertainty draws, puts intervals and chances in the table and lists the uncertain inputs.
 */
export async function buildReport(
  scenario: Scenario,
  results: ScenarioResults,
  settings: ReportSettings,
  generatedAt: Date,
  colourSlots?: readonly number[],
  orderComparison?: OrderComparison,
  draws?: UncertaintyResults,
): Promise<BuiltReport> {
  const fingerprint = await scenarioFingerprint(scenario, APP_VERSION);
  const html = buildReportHtml(scenario, results, { appVersion: APP_VERSION, generatedAt, fingerprint, ...settings, ...(colourSlots ? { colourSlots } : {}), ...(orderComparison ? { orderComparison } : {}), ...(draws ? { draws } : {}) });
  return { html, paper: settings.paper, orientation: settings.orientation, fingerprint, shortFingerprint: shortFingerprint(fingerprint), generatedAt };
}

export type CsvExport = 'table' | 'daily-series';

/**
 * The CSV text of an export: the options table (one row per option) or the daily series (long
 * format), headed by the scenario's fingerprint and the caution (results must be the engine's for
 * exactly this scenario; `draws`, the summary of its uncertainty draws, adds the table's interval and chance columns).
 */
export async function csvText(kind: CsvExport, scenario: Scenario, results: ScenarioResults, draws?: UncertaintyResults): Promise<string> {
  const source = { fingerprint: await scenarioFingerprint(scenario, APP_VERSION), appVersion: APP_VERSION };
  const drawn = draws === undefined || scenario.uncertainty === undefined ? undefined : { summary: draws, parameters: scenario.uncertainty.parameters };
  return kind === 'table' ? optionsTableCsv(results, source, drawn) : dailySeriesCsv(results, source);
}

/**
 * File name for an export of the document `fileName`: "city.json" -> "city-report.pdf",
 * "city-table.csv", "city-daily-series.csv". Characters a file name cannot hold become "-".
 */
export function exportFileName(fileName: string, what: 'report' | CsvExport, extension: 'pdf' | 'csv'): string {
  const base = fileName.replace(/\.json$/i, '').replace(/[\\/:*?"<>|\u0000-\u001f]/g, '-').trim().slice(0, 180) || 'scenario';
  return `${base}-${what}.${extension}`;
}

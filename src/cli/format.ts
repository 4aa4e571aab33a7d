/** Renders the results of `mixwise run` in the format asked for on the command line. */
import type { ScenarioSummary } from '../engine/index.ts';
import { optionsTableCsv, type CsvSource } from '../report/csv.ts';
import type { OutputFormat } from './args.ts';
import { formatMarkdown } from './formatMarkdown.ts';
import { formatText } from './formatText.ts';
import { optionsReport } from './optionsReport.ts';
import { printedReport, type PrintedDraws } from './tableModel.ts';
import { withUncertainty } from './uncertainty.ts';

/** `source` names the scenario and program version in the CSV header block; `draws` summarises the uncertainty draws, if any. */
export function formatReport(results: ScenarioSummary, format: OutputFormat, source: CsvSource, draws?: PrintedDraws): string {
  switch (format) {
    case 'json': {
      const report = optionsReport(results);
      return `${JSON.stringify(draws === undefined ? report : withUncertainty(report, draws.summary), null, 2)}\n`;
    }
    case 'csv':
      return optionsTableCsv(results, source, draws);
    case 'md':
      return formatMarkdown(printedReport(results, draws));
    case 'table':
      return formatText(printedReport(results, draws));
  }
}

/** Renders the options report in the format asked for on the command line. */
import type { OutputFormat } from './args.ts';
import { formatCsv } from './format-csv.ts';
import { formatMarkdown } from './format-markdown.ts';
import { formatText } from './format-text.ts';
import type { OptionsReport } from './options-report.ts';
import { printedReport } from './table-model.ts';

export function formatReport(report: OptionsReport, format: OutputFormat): string {
  switch (format) {
    case 'json':
      return `${JSON.stringify(report, null, 2)}\n`;
    case 'csv':
      return formatCsv(report);
    case 'md':
      return formatMarkdown(printedReport(report));
    case 'table':
      return formatText(printedReport(report));
  }
}

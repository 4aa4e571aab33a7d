/**
 * The report's commands (menu, toolbar, shortcuts and the Report view all call these): print the
 * report, export it as PDF, export the options table or the daily series as CSV. Each waits
 * until the engine has caught up with the latest edit, so what is printed always belongs to the
 * scenario on screen, and reports the outcome in the app's notice line.
 */
import type { MenuCommand, SaveOutcome } from '../../shared/hostApi.ts';
import { host } from '../lib/host.ts';
import { buildReport, csvText, exportFileName, type CsvExport } from '../lib/reportDocument.ts';
import { reportSettings } from './reportSettings.svelte.ts';
import { workspace } from './workspace.svelte.ts';

export const REPORT_COMMANDS = ['print-report', 'export-report-pdf', 'export-table-csv', 'export-daily-csv'] as const;
export type ReportCommand = (typeof REPORT_COMMANDS)[number];

export function isReportCommand(command: MenuCommand): command is ReportCommand {
  return (REPORT_COMMANDS as readonly string[]).includes(command);
}

/** Longest wait for fresh results before giving up (the demo computes in well under a second). */
const FRESH_RESULTS_TIMEOUT_MS = 60_000;
const POLL_MS = 50;

class ReportCommands {
  /** The command in progress, if any (buttons show it and do not start a second one). */
  busy = $state<ReportCommand | null>(null);

  /** The scenario with the engine's results for exactly it, once they are in; null (with a notice) on failure. */
  private async freshInputs() {
    const started = performance.now();
    if (workspace.stale) workspace.notice = { kind: 'info', text: 'Waiting for the results of the latest edit…' };
    while (workspace.stale || workspace.results === null) {
      if (workspace.engineError !== null) {
        workspace.notice = { kind: 'error', text: `No report: the engine could not compute this scenario (${workspace.engineError}).` };
        return null;
      }
      if (workspace.engineRefusal !== null) {
        workspace.notice = { kind: 'error', text: `No report: this scenario cannot be computed: ${workspace.engineRefusal}` };
        return null;
      }
      if (performance.now() - started > FRESH_RESULTS_TIMEOUT_MS) {
        workspace.notice = { kind: 'error', text: 'No report: the results are still being computed. Try again in a moment.' };
        return null;
      }
      await new Promise((resolve) => setTimeout(resolve, POLL_MS));
    }
    if (workspace.draws?.state === 'running') workspace.notice = { kind: 'info', text: 'The uncertainty draws are still running: this report has no intervals yet. Print again once they are done.' };
    return { scenario: workspace.scenario, results: workspace.results, colourSlots: workspace.doc.colourSlots, orderComparison: workspace.reportOrders ?? undefined, draws: workspace.reportDraws ?? undefined };
  }

  private tell(outcome: SaveOutcome): void {
    if (outcome.ok) workspace.notice = { kind: 'info', text: `Exported ${outcome.file.name}.` };
    else if (!outcome.cancelled) workspace.notice = { kind: 'error', text: outcome.message };
    else if (workspace.notice?.text.startsWith('Waiting')) workspace.notice = null;
  }

  private async report() {
    const inputs = await this.freshInputs();
    return inputs === null ? null : buildReport(inputs.scenario, inputs.results, reportSettings.current, new Date(), inputs.colourSlots, inputs.orderComparison, inputs.draws);
  }

  private async csv(kind: CsvExport): Promise<void> {
    const inputs = await this.freshInputs();
    if (inputs === null) return;
    const suggestedName = exportFileName(workspace.fileName, kind, 'csv');
    this.tell(await host.exportCsv({ suggestedName, text: await csvText(kind, inputs.scenario, inputs.results, inputs.draws) }));
  }

  private async execute(command: ReportCommand): Promise<void> {
    switch (command) {
      case 'print-report': {
        const report = await this.report();
        if (report === null) return;
        if (workspace.notice?.text.startsWith('Waiting')) workspace.notice = null;
        await host.printReport(report);
        return;
      }
      case 'export-report-pdf': {
        const report = await this.report();
        if (report === null) return;
        if (host.kind === 'web') workspace.notice = { kind: 'info', text: 'To save a PDF, choose "Save as PDF" as the printer in the print dialog.' };
        this.tell(await host.exportReportPdf(report, exportFileName(workspace.fileName, 'report', 'pdf')));
        return;
      }
      case 'export-table-csv':
        return this.csv('table');
      case 'export-daily-csv':
        return this.csv('daily-series');
    }
  }

  /** Runs a report command unless one is already running; errors end up in the notice line. */
  async run(command: ReportCommand): Promise<void> {
    if (this.busy !== null) return;
    this.busy = command;
    try {
      await this.execute(command);
    } catch (err) {
      workspace.notice = { kind: 'error', text: `${(err as Error).message}` };
    } finally {
      this.busy = null;
    }
  }
}

export const reportCommands = new ReportCommands();

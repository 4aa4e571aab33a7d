/**
 * The one object the renderer uses to reach the host: the Electron main process (desktop)
 * or the browser (web mode). Both implement `MixwiseHost`; the renderer never assumes which.
 *
 * This file holds types and channel names only, so main, preload and renderer can all import it.
 */
import type { Orientation as ReportOrientation, Paper as ReportPaper } from '../report/index.ts';
import type { MenuCommand } from './commands.ts';

/** A scenario file the user picked: its display name, where it lives (desktop only) and its text. */
export interface OpenedScenarioFile {
  name: string;
  /** Absolute path on disk (desktop); null in web mode. */
  path: string | null;
  text: string;
}

/** Where a file was written: display name and path (null in web mode, where it is a download). */
export interface SavedFile {
  name: string;
  path: string | null;
}

/** An entry of the recent-files list. */
export interface RecentFile {
  name: string;
  /** Desktop: absolute path. Web: a key into the browser's stored copies. */
  path: string;
}

/** Commands the native menu, a shortcut or a button asks the renderer to carry out (the table is commands.ts). */
export { MENU_COMMANDS, type MenuCommand } from './commands.ts';

/** What the renderer tells the host about the open document (window title, unsaved-changes prompt). */
export interface DocumentState {
  title: string;
  dirty: boolean;
}

export interface SaveRequest {
  /** Write here without asking; null opens a "save as" dialog (or, in web mode, downloads). */
  path: string | null;
  /** Suggested file name for the dialog / download, e.g. `my-scenario.json`. */
  suggestedName: string;
  /** The scenario as JSON text; the host refuses text that is not a valid scenario. */
  text: string;
}

/** The printable policy options report as the renderer built it (src/report), with its page settings. */
export interface ReportDocument {
  /** Self-contained HTML (styles and SVG charts inline, no script). */
  html: string;
  paper: ReportPaper;
  orientation: ReportOrientation;
}

/** A CSV file to write (options table or daily series). */
export interface CsvExportRequest {
  /** Suggested file name for the dialog / download, e.g. `my-scenario-table.csv`. */
  suggestedName: string;
  text: string;
}

export type SaveOutcome = { ok: true; file: SavedFile } | { ok: false; cancelled: true } | { ok: false; cancelled: false; message: string };

export interface MixwiseHost {
  readonly kind: 'desktop' | 'web';
  /** Ask the user for a scenario file; null when cancelled. */
  openScenario(): Promise<OpenedScenarioFile | null>;
  /** Re-open an entry of the recent list; null when it no longer exists. */
  openRecent(path: string): Promise<OpenedScenarioFile | null>;
  listRecent(): Promise<RecentFile[]>;
  /** Write the scenario atomically (never a half-written file, never an invalid one). */
  saveScenario(request: SaveRequest): Promise<SaveOutcome>;
  /** Print the current view (system print dialog). */
  print(): Promise<void>;
  /** Save the current view as PDF; in web mode this opens the print dialog (choose "Save as PDF"). */
  exportPdf(suggestedName: string): Promise<SaveOutcome>;
  /** Print the report (system print dialog); desktop prints it from a hidden window, web mode from a frame of this page. */
  printReport(report: ReportDocument): Promise<void>;
  /** Save the report as PDF (desktop: a save dialog; web mode: the print dialog, choose "Save as PDF"). */
  exportReportPdf(report: ReportDocument, suggestedName: string): Promise<SaveOutcome>;
  /** Write a CSV file (desktop: a save dialog and an atomic write; web mode: a download). */
  exportCsv(request: CsvExportRequest): Promise<SaveOutcome>;
  setDocumentState(state: DocumentState): void;
  /** Subscribe to menu commands (`open-recent` carries the entry's path); returns the unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommand, path?: string) => void): () => void;
}

/** IPC channel names, renderer -> main (invoke) and main -> renderer (send). */
export const IPC = {
  open: 'scenario:open',
  openRecent: 'scenario:open-recent',
  listRecent: 'recent:list',
  save: 'scenario:save',
  print: 'view:print',
  exportPdf: 'view:export-pdf',
  printReport: 'report:print',
  exportReportPdf: 'report:export-pdf',
  exportCsv: 'report:export-csv',
  documentState: 'document:state',
  menuCommand: 'menu:command',
} as const;

/** Name of the global the preload exposes. */
export const HOST_GLOBAL = 'mixwiseHost';

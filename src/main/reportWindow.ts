/**
 * The hidden window the report is printed from. Its HTML is served from memory under
 * `mixwise://report/<random>.html` (see reportPrinting.ts) for as long as the window lives.
 */
import { BrowserWindow, type WebContents } from 'electron';
import { ReportPages, reportPageHeaders, reportPrintOptions, reportWindowOptions, printFailureMessage } from './reportPrinting.ts';
import type { ReportDocument } from '../shared/hostApi.ts';

const pages = new ReportPages();

/** The response for a report page request, or null when the URL is not one (the app's protocol handler asks first). */
export function reportPageResponse(requestUrl: string): Response | null {
  const html = pages.htmlFor(requestUrl);
  return html === null ? null : new Response(html, { status: 200, headers: reportPageHeaders() });
}

/** Loads `html` in a hidden, locked-down window, runs `act` on it, then closes the window. */
export async function withReportWindow<T>(html: string, parent: BrowserWindow, act: (contents: WebContents) => Promise<T>): Promise<T> {
  const url = pages.add(html);
  const window = new BrowserWindow({ ...reportWindowOptions(), parent });
  const contents = window.webContents;
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  contents.on('will-navigate', (event) => event.preventDefault());
  contents.on('will-attach-webview', (event) => event.preventDefault());
  try {
    await window.loadURL(url);
    return await act(contents);
  } finally {
    pages.remove(url);
    if (!window.isDestroyed()) window.destroy();
  }
}

/** Opens the system print dialog for the report; rejects with a plain message when printing fails (not when cancelled). */
export function printReportContents(contents: WebContents, report: ReportDocument): Promise<void> {
  return new Promise((resolve, reject) => {
    contents.print(reportPrintOptions(report), (success, failureReason) => {
      const failure = printFailureMessage(success, failureReason);
      if (failure === null) resolve();
      else reject(new Error(failure));
    });
  });
}

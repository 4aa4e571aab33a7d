/**
 * How the main process prints the report, as plain data and functions (unit-tested):
 * the hidden window's settings, its content security policy, the print and PDF options, and
 * the short-lived in-memory pages it loads (`mixwise://report/<random>.html`).
 *
 * The report's HTML comes from the renderer, so it is treated as a stranger's: it is shown in a
 * window with no preload, no Node, a sandbox and JavaScript off, under a CSP that allows only
 * inline styles and data: images, on an origin other than the app's (so it can send no IPC the
 * app would accept and read none of the app's storage).
 */
import type { BrowserWindowConstructorOptions, PrintToPDFOptions, WebContentsPrintOptions } from 'electron';
import { randomBytes } from 'node:crypto';
import type { ReportDocument } from '../shared/hostApi.ts';
import { APP_SCHEME } from './appProtocol.ts';
import { LOCKED_DOWN_WEB_PREFERENCES } from './windowOptions.ts';

/** Host of the report pages under the app's scheme; the app itself is served from `app`. */
export const REPORT_HOST = 'report';
export const REPORT_ORIGIN = `${APP_SCHEME}://${REPORT_HOST}`;

/** The report is one self-contained document: inline styles and SVG, nothing fetched, nothing run. */
export const REPORT_CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "style-src 'unsafe-inline'",
  'img-src data:',
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

/** The hidden window the report is printed from (Electron security checklist, plus JavaScript off). */
export function reportWindowOptions(): BrowserWindowConstructorOptions {
  return {
    show: false,
    width: 900,
    height: 1200,
    title: 'Mixwise report',
    webPreferences: { ...LOCKED_DOWN_WEB_PREFERENCES, javascript: false },
  };
}

/**
 * PDF options: the report's own CSS sets paper, orientation, margins and the running footer
 * (`preferCSSPageSize`); paper and orientation are also passed as the fallback Chromium uses
 * when a page has no size of its own. Tagged PDF keeps the text and tables readable by screen readers.
 */
export function reportPdfOptions(report: Pick<ReportDocument, 'paper' | 'orientation'>): PrintToPDFOptions {
  return {
    preferCSSPageSize: true,
    printBackground: true,
    pageSize: report.paper,
    landscape: report.orientation === 'landscape',
    displayHeaderFooter: false,
    generateTaggedPDF: true,
  };
}

/** Print-dialog options: starts on the report's paper and orientation (the user may still change them). */
export function reportPrintOptions(report: Pick<ReportDocument, 'paper' | 'orientation'>): WebContentsPrintOptions {
  return {
    silent: false,
    printBackground: true,
    pageSize: report.paper,
    landscape: report.orientation === 'landscape',
  };
}

/**
 * Report pages waiting to be loaded by a hidden window, each under an unguessable name; a page
 * is removed once its window is done with it.
 */
export class ReportPages {
  private readonly pages = new Map<string, string>();

  /** Keeps `html` and returns the URL that serves it. */
  add(html: string): string {
    const url = `${REPORT_ORIGIN}/${randomBytes(16).toString('hex')}.html`;
    this.pages.set(url, html);
    return url;
  }

  remove(url: string): void {
    this.pages.delete(url);
  }

  /** The HTML for a request URL, or null when it is not a waiting report page. */
  htmlFor(requestUrl: string): string | null {
    let url: URL;
    try {
      url = new URL(requestUrl);
    } catch {
      return null;
    }
    if (url.protocol !== `${APP_SCHEME}:` || url.host !== REPORT_HOST) return null;
    return this.pages.get(`${REPORT_ORIGIN}${url.pathname}`) ?? null;
  }

  get size(): number {
    return this.pages.size;
  }
}

/** Headers a report page is served with. */
export function reportPageHeaders(): Record<string, string> {
  return {
    'content-type': 'text/html; charset=utf-8',
    'content-security-policy': REPORT_CONTENT_SECURITY_POLICY,
    'x-content-type-options': 'nosniff',
    'cache-control': 'no-store',
  };
}

/**
 * What to tell the user after the print dialog closes: null when the report printed or the user
 * cancelled, else the reason Electron gave (its reasons include "cancelled", "failed" and
 * "Print job canceled").
 */
export function printFailureMessage(success: boolean, failureReason: string): string | null {
  if (success || /cancel/i.test(failureReason)) return null;
  return `The report was not printed: ${failureReason || 'the printer reported an error'}.`;
}

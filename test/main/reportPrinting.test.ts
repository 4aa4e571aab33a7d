import { describe, expect, it } from 'vitest';
import type { MenuItemConstructorOptions } from 'electron';
import { menuTemplate } from '../../src/main/menu.ts';
import {
  printFailureMessage,
  REPORT_CONTENT_SECURITY_POLICY,
  ReportPages,
  reportPageHeaders,
  reportPdfOptions,
  reportPrintOptions,
  reportWindowOptions,
} from '../../src/main/reportPrinting.ts';
import { isAllowedNavigation } from '../../src/main/contentSecurity.ts';
import type { MenuCommand } from '../../src/shared/hostApi.ts';

describe('the hidden report window', () => {
  it('runs no script and no Node, sandboxed, isolated, hidden, without a preload', () => {
    const options = reportWindowOptions();
    expect(options.show).toBe(false);
    expect(options.webPreferences).toMatchObject({
      javascript: false,
      sandbox: true,
      contextIsolation: true,
      nodeIntegration: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      webviewTag: false,
    });
    expect(options.webPreferences?.preload).toBeUndefined();
  });

  it('serves the report under a CSP that allows inline styles and data: images only', () => {
    const directives = REPORT_CONTENT_SECURITY_POLICY.split(';').map((d) => d.trim());
    expect(directives).toContain("default-src 'none'");
    expect(directives).toContain("style-src 'unsafe-inline'");
    expect(directives).toContain('img-src data:');
    expect(REPORT_CONTENT_SECURITY_POLICY).not.toMatch(/script-src/);
    expect(reportPageHeaders()).toMatchObject({ 'content-type': 'text/html; charset=utf-8', 'content-security-policy': REPORT_CONTENT_SECURITY_POLICY });
  });
});

describe('ReportPages', () => {
  it('serves a page under an unguessable report URL until it is removed', () => {
    const pages = new ReportPages();
    const a = pages.add('<!DOCTYPE html><p>a</p>');
    const b = pages.add('<!DOCTYPE html><p>b</p>');
    expect(a).toMatch(/^mixwise:\/\/report\/[0-9a-f]{32}\.html$/);
    expect(a).not.toBe(b);
    expect(pages.htmlFor(a)).toBe('<!DOCTYPE html><p>a</p>');
    expect(pages.htmlFor(`${a}?x=1#top`)).toBe('<!DOCTYPE html><p>a</p>');
    pages.remove(a);
    expect(pages.htmlFor(a)).toBeNull();
    expect(pages.htmlFor(b)).toBe('<!DOCTYPE html><p>b</p>');
    expect(pages.size).toBe(1);
  });

  it('answers nothing for other hosts, schemes, unknown names or bad URLs', () => {
    const pages = new ReportPages();
    const url = pages.add('<!DOCTYPE html>');
    const name = url.slice(url.lastIndexOf('/'));
    expect(pages.htmlFor(`mixwise://app${name}`)).toBeNull();
    expect(pages.htmlFor(`https://report${name}`)).toBeNull();
    expect(pages.htmlFor('mixwise://report/0000.html')).toBeNull();
    expect(pages.htmlFor('not a url')).toBeNull();
  });

  it('is not a page the app window may navigate to', () => {
    const url = new ReportPages().add('<!DOCTYPE html>');
    expect(isAllowedNavigation(url, undefined)).toBe(false);
  });
});

describe('print and PDF options', () => {
  it('prints to PDF on the report\'s own CSS page size, with backgrounds, tagged, no Chromium header', () => {
    expect(reportPdfOptions({ paper: 'A4', orientation: 'portrait' })).toEqual({
      preferCSSPageSize: true,
      printBackground: true,
      pageSize: 'A4',
      landscape: false,
      displayHeaderFooter: false,
      generateTaggedPDF: true,
    });
    expect(reportPdfOptions({ paper: 'Letter', orientation: 'landscape' })).toMatchObject({ pageSize: 'Letter', landscape: true, preferCSSPageSize: true });
  });

  it('opens the print dialog on the chosen paper and orientation', () => {
    expect(reportPrintOptions({ paper: 'Letter', orientation: 'landscape' })).toEqual({ silent: false, printBackground: true, pageSize: 'Letter', landscape: true });
    expect(reportPrintOptions({ paper: 'A4', orientation: 'portrait' })).toMatchObject({ pageSize: 'A4', landscape: false });
  });

  it('says nothing after a print or a cancel, and names the reason of a failure', () => {
    expect(printFailureMessage(true, '')).toBeNull();
    expect(printFailureMessage(false, 'cancelled')).toBeNull();
    expect(printFailureMessage(false, 'Print job canceled')).toBeNull();
    expect(printFailureMessage(false, 'failed')).toBe('The report was not printed: failed.');
    expect(printFailureMessage(false, '')).toContain('the printer reported an error');
  });
});

describe('File menu report items', () => {
  const sent: MenuCommand[] = [];
  const actions = { send: (c: MenuCommand) => sent.push(c), openRecent: () => undefined, clearRecent: () => undefined };
  const file = (menuTemplate([], actions, false).find((m) => m.label === 'File')?.submenu ?? []) as MenuItemConstructorOptions[];
  const item = (label: string) => file.find((i) => i.label === label);

  it('prints and exports the report, with shortcuts shown but handled by the renderer', () => {
    const expected: [string, MenuCommand, string | undefined][] = [
      ['Print report…', 'print-report', 'CmdOrCtrl+P'],
      ['Export report as PDF…', 'export-report-pdf', 'CmdOrCtrl+Shift+E'],
      ['Export table CSV…', 'export-table-csv', 'CmdOrCtrl+E'],
      ['Export daily series CSV…', 'export-daily-csv', undefined],
    ];
    for (const [label, command, accelerator] of expected) {
      const entry = item(label);
      expect(entry, label).toBeDefined();
      expect(entry?.accelerator).toBe(accelerator);
      expect(entry?.registerAccelerator).toBe(false);
      (entry?.click as () => void)();
      expect(sent.at(-1)).toBe(command);
    }
  });

  it('has the Report view under View', () => {
    const view = (menuTemplate([], actions, false).find((m) => m.label === 'View')?.submenu ?? []) as MenuItemConstructorOptions[];
    const report = view.find((i) => i.label === 'Report');
    expect(report?.accelerator).toBe('Alt+5');
    (report?.click as () => void)();
    expect(sent.at(-1)).toBe('view-report');
  });
});

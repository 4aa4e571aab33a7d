import { describe, expect, it } from 'vitest';
import { checkIpcMessage } from '../../src/main/ipcSender.ts';
import { MAX_CSV_CHARS, MAX_REPORT_HTML_CHARS } from '../../src/shared/ipcContract.ts';
import { IPC } from '../../src/shared/hostApi.ts';

const app = { frameUrl: 'mixwise://app/index.html', isMainFrame: true };
const html = '<!DOCTYPE html>\n<html lang="en"><head><style>body{}</style></head><body><p>R 2.50</p></body></html>\n';
const report = { html, paper: 'A4', orientation: 'portrait' };

describe('report:print payload', () => {
  it('accepts a report document from the app page', () => {
    expect(checkIpcMessage(IPC.printReport, app, report, undefined)).toEqual({ ok: true, request: report });
    const letter = { ...report, paper: 'Letter', orientation: 'landscape' };
    expect(checkIpcMessage(IPC.printReport, app, letter, undefined).ok).toBe(true);
  });

  it('refuses a report from anyone but the app top frame (e.g. the report page itself)', () => {
    const fromReport = checkIpcMessage(IPC.printReport, { frameUrl: 'mixwise://report/abc.html', isMainFrame: true }, report, undefined);
    expect(fromReport).toMatchObject({ ok: false, reason: expect.stringContaining('is not the app page') });
    expect(checkIpcMessage(IPC.printReport, { ...app, isMainFrame: false }, report, undefined).ok).toBe(false);
  });

  it('refuses HTML that is not a string, not a document, too large, or holds a script', () => {
    const reason = (payload: unknown) => {
      const check = checkIpcMessage(IPC.printReport, app, payload, undefined);
      return check.ok ? 'accepted' : check.reason;
    };
    expect(reason({ ...report, html: 42 })).toContain('html');
    expect(reason({ ...report, html: '<p>fragment</p>' })).toContain('must be an HTML document');
    expect(reason({ ...report, html: `${html}<SCRIPT>alert(1)</SCRIPT>` })).toContain('must not contain a script element');
    expect(reason({ ...report, html: html + ' '.repeat(MAX_REPORT_HTML_CHARS) })).toContain(`at most ${MAX_REPORT_HTML_CHARS}`);
    // Escaped markup in user text is harmless and accepted.
    expect(reason({ ...report, html: html.replace('R 2.50', '&lt;script&gt;') })).toBe('accepted');
  });

  it('refuses unknown paper, orientation, and extra fields', () => {
    const reason = (payload: unknown) => {
      const check = checkIpcMessage(IPC.printReport, app, payload, undefined);
      return check.ok ? 'accepted' : check.reason;
    };
    expect(reason({ ...report, paper: 'A3' })).toContain('paper');
    expect(reason({ ...report, orientation: 'sideways' })).toContain('orientation');
    expect(reason({ ...report, deviceName: 'office' })).not.toBe('accepted');
    expect(reason(undefined)).not.toBe('accepted');
  });
});

describe('report:export-pdf payload', () => {
  it('accepts a report with a PDF file name', () => {
    const payload = { ...report, suggestedName: 'demo-report.pdf' };
    expect(checkIpcMessage(IPC.exportReportPdf, app, payload, undefined)).toEqual({ ok: true, request: payload });
  });

  it('refuses a path or another extension as the suggested name', () => {
    const path = checkIpcMessage(IPC.exportReportPdf, app, { ...report, suggestedName: '../../x.pdf' }, undefined);
    expect(path).toMatchObject({ ok: false, reason: expect.stringContaining('suggestedName') });
    const extension = checkIpcMessage(IPC.exportReportPdf, app, { ...report, suggestedName: 'demo.exe' }, undefined);
    expect(extension).toMatchObject({ ok: false, reason: expect.stringContaining('must end in .pdf') });
  });
});

describe('report:export-csv payload', () => {
  it('accepts CSV text with a .csv name', () => {
    const payload = { suggestedName: 'demo-table.csv', text: 'option,r_start\r\nNo measures,2.5\r\n' };
    expect(checkIpcMessage(IPC.exportCsv, app, payload, undefined)).toEqual({ ok: true, request: payload });
  });

  it('refuses a wrong name, non-text content, extra fields and oversize text', () => {
    expect(checkIpcMessage(IPC.exportCsv, app, { suggestedName: 'a.json', text: '' }, undefined)).toMatchObject({ ok: false, reason: expect.stringContaining('.csv') });
    expect(checkIpcMessage(IPC.exportCsv, app, { suggestedName: 'a.csv', text: [1, 2] }, undefined)).toMatchObject({ ok: false, reason: expect.stringContaining('text') });
    expect(checkIpcMessage(IPC.exportCsv, app, { suggestedName: 'a.csv', text: '', path: '/etc/x.csv' }, undefined).ok).toBe(false);
    const huge = checkIpcMessage(IPC.exportCsv, app, { suggestedName: 'a.csv', text: 'x'.repeat(MAX_CSV_CHARS + 1) }, undefined);
    expect(huge).toMatchObject({ ok: false, reason: expect.stringContaining(`at most ${MAX_CSV_CHARS}`) });
  });
});

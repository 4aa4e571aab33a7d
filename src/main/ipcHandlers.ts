/**
 * IPC handlers of the main process. Every message passes `checkIpcMessage` (channel,
 * sender, payload) before anything happens; a refused message is logged and answered
 * with an error, never acted on.
 */
import { BrowserWindow, dialog, ipcMain, type IpcMainEvent, type IpcMainInvokeEvent } from 'electron';
import { basename } from 'node:path';
import { IPC, type OpenedScenarioFile, type RecentFile, type SaveOutcome } from '../shared/hostApi.ts';
import { checkIpcMessage, type IpcChannel, type IpcPayload } from './ipcContract.ts';
import { readScenarioFile, saveScenarioText } from './scenarioFiles.ts';
import { writeFileAtomic } from '../shared/atomicWrite.ts';
import { reportPdfOptions } from './reportPrinting.ts';
import { printReportContents, withReportWindow } from './reportWindow.ts';

export interface HandlerContext {
  devServerUrl: string | undefined;
  recent(): RecentFile[];
  rememberRecent(path: string): Promise<void>;
  forgetRecent(path: string): Promise<void>;
  setDocumentState(window: BrowserWindow, title: string, dirty: boolean): void;
}

const SCENARIO_FILTERS = [{ name: 'Scenario (JSON)', extensions: ['json'] }];

function senderOf(event: IpcMainInvokeEvent | IpcMainEvent) {
  return { frameUrl: event.senderFrame?.url, isMainFrame: event.senderFrame !== null && event.senderFrame === event.sender.mainFrame };
}

function handle<C extends IpcChannel>(
  channel: C,
  ctx: HandlerContext,
  run: (payload: IpcPayload<C>, window: BrowserWindow) => Promise<unknown>,
): void {
  ipcMain.handle(channel, async (event, payload: unknown) => {
    const check = checkIpcMessage(channel, senderOf(event), payload, ctx.devServerUrl);
    const window = BrowserWindow.fromWebContents(event.sender);
    if (!check.ok || window === null) {
      const reason = check.ok ? `${channel}: no window` : check.reason;
      console.warn(`IPC refused: ${reason}`);
      throw new Error(`Refused: ${reason}`);
    }
    return run(check.payload, window);
  });
}

async function openPath(path: string, ctx: HandlerContext): Promise<OpenedScenarioFile> {
  const file = await readScenarioFile(path);
  await ctx.rememberRecent(path);
  return file;
}

export function registerIpcHandlers(ctx: HandlerContext): void {
  handle(IPC.open, ctx, async (_payload, window) => {
    const picked = await dialog.showOpenDialog(window, { title: 'Open scenario', filters: SCENARIO_FILTERS, properties: ['openFile'] });
    if (picked.canceled || picked.filePaths.length === 0) return null;
    return openPath(picked.filePaths[0], ctx);
  });

  handle(IPC.openRecent, ctx, async ({ path }) => {
    if (!ctx.recent().some((r) => r.path === path)) throw new Error('Refused: not in the recent-files list');
    try {
      return await openPath(path, ctx);
    } catch {
      await ctx.forgetRecent(path);
      return null;
    }
  });

  handle(IPC.listRecent, ctx, async () => ctx.recent());

  handle(IPC.save, ctx, async ({ path, suggestedName, text }, window): Promise<SaveOutcome> => {
    let target = path;
    if (target === null) {
      const picked = await dialog.showSaveDialog(window, { title: 'Save scenario', defaultPath: suggestedName, filters: SCENARIO_FILTERS });
      if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
      target = picked.filePath;
    } else if (!ctx.recent().some((r) => r.path === target)) {
      // A silent save may only go to a file this user opened or saved through a dialog.
      return { ok: false, cancelled: false, message: 'Not saved: that file was not opened here; use Save as.' };
    }
    try {
      await saveScenarioText(target, text);
    } catch (err) {
      return { ok: false, cancelled: false, message: (err as Error).message };
    }
    await ctx.rememberRecent(target);
    return { ok: true, file: { name: basename(target), path: target } };
  });

  handle(IPC.print, ctx, async (_payload, window) => {
    await new Promise<void>((resolveDone) => window.webContents.print({ printBackground: true }, () => resolveDone()));
  });

  handle(IPC.exportPdf, ctx, async ({ suggestedName }, window): Promise<SaveOutcome> => {
    const picked = await dialog.showSaveDialog(window, { title: 'Export PDF', defaultPath: suggestedName, filters: [{ name: 'PDF', extensions: ['pdf'] }] });
    if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
    const pdf = await window.webContents.printToPDF({ printBackground: true, landscape: true, pageSize: 'A4' });
    await writeFileAtomic(picked.filePath, pdf);
    return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
  });

  handle(IPC.printReport, ctx, async (report, window) => {
    await withReportWindow(report.html, window, (contents) => printReportContents(contents, report));
  });

  handle(IPC.exportReportPdf, ctx, async (report, window): Promise<SaveOutcome> => {
    const picked = await dialog.showSaveDialog(window, { title: 'Export report as PDF', defaultPath: report.suggestedName, filters: [{ name: 'PDF', extensions: ['pdf'] }] });
    if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
    try {
      const pdf = await withReportWindow(report.html, window, (contents) => contents.printToPDF(reportPdfOptions(report)));
      await writeFileAtomic(picked.filePath, pdf);
    } catch (err) {
      return { ok: false, cancelled: false, message: `The PDF was not written: ${(err as Error).message}` };
    }
    return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
  });

  handle(IPC.exportCsv, ctx, async ({ suggestedName, text }, window): Promise<SaveOutcome> => {
    const picked = await dialog.showSaveDialog(window, { title: 'Export CSV', defaultPath: suggestedName, filters: [{ name: 'CSV', extensions: ['csv'] }] });
    if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
    try {
      await writeFileAtomic(picked.filePath, text);
    } catch (err) {
      return { ok: false, cancelled: false, message: `The CSV was not written: ${(err as Error).message}` };
    }
    return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
  });

  ipcMain.on(IPC.documentState, (event, payload: unknown) => {
    const check = checkIpcMessage(IPC.documentState, senderOf(event), payload, ctx.devServerUrl);
    const window = BrowserWindow.fromWebContents(event.sender);
    if (!check.ok || window === null) {
      console.warn(`IPC refused: ${check.ok ? 'no window' : check.reason}`);
      return;
    }
    ctx.setDocumentState(window, check.payload.title, check.payload.dirty);
  });
}

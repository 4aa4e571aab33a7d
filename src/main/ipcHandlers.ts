/**
 * IPC handlers of the main process: one per channel of the shared contract
 * (src/shared/ipcContract.ts), typed by it. Every message passes `checkIpcMessage` (channel,
 * sender, payload) before anything happens; a refused message is logged and answered with an
 * error, never acted on.
 */
import { BrowserWindow, dialog, ipcMain, type IpcMainEvent, type IpcMainInvokeEvent } from 'electron';
import { basename } from 'node:path';
import { IPC, type OpenedScenarioFile, type RecentFile, type SaveOutcome } from '../shared/hostApi.ts';
import { IPC_CHANNELS, type IpcChannel, type IpcHandlers } from '../shared/ipcContract.ts';
import { checkIpcMessage } from './ipcSender.ts';
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

/**
 * Serves `channel` with its handler once the message passes the checks: invoked channels answer
 * (a refusal rejects the renderer's promise), the one-way `document:state` is acted on or dropped.
 */
function serve<C extends IpcChannel>(channel: C, handlers: IpcHandlers<BrowserWindow>, devServerUrl: string | undefined): void {
  const accept = (event: IpcMainInvokeEvent | IpcMainEvent, payload: unknown) => {
    const check = checkIpcMessage(channel, senderOf(event), payload, devServerUrl);
    const window = BrowserWindow.fromWebContents(event.sender);
    if (check.ok && window !== null) return { request: check.request, window };
    const reason = check.ok ? `${channel}: no window` : check.reason;
    console.warn(`IPC refused: ${reason}`);
    return reason;
  };
  if (channel === IPC.documentState) {
    ipcMain.on(channel, (event, payload: unknown) => {
      const accepted = accept(event, payload);
      if (typeof accepted !== 'string') void handlers[channel](accepted.request, accepted.window);
    });
    return;
  }
  ipcMain.handle(channel, async (event, payload: unknown) => {
    const accepted = accept(event, payload);
    if (typeof accepted === 'string') throw new Error(`Refused: ${accepted}`);
    return handlers[channel](accepted.request, accepted.window);
  });
}

async function openPath(path: string, ctx: HandlerContext): Promise<OpenedScenarioFile> {
  const file = await readScenarioFile(path);
  await ctx.rememberRecent(path);
  return file;
}

/** The main process's answer to every channel of the contract. */
export function mainHandlers(ctx: HandlerContext): IpcHandlers<BrowserWindow> {
  return {
    [IPC.open]: async (_request, window) => {
      const picked = await dialog.showOpenDialog(window, { title: 'Open scenario', filters: SCENARIO_FILTERS, properties: ['openFile'] });
      if (picked.canceled || picked.filePaths.length === 0) return null;
      return openPath(picked.filePaths[0], ctx);
    },

    [IPC.openRecent]: async ({ path }) => {
      if (!ctx.recent().some((r) => r.path === path)) throw new Error('Refused: not in the recent-files list');
      try {
        return await openPath(path, ctx);
      } catch {
        await ctx.forgetRecent(path);
        return null;
      }
    },

    [IPC.listRecent]: () => ctx.recent(),

    [IPC.save]: async ({ path, suggestedName, text }, window): Promise<SaveOutcome> => {
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
    },

    [IPC.print]: async (_request, window) => {
      await new Promise<void>((resolveDone) => window.webContents.print({ printBackground: true }, () => resolveDone()));
    },

    [IPC.exportPdf]: async ({ suggestedName }, window): Promise<SaveOutcome> => {
      const picked = await dialog.showSaveDialog(window, { title: 'Export PDF', defaultPath: suggestedName, filters: [{ name: 'PDF', extensions: ['pdf'] }] });
      if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
      const pdf = await window.webContents.printToPDF({ printBackground: true, landscape: true, pageSize: 'A4' });
      await writeFileAtomic(picked.filePath, pdf);
      return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
    },

    [IPC.printReport]: async (report, window) => {
      await withReportWindow(report.html, window, (contents) => printReportContents(contents, report));
    },

    [IPC.exportReportPdf]: async (report, window): Promise<SaveOutcome> => {
      const picked = await dialog.showSaveDialog(window, { title: 'Export report as PDF', defaultPath: report.suggestedName, filters: [{ name: 'PDF', extensions: ['pdf'] }] });
      if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
      try {
        const pdf = await withReportWindow(report.html, window, (contents) => contents.printToPDF(reportPdfOptions(report)));
        await writeFileAtomic(picked.filePath, pdf);
      } catch (err) {
        return { ok: false, cancelled: false, message: `The PDF was not written: ${(err as Error).message}` };
      }
      return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
    },

    [IPC.exportCsv]: async ({ suggestedName, text }, window): Promise<SaveOutcome> => {
      const picked = await dialog.showSaveDialog(window, { title: 'Export CSV', defaultPath: suggestedName, filters: [{ name: 'CSV', extensions: ['csv'] }] });
      if (picked.canceled || picked.filePath === undefined) return { ok: false, cancelled: true };
      try {
        await writeFileAtomic(picked.filePath, text);
      } catch (err) {
        return { ok: false, cancelled: false, message: `The CSV was not written: ${(err as Error).message}` };
      }
      return { ok: true, file: { name: basename(picked.filePath), path: picked.filePath } };
    },

    [IPC.documentState]: ({ title, dirty }, window) => ctx.setDocumentState(window, title, dirty),
  };
}

/** Registers the handler of every channel of the contract. */
export function registerIpcHandlers(ctx: HandlerContext): void {
  const handlers = mainHandlers(ctx);
  for (const channel of IPC_CHANNELS) serve(channel, handlers, ctx.devServerUrl);
}

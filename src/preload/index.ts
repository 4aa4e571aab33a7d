/**
 * Preload: exposes one typed object, `window.mixwiseHost`, and nothing else. It forwards
 * to the main process over the channels in src/shared/hostApi.ts; main validates every message again.
 */
import { contextBridge, ipcRenderer } from 'electron';
import { HOST_GLOBAL, IPC, MENU_COMMANDS, type MenuCommand, type MixwiseHost } from '../shared/hostApi.ts';

const host: MixwiseHost = {
  kind: 'desktop',
  openScenario: () => ipcRenderer.invoke(IPC.open),
  openRecent: (path) => ipcRenderer.invoke(IPC.openRecent, { path }),
  listRecent: () => ipcRenderer.invoke(IPC.listRecent),
  saveScenario: (request) => ipcRenderer.invoke(IPC.save, { path: request.path, suggestedName: request.suggestedName, text: request.text }),
  print: () => ipcRenderer.invoke(IPC.print),
  exportPdf: (suggestedName) => ipcRenderer.invoke(IPC.exportPdf, { suggestedName }),
  printReport: (report) => ipcRenderer.invoke(IPC.printReport, { html: report.html, paper: report.paper, orientation: report.orientation }),
  exportReportPdf: (report, suggestedName) =>
    ipcRenderer.invoke(IPC.exportReportPdf, { html: report.html, paper: report.paper, orientation: report.orientation, suggestedName }),
  exportCsv: (request) => ipcRenderer.invoke(IPC.exportCsv, { suggestedName: request.suggestedName, text: request.text }),
  setDocumentState: (state) => ipcRenderer.send(IPC.documentState, { title: state.title, dirty: state.dirty }),
  onMenuCommand(listener) {
    const forward = (_event: unknown, command: unknown, path: unknown) => {
      if (typeof command === 'string' && (MENU_COMMANDS as readonly string[]).includes(command)) {
        listener(command as MenuCommand, typeof path === 'string' ? path : undefined);
      }
    };
    ipcRenderer.on(IPC.menuCommand, forward);
    return () => ipcRenderer.removeListener(IPC.menuCommand, forward);
  },
};

contextBridge.exposeInMainWorld(HOST_GLOBAL, host);

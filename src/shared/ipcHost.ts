/**
 * `MixwiseHost` over the IPC contract (ipcContract.ts): each host method is one channel with its
 * request. The preload builds the desktop host from Electron's `ipcRenderer`; the web host builds
 * its own from handlers that run in the page. So both hosts send the same requests on the same
 * channels, and the contract's types check every call.
 *
 * Imports only types and channel names (no zod): the sandboxed preload bundles it.
 */
import { IPC, type MenuCommand, type MixwiseHost } from './hostApi.ts';
import type { IpcInvokeChannel, IpcOneWayChannel, IpcReply, IpcRequest } from './ipcContract.ts';

/** How a host carries a request: invoke (answered) or send (one-way). */
export interface IpcTransport {
  invoke<C extends IpcInvokeChannel>(channel: C, request: IpcRequest<C>): Promise<IpcReply<C>>;
  send<C extends IpcOneWayChannel>(channel: C, request: IpcRequest<C>): void;
}

export function hostOverIpc(
  kind: MixwiseHost['kind'],
  { invoke, send }: IpcTransport,
  onMenuCommand: (listener: (command: MenuCommand, path?: string) => void) => () => void,
): MixwiseHost {
  return {
    kind,
    openScenario: () => invoke(IPC.open, undefined),
    openRecent: (path) => invoke(IPC.openRecent, { path }),
    listRecent: () => invoke(IPC.listRecent, undefined),
    saveScenario: (request) => invoke(IPC.save, { path: request.path, suggestedName: request.suggestedName, text: request.text }),
    print: () => invoke(IPC.print, undefined),
    exportPdf: (suggestedName) => invoke(IPC.exportPdf, { suggestedName }),
    printReport: (report) => invoke(IPC.printReport, { html: report.html, paper: report.paper, orientation: report.orientation }),
    exportReportPdf: (report, suggestedName) =>
      invoke(IPC.exportReportPdf, { html: report.html, paper: report.paper, orientation: report.orientation, suggestedName }),
    exportCsv: (request) => invoke(IPC.exportCsv, { suggestedName: request.suggestedName, text: request.text }),
    setDocumentState: (state) => send(IPC.documentState, { title: state.title, dirty: state.dirty }),
    onMenuCommand,
  };
}

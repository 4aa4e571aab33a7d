/**
 * The IPC contract is one list of channels: the main process serves exactly those, the preload
 * and the web host call exactly those, and both hosts refuse a bad request naming the field.
 * Electron is replaced by a recorder (no Electron binary runs in the unit tests).
 */
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { IPC, type MixwiseHost } from '../../src/shared/hostApi.ts';
import { IPC_CHANNELS, type IpcChannel, type IpcHandlers } from '../../src/shared/ipcContract.ts';
import { hostOverIpc } from '../../src/shared/ipcHost.ts';

type Listener = (event: unknown, payload: unknown) => unknown;
const electron = vi.hoisted(() => ({
  handled: new Map<string, Listener>(),
  heard: new Map<string, Listener>(),
  invoked: [] as string[],
  sent: [] as string[],
  exposed: null as unknown,
}));

vi.mock('electron', () => ({
  ipcMain: {
    handle: (channel: string, listener: Listener) => electron.handled.set(channel, listener),
    on: (channel: string, listener: Listener) => electron.heard.set(channel, listener),
  },
  BrowserWindow: { fromWebContents: () => ({ id: 1 }) },
  dialog: {},
  ipcRenderer: {
    invoke: async (channel: string) => void electron.invoked.push(channel),
    send: (channel: string) => void electron.sent.push(channel),
    on: () => undefined,
    removeListener: () => undefined,
  },
  contextBridge: { exposeInMainWorld: (_name: string, host: unknown) => (electron.exposed = host) },
}));

const report = { html: '<!DOCTYPE html><html><body></body></html>', paper: 'A4', orientation: 'portrait' } as const;

/** Calls every method of a host once; returns when all calls settled. */
async function callEveryMethod(host: MixwiseHost): Promise<void> {
  const calls: { [K in Exclude<keyof MixwiseHost, 'kind' | 'onMenuCommand'>]: () => unknown } = {
    openScenario: () => host.openScenario(),
    openRecent: () => host.openRecent('/data/a.json'),
    listRecent: () => host.listRecent(),
    saveScenario: () => host.saveScenario({ path: null, suggestedName: 'a.json', text: '{}' }),
    print: () => host.print(),
    exportPdf: () => host.exportPdf('a.pdf'),
    printReport: () => host.printReport(report),
    exportReportPdf: () => host.exportReportPdf(report, 'a.pdf'),
    exportCsv: () => host.exportCsv({ suggestedName: 'a.csv', text: 'x' }),
    setDocumentState: () => host.setDocumentState({ title: 'Demo', dirty: false }),
  };
  await Promise.allSettled(Object.values(calls).map((call) => call()));
}

const sorted = (channels: Iterable<string>) => [...channels].sort();

/**
 * The web host, loaded by a path tsc does not follow: it is compiled under the renderer's
 * configuration (DOM types), which this Node test configuration leaves out. It touches the DOM
 * only when a handler runs, never for a refused request.
 */
async function webHost(): Promise<{ webHandlers: IpcHandlers<void>; createWebHost(): MixwiseHost }> {
  const path = '../../src/renderer/lib/webHost.ts';
  return import(/* @vite-ignore */ path);
}

describe('one list of IPC channels', () => {
  beforeAll(async () => {
    const { registerIpcHandlers } = await import('../../src/main/ipcHandlers.ts');
    registerIpcHandlers({ devServerUrl: undefined, recent: () => [], rememberRecent: async () => undefined, forgetRecent: async () => undefined, setDocumentState: () => undefined });
    await import('../../src/preload/index.ts');
  });

  it('every host method is one channel of the contract, and every channel is some method', async () => {
    const used: string[] = [];
    const host = hostOverIpc('desktop', { invoke: async (channel) => void used.push(channel) as never, send: (channel) => void used.push(channel) }, () => () => undefined);
    await callEveryMethod(host);
    expect(sorted(used)).toEqual(sorted(IPC_CHANNELS));
    expect(new Set(used).size).toBe(used.length);
  });

  it('the main process serves exactly the contract: one-way document state heard, the rest answered', () => {
    expect(sorted([...electron.handled.keys(), ...electron.heard.keys()])).toEqual(sorted(IPC_CHANNELS));
    expect([...electron.heard.keys()]).toEqual([IPC.documentState]);
  });

  it('the preload calls exactly the contract', async () => {
    await callEveryMethod(electron.exposed as MixwiseHost);
    expect(electron.sent).toEqual([IPC.documentState]);
    expect(sorted([...electron.invoked, ...electron.sent])).toEqual(sorted(IPC_CHANNELS));
  });

  it('the web host answers exactly the contract', async () => {
    const { webHandlers } = await webHost();
    expect(sorted(Object.keys(webHandlers))).toEqual(sorted(IPC_CHANNELS));
  });
});

describe('a bad request is refused, naming the field, by both hosts', () => {
  const app = { senderFrame: { url: 'mixwise://app/index.html' }, sender: {} as { mainFrame?: unknown } };
  app.sender.mainFrame = app.senderFrame;
  const desktop = (channel: IpcChannel, payload: unknown) => Promise.resolve().then(() => electron.handled.get(channel)!(app, payload));

  const cases: { what: string; desktop: () => Promise<unknown>; web: (host: MixwiseHost) => Promise<unknown>; reason: RegExp }[] = [
    {
      what: 'a CSV name without .csv',
      desktop: () => desktop(IPC.exportCsv, { suggestedName: 'table.json', text: 'a,b' }),
      web: (host) => host.exportCsv({ suggestedName: 'table.json', text: 'a,b' }),
      reason: /^Refused: report:export-csv: suggestedName must end in \.csv$/,
    },
    {
      what: 'a path as the suggested scenario name',
      desktop: () => desktop(IPC.save, { path: null, suggestedName: '../a.json', text: '{}' }),
      web: (host) => host.saveScenario({ path: null, suggestedName: '../a.json', text: '{}' }),
      reason: /^Refused: scenario:save: suggestedName must be a file name, not a path$/,
    },
    {
      what: 'a report with a script',
      desktop: () => desktop(IPC.printReport, { ...report, html: `${report.html}<script>x()</script>` }),
      web: (host) => host.printReport({ ...report, html: `${report.html}<script>x()</script>` }),
      reason: /^Refused: report:print: html must not contain a script element$/,
    },
  ];

  it.each(cases)('$what', async ({ desktop: onDesktop, web, reason }) => {
    const { createWebHost } = await webHost();
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    await expect(onDesktop()).rejects.toThrow(reason);
    await expect(web(createWebHost())).rejects.toThrow(reason);
    warn.mockRestore();
  });
});

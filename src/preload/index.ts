/**
 * Preload: exposes one typed object, `window.mixwiseHost`, and nothing else. It forwards
 * to the main process over the IPC contract (src/shared/ipcContract.ts, through ipcHost.ts);
 * main validates every message again.
 */
import { contextBridge, ipcRenderer } from 'electron';
import { HOST_GLOBAL, IPC, MENU_COMMANDS, type MenuCommand } from '../shared/hostApi.ts';
import { hostOverIpc } from '../shared/ipcHost.ts';

const host = hostOverIpc(
  'desktop',
  { invoke: (channel, request) => ipcRenderer.invoke(channel, request), send: (channel, request) => ipcRenderer.send(channel, request) },
  (listener) => {
    const forward = (_event: unknown, command: unknown, path: unknown) => {
      if (typeof command === 'string' && (MENU_COMMANDS as readonly string[]).includes(command)) {
        listener(command as MenuCommand, typeof path === 'string' ? path : undefined);
      }
    };
    ipcRenderer.on(IPC.menuCommand, forward);
    return () => ipcRenderer.removeListener(IPC.menuCommand, forward);
  },
);

contextBridge.exposeInMainWorld(HOST_GLOBAL, host);

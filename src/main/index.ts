/**
 * Electron main process: one window showing the renderer bundle over the app's own scheme,
 * locked down (see windowOptions.ts, contentSecurity.ts), a native menu, and IPC handlers
 * for files and printing. Everything else happens in the renderer.
 */
import { app, BrowserWindow, dialog, Menu, net, protocol, session, shell } from 'electron';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { IPC, type MenuCommand, type RecentFile } from '../shared/hostApi.ts';
import { APP_ENTRY_URL, APP_SCHEME, assetPathFor, mimeTypeFor } from './appProtocol.ts';
import { CONTENT_SECURITY_POLICY, isAllowedNavigation } from './contentSecurity.ts';
import { registerIpcHandlers } from './ipcHandlers.ts';
import { reportPageResponse } from './reportWindow.ts';
import { menuTemplate } from './menu.ts';
import { loadRecent, storeRecent, withRecent, withoutRecent } from './recentFiles.ts';
import { mainWindowOptions } from './windowOptions.ts';
import { closeDecision } from './unsavedChanges.ts';

protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

const devServerUrl = process.env.ELECTRON_RENDERER_URL;
const rendererRoot = join(import.meta.dirname, '../renderer');
const recentStore = () => join(app.getPath('userData'), 'recent-files.json');
let recent: RecentFile[] = [];
const dirtyWindows = new WeakMap<BrowserWindow, boolean>();

function sendCommand(command: MenuCommand): void {
  BrowserWindow.getFocusedWindow()?.webContents.send(IPC.menuCommand, command);
}

function rebuildMenu(): void {
  const actions = {
    send: sendCommand,
    openRecent: (path: string) => BrowserWindow.getFocusedWindow()?.webContents.send(IPC.menuCommand, 'open-recent', path),
    clearRecent: () => void updateRecent([]),
  };
  Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(recent, actions, process.platform === 'darwin')));
}

async function updateRecent(list: RecentFile[]): Promise<void> {
  recent = list;
  await storeRecent(recentStore(), list).catch((err: unknown) => console.warn(`Could not store recent files: ${String(err)}`));
  rebuildMenu();
}

function serveRenderer(): void {
  protocol.handle(APP_SCHEME, async (request) => {
    const report = reportPageResponse(request.url);
    if (report !== null) return report;
    const path = assetPathFor(request.url, rendererRoot);
    if (path === null) return new Response('Not found', { status: 404 });
    const response = await net.fetch(pathToFileURL(path).toString());
    if (!response.ok) return response;
    return new Response(response.body, { status: 200, headers: { 'content-type': mimeTypeFor(path), 'content-security-policy': CONTENT_SECURITY_POLICY } });
  });
}

function createWindow(): void {
  const window = new BrowserWindow(mainWindowOptions(join(import.meta.dirname, '../preload/index.cjs')));
  const contents = window.webContents;
  contents.setWindowOpenHandler(({ url }) => {
    if (/^https:\/\//.test(url)) void shell.openExternal(url);
    return { action: 'deny' };
  });
  contents.on('will-navigate', (event, url) => {
    if (!isAllowedNavigation(url, devServerUrl)) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  window.on('close', (event) => {
    const decision = closeDecision(dirtyWindows.get(window) ?? false, (options) => dialog.showMessageBoxSync(window, options));
    if (decision === 'stay') event.preventDefault();
  });
  window.once('ready-to-show', () => window.show());
  void window.loadURL(devServerUrl ?? APP_ENTRY_URL);
}

app.enableSandbox();
void app.whenReady().then(async () => {
  session.defaultSession.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  serveRenderer();
  recent = await loadRecent(recentStore());
  registerIpcHandlers({
    devServerUrl,
    recent: () => recent,
    rememberRecent: (path) => updateRecent(withRecent(recent, path)),
    forgetRecent: (path) => updateRecent(withoutRecent(recent, path)),
    setDocumentState: (window, title, dirty) => {
      dirtyWindows.set(window, dirty);
      window.setTitle(`${dirty ? '• ' : ''}${title} — Mixwise`);
      window.setDocumentEdited(dirty);
    },
  });
  rebuildMenu();
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});

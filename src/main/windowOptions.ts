/**
 * The main window's options, as a plain function so the security settings can be tested.
 * Rules (Electron security checklist, electronjs.org/docs/latest/tutorial/security):
 * context isolation on, renderer sandboxed, no Node integration, web security on,
 * no webview tag, no insecure content.
 */
import type { BrowserWindowConstructorOptions, WebPreferences } from 'electron';

/** The checklist's web preferences, shared by every window the app opens (main and report). */
export const LOCKED_DOWN_WEB_PREFERENCES: Readonly<WebPreferences> = {
  contextIsolation: true,
  sandbox: true,
  nodeIntegration: false,
  nodeIntegrationInWorker: false,
  nodeIntegrationInSubFrames: false,
  webSecurity: true,
  allowRunningInsecureContent: false,
  webviewTag: false,
  spellcheck: false,
};

export function mainWindowOptions(preloadPath: string): BrowserWindowConstructorOptions {
  return {
    width: 1360,
    height: 880,
    minWidth: 900,
    minHeight: 600,
    show: false,
    title: 'Mixwise',
    backgroundColor: '#f7f6f2',
    webPreferences: { ...LOCKED_DOWN_WEB_PREFERENCES, preload: preloadPath },
  };
}

import { describe, expect, it } from 'vitest';
import { mainWindowOptions } from '../../src/main/windowOptions.ts';

describe('mainWindowOptions', () => {
  it('locks the renderer down (Electron security checklist)', () => {
    const prefs = mainWindowOptions('/app/preload/index.cjs').webPreferences ?? {};
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.webviewTag).toBe(false);
    expect(prefs.preload).toBe('/app/preload/index.cjs');
  });
});

/**
 * What `npm start` opens, decided from facts about this machine (a plain function, so it is
 * tested without starting anything):
 *   1. the Electron desktop app when its runtime starts here;
 *   2. else, when a Chromium is installed and there is a display to show a window on, the app in
 *      a Chromium application window (`--app=URL`, no tabs or address bar) with its own profile
 *      folder, so it keeps its own saved working copy and never touches the user's browser;
 *   3. else web mode only: the address is printed for any browser.
 * In cases 2 and 3 the web server runs and its address is printed either way.
 */

export interface MachineFacts {
  /** The Electron binary, or null when it is not installed. */
  electronBinary: string | null;
  /** Whether that binary runs here (`electron --version` succeeded). */
  electronStarts: boolean;
  /** The Chromium binary when it exists, else null. */
  chromium: string | null;
  /** Whether a graphical display is available (DISPLAY or WAYLAND_DISPLAY on Linux; always elsewhere). */
  hasDisplay: boolean;
  /** Running as root (Chromium then needs --no-sandbox). */
  isRoot: boolean;
  /** Address web mode serves. */
  url: string;
  /** Profile folder for the Chromium window. */
  profileDir: string;
}

export type StartPlan =
  | { kind: 'electron'; binary: string }
  | { kind: 'chromium-window'; chromium: string; args: string[]; url: string; why: string }
  | { kind: 'web'; url: string; why: string };

/** Why Electron is not used, in a few words. */
function electronMissing(facts: MachineFacts): string {
  return facts.electronBinary === null ? 'Electron runtime is missing here (binary not installed)' : 'Electron runtime is missing here (binary does not start)';
}

/** Chromium flags for an application window of the app with its own profile. */
export function chromiumWindowArgs(url: string, profileDir: string, isRoot: boolean): string[] {
  return [
    `--app=${url}`,
    `--user-data-dir=${profileDir}`,
    '--no-first-run',
    '--no-default-browser-check',
    '--disable-sync',
    '--disable-background-networking',
    ...(isRoot ? ['--no-sandbox'] : []),
  ];
}

export function planStart(facts: MachineFacts): StartPlan {
  if (facts.electronBinary !== null && facts.electronStarts) return { kind: 'electron', binary: facts.electronBinary };
  const missing = electronMissing(facts);
  if (facts.chromium !== null && facts.hasDisplay) {
    return {
      kind: 'chromium-window',
      chromium: facts.chromium,
      args: chromiumWindowArgs(facts.url, facts.profileDir, facts.isRoot),
      url: facts.url,
      why: `${missing}: opening the app in a Chromium window instead.`,
    };
  }
  const noWindow = facts.chromium === null ? 'no Chromium installed' : 'no display for a window';
  return { kind: 'web', url: facts.url, why: `${missing}, ${noWindow}: starting web mode instead.` };
}

/** Whether a window can be shown: on Linux only with an X11 or Wayland display. */
export function hasDisplay(platform: string, env: Record<string, string | undefined>): boolean {
  if (platform !== 'linux') return true;
  return Boolean(env.DISPLAY) || Boolean(env.WAYLAND_DISPLAY);
}

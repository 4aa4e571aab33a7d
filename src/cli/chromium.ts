/**
 * The local Chromium every headless use of a browser shares: `mixwise report --out X.pdf`
 * (reportPdf.ts) and the browser tests (playwright.config.ts). Always Debian's chromium package
 * or $CHROMIUM_PATH, never a downloaded browser.
 */

/** Where Debian's chromium package puts the browser. */
export const DEFAULT_CHROMIUM = '/usr/bin/chromium';

/** Flags that keep Chromium offline, quiet and working without a display or sandbox. */
export const CHROMIUM_ARGS: readonly string[] = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** $CHROMIUM_PATH when set and not empty, else /usr/bin/chromium (whether or not it exists). */
export function chromiumPath(env: Record<string, string | undefined>): string {
  return env.CHROMIUM_PATH !== undefined && env.CHROMIUM_PATH !== '' ? env.CHROMIUM_PATH : DEFAULT_CHROMIUM;
}

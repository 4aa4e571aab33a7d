/**
 * Printing the report's HTML to PDF with a locally installed Chromium, driven by playwright-core
 * (never a downloaded browser). The page's own CSS sets paper size, margins and the running
 * footer (`preferCSSPageSize`).
 */
import { existsSync } from 'node:fs';
import { CliError, EXIT_CODES } from './errors.ts';

/** Where Debian's chromium package puts the browser. */
export const DEFAULT_CHROMIUM = '/usr/bin/chromium';

/** Flags that keep Chromium offline, quiet and working without a display or sandbox. */
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** $CHROMIUM_PATH when set, else /usr/bin/chromium; a `CliError` (exit 3) when it is not there. */
export function findChromium(env: Record<string, string | undefined>): string {
  const chosen = env.CHROMIUM_PATH !== undefined && env.CHROMIUM_PATH !== '' ? env.CHROMIUM_PATH : DEFAULT_CHROMIUM;
  if (!existsSync(chosen)) {
    const where = chosen === DEFAULT_CHROMIUM ? `${DEFAULT_CHROMIUM} (set CHROMIUM_PATH to use another)` : `CHROMIUM_PATH=${chosen}`;
    throw new CliError(`cannot make a PDF: no Chromium found at ${where}; install it (Debian: apt-get install chromium) or write --out report.html and print that`, EXIT_CODES.fileError);
  }
  return chosen;
}

/** Renders `html` in Chromium and returns the PDF bytes. */
export async function printHtmlToPdf(html: string, chromiumPath: string): Promise<Uint8Array> {
  let playwright: typeof import('playwright-core');
  try {
    playwright = await import('playwright-core');
  } catch {
    throw new CliError('cannot make a PDF: the playwright-core package is not installed (npm install)', EXIT_CODES.fileError);
  }
  const browser = await playwright.chromium.launch({ executablePath: chromiumPath, args: CHROMIUM_ARGS, timeout: 60_000 });
  try {
    const page = await browser.newPage();
    await page.setContent(html, { waitUntil: 'load' });
    return await page.pdf({ preferCSSPageSize: true, printBackground: true, tagged: true, outline: false });
  } finally {
    await browser.close();
  }
}

/**
 * Printing the report's HTML to PDF with a locally installed Chromium, driven by playwright-core
 * (never a downloaded browser). The page's own CSS sets paper size, margins and the running
 * footer (`preferCSSPageSize`).
 */
import { existsSync } from 'node:fs';
import { CHROMIUM_ARGS, DEFAULT_CHROMIUM, chromiumPath } from './chromium.ts';
import { CliError, EXIT_CODES } from './errors.ts';

/** $CHROMIUM_PATH when set, else /usr/bin/chromium; a `CliError` (exit 3) when it is not there. */
export function findChromium(env: Record<string, string | undefined>): string {
  const chosen = chromiumPath(env);
  if (!existsSync(chosen)) {
    const where = chosen === DEFAULT_CHROMIUM ? `${DEFAULT_CHROMIUM} (set CHROMIUM_PATH to use another)` : `CHROMIUM_PATH=${chosen}`;
    throw new CliError(`cannot make a PDF: no Chromium found at ${where}; install it (Debian: apt-get install chromium) or write --out report.html and print that`, EXIT_CODES.fileError);
  }
  return chosen;
}

/** Renders `html` in Chromium and returns the PDF bytes. */
export async function printHtmlToPdf(html: string, executablePath: string): Promise<Uint8Array> {
  let playwright: typeof import('playwright-core');
  try {
    playwright = await import('playwright-core');
  } catch {
    throw new CliError('cannot make a PDF: the playwright-core package is not installed (npm install)', EXIT_CODES.fileError);
  }
  const browser = await playwright.chromium.launch({ executablePath, args: [...CHROMIUM_ARGS], timeout: 60_000 });
  try {
    const page = await browser.newPage();
    await page.setContent(html, { waitUntil: 'load' });
    return await page.pdf({ preferCSSPageSize: true, printBackground: true, tagged: true, outline: false });
  } finally {
    await browser.close();
  }
}

/**
 * What the browser tests share: paths, the artifacts folder, the command line, and the app
 * opened in web mode with its results settled.
 */
import { expect, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromiumPath } from '../src/cli/chromium.ts';

export const ROOT = fileURLToPath(new URL('..', import.meta.url));
export const DEMO = join(ROOT, 'resources/demo-scenario.json');
const BIN = join(ROOT, 'bin/mixwise.mjs');

/** Screenshots and rendered pages for a look by eye. */
export const ARTIFACTS = join(ROOT, 'e2e-artifacts');
mkdirSync(ARTIFACTS, { recursive: true });

/** The Chromium the tests and `mixwise report` use ($CHROMIUM_PATH or /usr/bin/chromium). */
export const CHROMIUM = chromiumPath(process.env);

/** Runs the built command line (bin/mixwise.mjs) and returns what it prints. */
export function mixwise(...args: string[]): string {
  return execFileSync(process.execPath, [BIN, ...args], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
}

/** Waits until the newest results are shown (no stale marker). */
export async function settled(page: Page): Promise<void> {
  await expect(page.getByTestId('run-status')).toHaveAttribute('data-stale', 'false', { timeout: 20_000 });
}

/** Opens the app with its results settled; the returned list collects uncaught page errors. */
export async function openApp(page: Page): Promise<string[]> {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  return errors;
}

/** The option columns of the board. */
export const columns = (page: Page) => page.locator('[data-testid^="option-column-"]');

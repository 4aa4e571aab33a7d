/**
 * The app's engine pool (src/renderer/lib/engineClient.ts): one Web Worker per logical core the
 * browser reports (navigator.hardwareConcurrency, at most 8), started with the app; the options of
 * a run spread over them (breadth first: test/engine/poolScheduling.test.ts).
 */
import { expect, test } from '@playwright/test';
import { openApp } from './helpers.ts';

for (const cores of [3, 16]) {
  test(`with ${cores} logical cores the app runs ${Math.min(8, cores)} engine workers`, async ({ page }) => {
    await page.addInitScript((n) => Object.defineProperty(Navigator.prototype, 'hardwareConcurrency', { get: () => n, configurable: true }), cores);
    const errors = await openApp(page);
    const engineWorkers = () => page.workers().filter((w) => w.url().includes('engine.worker'));
    await expect.poll(() => engineWorkers().length).toBe(Math.min(8, cores));
    expect(errors).toEqual([]);
  });
}

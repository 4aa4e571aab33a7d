/**
 * Uncertain inputs in the Assumptions view (web mode, Debian's chromium): an input is made
 * uncertain with the keyboard, its range edited, a refused range named by the labels on screen
 * (no undo step taken), the kind changed with centre and range kept, the source required, a second
 * input added and the first removed with a notice; every accepted change is one undo step. The fit
 * panel's "Use this R0" can carry the fit's 95% interval as R0's lognormal range, in the same step.
 */
import { expect, test, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { r0RoundedToFit } from '../src/renderer/lib/fitFromCounts.ts';
import { settled } from './helpers.ts';

async function type(page: Page, testid: string, text: string) {
  const input = page.getByTestId(testid);
  await input.fill(text);
  await input.press('Enter');
}

test('uncertain inputs: add, edit, refuse, change kind, source, remove, undo', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  const panel = page.getByTestId('uncertainty-panel');
  await expect(panel.getByRole('heading', { name: 'Uncertain inputs' })).toBeVisible();

  // By keyboard: pick R0 in the list, press the button with Enter.
  const pick = page.getByTestId('uncertainty-add-name');
  await pick.focus();
  await pick.selectOption({ label: 'R0' });
  await page.keyboard.press('Tab');
  await expect(page.getByTestId('uncertainty-add-section')).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('uncertain-0-name')).toHaveValue('r0');
  await expect(page.getByTestId('uncertain-0-low')).toHaveValue('2');
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue('3');
  await expect(page.getByTestId('uncertainty-draws')).toHaveValue('1000');
  await expect(page.getByTestId('uncertainty-level')).toHaveValue('90');

  await type(page, 'uncertain-0-high', '3.2');
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue('3.2');

  // A refused range: the message uses the labels shown, not the file's paths; nothing changes.
  await type(page, 'uncertain-0-high', '1.5');
  const row = page.getByTestId('uncertain-0');
  await expect(row.getByRole('alert')).toHaveText('Uncertain R0: high must be above low (2), got 1.5');
  await expect(row.getByRole('alert')).not.toContainText('uncertainty.parameters');
  await page.getByTestId('uncertain-0-high').press('Escape');
  await type(page, 'uncertainty-draws', '1');
  await expect(panel.getByRole('alert')).toContainText('Draws must be at least 2, got 1.');
  await page.getByTestId('uncertainty-draws').press('Escape');

  // Undo goes back one accepted change at a time: high 3.2 -> 3, then no section.
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue('3');
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('uncertainty-add-section')).toBeVisible();
  await page.getByTestId('redo').click();
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue('3');

  // Another kind keeps the centre and the range.
  const kind = page.getByTestId('uncertain-0-kind');
  await kind.focus();
  await kind.selectOption('lognormal');
  await expect(page.getByTestId('uncertain-0-median')).toHaveValue('2.5');
  await expect(page.getByTestId('uncertain-0-low')).toHaveValue('2');
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue('3');
  await type(page, 'uncertain-0-median', '3.5');
  await expect(row.getByRole('alert')).toHaveText('Uncertain R0: 95% range must have low < median (3.5) < high, got [2,3]');
  await page.getByTestId('uncertain-0-median').press('Escape');
  await page.getByTestId('uncertain-0-spread').selectOption('geometricSd');
  await expect(page.getByTestId('uncertain-0-gsd')).toHaveValue('1.109');

  // The source is required and kept.
  const source = page.getByTestId('uncertain-0-source');
  await source.fill('');
  await source.blur();
  await expect(row.getByRole('alert')).toContainText('Uncertain R0: source must say where the range comes from');
  await source.fill('Range of published estimates for this pathogen (invented for the demo).');
  await source.blur();
  await expect(row.getByRole('alert')).toHaveCount(0);

  // A second input, then the first removed: a notice with the undo hint.
  await page.getByTestId('uncertainty-add-name').selectOption({ label: 'Work contacts factor' });
  await page.getByTestId('uncertainty-add').click();
  await expect(page.getByTestId('uncertain-1-name')).toHaveValue('contactScale.work');
  await expect(page.getByTestId('uncertain-1-low')).toHaveValue('0.8');
  await page.getByTestId('uncertain-0-remove').click();
  await expect(page.getByTestId('notice')).toContainText('Removed R0 from the uncertain inputs. Undo (Ctrl+Z) brings it back.');
  await expect(page.getByTestId('uncertain-0-name')).toHaveValue('contactScale.work');
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('uncertain-0-name')).toHaveValue('r0');
  await expect(page.getByTestId('uncertain-0-source')).toHaveValue('Range of published estimates for this pathogen (invented for the demo).');

  await settled(page);
  await page.screenshot({ path: 'e2e-artifacts/uncertainty-editor.png', fullPage: true });
  expect(errors).toEqual([]);
});

test('"Use this R0" with its interval writes R0 lognormal from the fit in one undo step', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await page.getByTestId('fit-file').setInputFiles('resources/example-cases.csv');
  await expect(page.getByTestId('fit-results')).toHaveAttribute('data-busy', 'false', { timeout: 20_000 });
  await expect(page.getByTestId('fit-r0')).toBeVisible();
  const fit = JSON.parse(execFileSync('npx', ['mixwise', 'fit', 'resources/example-cases.csv', '--scenario', 'resources/demo-scenario.json', '--format', 'json', '--family', 'negative-binomial'], { encoding: 'utf8' })) as {
    r0: number;
    r0Interval: [number, number];
  };
  const median = r0RoundedToFit(fit.r0, fit.r0Interval);
  const four = (x: number) => String(Number(x.toPrecision(4)));

  await page.getByTestId('fit-with-interval').check();
  await page.getByTestId('fit-apply').click();
  await expect(page.getByTestId('fit-applied')).toContainText("with its 95% interval");
  await expect(page.getByTestId('r0-input')).toHaveValue(String(median));
  await expect(page.getByTestId('uncertain-0-name')).toHaveValue('r0');
  await expect(page.getByTestId('uncertain-0-kind')).toHaveValue('lognormal');
  await expect(page.getByTestId('uncertain-0-median')).toHaveValue(String(median));
  await expect(page.getByTestId('uncertain-0-low')).toHaveValue(four(fit.r0Interval[0]));
  await expect(page.getByTestId('uncertain-0-high')).toHaveValue(four(fit.r0Interval[1]));
  await expect(page.getByTestId('uncertain-0-source')).toHaveValue(/^Fit of example-cases\.csv, days \d+ to \d+ \(2031-\d\d-\d\d to 2031-\d\d-\d\d\): R0 /);

  // One step: undo restores R0 2.5 and no uncertain input.
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('r0-input')).toHaveValue('2.5');
  await expect(page.getByTestId('uncertainty-add-section')).toBeVisible();
  await expect(page.getByTestId('undo')).toBeDisabled();
  expect(errors).toEqual([]);
});

/**
 * Charts in the app (web mode, Debian's chromium): readable log-scale ticks with a sensible
 * floor, each option drawn with the report's dash and marker as well as its colour, and contact
 * heatmaps on one colour scale with a key.
 */
import { expect, test } from '@playwright/test';
import { optionStyle } from '../src/report/palette.ts';
import { ARTIFACTS, openApp } from './helpers.ts';

test('ICU beds on a log scale: ticks read as plain numbers and the axis stops at a sensible floor', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Curves' }).click();
  await page.getByTestId('metric-icuOccupancy').check();
  await page.getByLabel('Log scale').check();
  const canvas = page.getByTestId('curves-chart').locator('canvas');
  await expect(canvas).toHaveAttribute('data-y-scale', 'logarithmic');
  const min = Number(await canvas.getAttribute('data-y-min'));
  expect(min).toBeGreaterThanOrEqual(0.01);
  const ticks = ((await canvas.getAttribute('data-y-ticks')) ?? '').split('|').filter((t) => t !== '');
  expect(ticks.length).toBeGreaterThan(2);
  for (const tick of ticks) {
    expect(tick.length, tick).toBeLessThanOrEqual(8);
    expect(tick, tick).toMatch(/^[\d,]+(\.\d{1,2})?$/);
  }
  await page.getByTestId('curves-chart').screenshot({ path: `${ARTIFACTS}/curves-icu-log.png` });
});

test('curves use the report\'s dash pattern and marker for each option, not colour alone', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Curves' }).click();
  const canvas = page.getByTestId('curves-chart').locator('canvas');
  const series = JSON.parse((await canvas.getAttribute('data-series')) ?? '[]') as { label: string; dash: number[]; marker: string }[];
  const options = series.slice(0, 5);
  expect(options).toHaveLength(5);
  options.forEach((s, k) => {
    const style = optionStyle(k);
    expect(s.dash.join(' '), s.label).toBe(style.dash);
  });
  expect(new Set(options.map((s) => s.marker)).size).toBe(5);
  expect(new Set(options.map((s) => s.dash.join(' '))).size).toBe(4);
  await page.emulateMedia({ colorScheme: 'light' });
  await page.addStyleTag({ content: 'canvas { filter: grayscale(1); }' });
  await page.getByTestId('curves-chart').screenshot({ path: `${ARTIFACTS}/curves-greyscale.png` });
});

test('contact heatmaps share one colour scale, shown in a key', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  const key = page.getByTestId('heatmap-key');
  await expect(key).toBeVisible();
  const baseline = await key.getAttribute('data-max');
  // Schools closed (option 1, phase 1): the same scale, so the closed-school cells turn lighter.
  await page.getByTestId('matrix-option').selectOption({ index: 1 });
  await page.getByTestId('matrix-phase').selectOption({ index: 1 });
  await expect(key).toHaveAttribute('data-max', baseline ?? '');
  await page.getByTestId('matrix-choice').selectOption('school');
  await expect(key).toHaveAttribute('data-max', baseline ?? '');
  await page.getByTestId('matrix-choice').selectOption('combined');
  await page.locator('figure.heatmap').screenshot({ path: `${ARTIFACTS}/heatmap-closed-schools.png` });
});

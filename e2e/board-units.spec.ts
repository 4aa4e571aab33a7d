/**
 * The options board writes every count with its unit (a bare "1.26 M" says nothing about what was
 * counted): infections and deaths in persons, beds against capacity in beds, doses in doses.
 */
import { expect, test } from '@playwright/test';
import { openApp } from './helpers.ts';

test('board counts carry their unit', async ({ page }) => {
  const errors = await openApp(page);
  await expect(page.getByTestId('cell-infections-0').locator('.main')).toHaveText(/^[\d.,]+( M)? persons$/);
  await expect(page.getByTestId('cell-deaths-0').locator('.main')).toHaveText(/^[\d.,]+( M)? persons$/);
  await expect(page.getByTestId('cell-peakIcuOccupancy-0').locator('.main')).toHaveText(/^[\d,]+ \/ [\d,]+ beds$/);
  expect(errors).toEqual([]);
});

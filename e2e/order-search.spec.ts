/**
 * "Find the best order" in the vaccination panel (web mode, Debian's chromium): the orders and
 * values the engine's search gives, progress while it runs, and applying or adding an order as
 * one undo step each.
 */
import { expect, test, type Page } from '@playwright/test';
import { inThreadEvaluator, prepareOrderSearch, runScenario, searchOrders, priorityOf } from '../src/engine/index.ts';
import { demoScenario } from './engineReference.ts';
import { ARTIFACTS, columns, openApp, settled } from './helpers.ts';

const cellValue = async (page: Page, id: string) => Number(await page.getByTestId(id).getAttribute('data-value'));

// Three groups (0-49, 50-59, 60+): six orders, a search of a few seconds.
const SPEC = '0-9,10-11,12-15';
const GROUPS = [[0, 1, 2, 3, 4, 5, 6, 7, 8, 9], [10, 11], [12, 13, 14, 15]];

test('finds the engine\'s best orders for deaths, applies one and adds another as an option, each undoable', async ({ page }) => {
  const errors = await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.vaccinationCampaign !== undefined);
  const prepared = prepareOrderSearch(scenario, { option: scenario.options[o].name, outcome: 'deaths', groups: GROUPS });
  if (!prepared.ok) throw new Error('request must fit the demo');
  const expected = await searchOrders(prepared.job, inThreadEvaluator(prepared.job), { top: 3 });

  await page.getByTestId(`option-name-${o}`).click();
  const finder = page.getByTestId('best-order-finder');
  await finder.getByTestId('order-groups').selectOption('custom');
  await finder.getByTestId('order-groups-spec').fill(SPEC);
  await finder.getByTestId('order-top').fill('3');
  await finder.getByTestId('order-find').click();
  await expect(finder.getByTestId('found-order-0')).toBeVisible({ timeout: 60_000 });
  await expect(finder.getByTestId('order-method')).toContainText('Exhaustive: all 6 orders of 3 groups');
  for (const [k, found] of expected.orders.entries()) {
    expect(await cellValue(page, `found-order-value-${k}`)).toBeCloseTo(found.value, 6);
  }
  await expect(finder.getByTestId('found-order-text-0')).toContainText('1. 60+ > 50-59 > 0-49');
  await expect(finder.getByTestId('builtin-order-0')).toContainText('Campaign order');
  await page.screenshot({ path: `${ARTIFACTS}/order-search.png`, fullPage: true });

  // Add the second-best order as a new option: one more column, with the search's deaths.
  const n = await columns(page).count();
  await finder.getByTestId('order-add-1').click();
  await expect(columns(page)).toHaveCount(n + 1);
  await settled(page);
  expect(await cellValue(page, `cell-deaths-${o + 1}`)).toBeCloseTo(expected.orders[1].value, 6);
  await page.getByTestId('undo').click();
  await expect(columns(page)).toHaveCount(n);

  // Use the best order for the option itself: the board's deaths become the search's best.
  await page.getByTestId(`option-name-${o}`).click();
  const before = await cellValue(page, `cell-deaths-${o}`);
  await page.getByTestId('best-order-finder').getByTestId('order-apply-0').click();
  await settled(page);
  const applied = structuredClone(scenario);
  applied.vaccinationCampaigns[0].priority = priorityOf(prepared.job, expected.orders[0].permutation);
  expect(await cellValue(page, `cell-deaths-${o}`)).toBeCloseTo(runScenario(applied).options[o].deaths, 6);
  await page.getByTestId('undo').click();
  await settled(page);
  expect(await cellValue(page, `cell-deaths-${o}`)).toBeCloseTo(before, 6);
  expect(errors).toEqual([]);
});

test('shows progress while searching and stops on request', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.vaccinationCampaign !== undefined);
  await page.getByTestId(`option-name-${o}`).click();
  const finder = page.getByTestId('best-order-finder');
  // The campaign's own 13 groups: a long heuristic search.
  await finder.getByTestId('order-find').click();
  await expect(finder.getByTestId('order-progress')).toBeVisible();
  await expect(finder.getByTestId('order-progress')).not.toHaveAttribute('value', '0', { timeout: 30_000 });
  await finder.getByTestId('order-stop').click();
  await expect(finder.getByTestId('order-progress')).toHaveCount(0);
  await expect(finder.getByTestId('order-find')).toBeEnabled();
});

test('refuses groups that repeat a band, in words', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.vaccinationCampaign !== undefined);
  await page.getByTestId(`option-name-${o}`).click();
  const finder = page.getByTestId('best-order-finder');
  await finder.getByTestId('order-groups').selectOption('custom');
  await finder.getByTestId('order-groups-spec').fill('0-9,9-15');
  await finder.getByTestId('order-find').click();
  await expect(finder.getByTestId('order-problems')).toContainText('Groups must not repeat a band: band 9 (45-49) appears twice');
});

test('with uncertain inputs, shows the share of draws each top order is best; includes the comparison in the report, one undo step, left out once outdated; says when an order is already the option\'s', async ({ page }) => {
  const errors = await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.vaccinationCampaign !== undefined);

  // R0 uncertain, with few draws.
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await page.getByTestId('uncertainty-add-name').selectOption({ label: 'R0' });
  await page.getByTestId('uncertainty-add-section').click();
  await page.getByTestId('uncertainty-draws').fill('6');
  await page.getByTestId('uncertainty-draws').press('Enter');
  await expect(page.getByTestId('uncertainty-draws')).toHaveValue('6');
  await page.getByRole('tab', { name: 'Board' }).click();

  await page.getByTestId(`option-name-${o}`).click();
  const finder = page.getByTestId('best-order-finder');
  await finder.getByTestId('order-groups').selectOption('custom');
  await finder.getByTestId('order-groups-spec').fill(SPEC);
  await finder.getByTestId('order-top').fill('3');
  await finder.getByTestId('order-find').click();
  await expect(finder.getByTestId('order-draws')).toContainText('share of 6 uncertainty draws', { timeout: 90_000 });
  const shares = await Promise.all([0, 1, 2].map(async (k) => Number(await finder.getByTestId(`found-order-value-${k}-share`).getAttribute('data-share'))));
  expect(shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 9);
  for (const x of shares) expect(Math.abs(x * 12 - Math.round(x * 12))).toBeLessThan(1e-9);
  await expect(finder.getByTestId('found-order-value-0-share')).toHaveText(/^\d+ %$/);

  // Include in the report (one undo step).
  await finder.getByTestId('order-include').click();
  await expect(finder.getByTestId('order-included')).toBeVisible();
  // Using the best order for the option changes the scenario, which outdates the included comparison.
  await finder.getByTestId('order-apply-0').click();
  await expect(finder.getByTestId('order-method')).toContainText('has changed since');
  // Adding the order the option now runs as a new option says so and adds nothing.
  const n = await columns(page).count();
  await finder.getByTestId('order-add-0').click();
  await expect(finder.getByTestId('order-notice')).toContainText('already runs, so no option was added');
  await expect(columns(page)).toHaveCount(n);

  // The report leaves the outdated comparison out and says so; undoing the apply brings it back,
  // undoing the include takes it out.
  await page.getByRole('tab', { name: 'Report' }).click();
  const report = page.frameLocator('iframe.sheet');
  await expect(page.getByTestId('report-orders-outdated')).toBeVisible();
  await expect(report.locator('h1')).toContainText('Policy options report', { timeout: 30_000 });
  await expect(report.locator('#orders')).toHaveCount(0);
  await page.getByTestId('undo').click();
  await expect(report.locator('#orders')).toContainText('Vaccination orders compared', { timeout: 30_000 });
  await expect(page.getByTestId('report-orders-outdated')).toHaveCount(0);
  await expect(report.locator('#orders')).toContainText('Best in draws');
  await expect(report.locator('#orders tr[data-row="order-0"]')).toContainText('1. 60+ > 50-59 > 0-49');
  await page.screenshot({ path: `${ARTIFACTS}/order-search-report.png`, fullPage: true });
  await page.getByTestId('undo').click();
  await expect(report.locator('#orders')).toHaveCount(0, { timeout: 30_000 });
  await page.getByTestId('redo').click();
  await expect(report.locator('#orders')).toHaveCount(1, { timeout: 30_000 });

  // Back on the board, the finder still shows what it found.
  await page.getByRole('tab', { name: 'Options board' }).click();
  await page.getByTestId(`option-name-${o}`).click();
  await expect(finder.getByTestId('found-order-text-0')).toContainText('1. 60+ > 50-59 > 0-49');
  await expect(finder.getByTestId('order-included')).toBeVisible();
  expect(errors).toEqual([]);
});

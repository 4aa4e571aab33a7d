/**
 * Draws of the uncertain inputs on the board and in the Spread view (web mode, Debian's chromium):
 * the deterministic board shows first, the draws run on the app's worker pool with a progress bar,
 * count and Cancel; intervals fill in under each cell and the chance rows appear, equal to the
 * engine's summary of the same draws computed here in one thread; Cancel stops, an edit restarts
 * the draws for the edited scenario, and the app answers clicks while draws run. The Spread view
 * shows the same summary; the printed report and the table CSV carry the finished draws.
 */
import { expect, test, type Page } from '@playwright/test';
import { readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateDrawRange, parseScenarioText, prepareDraws, runScenario, summariseDraws, type Scenario } from '../src/engine/index.ts';
import { catalogueReader } from '../src/report/drawOutcomes.ts';
import { formatInterval, screen } from '../src/report/numberFormat.ts';
import { outcome, valueContextOf } from '../src/report/outcomes.ts';
import { DEMO, settled } from './helpers.ts';

function withDraws(draws: number, seed: number): Scenario {
  const parsed = parseScenarioText(readFileSync(DEMO, 'utf8'));
  if (!parsed.ok) throw new Error('The demo scenario is not valid');
  return {
    ...parsed.scenario,
    uncertainty: {
      draws,
      seed,
      intervalLevel: 0.9,
      parameters: [
        { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'Invented range for the test' },
        { name: 'contactScale.work', distribution: { kind: 'triangular', low: 0.7, mode: 1, high: 1.2 }, source: 'Invented range for the test' },
      ],
    },
  };
}

async function openScenario(page: Page, scenario: Scenario, name: string) {
  const path = join(tmpdir(), `${name}-${Date.now()}.json`);
  writeFileSync(path, JSON.stringify(scenario));
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('open').click()]);
  await chooser.setFiles(path);
}

test('intervals and chances fill in from the draws, equal to the engine summary; progress and count while they run', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  const scenario = withDraws(48, 5);
  await openScenario(page, scenario, 'mixwise-draws');
  await settled(page);

  // The deterministic board is there at once (the draws come after).
  const deterministic = runScenario(scenario);
  // (Equal up to the last bits of a double: the browser's and Node's libm may round differently.)
  const shown = Number(await page.getByTestId('cell-deaths-1').getAttribute('data-value'));
  expect(Math.abs(shown - deterministic.options[1].deaths)).toBeLessThan(1e-9 * deterministic.options[1].deaths);
  const status = page.getByTestId('draws-status');
  await expect(status).toBeVisible();
  await expect(status).toHaveAttribute('data-state', 'done', { timeout: 60_000 });
  await expect(page.getByTestId('draws-count')).toHaveText('48 draws done');

  // The same summary as the engine gives on one thread for the same draws.
  const p = prepareDraws(scenario);
  const summary = summariseDraws(p, evaluateDrawRange(p, 0, 48, catalogueReader), catalogueReader.keys);
  const context = valueContextOf(deterministic);
  for (const key of ['deaths', 'infections', 'peakIcuOccupancy']) {
    for (const k of [0, 2]) {
      const expected = formatInterval({ ...outcome(key), unit: '' }, summary.options[k].intervals[key]!, 'screen', context);
      await expect(page.getByTestId(`interval-${key}-${k}`)).toHaveText(expected);
    }
  }
  await expect(page.getByTestId('row-label-better-deaths')).toHaveText('Chance of fewer deaths than the reference');
  const chance = page.getByTestId('chance-better-deaths-2');
  await expect(chance).toHaveAttribute('data-value', String(summary.options[2].probabilityBetterThanReference.deaths));
  await expect(chance).toHaveText(screen.percent(summary.options[2].probabilityBetterThanReference.deaths));
  await expect(page.getByTestId('chance-better-deaths-0')).toHaveText('reference');
  await expect(page.getByTestId('chance-best-deaths-1')).toHaveAttribute('data-value', String(summary.options[1].probabilityBest.deaths));
  await page.screenshot({ path: 'e2e-artifacts/board-draws.png', fullPage: false });
  expect(errors).toEqual([]);
});

test('Cancel stops the draws; an edit restarts them for the edited scenario; the app answers while they run', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  await openScenario(page, withDraws(4000, 1), 'mixwise-many-draws');
  await settled(page);

  const status = page.getByTestId('draws-status');
  await expect(status).toHaveAttribute('data-state', 'running');
  await expect(status.locator('progress')).toHaveAttribute('max', '4000');
  await expect(page.getByTestId('draws-count')).toHaveText(/^[\d,]+ of 4,000 draws$/);
  // Progress moves: some draws are done while the rest run.
  await expect.poll(async () => Number(await status.locator('progress').getAttribute('value')), { timeout: 60_000 }).toBeGreaterThan(0);

  // The app answers while draws run: another view opens, and the board comes back with the draws still going.
  await page.getByRole('tab', { name: 'Curves' }).click();
  await expect(page.getByRole('tab', { name: 'Curves' })).toHaveAttribute('aria-selected', 'true');
  await page.getByRole('tab', { name: 'Options board' }).click();
  await expect(status).toHaveAttribute('data-state', 'running');

  await page.getByTestId('draws-cancel').click();
  await expect(status).toHaveAttribute('data-state', 'cancelled');
  await expect(page.getByTestId('draws-count')).toHaveText(/^Draws stopped at [\d,]+ of 4,000\.$/);
  const stoppedAt = await status.locator('[data-testid="draws-count"]').textContent();
  await page.waitForTimeout(1500);
  // Nothing more arrives after Cancel.
  await expect(page.getByTestId('draws-count')).toHaveText(stoppedAt ?? '');

  await page.getByTestId('draws-restart').click();
  await expect(status).toHaveAttribute('data-state', 'running');

  // An edit (fewer draws, in the Assumptions view) cancels the running draws and starts the edited scenario's.
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  const draws = page.getByTestId('uncertainty-draws');
  await draws.fill('24');
  await draws.press('Enter');
  await page.getByRole('tab', { name: 'Options board' }).click();
  await expect(status.locator('progress').or(page.getByTestId('draws-count'))).not.toHaveCount(0);
  await expect(status).toHaveAttribute('data-state', 'done', { timeout: 60_000 });
  await expect(page.getByTestId('draws-count')).toHaveText('24 draws done');
  expect(errors).toEqual([]);
});

test('the Spread view: interval plot and table per outcome, PRCC ranking in a chart and in words, the caution; reached by keyboard', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);

  // Without uncertain inputs the view says where to name them.
  await page.getByRole('tab', { name: 'Spread' }).click();
  await expect(page.getByTestId('spread-empty')).toContainText('treats no input as uncertain');

  const scenario = withDraws(48, 5);
  await openScenario(page, scenario, 'mixwise-spread');
  await settled(page);
  await page.getByRole('tab', { name: 'Report' }).focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByRole('tab', { name: 'Spread' })).toBeFocused();
  await page.keyboard.press('Alt+1');
  await expect(page.getByRole('tab', { name: 'Options board' })).toHaveAttribute('aria-selected', 'true');
  await page.keyboard.press('Alt+6');
  await expect(page.getByRole('tab', { name: 'Spread' })).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByTestId('spread-basis')).toContainText('Over 48 draws', { timeout: 60_000 });

  const p = prepareDraws(scenario);
  const summary = summariseDraws(p, evaluateDrawRange(p, 0, 48, catalogueReader), catalogueReader.keys);
  const deterministic = runScenario(scenario);
  const context = valueContextOf(deterministic);
  await expect(page.getByTestId('spread-outcome')).toHaveValue('deaths');
  for (const k of [0, 1, 3]) await expect(page.getByTestId(`spread-interval-${k}`)).toHaveText(formatInterval(outcome('deaths'), summary.options[k].intervals.deaths!, 'screen', context));
  await expect(page.getByTestId('spread-view').getByRole('img')).toHaveCount(2);

  // The ranking for the selected option, in words: the same order as the engine's PRCCs.
  const prcc = (name: string) => summary.sensitivity.find((e) => e.option === 'No measures' && e.outcome === 'deaths' && e.parameter === name)!.prcc!;
  expect(Math.abs(prcc('r0'))).toBeGreaterThan(Math.abs(prcc('contactScale.work')));
  await expect(page.getByTestId('spread-words')).toContainText(`R0 explains most of the spread in deaths under “No measures” (PRCC +${prcc('r0').toFixed(2)}`);
  await expect(page.getByTestId('sensitivity-table').locator('tbody tr').first()).toContainText('R0');

  // Another outcome by keyboard; the table follows.
  const pick = page.getByTestId('spread-outcome');
  await pick.focus();
  await pick.selectOption('infections');
  await expect(page.getByTestId('spread-interval-1')).toHaveText(formatInterval(outcome('infections'), summary.options[1].intervals.infections!, 'screen', context));
  await expect(page.getByTestId('spread-caution')).toContainText('not forecasts');
  await expect(page.getByTestId('spread-caution')).toContainText('responsible public-health authority and local rules');
  await page.screenshot({ path: 'e2e-artifacts/view-spread.png', fullPage: true });
  expect(errors).toEqual([]);
});

test('the printed report carries the finished draws: intervals, uncertain inputs with sources, draws and seed', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);
  await openScenario(page, withDraws(24, 9), 'mixwise-report-draws');
  await settled(page);
  await page.getByRole('tab', { name: 'Report' }).click();
  const report = page.frameLocator('[data-testid="report-frame"]');
  await expect(report.getByRole('heading', { name: 'Uncertain inputs' })).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId('report-draws-pending')).toHaveCount(0);
  await expect(report.locator('table.uncertain-inputs')).toContainText('Invented range for the test');
  await expect(report.locator('dt', { hasText: 'Uncertainty' }).locator('xpath=following-sibling::dd[1]')).toContainText('24');
  await expect(report.locator('dt', { hasText: 'Uncertainty' }).locator('xpath=following-sibling::dd[1]')).toContainText('seed 9');
  // The table CSV carries the intervals and chances too.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('report-export-table-csv').click()]);
  const header = readFileSync(await download.path(), 'utf8').split('\n').find((line) => line.startsWith('option'));
  expect(header).toContain('deaths_low');
  expect(header).toContain('chance_lower_than_reference_deaths');
  expect(errors).toEqual([]);
});

/**
 * The Assumptions view edited in place (web mode, Debian's chromium): a relative susceptibility
 * changes R at start to the engine's value for the edited scenario; ICU beds change the board's
 * ICU capacity; a negative bed number is refused with a message naming the field and changes
 * nothing; undo restores; a period field takes the file's own bounds. A full-page screenshot goes to e2e-artifacts/view-assumptions-full.png.
 */
import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { parseScenarioText, runScenario, type Scenario } from '../src/engine/index.ts';
import { screen } from '../src/report/numberFormat.ts';
import { ARTIFACTS, DEMO, settled } from './helpers.ts';

function demo(): Scenario {
  const parsed = parseScenarioText(readFileSync(DEMO, 'utf8'));
  if (!parsed.ok) throw new Error('The demo scenario is not valid');
  return parsed.scenario;
}

async function open(page: Page, view: 'Assumptions' | 'Options board') {
  await page.getByRole('tab', { name: view }).click();
}

async function type(page: Page, testid: string, text: string) {
  const input = page.getByTestId(testid);
  await input.fill(text);
  await input.press('Enter');
}

/** Equal up to the last bits of a double (the browser's and Node's libm may round differently). */
function expectSameNumber(shown: number, engine: number, what: string) {
  expect(Math.abs(shown - engine), `${what}: ${shown} vs ${engine}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(engine)));
}

test('relative susceptibility, ICU beds, a refused entry and undo', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await settled(page);

  const scenario = demo();
  const option = scenario.options.findIndex((o) => o.name === 'Work contacts halved');
  expect(option).toBeGreaterThan(0);
  const before = runScenario(scenario).options[option];
  const icuBeds = scenario.healthcare!.capacity.icuBeds;

  // An invalid entry: a message naming the field, nothing changed (no undo step, no new run).
  await open(page, 'Assumptions');
  await type(page, 'ward-beds', '-5');
  await expect(page.getByTestId('hospital-panel').getByRole('alert')).toHaveText('Ward beds must be >= 0, got -5.');
  await expect(page.getByTestId('undo')).toBeDisabled();
  await page.getByTestId('ward-beds').press('Escape');
  await expect(page.getByTestId('ward-beds')).toHaveValue(String(scenario.healthcare!.capacity.wardBeds));

  // Relative susceptibility of the 15-19 band halved: R at start is the engine's for the edited scenario.
  const band = scenario.ageBands.findIndex((b) => b.label === '15-19');
  await expect(page.getByTestId(`susceptibility-${band}`)).toHaveValue('1');
  await type(page, `susceptibility-${band}`, '0.5');
  const edited = structuredClone(scenario);
  edited.disease.relativeSusceptibility = scenario.ageBands.map((_, i) => (i === band ? 0.5 : 1));
  const after = runScenario(edited).options[option];
  expect(Math.abs(after.rStart - before.rStart)).toBeGreaterThan(0.01);
  await settled(page);
  await open(page, 'Options board');
  const rCell = page.getByTestId(`cell-rStart-${option}`);
  await expect(rCell).toContainText(screen.r(after.rStart));
  expectSameNumber(Number(await rCell.getAttribute('data-value')), after.rStart, 'R at start after the edit');

  // ICU beds: the board's ICU capacity follows.
  const icuCell = page.getByTestId('cell-peakIcuOccupancy-0');
  await expect(icuCell).toContainText(`/ ${icuBeds} beds`);
  await open(page, 'Assumptions');
  await type(page, 'icu-beds', '150');
  await settled(page);
  await open(page, 'Options board');
  const peakIcu = runScenario({ ...edited, healthcare: { ...edited.healthcare!, capacity: { ...edited.healthcare!.capacity, icuBeds: 150 } } }).options[0].healthcare!.icu;
  await expect(icuCell).toContainText(screen.bedsAgainstCapacity(peakIcu.peakOccupancy, 150));

  // Undo twice: ICU beds, then the susceptibility, are back.
  await page.getByTestId('undo').click();
  await settled(page);
  await expect(icuCell).toContainText(`/ ${icuBeds} beds`);
  await page.getByTestId('undo').click();
  await settled(page);
  await expect(rCell).toContainText(screen.r(before.rStart));
  expectSameNumber(Number(await rCell.getAttribute('data-value')), before.rStart, 'R at start after undo');
  await expect(page.getByTestId('undo')).toBeDisabled();
  await open(page, 'Assumptions');
  await expect(page.getByTestId(`susceptibility-${band}`)).toHaveValue('1');
  await expect(page.getByTestId('icu-beds')).toHaveValue(String(icuBeds));

  // The field takes the file's own bounds (limits.ts) and says a broken one in the file reader's words:
  // 0.05 days is refused, 100 days (which the file accepts) is taken.
  await type(page, 'infectious-period', '0.05');
  await expect(page.getByRole('alert').filter({ hasText: 'Infectious period' })).toHaveText('Infectious period must be at least 0.1 days, got 0.05 days.');
  await expect(page.getByTestId('undo')).toBeDisabled();
  await page.getByTestId('infectious-period').press('Escape');
  await type(page, 'infectious-period', '100');
  await expect(page.getByTestId('undo')).toBeEnabled();
  await expect(page.getByRole('alert').filter({ hasText: 'Infectious period' })).toHaveCount(0);
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('infectious-period')).toHaveValue(String(scenario.disease.infectiousPeriodDays));

  expect(errors).toEqual([]);
});

test('the hospital section can be removed and added back with the program defaults', async ({ page }) => {
  await page.goto('/');
  await settled(page);
  await open(page, 'Assumptions');
  await expect(page.getByTestId('hospital-ratio-table')).toContainText('default');
  await type(page, 'infectionHospitalisationRatio-0', '1');
  await expect(page.getByTestId('infectionHospitalisationRatio-reset')).toBeVisible();
  await page.getByTestId('infectionHospitalisationRatio-reset').click();
  await expect(page.getByTestId('infectionHospitalisationRatio-reset')).toHaveCount(0);
  await page.getByTestId('remove-healthcare').click();
  await expect(page.getByTestId('add-healthcare')).toBeVisible();
  await page.getByTestId('add-healthcare').click();
  await expect(page.getByTestId('icu-beds')).toHaveValue('0');
  await expect(page.getByTestId('admissionDelay-mean')).toHaveValue('10');
  await page.getByTestId('undo').click();
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('icu-beds')).toHaveValue(String(demo().healthcare!.capacity.icuBeds));
});

test('a full-page screenshot of the Assumptions view', async ({ page }) => {
  await page.goto('/');
  await settled(page);
  await open(page, 'Assumptions');
  await expect(page.getByTestId('caution')).toBeVisible();
  await expect(page.getByTestId('campaign-summary')).toContainText('Autumn campaign');
  await page.waitForTimeout(300);
  await page.screenshot({ path: `${ARTIFACTS}/view-assumptions-full.png`, fullPage: true });
});

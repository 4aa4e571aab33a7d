/**
 * The "Fit from counts" panel in the Assumptions view (web mode, Debian's chromium): import the
 * example counts, fit, compare R0 with `mixwise fit` for the same window, apply it as one
 * undoable step, and reject a bad file naming its line.
 */
import { expect, test, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { screen } from '../src/report/numberFormat.ts';
import { r0RoundedToFit } from '../src/renderer/lib/fitFromCounts.ts';
import { demoScenario, engineRStart } from './engineReference.ts';
import { ARTIFACTS, openApp, settled } from './helpers.ts';

const CASES = 'resources/example-cases.csv';

/** `npx mixwise fit CASES --scenario demo --format json` with extra arguments. */
function cliFit(...extra: string[]): { r0: number; r0Interval: [number, number]; growthRatePerDay: number; window: { fromDay: number; toDay: number } } {
  const out = execFileSync('npx', ['mixwise', 'fit', CASES, '--scenario', 'resources/demo-scenario.json', '--format', 'json', ...extra], { encoding: 'utf8' });
  return JSON.parse(out);
}

async function fitted(page: Page) {
  await expect(page.getByTestId('fit-results')).toHaveAttribute('data-busy', 'false', { timeout: 20_000 });
  await expect(page.getByTestId('fit-r0')).toBeVisible();
}

async function openFitPanel(page: Page): Promise<string[]> {
  const errors = await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await page.getByTestId('fit-file').setInputFiles(CASES);
  await fitted(page);
  return errors;
}

const shownR0 = async (page: Page) => Number(await page.getByTestId('fit-r0').getAttribute('data-value'));

async function typeDay(page: Page, testid: string, day: number) {
  const input = page.getByTestId(testid);
  await input.fill(String(day));
  await input.press('Enter');
}

test('the example counts fit to the same R0 as the CLI, for the whole file and a typed window', async ({ page }) => {
  const errors = await openFitPanel(page);
  await expect(page.getByTestId('fit-summary')).toContainText('example-cases.csv: 35 days, 2031-03-03 to 2031-04-06');
  // The example counts are overdispersed, so the panel and `mixwise fit` both fit them negative-binomially by default.
  const whole = cliFit();
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(whole.r0, 9);
  await expect(page.getByTestId('fit-r0')).toHaveText(screen.r(whole.r0));
  await page.getByTestId('fit-family').selectOption('poisson');
  await fitted(page);
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(cliFit('--family', 'poisson').r0, 9);
  await expect(page.getByTestId('fit-dispersion')).toContainText('prefer the negative-binomial model');

  await typeDay(page, 'fit-from', 7);
  await typeDay(page, 'fit-to', 20);
  await page.getByTestId('fit-family').selectOption('negativeBinomial');
  await fitted(page);
  await expect(page.getByTestId('fit-window-dates')).toHaveText('2031-03-10 to 2031-03-23');
  const typed = cliFit('--from', '7', '--to', '20', '--family', 'negative-binomial');
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(typed.r0, 9);
  await expect(page.getByTestId('fit-dispersion')).toContainText('Negative-binomial alpha');
  expect(errors).toEqual([]);
});

test('dragging on the chart picks the window, and the fit matches the CLI for it', async ({ page }) => {
  await openFitPanel(page);
  const canvas = page.getByTestId('fit-panel').locator('canvas');
  await canvas.scrollIntoViewIfNeeded();
  // The page may still be laying out (the board below recomputes, the chart resizes): wait until
  // the chart's box stops moving before dragging on it.
  let box = await canvas.boundingBox();
  await expect.poll(async () => {
    const now = await canvas.boundingBox();
    const still = now !== null && box !== null && now.x === box.x && now.y === box.y && now.width === box.width;
    box = now;
    return still;
  }, { intervals: [200], timeout: 10_000 }).toBe(true);
  if (box === null) throw new Error('no chart');
  const y = box.y + box.height * 0.5;
  await page.mouse.move(box.x + box.width * 0.3, y);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.5, y, { steps: 5 });
  await page.mouse.move(box.x + box.width * 0.7, y, { steps: 5 });
  await page.mouse.up();
  // The window fields update once the drag has been handled; only then does a new fit start.
  const fromValue = async () => Number(await page.getByTestId('fit-from').inputValue());
  await expect.poll(fromValue, { timeout: 10_000 }).toBeGreaterThan(3);
  await fitted(page);
  const from = await fromValue();
  const to = Number(await page.getByTestId('fit-to').inputValue());
  expect(to).toBeLessThan(31);
  expect(to - from).toBeGreaterThan(8);
  const cli = cliFit('--from', String(from), '--to', String(to), '--family', 'negative-binomial');
  expect(cli.window).toMatchObject({ fromDay: from, toDay: to });
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(cli.r0, 9);
});

test('measures in force divide out as in `mixwise fit --measures-option`; Use this R0 is one undoable step', async ({ page }) => {
  const errors = await openFitPanel(page);
  const scenario = demoScenario();
  const measured = scenario.options.find((o) => o.phases[0]?.fromDay === 0);
  if (measured === undefined) throw new Error('demo has no day-0 measures');
  await typeDay(page, 'fit-to', 24);
  await page.getByTestId('fit-measures').selectOption(measured.name);
  await fitted(page);
  const cli = cliFit('--to', '24', '--measures-option', measured.name, '--family', 'negative-binomial');
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(cli.r0, 9);
  await expect(page.getByTestId('fit-measures-note')).toContainText(`measures of option “${measured.name}”`);
  await page.screenshot({ path: `${ARTIFACTS}/fit-panel.png`, fullPage: true });

  // R at start of the option without measures before and after applying the fitted R0.
  await page.getByRole('tab', { name: 'Options board' }).click();
  const plain = scenario.options.findIndex((o) => o.phases.length === 0);
  const cell = page.getByTestId(`cell-rStart-${plain}`);
  const before = Number(await cell.getAttribute('data-value'));
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await expect(page.getByTestId('undo')).toBeDisabled();
  await page.getByTestId('fit-apply').click();
  await settled(page);
  const written = r0RoundedToFit(cli.r0, cli.r0Interval);
  await expect(page.getByTestId('r0-input')).toHaveValue(String(written));
  await expect(page.getByTestId('r0-fit-source')).toContainText('Fitted to example-cases.csv, 2031-03-03 to 2031-03-27');
  await expect(page.getByTestId('r0-fit-source')).toContainText(`measures of “${measured.name}” divided out`);
  await page.getByTestId('r0-fit-source').screenshot({ path: `${ARTIFACTS}/fit-r0-source.png` });

  await page.getByRole('tab', { name: 'Options board' }).click();
  const expected = engineRStart({ ...scenario, disease: { ...scenario.disease, transmission: { kind: 'r0', r0: written } } }, plain);
  await expect.poll(async () => Number(await cell.getAttribute('data-value'))).toBeCloseTo(expected, 6);
  expect(expected).not.toBeCloseTo(before, 2);

  await page.getByTestId('undo').click();
  await settled(page);
  await expect.poll(async () => Number(await cell.getAttribute('data-value'))).toBeCloseTo(before, 12);
  await expect(page.getByTestId('undo')).toBeDisabled();
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await expect(page.getByTestId('r0-fit-source')).toHaveCount(0);
  expect(errors).toEqual([]);
});

test('a bad counts file shows a message naming the line and changes nothing', async ({ page }) => {
  await openFitPanel(page);
  const r0Before = await shownR0(page);
  const dir = join(tmpdir(), `mixwise-fit-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const bad = join(dir, 'bad-cases.csv');
  writeFileSync(bad, 'date;count\n2031-03-01;4\n\n2031-03-02;-1\n2031-03-03;x\n');
  await page.getByTestId('fit-file').setInputFiles(bad);
  const message = page.getByTestId('fit-message');
  await expect(message).toContainText('bad-cases.csv was not read: line 4, column "count": must be >= 0, got "-1"');
  await expect(message).toContainText('line 5, column "count": must be a number, got "x"');
  await expect(page.getByTestId('fit-summary')).toContainText('example-cases.csv');
  expect(await shownR0(page)).toBe(r0Before);
  await expect(page.getByTestId('undo')).toBeDisabled();
});

test('overdispersed counts switch to the negative-binomial model and say so; the chosen file stays named; Use this R0 confirms beside the button with R0 rounded to the fit', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await page.getByTestId('fit-file').setInputFiles(CASES);
  await fitted(page);
  // The example counts vary more than Poisson allows: the panel moves to negative binomial and says why.
  await expect(page.getByTestId('fit-family')).toHaveValue('negativeBinomial');
  await expect(page.getByTestId('fit-family-note')).toContainText('negative-binomial');
  await fitted(page);
  const whole = cliFit('--family', 'negative-binomial');
  await expect.poll(() => shownR0(page), { timeout: 20_000 }).toBeCloseTo(whole.r0, 9);
  // The picker names the loaded file; the browser's own "No file chosen" box is not shown.
  await expect(page.getByTestId('fit-file-name')).toHaveText('example-cases.csv');
  await expect(page.getByTestId('fit-file')).toBeHidden();
  // Choosing Poisson by hand sticks.
  await page.getByTestId('fit-family').selectOption('poisson');
  await fitted(page);
  await expect(page.getByTestId('fit-family')).toHaveValue('poisson');
  await page.getByTestId('fit-family').selectOption('negativeBinomial');
  await fitted(page);

  await page.getByTestId('fit-apply').click();
  await settled(page);
  await expect(page.getByTestId('fit-applied')).toContainText('R0 set to');
  const written = await page.getByTestId('r0-input').inputValue();
  const decimals = written.split('.')[1]?.length ?? 0;
  expect(decimals).toBeGreaterThanOrEqual(1);
  expect(decimals).toBeLessThanOrEqual(2);
  expect(Number(written)).toBeCloseTo(whole.r0, 1);
  await page.getByTestId('fit-panel').screenshot({ path: `${ARTIFACTS}/fit-panel-applied.png` });
});

/**
 * Calendar dates in the app (web mode, Debian's chromium): the start date is set and cleared in
 * the Assumptions view (one undo step each, a refused value explained with the field's label);
 * with it the board's peak row and the phases show dates, and a phase can be entered by date;
 * dated counts are fitted on the scenario's days.
 */
import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { fitCaseCounts, parseCaseCountsCsv } from '../src/engine/index.ts';
import { demoScenario } from './engineReference.ts';
import { openApp, settled } from './helpers.ts';

const CASES = 'resources/example-cases.csv';

async function type(page: Page, testid: string, text: string) {
  const input = page.getByTestId(testid);
  await input.fill(text);
  await input.press('Enter');
}

/** The date `days` after `start`, both YYYY-MM-DD (UTC arithmetic, written here apart from the app's). */
function plusDays(start: string, days: number): string {
  return new Date(Date.parse(`${start}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

async function setStartDate(page: Page, text: string) {
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await type(page, 'start-date', text);
}

test('a start date puts dates on the peak row and the phases, a phase is entered by date, and undo takes both back', async ({ page }) => {
  const errors = await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.phases.length === 1 && opt.phases[0].fromDay > 0);
  const phase = scenario.options[o].phases[0];

  // A date that does not exist is refused in the field's words and changes nothing.
  await setStartDate(page, '2031-02-29');
  await expect(page.getByTestId('start-date-problem')).toHaveText('Start date must be a calendar date written YYYY-MM-DD, got "2031-02-29"; the scenario keeps no start date.');
  await expect(page.getByTestId('undo')).toBeDisabled();

  await setStartDate(page, '2031-03-01');
  await expect(page.getByTestId('start-date-problem')).toHaveCount(0);
  await page.getByRole('tab', { name: 'Options board' }).click();
  await settled(page);
  const peak = page.getByTestId(`cell-peakDay-${o}`);
  await expect(peak).toContainText('(2031-');
  const peakDay = Number(/day (\d+)/.exec((await peak.textContent()) ?? '')?.[1]);
  expect(Number.isInteger(peakDay)).toBe(true);
  await expect(peak).toContainText(`day ${peakDay} (${plusDays('2031-03-01', peakDay)})`);
  await expect(page.getByTestId(`cell-rUnderMeasures-${o}`)).toContainText(`from day ${phase.fromDay} (${plusDays('2031-03-01', phase.fromDay)})`);

  await page.getByTestId(`option-name-${o}`).click();
  const dates = `${plusDays('2031-03-01', phase.fromDay)} to ${plusDays('2031-03-01', phase.toDay - 1)}`;
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days ${phase.fromDay}–${phase.toDay - 1} (${dates})`);
  await expect(page.getByTestId('day-convention')).toContainText('Day 0 is the scenario\'s first day (2031-03-01)');
  await expect(page.getByTestId('phase-from-date')).toHaveValue(plusDays('2031-03-01', phase.fromDay));
  await expect(page.getByTestId('editor-r-phase')).toContainText(`from day ${phase.fromDay} (${plusDays('2031-03-01', phase.fromDay)})`);

  // First day entered by date: 2031-04-01 is day 31 (March has 31 days).
  await page.getByTestId('phase-from-date').fill('2031-04-01');
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days 31–${phase.toDay - 1} (2031-04-01 to ${plusDays('2031-03-01', phase.toDay - 1)})`);
  await expect(page.getByTestId('phase-from')).toHaveValue('31');
  await expect(page.getByTestId('timeline-phase-0')).toHaveAttribute('aria-valuetext', `days 31 to ${phase.toDay - 1} (2031-04-01 to ${plusDays('2031-03-01', phase.toDay - 1)})`);

  // A date before day 0 is refused, naming the start date.
  await page.getByTestId('phase-from-date').fill('2031-02-20');
  await expect(page.getByTestId('measures-problems')).toHaveText('The first date must not be before the start date 2031-03-01 (day 0), got 2031-02-20.');

  // Undo: first the phase's days, then the start date.
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days ${phase.fromDay}–${phase.toDay - 1} (${dates})`);
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days ${phase.fromDay}–${phase.toDay - 1}`);
  await expect(page.getByTestId('phase-from-date')).toHaveCount(0);
  await settled(page);
  await expect(page.getByTestId(`cell-peakDay-${o}`)).not.toContainText('(2031-');
  expect(errors).toEqual([]);
});

test('clearing the start date is one undoable edit', async ({ page }) => {
  const errors = await openApp(page);
  await setStartDate(page, '2028-02-29');
  await expect(page.getByTestId('start-date')).toHaveValue('2028-02-29');
  await page.getByTestId('start-date-clear').click();
  await expect(page.getByTestId('start-date')).toHaveValue('');
  await expect(page.getByTestId('start-date-clear')).toHaveCount(0);
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('start-date')).toHaveValue('2028-02-29');
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('start-date')).toHaveValue('');
  await expect(page.getByTestId('undo')).toBeDisabled();
  expect(errors).toEqual([]);
});

test('the fit places dated counts on the scenario days and refuses counts before the start date, naming the line', async ({ page }) => {
  const errors = await openApp(page);
  await setStartDate(page, '2031-03-05');
  await page.getByTestId('fit-file').setInputFiles(CASES);
  // The example counts start 2031-03-03, two days before day 0: line 2 is the first such row.
  await expect(page.getByTestId('fit-placement')).toContainText('line 2, column "date": is before the scenario\'s start date 2031-03-05, so it has no scenario day; lines 2 to 3 are (2 rows)');
  await expect(page.getByTestId('fit-placement')).toContainText('got "2031-03-03"');

  // 2031-02-10 + 21 days = 2031-03-03 (February 2031 has 28 days).
  await type(page, 'start-date', '2031-02-10');
  await expect(page.getByTestId('fit-placement')).toHaveCount(0);
  await expect(page.getByTestId('fit-results')).toHaveAttribute('data-busy', 'false', { timeout: 20_000 });
  await expect(page.getByTestId('fit-days')).toHaveText("Counts are placed on the scenario's days (day 0 = 2031-02-10); the file's first date 2031-03-03 is day 21.");
  await expect(page.getByTestId('fit-from')).toHaveValue('21');
  const parsed = parseCaseCountsCsv(readFileSync(CASES, 'utf8'));
  if (!parsed.ok) throw new Error('example counts not read');
  const expected = fitCaseCounts({ series: parsed.series, scenario: { ...demoScenario(), startDate: '2031-02-10' }, sourceFile: 'example-cases.csv' });
  if (!expected.ok) throw new Error(expected.problems.join('; '));
  await expect.poll(async () => Number(await page.getByTestId('fit-r0').getAttribute('data-value')), { timeout: 20_000 }).toBeCloseTo(expected.value.r0.r0, 9);
  expect(errors).toEqual([]);
});

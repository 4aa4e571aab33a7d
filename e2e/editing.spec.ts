/**
 * Editing in place (web mode, Debian's chromium): messages in the words the user sees, refused
 * values that do not linger, notices with an undo hint, a plausibility note on R0, one day
 * convention in the editor, and labels written the same way.
 */
import { expect, test, type Page } from '@playwright/test';
import { demoScenario } from './engineReference.ts';
import { ARTIFACTS, openApp, settled } from './helpers.ts';

async function type(page: Page, testid: string, text: string) {
  const input = page.getByTestId(testid);
  await input.fill(text);
  await input.press('Enter');
}

test('ward beds above the surge level: the message uses the table\'s labels and the header stays over its inputs', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  const surge = demoScenario().healthcare!.capacity.wardSurgeBeds!;
  const header = page.getByTestId('capacity-table').locator('thead th').nth(1);
  const before = await header.boundingBox();
  await type(page, 'ward-beds', String(surge + 500));
  const alert = page.getByTestId('capacity-table').getByRole('alert');
  await expect(alert).toBeVisible();
  const text = (await alert.textContent()) ?? '';
  expect(text).not.toMatch(/healthcare\.|wardSurgeBeds|wardBeds/);
  expect(text).toContain('Ward beds at full surge');
  const after = await header.boundingBox();
  const input = await page.getByTestId('ward-beds').boundingBox();
  expect(Math.abs(after!.x - before!.x)).toBeLessThanOrEqual(2);
  // The input sits under its header.
  expect(input!.x + input!.width).toBeGreaterThan(after!.x);
  expect(input!.x).toBeLessThan(after!.x + after!.width);
  await page.getByTestId('capacity-table').screenshot({ path: `${ARTIFACTS}/capacity-message.png` });
});

test('a refused value is put back when the field is left, and the message says what was kept', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  const kept = String(demoScenario().populationPersons[0]);
  await type(page, 'population-0', '-500');
  const alert = page.getByTestId('population-table').getByRole('alert');
  await expect(alert).toContainText('must be >= 0, got -500');
  await page.getByTestId('population-0').press('Tab');
  await expect(page.getByTestId('population-0')).toHaveValue(kept);
  await expect(alert).toContainText(`kept ${kept}`);
  await expect(page.getByTestId('undo')).toBeDisabled();
});

test('removing the hospital section says so with an undo hint, and undo brings it back', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await page.getByTestId('remove-healthcare').click();
  await expect(page.getByTestId('notice')).toContainText('Removed the hospital section');
  await expect(page.getByTestId('notice')).toContainText('Undo (Ctrl+Z)');
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('ward-beds')).toBeVisible();
});

test('an implausible R0 is accepted with a note beside it', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Assumptions' }).click();
  await expect(page.getByTestId('r0-note')).toHaveCount(0);
  await type(page, 'r0-input', '20');
  await settled(page);
  await expect(page.getByTestId('r0-note')).toContainText('R0 = 20');
  await type(page, 'r0-input', '2.5');
  await expect(page.getByTestId('r0-note')).toHaveCount(0);
});

test('the editor writes phases as first and last day, both included, and says so once', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.phases.length === 1 && opt.phases[0].fromDay > 0);
  const phase = scenario.options[o].phases[0];
  await page.getByTestId(`option-name-${o}`).click();
  const editor = page.getByTestId('measures-editor');
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days ${phase.fromDay}–${phase.toDay - 1}`);
  await expect(page.getByTestId('phase-last')).toHaveValue(String(phase.toDay - 1));
  await expect(editor.getByText('both included')).toHaveCount(1);
  // Typing a last day keeps that day in the phase.
  await page.getByTestId('phase-last').fill(String(phase.toDay + 4));
  await page.getByTestId('phase-last').press('Enter');
  await expect(page.getByTestId('phase-tab-0')).toHaveText(`Phase 1: days ${phase.fromDay}–${phase.toDay + 4}`);
  await expect(page.getByTestId('timeline-phase-0')).toHaveAttribute('aria-valuetext', `days ${phase.fromDay} to ${phase.toDay + 4}`);
  // The demo's own description follows the same convention.
  expect(scenario.options[o].description).toContain(`days ${phase.fromDay} to ${phase.toDay - 1}`);
});

test('setting labels are written alike, and the phase timeline shows its last tick whole', async ({ page }) => {
  await openApp(page);
  await page.getByTestId('option-name-1').click();
  await expect(page.locator('label[for]').filter({ hasText: /isolation/i })).toHaveText('Case isolation');
  const labels = await page.getByTestId('measures-editor').locator('fieldset label[for]').allTextContents();
  for (const label of labels) expect(label.slice(1), label).toBe(label.slice(1).toLowerCase());
  const svg = await page.locator('svg.timeline').boundingBox();
  const ticks = page.locator('svg.timeline text.tick');
  const last = ticks.last();
  const box = await last.boundingBox();
  expect(box!.x + box!.width).toBeLessThanOrEqual(svg!.x + svg!.width + 0.5);
  await page.locator('svg.timeline').screenshot({ path: `${ARTIFACTS}/timeline.png` });
});

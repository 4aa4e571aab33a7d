/**
 * Measures switched by a trigger, in the measures editor: the rule in words, the board's
 * trigger rows with the engine's numbers, the curves' shading and thresholds, undo.
 */
import { expect, test } from '@playwright/test';
import { runScenario, type Scenario } from '../src/engine/index.ts';
import { demoScenario } from './engineReference.ts';
import { ARTIFACTS, openApp, settled } from './helpers.ts';

test('a phase switched by ICU occupancy: rule in words, board rows from the engine, curves marked, undo', async ({ page }) => {
  const errors = await openApp(page);
  const scenario = demoScenario();
  const o = scenario.options.findIndex((opt) => opt.name === 'Schools closed 8 weeks');
  await page.getByTestId(`option-name-${o}`).click();
  await page.getByTestId('phase-tab-0').click();
  await page.getByTestId('when-triggered').check();
  await settled(page);
  await page.getByTestId('trigger-on').fill('80');
  await page.getByTestId('trigger-on').press('Tab');
  await page.getByTestId('trigger-off').fill('40');
  await page.getByTestId('trigger-off').press('Tab');
  await settled(page);
  await expect(page.getByTestId('trigger-words')).toContainText('in force when ICU occupancy exceeds 80 beds, lifted when it falls below 40 beds, decided each day with a 3-day lag, at least 14 days at a time');
  await expect(page.getByTestId('phase-tab-0')).toContainText('when triggered');

  // The engine on the same edit.
  const edited: Scenario = structuredClone(scenario);
  edited.options[o].phases[0].trigger = { quantity: 'icuOccupancy', onAbove: 80, offBelow: 40, minimumDaysOn: 14, lagDays: 3 };
  const expected = runScenario(edited).options[o];
  const cell = page.getByTestId(`cell-switchesOn-${o}`);
  await expect(cell).toHaveAttribute('data-value', String(expected.triggers[0].switchesOn));
  await expect(page.getByTestId(`cell-daysUnderMeasures-${o}`)).toHaveAttribute('data-value', String(expected.daysUnderMeasures));

  await page.locator('#tab-curves').click();
  await page.getByTestId('metric-icuOccupancy').check();
  await expect(page.getByTestId('trigger-note')).toContainText('Orange shading');
  await page.screenshot({ path: `${ARTIFACTS}/curves-triggered.png`, fullPage: true });

  await page.keyboard.press('Control+z');
  await page.keyboard.press('Control+z');
  await page.keyboard.press('Control+z');
  await settled(page);
  await expect(page.getByTestId(`cell-switchesOn-${o}`)).toHaveCount(0);
  expect(errors).toEqual([]);
});

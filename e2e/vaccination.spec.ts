/**
 * Hospital demand and vaccination in the app (web mode, Debian's chromium): board rows against
 * the engine, the vaccination panel (templates, keyboard and drag reordering, coverage needed),
 * and "compare orders".
 */
import { expect, test, type Page } from '@playwright/test';
import { coverageNeededForRBelowOne, prepareScenario, priorityFromTemplate, runScenario, type Scenario } from '../src/engine/index.ts';
import { screen } from '../src/report/numberFormat.ts';
import { demoScenario } from './engineReference.ts';
import { ARTIFACTS, columns, openApp, settled } from './helpers.ts';

const cellValue = async (page: Page, id: string) => Number(await page.getByTestId(id).getAttribute('data-value'));

/** The demo option that runs a campaign ("Vaccinate oldest first"). */
function campaignOption(s: Scenario): number {
  const o = s.options.findIndex((opt) => opt.vaccinationCampaign !== undefined);
  expect(o).toBeGreaterThanOrEqual(0);
  return o;
}

/** Band labels of the groups in the panel's priority list, first group first. */
async function shownOrder(page: Page): Promise<string[]> {
  return page.locator('[data-testid^="priority-bands-"]').allTextContents();
}

test('the board shows each option\'s ICU peak against capacity as the engine computes it', async ({ page }) => {
  const errors = await openApp(page);
  const scenario = demoScenario();
  const engine = runScenario(scenario);
  for (const [o, expected] of engine.options.entries()) {
    const icu = expected.healthcare!.icu;
    const cell = page.getByTestId(`cell-peakIcuOccupancy-${o}`);
    expect(await cellValue(page, `cell-peakIcuOccupancy-${o}`)).toBeCloseTo(icu.peakOccupancy, 6);
    await expect(cell).toContainText(screen.bedsAgainstCapacity(icu.peakOccupancy, icu.capacityBeds));
    await expect(cell).toHaveAttribute('data-over', String(icu.peakOccupancy > icu.capacityBeds));
    expect(await cellValue(page, `cell-daysIcuOverCapacity-${o}`)).toBe(icu.daysOverCapacity);
    expect(await cellValue(page, `cell-admissions-${o}`)).toBeCloseTo(expected.healthcare!.admissions, 6);
    // Averted counts are the engine's comparison with the reference option.
    expect(await cellValue(page, `cell-deathsAverted-${o}`)).toBeCloseTo(expected.comparison!.deathsAverted, 6);
    if (expected.vaccination === null) {
      await expect(page.getByTestId(`cell-doses-${o}`)).toContainText('—');
      await expect(page.getByTestId(`cell-dosesToNonSusceptibleShare-${o}`)).toContainText('—');
    } else {
      expect(await cellValue(page, `cell-doses-${o}`)).toBeCloseTo(expected.vaccination.doses, 6);
      expect(await cellValue(page, `cell-deathsAvertedPer1000Doses-${o}`)).toBeCloseTo(expected.comparison!.deathsAvertedPer1000Doses!, 6);
      expect(await cellValue(page, `cell-dosesToNonSusceptibleShare-${o}`)).toBeCloseTo(expected.vaccination.dosesToNonSusceptibleShare, 9);
    }
  }
  expect(errors).toEqual([]);
});

test('applying an order template changes deaths to the engine\'s value; coverage needed matches the engine', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = campaignOption(scenario);
  await page.getByTestId(`option-name-${o}`).click();
  const panel = page.getByTestId('vaccination-panel');
  await expect(panel.getByTestId('campaign-select')).toHaveValue(scenario.options[o].vaccinationCampaign!);

  // Coverage needed for the demo's order, as the engine says.
  const prepared = prepareScenario(scenario);
  const campaign = scenario.vaccinationCampaigns[0];
  const coverage = coverageNeededForRBelowOne(prepared, scenario.options[o], campaign);
  const coverageText = panel.getByTestId('coverage-needed');
  if (coverage.doses === null) await expect(coverageText).toContainText(`Not reachable with these uptake ceilings: with every ceiling met, R at start is ${screen.r(coverage.reproductionNumberAtCeiling)}`);
  else await expect(coverageText).toContainText('bring R at start below 1');

  const before = await cellValue(page, `cell-deaths-${o}`);
  await panel.getByTestId('template-youngestAdultsFirst').click();
  await settled(page);
  campaign.priority = priorityFromTemplate('youngestAdultsFirst', prepared);
  const expected = runScenario(scenario).options[o].deaths;
  const shown = await cellValue(page, `cell-deaths-${o}`);
  expect(shown).not.toBeCloseTo(before, 3);
  expect(shown).toBeCloseTo(expected, 6);
  await expect(panel.getByTestId('template-youngestAdultsFirst')).toHaveAttribute('aria-pressed', 'true');

  // One undo step brings the old order and the old deaths back.
  await page.getByTestId('undo').click();
  await settled(page);
  expect(await cellValue(page, `cell-deaths-${o}`)).toBeCloseTo(before, 6);
});

test('compare orders adds one option per template it does not already run, side by side, as one undo step', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = campaignOption(scenario);
  const n = await columns(page).count();
  await expect(page.getByTestId('compare-orders')).toBeDisabled();
  await page.getByTestId(`option-name-${o}`).click();
  await page.getByTestId('compare-orders').click();
  // The demo's campaign runs oldest first already: no copy for that order.
  await expect(columns(page)).toHaveCount(n + 3);
  const labels = ['Youngest adults first', 'Most contacts first', 'Even spread across adults'];
  for (const [k, label] of labels.entries()) {
    await expect(page.getByTestId(`option-name-${o + 1 + k}`)).toHaveText(`${scenario.options[o].name} · ${label}`);
  }
  await settled(page);
  // Each copy runs its own campaign copy: the board's deaths are the engine's for that order.
  const prepared = prepareScenario(scenario);
  for (const [k, id] of (['youngestAdultsFirst', 'mostContactsFirst', 'evenAcrossAdults'] as const).entries()) {
    const copy = structuredClone(scenario);
    copy.vaccinationCampaigns[0].priority = priorityFromTemplate(id, prepared);
    expect(await cellValue(page, `cell-deaths-${o + 1 + k}`)).toBeCloseTo(runScenario(copy).options[o].deaths, 6);
  }
  await page.getByTestId(`option-name-${o + 1}`).click();
  await expect(page.getByTestId('campaign-select')).toHaveValue(`${scenario.vaccinationCampaigns[0].name} · Youngest adults first`);
  await page.getByTestId('undo').click();
  await expect(columns(page)).toHaveCount(n);
});

test('the priority order can be rearranged from the keyboard and by drag', async ({ page }) => {
  await openApp(page);
  const scenario = demoScenario();
  const o = campaignOption(scenario);
  await page.getByTestId(`option-name-${o}`).click();
  const labels = scenario.ageBands.map((b) => b.label);
  const initial = scenario.vaccinationCampaigns[0].priority.map((g) => g.map((b) => labels[b]).join(', '));
  await expect.poll(() => shownOrder(page)).toEqual(initial);

  // Move group 3 up twice with the ▲ button; focus stays on the moved group's button.
  await page.getByTestId('priority-up-2').focus();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('priority-up-1')).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('priority-up-0')).toBeDisabled();
  const moved = [initial[2], initial[0], initial[1], ...initial.slice(3)];
  await expect.poll(() => shownOrder(page)).toEqual(moved);

  // Alt+Down on a group's handle moves it down one place.
  await page.getByTestId('priority-handle-0').focus();
  await page.keyboard.press('Alt+ArrowDown');
  await expect(page.getByTestId('priority-handle-1')).toBeFocused();
  await expect.poll(() => shownOrder(page)).toEqual([initial[0], initial[2], initial[1], ...initial.slice(3)]);

  // The engine ran the edited order.
  await settled(page);
  const edited = structuredClone(scenario);
  const p = edited.vaccinationCampaigns[0].priority;
  edited.vaccinationCampaigns[0].priority = [p[0], p[2], p[1], ...p.slice(3)];
  expect(await cellValue(page, `cell-deaths-${o}`)).toBeCloseTo(runScenario(edited).options[o].deaths, 6);

  // Join the first two groups, split them again.
  await page.getByTestId('priority-merge-0').click();
  await expect(page.getByTestId('priority-bands-0')).toHaveText(`${initial[0]}, ${initial[2]}`);
  await page.getByTestId('priority-split-0').click();
  await expect(page.getByTestId('priority-bands-1')).toHaveText(initial[2]);

  // Drag the last group to the top.
  const last = initial.length - 1;
  await page.getByTestId(`priority-group-${last}`).dragTo(page.getByTestId('priority-group-0'));
  await expect(page.getByTestId('priority-bands-0')).toHaveText(initial[last]);

  // A rejected edit shows its message next to the field and changes nothing.
  const death = page.getByTestId('efficacy-death');
  await death.fill('10');
  await death.press('Enter');
  await expect(page.getByTestId('vaccination-panel').getByRole('alert')).toContainText('Efficacy against death must be at least efficacy against infection');
  await expect(page.getByTestId('priority-bands-0')).toHaveText(initial[last]);
});

test('screenshots: board with hospital and vaccination rows, the vaccination panel, curves', async ({ page }) => {
  await openApp(page);
  const o = campaignOption(demoScenario());
  await page.getByTestId(`option-name-${o}`).click();
  await page.locator('section.board').screenshot({ path: `${ARTIFACTS}/vaccination-board.png` });
  await page.getByTestId('vaccination-panel').screenshot({ path: `${ARTIFACTS}/vaccination-panel.png` });
  await page.getByRole('tab', { name: 'Curves' }).click();
  await page.getByTestId('metric-icuOccupancy').check();
  await expect(page.getByTestId('capacity-note')).toContainText('ICU capacity');
  await expect(page.getByTestId('doses-chart')).toBeVisible();
  await page.waitForTimeout(300);
  await page.screenshot({ path: `${ARTIFACTS}/view-curves-icu-doses.png`, fullPage: true });
});

/**
 * A scenario whose R cannot be pinned down (test/helpers/unsettledRoots.ts): opening one the check
 * refuses names the phase and keeps the open document; opening one only the run refuses shows
 * the refusal in words in the message area, "Not computed" in the status, and no engine error;
 * the next scenario that computes takes the message away.
 */
import { expect, test, type Page } from '@playwright/test';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { immuneHubLeavingOddContacts, phaseLeavingOddContacts } from '../test/helpers/unsettledRoots.ts';
import { openApp, settled } from './helpers.ts';

async function openFile(page: Page, name: string, content: object) {
  const path = join(tmpdir(), `mixwise-${name}-${Date.now()}.json`);
  writeFileSync(path, JSON.stringify(content));
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('open').click()]);
  await chooser.setFiles(path);
}

test('an R that cannot be pinned down is refused in words, never an engine error', async ({ page }) => {
  const errors = await openApp(page);
  const firstOption = await page.getByTestId('option-name-1').textContent();

  await openFile(page, 'phase', phaseLeavingOddContacts());
  await expect(page.getByTestId('notice')).toContainText('options[1].phases[0] (option "ordinary contacts shut") must give measures R can be computed under: with everyone susceptible the largest eigenvalue of the next-generation matrix could not be pinned down');
  await expect(page.getByTestId('option-name-1')).toHaveText(firstOption ?? '');

  await openFile(page, 'day0', immuneHubLeavingOddContacts());
  await expect(page.getByTestId('notice')).toContainText('This scenario cannot be computed: Option “as usual” must give measures R can be computed under: on day 0 the largest eigenvalue of the next-generation matrix could not be pinned down');
  await expect(page.getByTestId('run-refused')).toContainText('Not computed');
  await expect(page.getByTestId('run-status')).not.toContainText('Engine error');

  await page.getByRole('button', { name: 'New', exact: true }).click();
  const unsaved = page.getByRole('dialog', { name: 'Unsaved changes' });
  if (await unsaved.isVisible()) await unsaved.getByRole('button', { name: /discard|don.t save/i }).click();
  await settled(page);
  await expect(page.getByTestId('notice')).toHaveCount(0);
  await expect(page.getByTestId('run-refused')).toHaveCount(0);
  expect(errors).toEqual([]);
});

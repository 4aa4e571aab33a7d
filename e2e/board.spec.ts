/**
 * The options board as an analyst meets it (web mode, Debian's chromium): comparing vaccination
 * orders, explanations reachable from the keyboard, row labels and option headers kept in view,
 * better and worse told apart without colour, readable text on every shade, and the shading kept
 * when the view is printed.
 */
import { expect, test, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { demoScenario } from './engineReference.ts';
import { ARTIFACTS, columns, openApp, settled } from './helpers.ts';

/** The demo option that runs a campaign. */
const campaignOption = () => demoScenario().options.findIndex((o) => o.vaccinationCampaign !== undefined);

test('compare vaccination orders: no error, a notice, no copy of the order already run, the new columns in view', async ({ page }) => {
  const errors = await openApp(page);
  const n = await columns(page).count();
  // Disabled until a vaccinated option is selected, and the reason is on the page, not only in a tooltip.
  await expect(page.getByTestId('compare-orders')).toBeDisabled();
  await expect(page.getByTestId('compare-orders-why')).toBeVisible();
  await expect(page.getByTestId('compare-orders-why')).toContainText('vaccination campaign');
  const o = campaignOption();
  await page.getByTestId(`option-name-${o}`).click();
  await expect(page.getByTestId('compare-orders')).toBeEnabled();
  await expect(page.getByTestId('compare-orders-why')).toHaveCount(0);
  await page.getByTestId('compare-orders').click();
  await expect(page.getByTestId('notice')).toContainText('one per vaccination order');
  // The demo's campaign already runs oldest first: that order gets no copy.
  await expect(columns(page)).toHaveCount(n + 3);
  await expect(page.getByTestId('notice')).toContainText('Oldest first');
  const names = await page.locator('[data-testid^="option-name-"]').allTextContents();
  expect(names.some((name) => name.includes('· Oldest first'))).toBe(false);
  await settled(page);
  // The last new column is scrolled into the board's view.
  const board = await page.locator('section.board .scroll').boundingBox();
  const last = await page.getByTestId(`option-column-${o + 3}`).boundingBox();
  expect(last!.x + last!.width).toBeLessThanOrEqual(board!.x + board!.width + 1);
  expect(last!.x).toBeGreaterThanOrEqual(board!.x - 1);
  expect(errors).toEqual([]);
});

test('row explanations open from the keyboard and show while the label has focus', async ({ page }) => {
  await openApp(page);
  const label = page.getByTestId('row-label-rStart');
  await label.focus();
  await expect(label).toBeFocused();
  const tip = page.getByTestId('row-hint-rStart');
  await expect(tip).toBeVisible();
  await expect(tip).toContainText('next-generation matrix');
  await page.keyboard.press('Tab');
  await expect(tip).toBeHidden();
});

test('wide boards keep row labels and option headers in view while scrolling', async ({ page }) => {
  await page.setViewportSize({ width: 1000, height: 700 });
  await openApp(page);
  for (let k = 0; k < 4; k++) await page.getByTestId('duplicate-1').click();
  await settled(page);
  const scroller = page.locator('section.board .scroll');
  const box = await scroller.boundingBox();
  await scroller.evaluate((el) => {
    el.scrollLeft = el.scrollWidth;
    el.scrollTop = 300;
  });
  await page.waitForTimeout(100);
  const rowLabel = await page.getByTestId('row-label-deaths').locator('xpath=ancestor::th').boundingBox();
  expect(rowLabel!.x).toBeLessThanOrEqual(box!.x + 2);
  const header = await page.getByTestId('option-column-5').boundingBox();
  expect(header!.y).toBeLessThanOrEqual(box!.y + 2);
  await page.screenshot({ path: `${ARTIFACTS}/board-scrolled.png` });
});

/** Colour contrast (WCAG 2.1) of every cell's small text against the cell's own shade over white. */
const CELL_TEXT_CONTRAST = `(() => {
  const rgba = (c) => (c.match(/[\\\\d.]+/g) || []).map(Number);
  const over = (fg, bg) => { const a = fg.length > 3 ? fg[3] : 1; return [0, 1, 2].map((i) => fg[i] * a + bg[i] * (1 - a)); };
  const lum = (c) => { const [r, g, b] = c.map((v) => { const s = v / 255; return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4; }); return 0.2126 * r + 0.7152 * g + 0.0722 * b; };
  let worst = 99, where = '';
  for (const td of document.querySelectorAll('[data-testid="options-board"] td.num')) {
    const bg = over(rgba(getComputedStyle(td).backgroundColor), [255, 255, 255]);
    for (const el of td.querySelectorAll('span')) {
      const fg = over(rgba(getComputedStyle(el).color), bg);
      const a = lum(fg), b = lum(bg);
      const ratio = (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
      if (ratio < worst) { worst = ratio; where = td.getAttribute('data-testid') + ' ' + el.className; }
    }
  }
  return { worst, where };
})()`;

test('better and worse differ in grey too, and small text on every shade reaches 4.5:1', async ({ page }) => {
  await openApp(page);
  const better = page.locator('td.num.better').first();
  const worse = page.locator('td.num.worse').first();
  await expect(better).toBeVisible();
  await expect(worse).toBeVisible();
  // A pattern marks worse cells (and the legend's swatch), so the two read apart without hue.
  const pattern = (el: typeof better) => el.evaluate((e) => e.ownerDocument.defaultView!.getComputedStyle(e).backgroundImage);
  expect(await pattern(better)).toBe('none');
  expect(await pattern(worse)).not.toBe('none');
  expect(await pattern(page.locator('.legend .swatch.worse'))).not.toBe('none');
  const { worst, where } = await page.evaluate<{ worst: number; where: string }>(CELL_TEXT_CONTRAST);
  expect(worst, where).toBeGreaterThanOrEqual(4.5);
  await page.addStyleTag({ content: 'section.board { filter: grayscale(1); }' });
  await page.locator('section.board').screenshot({ path: `${ARTIFACTS}/board-greyscale.png` });
});

test('printing the board keeps the better/worse shading the legend refers to', async ({ page }) => {
  await openApp(page);
  // Chromium prints without backgrounds unless the page asks for its colours to be kept.
  const pdf = await page.pdf({ format: 'A4', landscape: true, printBackground: false });
  const dir = join(tmpdir(), `mixwise-board-print-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const pdfPath = join(dir, 'board.pdf');
  writeFileSync(pdfPath, pdf);
  execFileSync('pdftoppm', ['-r', '40', '-f', '1', '-l', '1', pdfPath, join(dir, 'page')]);
  const ppm = readFileSync(join(dir, 'page-1.ppm'));
  // Binary PPM (P6): header "P6\nW H\n255\n" then RGB bytes.
  const header = ppm.subarray(0, 20).toString('latin1').split(/\s+/);
  const [w, h] = [Number(header[1]), Number(header[2])];
  const start = ppm.length - w * h * 3;
  // Count pixels of the light tints only (translucent shades over white), not the solid option colours.
  let blue = 0;
  let orange = 0;
  for (let p = start; p < ppm.length; p += 3) {
    const [r, g, b] = [ppm[p], ppm[p + 1], ppm[p + 2]];
    // Tints of rgba(0, 114, 178, 0.1-0.4) and rgba(230, 159, 0, 0.1-0.4) over white.
    if (r >= 140 && r <= 235 && g >= 185 && g <= 245 && b >= 215 && b > r + 15) blue++;
    if (r >= 243 && g >= 205 && g <= 248 && b >= 135 && b <= 235 && g > b + 10) orange++;
  }
  expect(blue, 'printed pixels of the better shade').toBeGreaterThan(200);
  expect(orange, 'printed pixels of the worse shade').toBeGreaterThan(200);
});

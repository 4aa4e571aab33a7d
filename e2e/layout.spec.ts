/**
 * Layout in Debian's chromium (web mode): a narrow window (200% zoom of a 1440 px screen is
 * 720 CSS px), the printed view, the by-age tables, text sizes and focus contrast. Screenshots
 * go to e2e-artifacts/ for a look by eye.
 */
import { expect, test, type Page } from '@playwright/test';
import { ARTIFACTS, openApp } from './helpers.ts';

const VIEWS = ['Options board', 'Curves', 'By age', 'Assumptions', 'Report'] as const;

/** How far the page scrolls sideways (0 when it fits the window). */
const sidewaysScroll = (page: Page) => page.evaluate<number>('document.documentElement.scrollWidth - document.documentElement.clientWidth');

// Browser-side checks, written as script text (this project's TypeScript has no DOM library).

/** Text smaller than 12 px in visible elements: one line per finding. */
const SMALL_TEXT = `(() => {
  const found = [];
  const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
  for (let node = walker.nextNode(); node !== null; node = walker.nextNode()) {
    const text = (node.textContent || '').trim();
    const el = node.parentElement;
    if (text === '' || el === null) continue;
    const style = getComputedStyle(el);
    const box = el.getBoundingClientRect();
    if (box.width === 0 || style.visibility === 'hidden' || el.closest('.sr-only') !== null) continue;
    const size = parseFloat(style.fontSize);
    if (size < 12) found.push(size + 'px "' + text.slice(0, 30) + '" in <' + el.tagName.toLowerCase() + ' class="' + (el.getAttribute('class') || '') + '">');
  }
  return found;
})()`;

/** WCAG 2.1 contrast ratio of the focused element's outline against its header bar. */
const FOCUS_RING_CONTRAST = `(() => {
  const el = document.activeElement;
  const rgb = (c) => (c.match(/[\\d.]+/g) || []).slice(0, 3).map(Number);
  const lum = (c) => {
    const [r, g, b] = c.map((v) => {
      const s = v / 255;
      return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };
  const ring = lum(rgb(getComputedStyle(el).outlineColor));
  const bar = lum(rgb(getComputedStyle(el.closest('header')).backgroundColor));
  return (Math.max(ring, bar) + 0.05) / (Math.min(ring, bar) + 0.05);
})()`;

test('at 720 CSS px wide the toolbar wraps clear of the file name, keeps Notes and About on screen, and no view scrolls sideways', async ({ page }) => {
  await page.setViewportSize({ width: 720, height: 900 });
  const errors = await openApp(page);
  const doc = await page.getByTestId('document-name').boundingBox();
  for (const name of ['Notes', 'About', 'Open…', 'Undo']) {
    const box = await page.getByRole('button', { name, exact: true }).boundingBox();
    expect(box, name).not.toBeNull();
    expect(box!.x + box!.width, `${name} inside the window`).toBeLessThanOrEqual(720);
    const overlaps = doc !== null && box!.x < doc.x + doc.width && box!.x + box!.width > doc.x && box!.y < doc.y + doc.height && box!.y + box!.height > doc.y;
    expect(overlaps, `${name} clear of the file name`).toBe(false);
  }
  await page.getByTestId('option-name-1').click();
  for (const view of VIEWS) {
    await page.getByRole('tab', { name: view }).click();
    await page.waitForTimeout(250);
    await page.screenshot({ path: `${ARTIFACTS}/narrow-${view.replace(/ /g, '-').toLowerCase()}.png`, fullPage: true });
    expect(await sidewaysScroll(page), `${view} scrolls sideways`).toBeLessThanOrEqual(0);
  }
  expect(errors).toEqual([]);
});

test('printing the Curves view keeps the chart and its side panel on the page', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'Curves' }).click();
  await page.waitForTimeout(200);
  // An A4 page with 1.5 cm margins is about 690 CSS px wide.
  await page.emulateMedia({ media: 'print' });
  await page.setViewportSize({ width: 690, height: 1000 });
  await page.waitForTimeout(300);
  for (const id of ['curves-chart', 'curves-readout']) {
    const box = await page.getByTestId(id).boundingBox();
    expect(box, id).not.toBeNull();
    expect(box!.x + box!.width, `${id} right edge`).toBeLessThanOrEqual(690);
  }
  const canvas = await page.getByTestId('curves-chart').locator('canvas').boundingBox();
  expect(canvas!.x + canvas!.width).toBeLessThanOrEqual(690);
  await page.screenshot({ path: `${ARTIFACTS}/print-curves.png`, fullPage: true });
});

test('by-age tables show every option name in full, without a sideways scroll', async ({ page }) => {
  await openApp(page);
  await page.getByRole('tab', { name: 'By age' }).click();
  for (const id of ['attack', 'deaths']) {
    const table = page.getByTestId(`by-age-table-${id}`);
    const cut = await table.locator('xpath=..').evaluate((wrap) => wrap.scrollWidth - wrap.clientWidth);
    expect(cut, `${id} table wider than its box`).toBeLessThanOrEqual(0);
  }
  await page.screenshot({ path: `${ARTIFACTS}/by-age-tables.png`, fullPage: true });
});

test('no text smaller than 12 px in any view, and the toolbar focus ring stands out from the bar', async ({ page }) => {
  await openApp(page);
  await page.getByTestId('option-name-4').click();
  for (const view of VIEWS) {
    await page.getByRole('tab', { name: view }).click();
    await page.waitForTimeout(200);
    const small = await page.evaluate<string[]>(SMALL_TEXT);
    expect(small.slice(0, 8), `${view}: text below 12 px`).toEqual([]);
  }
  // WCAG 2.1 non-text contrast (1.4.11): a focus indicator needs 3:1 against what surrounds it.
  await page.getByRole('button', { name: 'Notes', exact: true }).focus();
  await page.keyboard.press('Shift+Tab');
  await page.keyboard.press('Tab');
  const ratio = await page.evaluate<number>(FOCUS_RING_CONTRAST);
  expect(ratio).toBeGreaterThanOrEqual(3);
});

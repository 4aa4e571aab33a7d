/**
 * The printed report, end to end: `mixwise report --out X.pdf` prints through Debian's Chromium,
 * `pdftotext -layout` (poppler-utils) reads the PDF back, and the text must hold the numbers that
 * `mixwise run --format json` gives for the same file, formatted as the report formats them.
 * A scenario with 12 options must paginate without splitting a table row. PNGs of the first two
 * pages go to e2e-artifacts/ for a look at the layout.
 */
import { test, expect } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseScenarioText } from '../src/engine/validation.ts';
import { canonicalJson, print } from '../src/report/index.ts';
import { ARTIFACTS, CHROMIUM, DEMO, ROOT, mixwise } from './helpers.ts';

const VERSION = (JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string }).version;

interface JsonOption {
  name: string;
  rStart: number;
  attackRate: number;
  deaths: number;
  peakIcuOccupancy: number | null;
}

test.skip(!existsSync(CHROMIUM), `no Chromium at ${CHROMIUM}`);

function cliOptions(file: string): JsonOption[] {
  return (JSON.parse(mixwise('run', file, '--format', 'json')) as { options: JsonOption[] }).options;
}

/** The PDF's text, page by page (pdftotext separates pages with form feeds). */
function pdfPages(pdf: string): string[] {
  const text = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
  return text.split('\f').filter((page) => page.trim() !== '');
}

/** Short fingerprint computed independently here: SHA-256 (node:crypto) of canonical JSON + version. */
function expectedShortFingerprint(file: string): string {
  const parsed = parseScenarioText(readFileSync(file, 'utf8'));
  if (!parsed.ok) throw new Error(`${file} is not valid`);
  return createHash('sha256').update(`${canonicalJson(parsed.scenario)}\nmixwise ${VERSION}`, 'utf8').digest('hex').slice(0, 12);
}

/**
 * Every printed line of a table row, in page order: the cells after its label (cells are
 * separated by two or more spaces in -layout text). A row split across pages would leave its
 * label and values apart, so it would not match here.
 */
function rowLines(pages: string[], label: string): { page: number; cells: string[] }[] {
  const found: { page: number; cells: string[] }[] = [];
  pages.forEach((page, p) => {
    for (const line of page.split('\n')) {
      const trimmed = line.trim();
      if (trimmed.startsWith(label) && /\s{2,}/.test(trimmed.slice(label.length))) {
        found.push({ page: p, cells: trimmed.slice(label.length).trim().split(/\s{2,}/) });
      }
    }
  });
  return found;
}

function renderPdf(file: string, pdf: string, ...extra: string[]): string[] {
  mixwise('report', file, '--out', pdf, ...extra);
  expect(readFileSync(pdf).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  return pdfPages(pdf);
}

function savePngs(pdf: string, prefix: string): void {
  for (const page of ['1', '2']) {
    // -singlefile: the name is exactly prefix-N.png (otherwise pdftoppm pads N by the page count).
    execFileSync('pdftoppm', ['-png', '-r', '60', '-f', page, '-l', page, '-singlefile', pdf, join(ARTIFACTS, `${prefix}-${page}`)]);
    expect(existsSync(join(ARTIFACTS, `${prefix}-${page}.png`))).toBe(true);
  }
}

const work = mkdtempSync(join(tmpdir(), 'mixwise-report-e2e-'));

test('demo report PDF: fingerprint on every page, and the numbers of mixwise run', () => {
  const pdf = join(work, 'demo.pdf');
  const pages = renderPdf(DEMO, pdf);
  const short = expectedShortFingerprint(DEMO);
  expect(pages.length).toBeGreaterThan(3);
  pages.forEach((page, p) => {
    expect(page, `page ${p + 1}`).toContain(`scenario ${short}`);
    expect(page, `page ${p + 1}`).toContain(`Page ${p + 1} of ${pages.length}`);
  });

  const options = cliOptions(DEMO);
  const row = (label: string) => rowLines(pages, label).flatMap((r) => r.cells);
  expect(row('R at start (day 0)')).toEqual(options.map((o) => print.r(o.rStart)));
  expect(row('Attack rate, % of population')).toEqual(options.map((o) => print.percent(o.attackRate)));
  expect(row('Deaths, persons')).toEqual(options.map((o) => print.persons(o.deaths)));
  expect(row('Peak ICU beds in use')).toEqual(options.map((o) => print.persons(o.peakIcuOccupancy ?? NaN)));

  const all = pages.join('\n');
  expect(all).toContain('not forecasts');
  expect(all.replace(/\s+/g, ' ')).toContain('decisions rest with the responsible public-health authority and local rules');
  savePngs(pdf, 'report-demo-a4-portrait');
});

test('12 options: the table splits into column groups and no row is split across pages', () => {
  const scenario = JSON.parse(readFileSync(DEMO, 'utf8')) as { options: unknown[] };
  for (let k = scenario.options.length; k < 12; k++) {
    scenario.options.push({ name: `Schools shut ${k} wk`, phases: [{ fromDay: 14, toDay: 14 + 7 * k, settingMultipliers: { school: 0 } }] });
  }
  const file = join(work, 'twelve.json');
  writeFileSync(file, JSON.stringify(scenario));
  const options = cliOptions(file);
  expect(options).toHaveLength(12);

  for (const [layout, extra, perGroup] of [
    ['a4-portrait', [], 5],
    ['letter-landscape', ['--paper', 'Letter', '--landscape'], 8],
  ] as const) {
    const pdf = join(work, `twelve-${layout}.pdf`);
    const pages = renderPdf(file, pdf, ...extra);
    const groups = Math.ceil(12 / perGroup);
    const expected: [string, (o: JsonOption) => string][] = [
      ['R at start (day 0)', (o) => print.r(o.rStart)],
      ['Attack rate, % of population', (o) => print.percent(o.attackRate)],
      ['Deaths, persons', (o) => print.persons(o.deaths)],
      ['Peak ICU beds in use', (o) => print.persons(o.peakIcuOccupancy ?? NaN)],
    ];
    for (const [label, format] of expected) {
      const lines = rowLines(pages, label);
      // One line per column group, each with that group's values, label and values on one page.
      expect(lines.map((l) => l.cells.length), `${layout}: ${label}`).toEqual(
        Array.from({ length: groups }, (_, g) => Math.min(perGroup, 12 - g * perGroup)),
      );
      expect(lines.flatMap((l) => l.cells), `${layout}: ${label}`).toEqual(options.map(format));
    }
    // Every row of the table, in every group, prints whole on one line of one page.
    for (const label of ['Growth rate at start, per day', 'Doubling time at start, days', 'Peak day (most infected)', 'Infections, persons', 'Deaths averted vs reference', 'Days ICU over capacity']) {
      expect(rowLines(pages, label).map((l) => l.cells.length), `${layout}: ${label}`).toEqual(
        Array.from({ length: groups }, (_, g) => Math.min(perGroup, 12 - g * perGroup)),
      );
    }
    const short = expectedShortFingerprint(file);
    for (const page of pages) expect(page).toContain(`scenario ${short}`);
    savePngs(pdf, `report-12-options-${layout}`);
  }
});

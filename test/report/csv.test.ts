import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import { CAUTION } from '../../src/report/cautions.ts';
import { dailySeriesCsv as dailySeriesCsvOf, optionsTableCsv as optionsTableCsvOf } from '../../src/report/csv.ts';
import type { ScenarioResults } from '../../src/engine/results.ts';
import { demo } from './helpers.ts';

const SOURCE = { fingerprint: 'f'.repeat(64), appVersion: '9.9.9' };
const optionsTableCsv = (results: ScenarioResults) => optionsTableCsvOf(results, SOURCE);
const dailySeriesCsv = (results: ScenarioResults) => dailySeriesCsvOf(results, SOURCE);

/** Parses CSV text into header-keyed rows, every cell as text (numbers are compared after Number()); "#" lines are the header block. */
function parseCsv(text: string): Record<string, string>[] {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, dynamicTyping: false, comments: '#' });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

const num = (cell: string): number | null => (cell === '' ? null : Number(cell));

/** The engine's number at the CSV's stated precision (6 significant digits): within half a unit of the 6th digit. */
function expectAtStatedPrecision(cell: string | undefined, engine: number | null): void {
  if (engine === null) return void expect(cell ?? '').toBe('');
  const shown = Number(cell);
  expect(Math.abs(shown - engine), `${cell} vs ${engine}`).toBeLessThanOrEqual(5e-6 * Math.abs(engine));
}

describe('optionsTableCsv', () => {
  const { scenario, results } = demo();
  const rows = parseCsv(optionsTableCsv(results));

  it('reads back to the numbers of a fresh runScenario at the stated precision, one row per option', () => {
    const fresh = runScenario(scenario);
    expect(rows.map((r) => r.option)).toEqual(fresh.options.map((o) => o.name));
    fresh.options.forEach((o, k) => {
      const r = rows[k];
      expect(r.reference).toBe(String(k === fresh.referenceIndex));
      expectAtStatedPrecision(r.r_start, o.rStart);
      expectAtStatedPrecision(r.growth_rate_per_day, o.growthRatePerDay);
      expectAtStatedPrecision(r.doubling_time_days, o.doublingTimeDays);
      expectAtStatedPrecision(r.halving_time_days, o.halvingTimeDays);
      expect(num(r.peak_day)).toBe(o.peakDay);
      expectAtStatedPrecision(r.peak_prevalence, o.peakPrevalence);
      expectAtStatedPrecision(r.infections, o.infections);
      expectAtStatedPrecision(r.attack_rate, o.attackRate);
      expectAtStatedPrecision(r.deaths, o.deaths);
      expectAtStatedPrecision(r.deaths_averted, fresh.options[fresh.referenceIndex].deaths - o.deaths);
      expectAtStatedPrecision(r.final_size_attack_rate, o.finalSize?.attackRate ?? null);
      expectAtStatedPrecision(r.peak_icu_occupancy, o.healthcare?.icu.peakOccupancy ?? null);
      expectAtStatedPrecision(r.hospital_admissions, o.healthcare?.admissions ?? null);
      expectAtStatedPrecision(r.vaccine_doses, o.vaccination?.doses ?? null);
      expectAtStatedPrecision(r.deaths_averted_per_1000_doses, o.comparison?.deathsAvertedPer1000Doses ?? null);
      fresh.ageBands.forEach((band, i) => {
        expectAtStatedPrecision(r[`attack_rate ${band}`], o.attackRateByBand[i]);
        expectAtStatedPrecision(r[`deaths ${band}`], o.deathsByBand[i]);
      });
    });
  });

  it('quotes names with commas or quotes and leaves hospital columns out without healthcare', () => {
    const renamed = { ...scenario, healthcare: undefined, options: scenario.options.map((o, k) => (k === 1 ? { ...o, name: 'Schools, "short"' } : o)) };
    const text = optionsTableCsv(runScenario(renamed));
    expect(text).toContain('"Schools, ""short"""');
    const back = parseCsv(text);
    expect(back[1].option).toBe('Schools, "short"');
    expect(Object.keys(back[0])).not.toContain('hospital_admissions');
    expect(text.endsWith('\r\n')).toBe(true);
  });

  it('starts with a "#" header block: what it is, the fingerprint and version, the caution, units and precision', () => {
    for (const text of [optionsTableCsv(results), dailySeriesCsv(results)]) {
      const block = text.split('\r\n').filter((line) => line.startsWith('# '));
      expect(text.startsWith('# Mixwise ')).toBe(true);
      expect(block.some((line) => line.includes(`Scenario fingerprint: ${SOURCE.fingerprint}`) && line.includes('mixwise 9.9.9'))).toBe(true);
      expect(block).toContain(`# ${CAUTION}`);
      expect(block.some((line) => line.includes('6 significant digits'))).toBe(true);
      expect(block.some((line) => line.startsWith('# Units:') || line.startsWith('# Quantities:'))).toBe(true);
    }
  });

  it('writes no number with more than 6 significant digits', () => {
    const cells = optionsTableCsv(results).split('\r\n').filter((line) => line !== '' && !line.startsWith('#')).slice(1).flatMap((line) => line.split(','));
    const numbers = cells.filter((c) => c !== '' && !Number.isNaN(Number(c)));
    expect(numbers.length).toBeGreaterThan(100);
    for (const c of numbers) {
      const digits = c.replace(/e.*$/, '').replace(/^-/, '').replace('.', '').replace(/^0+/, '');
      if (!Number.isInteger(Number(c))) expect(digits.length, c).toBeLessThanOrEqual(6);
    }
  });
});

describe('dailySeriesCsv', () => {
  const { results } = demo();
  const rows = parseCsv(dailySeriesCsv(results));

  it('has one line per option, day, band and quantity, in long format', () => {
    const H = results.options[0].series.days;
    const n = results.ageBands.length;
    // Per option: susceptible and prevalence (H+1 days) and incidence (H days) by band and 'all';
    // deaths (H), R(t) (H+1), four hospital series (H each).
    // Options with a vaccination campaign add daily doses by band and 'all' (H days).
    const perOption = (n + 1) * (2 * (H + 1) + H) + H + (H + 1) + 4 * H;
    const withDoses = results.options.filter((o) => o.vaccination !== null).length;
    expect(withDoses).toBeGreaterThan(0);
    expect(rows.length).toBe(results.options.length * perOption + withDoses * (n + 1) * H);
    expect(Object.keys(rows[0])).toEqual(['option', 'day', 'band', 'quantity', 'value']);
  });

  it('reads back to the engine series; band all is the sum over bands', () => {
    const o = results.options[2];
    const s = o.series;
    const pick = (quantity: string, band: string, day: number) =>
      rows.find((r) => r.option === o.name && r.quantity === quantity && r.band === band && Number(r.day) === day);
    const d = 60;
    const i = 7;
    expectAtStatedPrecision(pick('prevalence', results.ageBands[i], d)?.value, s.prevalence[d * s.bands + i]);
    expectAtStatedPrecision(pick('incidence', results.ageBands[i], d)?.value, s.incidence[d * s.bands + i]);
    expectAtStatedPrecision(pick('susceptible', results.ageBands[i], d)?.value, s.susceptible[d * s.bands + i]);
    expectAtStatedPrecision(pick('deaths', 'all', d)?.value, s.deaths[d]);
    expectAtStatedPrecision(pick('rt', 'all', d)?.value, s.rt[d]);
    expectAtStatedPrecision(pick('icu_occupancy', 'all', d)?.value, o.healthcare!.series.icuOccupancy[d]);
    let total = 0;
    for (let b = 0; b < s.bands; b++) total += s.prevalence[d * s.bands + b];
    expectAtStatedPrecision(pick('prevalence', 'all', d)?.value, total);
    // Summed daily incidence (day 0 holds the initial infections) gives the option's infections,
    // within the rounding of each day's value to 6 significant digits.
    const incidenceAll = rows.filter((r) => r.option === o.name && r.quantity === 'incidence' && r.band === 'all').reduce((a, r) => a + Number(r.value), 0);
    expect(Math.abs(incidenceAll - o.infections)).toBeLessThanOrEqual(5e-6 * o.infections);
  });
});

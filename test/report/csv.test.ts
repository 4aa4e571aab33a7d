import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import { dailySeriesCsv, optionsTableCsv } from '../../src/report/csv.ts';
import { demo } from './helpers.ts';

/** Parses CSV text into header-keyed rows, every cell as text (numbers are compared after Number()). */
function parseCsv(text: string): Record<string, string>[] {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, dynamicTyping: false });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

const num = (cell: string): number | null => (cell === '' ? null : Number(cell));

describe('optionsTableCsv', () => {
  const { scenario, results } = demo();
  const rows = parseCsv(optionsTableCsv(results));

  it('reads back to exactly the numbers of a fresh runScenario, one row per option', () => {
    const fresh = runScenario(scenario);
    expect(rows.map((r) => r.option)).toEqual(fresh.options.map((o) => o.name));
    fresh.options.forEach((o, k) => {
      const r = rows[k];
      expect(r.reference).toBe(String(k === fresh.referenceIndex));
      expect(num(r.r_start)).toBe(o.rStart);
      expect(num(r.growth_rate_per_day)).toBe(o.growthRatePerDay);
      expect(num(r.doubling_time_days)).toBe(o.doublingTimeDays);
      expect(num(r.halving_time_days)).toBe(o.halvingTimeDays);
      expect(num(r.peak_day)).toBe(o.peakDay);
      expect(num(r.peak_prevalence)).toBe(o.peakPrevalence);
      expect(num(r.infections)).toBe(o.infections);
      expect(num(r.attack_rate)).toBe(o.attackRate);
      expect(num(r.deaths)).toBe(o.deaths);
      expect(num(r.deaths_averted)).toBeCloseTo(fresh.options[fresh.referenceIndex].deaths - o.deaths, 6);
      expect(num(r.final_size_attack_rate)).toBe(o.finalSize?.attackRate ?? null);
      expect(num(r.peak_icu_occupancy)).toBe(o.healthcare?.icu.peakOccupancy ?? null);
      expect(num(r.hospital_admissions)).toBe(o.healthcare?.admissions ?? null);
      expect(num(r.vaccine_doses)).toBe(o.vaccination?.doses ?? 0);
      expect(num(r.deaths_averted_per_1000_doses)).toBe(o.comparison?.deathsAvertedPer1000Doses ?? null);
      fresh.ageBands.forEach((band, i) => {
        expect(num(r[`attack_rate ${band}`])).toBe(o.attackRateByBand[i]);
        expect(num(r[`deaths ${band}`])).toBe(o.deathsByBand[i]);
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
    expect(Number(pick('prevalence', results.ageBands[i], d)?.value)).toBe(s.prevalence[d * s.bands + i]);
    expect(Number(pick('incidence', results.ageBands[i], d)?.value)).toBe(s.incidence[d * s.bands + i]);
    expect(Number(pick('susceptible', results.ageBands[i], d)?.value)).toBe(s.susceptible[d * s.bands + i]);
    expect(Number(pick('deaths', 'all', d)?.value)).toBe(s.deaths[d]);
    expect(Number(pick('rt', 'all', d)?.value)).toBe(s.rt[d]);
    expect(Number(pick('icu_occupancy', 'all', d)?.value)).toBe(o.healthcare?.series.icuOccupancy[d]);
    let total = 0;
    for (let b = 0; b < s.bands; b++) total += s.prevalence[d * s.bands + b];
    expect(Number(pick('prevalence', 'all', d)?.value)).toBeCloseTo(total, 6);
    // Summed daily incidence (day 0 holds the initial infections) gives the option's infections.
    const incidenceAll = rows.filter((r) => r.option === o.name && r.quantity === 'incidence' && r.band === 'all').reduce((a, r) => a + Number(r.value), 0);
    expect(incidenceAll).toBeCloseTo(o.infections, 3);
  });
});

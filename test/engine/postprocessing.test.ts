/**
 * The post-processing of an option run (hospital demand, the death series, measure burden) gives
 * the numbers it gave before it was rewritten for speed, within 1e-12 relative: the expected
 * values in fixtures/postprocessing.json were written by fixtures/makePostprocessingFixture.ts at
 * the revision before the rewrite, from inputs that need no integrator (fixtures/postprocessingCases.ts).
 * Also: hospital demand read from cumulative infections equals demand from the daily array, bit
 * for bit, and the blocked convolution equals the day-by-day sum bit for bit.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { totalOverBands, weightedBandSum } from '../../src/engine/bandTotals.ts';
import { convolve, scalarConvolveInto } from '../../src/engine/distributions.ts';
import { pairedConvolution } from '../../src/engine/pairedConvolution.ts';
import { healthcareDemand, healthcareDemandOfRun } from '../../src/engine/healthcare/demand.ts';
import { measureBurden } from '../../src/engine/measureBurden.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { demoScenario } from '../helpers/demo.ts';
import { burdenCases, syntheticInfections, withDelaysByBand } from './fixtures/postprocessingCases.ts';

const expected = JSON.parse(readFileSync(new URL('./fixtures/postprocessing.json', import.meta.url), 'utf8'));

/** Every number of `actual` within `rel` (relative, absolute below 1e-300) of `wanted`, every other value equal; `path` names the first that is not. */
function expectClose(actual: unknown, wanted: unknown, path: string, rel = 1e-12): void {
  if (typeof wanted === 'number') {
    expect(typeof actual, path).toBe('number');
    const a = actual as number;
    const tolerance = rel * Math.max(Math.abs(wanted), 1e-300);
    if (!(Math.abs(a - wanted) <= tolerance)) expect(a, path).toBe(wanted);
    return;
  }
  if (wanted === null || typeof wanted !== 'object') {
    expect(actual, path).toStrictEqual(wanted);
    return;
  }
  const actualObject = (ArrayBuffer.isView(actual) ? Array.from(actual as Float64Array) : actual) as Record<string, unknown>;
  expect(Object.keys(actualObject).sort(), path).toStrictEqual(Object.keys(wanted).sort());
  for (const [key, value] of Object.entries(wanted)) expectClose(actualObject[key], value, `${path}.${key}`, rel);
}

/** Cumulative infections by band, days 0..H (band-major), whose daily differences are `x` from day 1 on (day 0's go to the seeds). */
function cumulativeOf(x: Float64Array, n: number, seeds: Float64Array): Float64Array {
  const days = x.length / n;
  const cumulative = new Float64Array((days + 1) * n);
  for (let d = 0; d < days; d++) for (let i = 0; i < n; i++) cumulative[(d + 1) * n + i] = cumulative[d * n + i] + (d === 0 ? x[i] - seeds[i] : x[d * n + i]);
  return cumulative;
}

describe('post-processing of an option run', () => {
  const demo = demoScenario();
  const p = prepareScenario(demo);
  const n = demo.ageBands.length;
  const x = syntheticInfections(demo.populationPersons, demo.horizonDays);

  it('hospital demand is what it was before the rewrite (one delay group, and three)', () => {
    expectClose(healthcareDemand(p.healthcare!, x), expected.healthcare, 'healthcare');
    const byBand = prepareScenario(withDelaysByBand(demo));
    expect(byBand.healthcare!.groups).toHaveLength(3);
    expectClose(healthcareDemand(byBand.healthcare!, x), expected.healthcareByBandDelays, 'healthcareByBandDelays');
  });

  it('the death series is what it was before the rewrite', () => {
    expectClose(convolve(weightedBandSum(x, n, p.infectionFatalityRatio), p.deathDelayWeights), expected.deaths, 'deaths');
  });

  it('measure burden is what it was before the rewrite (fixed phases, and a triggered one beside a fixed one)', () => {
    const cases = burdenCases(demo);
    expect(cases).toHaveLength(expected.measureBurden.length);
    cases.forEach(({ scenario, option, triggers }, k) => {
      expectClose(measureBurden(scenario, option, triggers), expected.measureBurden[k], option.name);
      // Kept per option when no trigger moved the measures: a second run gets the same numbers.
      expect(measureBurden(scenario, option, triggers), option.name).toStrictEqual(measureBurden(scenario, option, triggers));
    });
  });

  it('hospital demand from cumulative infections equals demand from the daily array, bit for bit (with and without protected people)', () => {
    const h = prepareScenario(withDelaysByBand(demo)).healthcare!;
    const seeds = Float64Array.from(demo.initialState.infectedPersons);
    const cumulative = cumulativeOf(x, n, seeds);
    const daily = new Float64Array(x.length);
    for (let d = 0; d < demo.horizonDays; d++) for (let i = 0; i < n; i++) daily[d * n + i] = Math.max(0, cumulative[(d + 1) * n + i] - cumulative[d * n + i]) + (d === 0 ? seeds[i] : 0);
    expect(healthcareDemandOfRun(h, cumulative, seeds, null, 1)).toStrictEqual(healthcareDemand(h, daily));

    const protectedCumulative = cumulativeOf(syntheticInfections(demo.populationPersons.map((N) => N / 5), demo.horizonDays, 20), n, new Float64Array(n));
    const factor = 0.3;
    const weighted = daily.map((v, k) => {
      const row = Math.floor(k / n);
      const i = k % n;
      return Math.max(0, v - (1 - factor) * Math.max(0, protectedCumulative[(row + 1) * n + i] - protectedCumulative[row * n + i]));
    });
    expect(healthcareDemandOfRun(h, cumulative, seeds, protectedCumulative, factor)).toStrictEqual(healthcareDemand(h, weighted));
  });

  it("a run's hospital demand is that of its own daily infections series, bit for bit (options without vaccination)", () => {
    for (const option of demo.options.filter((o) => o.vaccinationCampaign === undefined)) {
      const run = simulateOption(p, option);
      expect(run.healthcare, option.name).toStrictEqual(healthcareDemand(p.healthcare!, run.series.incidence));
    }
  });

  it('the peak is the first day of the largest E + I total, each day summed over the bands in order, bit for bit', () => {
    for (const option of demo.options) {
      const run = simulateOption(p, option);
      const totals = totalOverBands(run.series.prevalence, n);
      let day = 0;
      for (let d = 1; d < totals.length; d++) if (totals[d] > totals[day]) day = d;
      expect([run.peakDay, run.peakInfectedPersons], option.name).toStrictEqual([day, totals[day]]);
    }
  });

  it('the blocked convolution and the two-lane one equal the day-by-day sum bit for bit, for every kernel and series length', () => {
    expect(pairedConvolution(), 'WebAssembly lanes in Node').not.toBeNull();
    const byDay = (series: Float64Array, w: Float64Array): Float64Array =>
      series.map((_, d) => {
        let acc = 0;
        for (let a = Math.max(0, d - w.length + 1); a <= d; a++) acc += series[a] * w[d - a];
        return acc;
      });
    for (const days of [0, 1, 3, 4, 5, 7, 8, 9, 15, 16, 17, 23, 24, 40, 365]) {
      for (const length of [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 11, 39, 40, 41, 60, 129, 400]) {
        const series = Float64Array.from({ length: days }, (_, d) => Math.exp(Math.sin(d * 1.3)) * 10 ** ((d % 7) - 3));
        const w = Float64Array.from({ length }, (_, k) => Math.exp(-k / 4) / 3 + 1e-9 * k);
        const wanted = Array.from(byDay(series, w));
        expect(Array.from(convolve(series, w)), `${days} days, kernel ${length}`).toStrictEqual(wanted);
        expect(Array.from(scalarConvolveInto(new Float64Array(days), series, w)), `scalar, ${days} days, kernel ${length}`).toStrictEqual(wanted);
      }
    }
    // A series that is not finite everywhere keeps the days its infinity does not reach finite.
    const series = Float64Array.from({ length: 100 }, (_, d) => (d === 60 ? Infinity : 1 + d));
    const w = Float64Array.from({ length: 10 }, (_, k) => 0.1 * (k + 1));
    expect(Array.from(convolve(series, w))).toStrictEqual(Array.from(byDay(series, w)));
  });
});

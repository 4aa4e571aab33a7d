/**
 * A summary run (`series: 'summary'`) delivers every outcome of the catalogue (src/report/outcomes.ts,
 * by option and by band) equal, bit for bit, to the full run's, and keeps no daily series. On the
 * demo (hospital section, vaccination, measures on fixed days), with a triggered option added, and
 * on the demo without its hospital section (where a summary run needs no daily infections at all).
 */
import { describe, expect, it } from 'vitest';
import { runScenario, runScenarioSummary } from '../../src/engine/run.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { mapInline } from '../../src/engine/pool/pool.ts';
import type { PolicyOption, Scenario, ScenarioSummary } from '../../src/engine/index.ts';
import { BAND_OUTCOMES, OUTCOMES, outcomeDatum } from '../../src/report/outcomes.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';

/** The demo with one more option: its first phase's measures switched on and off by ICU occupancy. */
function withTriggeredOption(s: Scenario): Scenario {
  const fixed = s.options.find((o) => o.phases.length > 0)!;
  const triggered: PolicyOption = {
    ...fixed,
    name: 'When ICU fills',
    phases: [{ ...fixed.phases[0], fromDay: 0, toDay: s.horizonDays, trigger: { quantity: 'icuOccupancy', onAbove: 40, offBelow: 20, minimumDaysOn: 14, lagDays: 3 } }],
  };
  return valid({ ...s, options: [...s.options, triggered] });
}

function withoutHospitals(s: Scenario): Scenario {
  const { healthcare: _, ...rest } = s;
  return valid({ ...rest, options: rest.options.map((o) => ({ ...o, phases: o.phases.filter((ph) => ph.trigger === undefined) })) });
}

/** Every catalogue number of every option, keyed "option / outcome". */
function catalogueValues(results: ScenarioSummary): Map<string, unknown> {
  const values = new Map<string, unknown>();
  for (const o of results.options) {
    for (const entry of OUTCOMES) values.set(`${o.name} / ${entry.key}`, outcomeDatum(entry, o, results));
    for (const entry of BAND_OUTCOMES) values.set(`${o.name} / ${entry.key}`, entry.read(o, results));
  }
  return values;
}

function expectSameOutcomes(s: Scenario): void {
  const full = catalogueValues(runScenario(s));
  const summary = catalogueValues(runScenarioSummary(s));
  expect(summary.size).toBe(full.size);
  for (const [key, value] of full) expect(summary.get(key), key).toStrictEqual(value);
}

describe('summary runs', () => {
  it('give every catalogue outcome of the full run, bit for bit: demo with a triggered option', { timeout: 60_000 }, () => {
    const s = withTriggeredOption(demoScenario());
    expect(s.options.some((o) => o.vaccinationCampaign !== undefined)).toBe(true);
    expect(s.healthcare).toBeDefined();
    expect(runScenarioSummary(s).options.at(-1)!.triggers[0].switchesOn).toBeGreaterThan(0);
    expectSameOutcomes(s);
  });

  it('give every catalogue outcome of the full run, bit for bit: demo without a hospital section', { timeout: 60_000 }, () => {
    expectSameOutcomes(withoutHospitals(demoScenario()));
  });

  it('a run without R(t) gives the full run\'s outcomes and series, R(t) aside, bit for bit', () => {
    const s = withTriggeredOption(demoScenario());
    const p = prepareScenario(s);
    for (const option of s.options) {
      const { series: fullSeries, ...fullOutcomes } = simulateOption(p, option);
      const { series, ...outcomes } = simulateOption(p, option, { series: 'noRt' });
      expect(outcomes, option.name).toStrictEqual(fullOutcomes);
      const { rt: _, ...withoutRt } = fullSeries;
      expect(series, option.name).toStrictEqual(withoutRt);
      expect('rt' in series).toBe(false);
    }
  });

  it('keep no daily series; the full run keeps them', () => {
    const s = demoScenario();
    const p = prepareScenario(s);
    const summary = simulateOption(p, s.options[0], { series: 'summary' });
    expect('series' in summary).toBe(false);
    expect(simulateOption(p, s.options[0]).series.rt.length).toBe(s.horizonDays + 1);
    const viaJob = mapInline('optionSummaries', s, [0, 1]);
    expect(viaJob.every((o) => !('series' in o))).toBe(true);
    expect(viaJob[1]).toStrictEqual(simulateOption(p, s.options[1], { series: 'summary' }));
  });
});

/**
 * The engine's default tolerances keep the outcomes analysts read within 1e-6 (relative) of a
 * tight-tolerance solution of the same engine (rtol 1e-10, atol 1e-10 persons): attack rates
 * (overall and by band), deaths, the peak of the infected and peak ward and ICU occupancy. On the
 * demo (every option, vaccination included) and on a fast-growth and a slow-growth variant.
 * Speed work may change how the engine integrates, never how close it stays to this.
 */
import { describe, expect, it } from 'vitest';
import { prepareScenario } from '../../src/engine/prepare.ts';
import type { OptionResults, Scenario } from '../../src/engine/index.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';

const TIGHT = { relative: 1e-10, absolute: 1e-10 };
const AGREEMENT = 1e-6;

/** The outcomes the accuracy promise covers, by name. */
function outcomes(o: OptionResults): Record<string, number> {
  const byBand = Object.fromEntries(o.attackRateByBand.map((x, i) => [`attackRate[${i}]`, x]));
  return {
    attackRate: o.attackRate,
    ...byBand,
    deaths: o.deaths,
    peakInfectedPersons: o.peakInfectedPersons,
    peakWardOccupancy: o.healthcare?.ward.peakOccupancy ?? 0,
    peakIcuOccupancy: o.healthcare?.icu.peakOccupancy ?? 0,
  };
}

/** The worst relative difference over the outcomes, with the outcome's name. */
function worstDifference(s: Scenario): { option: string; outcome: string; relative: number } {
  const p = prepareScenario(s);
  let worst = { option: '', outcome: '', relative: 0 };
  for (const option of s.options) {
    const fast = outcomes(simulateOption(p, option));
    const tight = outcomes(simulateOption(p, option, { accuracy: TIGHT }));
    for (const [name, reference] of Object.entries(tight)) {
      const relative = reference === 0 ? Math.abs(fast[name]) : Math.abs(fast[name] - reference) / Math.abs(reference);
      if (relative > worst.relative) worst = { option: option.name, outcome: name, relative };
    }
  }
  return worst;
}

/** The demo with another R0 and periods. */
function variant(r0: number, latentPeriodDays: number, infectiousPeriodDays: number): Scenario {
  const s = demoScenario();
  return valid({ ...s, disease: { ...s.disease, transmission: { kind: 'r0', r0 }, latentPeriodDays, infectiousPeriodDays } });
}

/** The demo under strong measures (every setting at `multiplier`, half the cases isolated) from `from` to `to`, then released. */
function suppressed(from: number, to: number, multiplier: number, horizonDays: number, vaccination: boolean): Scenario {
  const s = demoScenario();
  const settingMultipliers = Object.fromEntries(s.settings.map((setting) => [setting.name, multiplier]));
  const campaign = s.options.find((o) => o.vaccinationCampaign !== undefined)?.vaccinationCampaign;
  return valid({
    ...s,
    horizonDays,
    referenceOption: undefined,
    options: [{ name: 'suppressed, then released', ...(vaccination ? { vaccinationCampaign: campaign } : {}), phases: [{ fromDay: from, toDay: to, settingMultipliers, caseIsolation: 0.5 }] }],
  });
}

describe('accuracy of the default tolerances', () => {
  it('the demo, every option: within 1e-6 of rtol 1e-10', { timeout: 120_000 }, () => {
    expect(worstDifference(demoScenario()).relative).toBeLessThan(AGREEMENT);
  });

  it('fast growth (R0 6, latent 2 days, infectious 3 days): within 1e-6', { timeout: 120_000 }, () => {
    expect(worstDifference(variant(6, 2, 3)).relative).toBeLessThan(AGREEMENT);
  });

  it('slow growth (R0 1.3, latent 4 days, infectious 7 days): within 1e-6', { timeout: 120_000 }, () => {
    expect(worstDifference(variant(1.3, 4, 7)).relative).toBeLessThan(AGREEMENT);
  });

  // After months of suppression the second wave grows from E and I far below their first peak, and
  // its timing amplifies their relative error: no tolerance this loose keeps 1e-6 there (Tsitouras
  // 5(4) at the defaults: 1.4e-4 and 1.8e-3; the former Dormand-Prince 5(4) at rtol 4e-6: 1.2e-2
  // and 1.8e-3). These bounds catch an error control that relaxes small components (a floor at 1%
  // of each component's peak size: 9.3e-3 and 0.71).
  it('a second wave after 180 days of suppression: within 1e-3', { timeout: 120_000 }, () => {
    expect(worstDifference(suppressed(20, 200, 0.1, 500, false)).relative).toBeLessThan(1e-3);
  });

  it('a second wave after 240 days of suppression, with vaccination: within 1e-2', { timeout: 120_000 }, () => {
    expect(worstDifference(suppressed(60, 300, 0.15, 700, true)).relative).toBeLessThan(1e-2);
  });

  it('a looser tolerance is caught: rtol 1e-3 misses by more than 1e-6', { timeout: 120_000 }, () => {
    const s = demoScenario();
    const p = prepareScenario(s);
    const loose = outcomes(simulateOption(p, s.options[1], { accuracy: { relative: 1e-3 } }));
    const tight = outcomes(simulateOption(p, s.options[1], { accuracy: TIGHT }));
    expect(Math.abs(loose.peakInfectedPersons - tight.peakInfectedPersons) / tight.peakInfectedPersons).toBeGreaterThan(AGREEMENT);
  });
});

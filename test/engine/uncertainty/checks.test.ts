import { describe, expect, it } from 'vitest';
import { MIN_PERIOD_DAYS } from '../../../src/engine/limits.ts';
import {
  distributionQuantile,
  evaluateDrawRange,
  prepareDraws,
  summariseDraws,
  type Scenario,
  type UncertaintyInput,
} from '../../../src/engine/index.ts';
import { valid } from '../../helpers/scenarios.ts';
import { oneGroupFinalSize } from '../../helpers/byHand.ts';
import { catalogueReader, DRAW_OUTCOME_KEYS } from '../../../src/report/drawOutcomes.ts';


function oneBandWith(uncertainty: UncertaintyInput, options: Scenario['options'] = [{ name: 'none', description: '', phases: [] }]): Scenario {
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'one band with uncertainty',
    ageBands: [{ label: 'all', lowerAgeYears: 0 }],
    populationPersons: [1e6],
    settings: [{ name: 'all', contactsPerDay: [[10]] }],
    disease: { transmission: { kind: 'r0', r0: 2.5 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
    severity: { infectionFatalityRatio: [0.01], source: 'test value' },
    initialState: { infectedPersons: [100] },
    horizonDays: 1500,
    options,
    uncertainty,
  });
}

function run(s: Scenario) {
  const p = prepareDraws(s);
  return summariseDraws(p, evaluateDrawRange(p, 0, p.uncertainty.draws, catalogueReader), DRAW_OUTCOME_KEYS);
}

describe('uncertainty: published and structural checks', () => {
  it('one band, R0 uniform: the attack-rate interval is the final-size relation at the R0 quantiles', () => {
    // z(R0) = 1 - exp(-R0 z) (Kermack & McKendrick 1927) is increasing in R0, so the quantiles of the
    // attack rate are z at the quantiles of R0. With N Latin hypercube draws the sorted R0 draws lie
    // one per stratum, so the sample quantile at p lies within 1/N of the true p; the run itself
    // matches z to about 1e-4 (seeding of 1e-4 of the population, 1500 days).
    const N = 200;
    const r = run(oneBandWith({ draws: N, seed: 11, intervalLevel: 0.9, parameters: [{ name: 'r0', distribution: { kind: 'uniform', low: 1.5, high: 3 }, source: 'test' }] }));
    const q = (p: number) => 1.5 + 1.5 * p;
    const interval = r.options[0].intervals.attackRate;
    if (interval === null || interval === undefined) throw new Error('no attack-rate interval');
    for (const [value, p] of [[interval.low, 0.05], [interval.median, 0.5], [interval.high, 0.95]] as const) {
      expect(value).toBeGreaterThan(oneGroupFinalSize(q(p - 1 / N)) - 2e-4);
      expect(value).toBeLessThan(oneGroupFinalSize(q(p + 1 / N)) + 2e-4);
    }
    expect(r.uncertainty.failedDraws).toBe(0);
    // R0 drives the attack rate monotonically: PRCC (Spearman with one parameter) is 1.
    expect(r.sensitivity.find((x) => x.outcome === 'infections')?.prcc).toBeCloseTo(1, 10);
  });

  it('an option identical to the reference is never better, and every paired difference is zero', () => {
    const same = { name: 'same again', description: '', phases: [] };
    const s = oneBandWith(
      { draws: 40, seed: 3, parameters: [{ name: 'r0', distribution: { kind: 'triangular', low: 1.5, mode: 2, high: 3 }, source: 'test' }, { name: 'ifrScale', distribution: { kind: 'uniform', low: 0.5, high: 1.5 }, source: 'test' }] },
      [{ name: 'none', description: '', phases: [] }, same],
    );
    const p = prepareDraws(s);
    const draws = evaluateDrawRange(p, 0, 40, catalogueReader);
    for (const d of draws) {
      if (!d.ok) throw new Error(d.reason);
      expect(Array.from(d.outcomes[1])).toEqual(Array.from(d.outcomes[0]));
    }
    const r = summariseDraws(p, draws, DRAW_OUTCOME_KEYS);
    expect(r.options[1].probabilityBetterThanReference).toEqual({ deaths: 0, infections: 0 });
    expect(r.options[1].intervals.deathsAverted).toEqual({ median: 0, low: 0, high: 0 });
    // Tied in every draw: each is best in half of them.
    expect(r.options[1].probabilityBest.deaths).toBeCloseTo(0.5, 12);
  });

  it('an option that cuts contacts is better in every draw, and R0 (not the IFR) drives its infections', () => {
    const s = oneBandWith(
      { draws: 60, seed: 5, parameters: [{ name: 'r0', distribution: { kind: 'uniform', low: 1.5, high: 3 }, source: 'test' }, { name: 'ifrScale', distribution: { kind: 'uniform', low: 0.5, high: 1.5 }, source: 'test' }] },
      [{ name: 'none', description: '', phases: [] }, { name: 'fewer contacts', description: '', phases: [{ fromDay: 0, toDay: 1500, settingMultipliers: { all: 0.8 }, ageFactors: [], caseIsolation: 0 }] }],
    );
    const r = run(s);
    expect(r.options[1].probabilityBetterThanReference.deaths).toBe(1);
    expect(r.options[1].probabilityBest.infections).toBe(1);
    const prcc = (outcome: string, parameter: string) => r.sensitivity.find((x) => x.option === 'fewer contacts' && x.outcome === outcome && x.parameter === parameter)?.prcc;
    expect(prcc('infections', 'r0')).toBeGreaterThan(0.99);
    // Infections do not depend on the IFR at all, and R0 explains them entirely: 0.
    expect(prcc('infections', 'ifrScale')).toBe(0);
    expect(prcc('deaths', 'ifrScale')).toBeGreaterThan(0.9);
  });

  it('counts a draw that breaks a rule as failed, names it, and keeps the others', () => {
    // A latent period from a normal without truncation: draws below MIN_PERIOD_DAYS break its bound.
    const s = oneBandWith({ draws: 50, seed: 2, parameters: [{ name: 'latentPeriodDays', distribution: { kind: 'normal', mean: 0.5, sd: 0.5 }, source: 'test' }] });
    const p = prepareDraws(s);
    const expectedFailures = Array.from({ length: 50 }, (_, i) => i).filter((i) => !(distributionQuantile(s.uncertainty!.parameters[0].distribution, (p.hypercube.strata[0][i] + 0.5) / 50) >= MIN_PERIOD_DAYS)).length;
    const r = run(s);
    expect(r.uncertainty.failedDraws).toBeGreaterThan(0);
    expect(Math.abs(r.uncertainty.failedDraws - expectedFailures)).toBeLessThanOrEqual(1); // jitter can move one draw across 0
    expect(r.uncertainty.notes[0]).toMatch(/^draw \d+ failed and is left out: disease\.latentPeriodDays must be at least 0\.1 days, got /);
    expect(r.options[0].intervals.deaths).not.toBeNull();
  });
});

/**
 * Shares of draws in which each top order is best: an order better in every draw gets 1, equal
 * orders split the draws, the shares sum to 1, and a pool of workers gives the same shares.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { nodeWorkerPool } from '../../src/cli/workerThreads.ts';
import { mapInline } from '../../src/engine/pool/pool.ts';
import type { Scenario, ScenarioInput } from '../../src/engine/scenario.ts';
import { orderShares, orderValuesUnderDraw, prepareOrderDraws, type OrderDrawsContext } from '../../src/engine/vaccination/orderDraws.ts';
import { evaluateOptionUnderDraw } from '../../src/engine/uncertainty/drawOutcomes.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';

const ACTIVITY = [0.5, 2, 1.5, 2.5];

/**
 * Four bands of 1,000; band 3 has an IFR of 0. The vaccine does not stop infection (efficacy
 * against infection 0), so a dose only protects its own recipient from death: 1,500 doses to
 * bands 0 and 1 save deaths in every draw, the same doses to bands 3 and 2 save far fewer.
 */
function scenario(): Scenario {
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'dominance',
    ageBands: [0, 20, 40, 60].map((a) => ({ label: `from ${a}`, lowerAgeYears: a })),
    populationPersons: [1000, 1000, 1000, 1000],
    settings: [{ name: 'all', contactsPerDay: ACTIVITY.map((a) => ACTIVITY.map((b) => 2 * a * b)) }],
    disease: { transmission: { kind: 'r0', r0: 2 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
    severity: { infectionFatalityRatio: [0.03, 0.02, 0.005, 0], source: 'test values' },
    initialState: { infectedPersons: [0, 1e-6, 0, 0] },
    horizonDays: 1200,
    options: [{ name: 'vaccinate', vaccinationCampaign: 'supply' }],
    vaccinationCampaigns: [
      {
        name: 'supply',
        schedule: [{ fromDay: 0, dosesPerDay: 1500 }, { fromDay: 1, dosesPerDay: 0 }],
        uptakeCeiling: [1, 1, 1, 1],
        delayToProtectionDays: 1,
        efficacyAgainstInfection: 0,
        efficacyAgainstDeath: 0.8,
        priority: [[0], [1], [2], [3]],
      },
    ],
    uncertainty: {
      draws: 8,
      seed: 3,
      parameters: [
        { name: 'r0', distribution: { kind: 'uniform', low: 1.5, high: 3 }, source: 'test range' },
        { name: 'ifrScale', distribution: { kind: 'uniform', low: 0.5, high: 2 }, source: 'test range' },
      ],
    },
  } as ScenarioInput);
}

const GOOD = [[0], [1], [2], [3]];
const POOR = [[3], [2], [1], [0]];

function context(priorities: number[][][]): OrderDrawsContext {
  return { scenario: scenario(), option: 'vaccinate', outcome: 'deaths', priorities };
}

function sharesOf(c: OrderDrawsContext) {
  const results = mapInline('orderDraws', c, Array.from({ length: 8 }, (_, i) => i));
  return { results, shares: orderShares(prepareOrderDraws(c), results) };
}

const pool = nodeWorkerPool(2);
afterAll(() => pool.close());

describe('share of draws in which an order is best', () => {
  it('is 1 for an order better in every draw, and the draws really differ', () => {
    const { results, shares } = sharesOf(context([POOR, GOOD]));
    expect(shares.shareOfDrawsBest).toEqual([0, 1]);
    expect(shares).toMatchObject({ draws: 8, seed: 3, failedDraws: 0 });
    const good = results.map((r) => (r.ok ? r.values[1] : NaN));
    expect(new Set(good).size).toBe(8);
  });

  it('splits ties and sums to 1 over the orders compared', () => {
    const { shares } = sharesOf(context([GOOD, POOR, GOOD]));
    expect(shares.shareOfDrawsBest).toEqual([0.5, 0, 0.5]);
    const mixed = sharesOf(context([GOOD, [[1], [0], [2], [3]], [[0], [2], [1], [3]], POOR])).shares.shareOfDrawsBest;
    expect(mixed.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('runs each order under the draw evaluateOptionUnderDraw gives, measure adherence included', () => {
    // The demo's campaign option, given the measures of an option that has some.
    const demo = demoScenario();
    const withMeasures = demo.options.find((o) => o.phases.length > 0);
    const k = demo.options.findIndex((o) => o.vaccinationCampaign !== undefined);
    if (withMeasures === undefined || k < 0) throw new Error('the demo has an option with measures and one with a campaign');
    const option = { ...demo.options[k], phases: withMeasures.phases };
    const scenario = valid({
      ...demo,
      options: demo.options.map((o, j) => (j === k ? option : o)),
      uncertainty: {
        draws: 4,
        seed: 5,
        parameters: [
          { name: 'measureAdherence', distribution: { kind: 'uniform', low: 0.3, high: 0.9 }, source: 'test range' },
          { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test range' },
        ],
      },
    } as ScenarioInput);
    const campaign = scenario.vaccinationCampaigns.find((v) => v.name === option.vaccinationCampaign);
    const priority = [...(campaign?.priority ?? [])].reverse();
    const p = prepareOrderDraws({ scenario, option: option.name, outcome: 'deaths', priorities: [priority] });
    for (const draw of [0, 3]) {
      const mine = orderValuesUnderDraw(p, draw);
      const theirs = evaluateOptionUnderDraw(p.byOrder[0], draw, option);
      if (!mine.ok || !theirs.ok) throw new Error('draws must run');
      expect(mine.values[0]).toBe(theirs.results.deaths);
    }
  });

  it('is the same on a pool of workers', { timeout: 120_000 }, async () => {
    const c = context([GOOD, [[1], [0], [2], [3]], POOR]);
    const pooled = await pool.map('orderDraws', c, Array.from({ length: 8 }, (_, i) => i));
    expect(JSON.stringify(pooled)).toBe(JSON.stringify(sharesOf(c).results));
  });
});

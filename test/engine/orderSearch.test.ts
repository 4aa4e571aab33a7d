/** Order search: the exact knapsack case, exhaustive against brute force and heuristic, sound bounds, the Bubar et al. pattern. */
import { describe, expect, it } from 'vitest';
import { finalSizeByBand } from '../../src/engine/finalSize.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import type { Scenario, ScenarioInput } from '../../src/engine/scenario.ts';
import { segmentsOf } from '../../src/engine/segments.ts';
import { evaluateOrder, ORDER_OUTCOMES, outcomeBound, priorityOf, type OrderEvaluation, type OrderSearchJob } from '../../src/engine/vaccination/orderEvaluation.ts';
import { prepareCampaign } from '../../src/engine/vaccination/prepareCampaign.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { prepareOrderSearch } from '../../src/engine/vaccination/orderJob.ts';
import { inThreadEvaluator, searchOrders } from '../../src/engine/vaccination/orderSearch.ts';
import { demoScenario } from '../helpers/demo.ts';
import { valid } from '../helpers/scenarios.ts';

const N = 1000;
const ACTIVITY = [0.5, 2, 1.5, 2.5];
const IFR = [0.03, 0.02, 0.005, 0.003];

/**
 * Four bands of 1,000 people; band 0 has the highest IFR but few contacts. 1,500 doses go out on
 * day 0 (one and a half bands), protect after a mean of 1 day, and 1e-6 seeded infections need
 * some 90 days to take off, so every dose protects before transmission does.
 */
function knapsackScenario(efficacyAgainstInfection = 0, schedule = [{ fromDay: 0, dosesPerDay: 1500 }, { fromDay: 1, dosesPerDay: 0 }], seed = 1e-6): Scenario {
  const contacts = ACTIVITY.map((a) => ACTIVITY.map((b) => 2 * a * b));
  return valid({
    format: 'mixwise-scenario',
    version: 1,
    title: 'knapsack',
    ageBands: [0, 20, 40, 60].map((a) => ({ label: `from ${a}`, lowerAgeYears: a })),
    populationPersons: [N, N, N, N],
    settings: [{ name: 'all', contactsPerDay: contacts }],
    disease: { transmission: { kind: 'r0', r0: 2 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
    severity: { infectionFatalityRatio: IFR, source: 'test values' },
    initialState: { infectedPersons: [0, seed, 0, 0] },
    horizonDays: 1200,
    options: [{ name: 'vaccinate', vaccinationCampaign: 'supply' }],
    vaccinationCampaigns: [
      {
        name: 'supply',
        schedule,
        uptakeCeiling: [1, 1, 1, 1],
        delayToProtectionDays: 1,
        efficacyAgainstInfection,
        efficacyAgainstDeath: 0.8,
        priority: [[0], [1], [2], [3]],
      },
    ],
  } as ScenarioInput);
}

function jobOf(s: Scenario, outcome: string, groups?: number[][], option = s.options[s.options.length - 1].name): OrderSearchJob {
  const r = prepareOrderSearch(s, { option, outcome, groups });
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.job;
}

function allPermutations(m: number): number[][] {
  if (m === 0) return [[]];
  return allPermutations(m - 1).flatMap((p) => Array.from({ length: m }, (_, k) => [...p.slice(0, k), m - 1, ...p.slice(k)]));
}

describe('exact case: a vaccine that does not stop infection, given before take-off', () => {
  // With efficacy against infection 0 the epidemic, and so each band's attack rate AR_g, is the
  // same whatever the order; a dose in band g then averts e_D x IFR_g x AR_g deaths. With equal
  // costs (one dose a person) the fractional knapsack is solved by filling bands in decreasing
  // IFR_g x AR_g (Dantzig 1957, Operations Research 5:266): that order is the best for deaths.
  const s = knapsackScenario();
  // Attack rates from the multi-group final-size relation (Ma & Earn 2006, Bull Math Biol
  // 68:679), independent of the simulation.
  const p = prepareScenario(s);
  const m = segmentsOf(p, s.options[0], [])[0].transmission;
  const attack = Array.from(finalSizeByBand(m, p.bands.population, [1, 1, 1, 1], 5));
  const byRisk = [0, 1, 2, 3].sort((a, b) => IFR[b] * attack[b] - IFR[a] * attack[a]);
  const byIfr = [0, 1, 2, 3].sort((a, b) => IFR[b] - IFR[a]);
  /** Deaths for an order: IFR_g AR_g (N - e_D d_g), doses d filling bands in order. */
  const expectedDeaths = (order: number[]) => {
    let left = 1500;
    return order.reduce((total, g) => {
      const d = Math.min(N, left);
      left -= d;
      return total + IFR[g] * attack[g] * (N - 0.8 * d);
    }, 0);
  };

  it('has a case where the risk order differs from the IFR order', () => {
    expect(byRisk.slice(0, 2)).toEqual([1, 0]);
    expect(byIfr.slice(0, 2)).toEqual([0, 1]);
  });

  it('finds the order of decreasing IFR x attack rate, with the deaths the formula gives', async () => {
    const job = jobOf(s, 'deaths');
    const result = await searchOrders(job, inThreadEvaluator(job), { top: 3 });
    expect(result.method).toBe('exhaustive');
    expect(result.proven).toBe(true);
    const best = result.orders[0];
    // Only the first two groups get doses: the rest may come in any order.
    expect(best.permutation.slice(0, 2)).toEqual(byRisk.slice(0, 2));
    expect(best.noDosesFrom).toBe(2);
    expect(best.value).toBeCloseTo(expectedDeaths(byRisk), 1);
    const ifrOrder = evaluateOrder(job, byIfr);
    expect(ifrOrder.value).toBeCloseTo(expectedDeaths(byIfr), 1);
    expect(ifrOrder.value - best.value).toBeGreaterThan(0.5 * (expectedDeaths(byIfr) - expectedDeaths(byRisk)));
  });
});

describe('exhaustive search', () => {
  // 15 doses a day from day 0 and an epidemic that takes off within weeks: the campaign runs
  // through the epidemic, so every order differs and the bounds are tested where they bite.
  const s = knapsackScenario(0.7, [{ fromDay: 0, dosesPerDay: 15 }], 0.1);

  it('bounds every order that shares a prefix (the bound the pruning rests on)', () => {
    // Two paces of supply against the same epidemic: each catches a different way to overstate the bound.
    const faster = knapsackScenario(0.7, [{ fromDay: 0, dosesPerDay: 30 }], 0.1);
    for (const [scenario, outcome] of [[s, 'deaths'], [s, 'infections'], [s, 'yearsOfLifeLost'], [faster, 'deaths'], [faster, 'infections']] as const) {
      const job = jobOf(scenario, outcome);
      const all = allPermutations(4).map((perm) => evaluateOrder(job, perm));
      for (const a of all) {
        for (const b of all) {
          for (let k = 0; k <= 4 && a.permutation.slice(0, k).join() === b.permutation.slice(0, k).join(); k++) {
            expect(a.bounds[k]).toBeLessThanOrEqual(b.value * (1 + 1e-12));
          }
        }
      }
    }
  });

  it('returns the best orders that simulating all of them gives', async () => {
    for (const outcome of ['deaths', 'infections']) {
      const job = jobOf(s, outcome);
      const all: OrderEvaluation[] = allPermutations(4).map((perm) => evaluateOrder(job, perm));
      const values = all.map((e) => e.value).sort((a, b) => a - b);
      const result = await searchOrders(job, inThreadEvaluator(job), { top: 3 });
      expect(result.orders.map((o) => o.value)).toEqual(values.slice(0, 3));
      expect(result.evaluated).toBeLessThanOrEqual(24);
    }
  });

  it('and the heuristic search agree on the best order of small cases', async () => {
    const demo = demoScenario();
    const cases: [Scenario, string, number[][] | undefined][] = [
      [s, 'deaths', undefined],
      [s, 'infections', undefined],
      [demo, 'deaths', [[3, 4, 5, 6, 7, 8, 9], [10, 11], [12, 13], [14], [15]]],
    ];
    for (const [scenario, outcome, groups] of cases) {
      const job = jobOf(scenario, outcome, groups);
      const exhaustive = await searchOrders(job, inThreadEvaluator(job), { top: 1, method: 'exhaustive' });
      const heuristic = await searchOrders(job, inThreadEvaluator(job), { top: 1, method: 'heuristic', budget: 200 });
      expect(heuristic.proven).toBe(false);
      expect(heuristic.methodNote).toMatch(/Heuristic/);
      expect(heuristic.orders[0].value).toBe(exhaustive.orders[0].value);
    }
  });

  it('reports progress and stops when cancelled', async () => {
    const job = jobOf(s, 'deaths');
    const fractions: number[] = [];
    let calls = 0;
    const result = await searchOrders(job, inThreadEvaluator(job), { top: 1 }, { onProgress: (p) => fractions.push(p.fraction), isCancelled: () => ++calls > 1 });
    expect(result.cancelled).toBe(true);
    expect(result.proven).toBe(false);
    expect(fractions.length).toBeGreaterThan(0);
    expect(Math.max(...fractions)).toBeLessThan(1);
  });
});

describe('Bubar et al. 2021, Science 371:916 (qualitative)', () => {
  // With a vaccine that blocks transmission, giving doses to adults 20-49 first minimises
  // infections and giving them to adults 60+ first minimises deaths. On the demo with efficacy
  // against infection 0.9 and the campaign for adults (15-19 left out, as in their adult
  // strategies), groups 20-49, 50-59, 60+:
  const demo = demoScenario();
  const c = demo.vaccinationCampaigns[0];
  const s: Scenario = {
    ...demo,
    vaccinationCampaigns: [{ ...c, uptakeCeiling: c.uptakeCeiling.map((u, i) => (i === 3 ? 0 : u)), efficacyAgainstInfection: 0.9, efficacyAgainstDeath: 0.9, efficacyAgainstAdmission: 0.9 }],
  };
  const groups = [[4, 5, 6, 7, 8, 9], [10, 11], [12, 13, 14, 15]];

  it('finds 20-49 first for infections and 60+ first for deaths', async () => {
    const infections = jobOf(s, 'infections', groups);
    const deaths = jobOf(s, 'deaths', groups);
    const forInfections = await searchOrders(infections, inThreadEvaluator(infections), { top: 1 });
    const forDeaths = await searchOrders(deaths, inThreadEvaluator(deaths), { top: 1 });
    expect(forInfections.orders[0].permutation[0]).toBe(0);
    expect(forDeaths.orders[0].permutation[0]).toBe(2);
  });
});

describe('search requests', () => {
  const demo = demoScenario();
  const problems = (request: { option: string; outcome: string; groups?: number[][] }, s: Scenario = demo) => {
    const r = prepareOrderSearch(s, request);
    return r.ok ? [] : r.problems.map((p) => `${p.path} ${p.rule}`);
  };

  it('name the field and the rule', () => {
    expect(problems({ option: 'nope', outcome: 'deaths' })[0]).toMatch(/^option must name a policy option of the scenario/);
    expect(problems({ option: 'Vaccinate oldest first', outcome: 'cost' })[0]).toMatch(/^outcome must be one of deaths, infections/);
    expect(problems({ option: 'No measures', outcome: 'deaths' })).toEqual(['option must run a vaccination campaign (this option has none)']);
    expect(problems({ option: 'Vaccinate oldest first', outcome: 'deaths', groups: [[3, 4, 5], [5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]] })).toEqual(['groups must not repeat a band: band 5 (25-29) appears twice']);
    expect(problems({ option: 'Vaccinate oldest first', outcome: 'deaths', groups: [[4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]] })).toEqual([
      'groups must include band 3 (15-19), which the campaign can vaccinate (uptake ceiling 0.7)',
    ]);
  });

  it('keep groups in which no one can be vaccinated out of the search, last', () => {
    const job = jobOf(demo, 'deaths', [[0, 1, 2], [3, 4, 5, 6, 7, 8, 9], [10, 11, 12, 13, 14, 15]]);
    expect(job.groups).toEqual([[3, 4, 5, 6, 7, 8, 9], [10, 11, 12, 13, 14, 15]]);
    expect(job.idleGroups).toEqual([[0, 1, 2]]);
  });
});

describe('order evaluation runs', () => {
  it('give the bounds and outcomes a full run gives, for every outcome (summary or no-R(t) runs instead of full ones)', () => {
    const s = demoScenario();
    const option = s.options.find((o) => o.vaccinationCampaign !== undefined)!.name;
    for (const outcome of ORDER_OUTCOMES) {
      const job = jobOf(s, outcome, undefined, option);
      const permutation = job.groups.map((_, k) => job.groups.length - 1 - k);
      const evaluation = evaluateOrder(job, permutation);
      const p = job.prepared;
      const campaign = prepareCampaign({ ...job.campaign.campaign, priority: priorityOf(job, permutation) }, p.bands.population, p.scenario.horizonDays);
      const full = simulateOption({ ...p, campaigns: new Map([[campaign.campaign.name, campaign]]) }, job.option);
      expect(evaluation.value, outcome).toBe(outcome === 'peakIcuOccupancy' ? full.healthcare!.icu.peakOccupancy : outcome === 'admissions' ? full.healthcare!.admissions : full[outcome]);
      const bounds = evaluation.prefixDays.map((t, k) => (k === permutation.length ? evaluation.value : Math.min(evaluation.value, outcomeBound(job, full, Math.floor(t)))));
      expect(evaluation.bounds, outcome).toStrictEqual(bounds);
      expect(evaluation.bounds.slice(0, -1).some((b) => b > 0), outcome).toBe(true);
    }
  });
});

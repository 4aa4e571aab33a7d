/**
 * How often each of the top orders is the best one when the scenario's uncertain inputs vary:
 * every order runs under every Latin hypercube draw of the scenario's `uncertainty` section (the
 * same draws, from the same seed, as `mixwise run`: preparedScenarioOfDraw, as the run's draws
 * use, then a summary run of the option, whose outcomes are the full run's bit for bit), and per draw
 * the order with the lowest value of the searched outcome wins, ties split equally (common
 * random numbers: the orders are compared draw by draw). A draw that fails for any order is left
 * out for all of them, so the comparison stays paired.
 *
 * Each draw is a pure function of (context, draw index), so the draws map over a worker pool
 * (job `orderDraws`, pool/jobs.ts) with the same shares as one thread.
 */
import { probabilityLowest } from '../uncertainty/summaries.ts';
import { prepareDraws, preparedScenarioOfDraw, type PreparedDraws } from '../uncertainty/drawOutcomes.ts';
import type { PolicyOption, Scenario } from '../scenario.ts';
import { simulateOption } from '../simulate.ts';
import { outcomeValue, type OrderOutcome } from './orderEvaluation.ts';

/** What every worker needs: plain data. */
export interface OrderDrawsContext {
  /** A valid scenario with an `uncertainty` section. */
  scenario: Scenario;
  /** The option whose campaign is reordered. */
  option: string;
  outcome: OrderOutcome;
  /** The orders compared, as campaign priorities (band groups, first group first). */
  priorities: number[][][];
}

export interface PreparedOrderDraws {
  option: PolicyOption;
  outcome: OrderOutcome;
  /** One per order: the draws over the scenario with the option's campaign in that order. */
  byOrder: PreparedDraws[];
}

/** Values of the searched outcome of every order under one draw, or why the draw failed. */
export type OrderDrawResult = { draw: number; ok: true; values: number[] } | { draw: number; ok: false; reason: string };

export interface OrderShares {
  /** Per order (context order): share of the successful draws in which it is best, ties split; sums to 1. */
  shareOfDrawsBest: number[];
  draws: number;
  seed: number;
  failedDraws: number;
}

export function prepareOrderDraws(c: OrderDrawsContext): PreparedOrderDraws {
  const base = prepareDraws(c.scenario);
  const option = c.scenario.options.find((o) => o.name === c.option);
  if (option?.vaccinationCampaign === undefined) throw new Error(`option ${JSON.stringify(c.option)} runs no vaccination campaign`);
  const byOrder = c.priorities.map((priority) => {
    const vaccinationCampaigns = c.scenario.vaccinationCampaigns.map((v) => (v.name === option.vaccinationCampaign ? { ...v, priority } : v));
    // The hypercube depends only on the seed and the parameters, so every order shares it.
    return { ...base, scenario: { ...c.scenario, vaccinationCampaigns } };
  });
  return { option, outcome: c.outcome, byOrder };
}

/** Every order under draw i; never throws. */
export function orderValuesUnderDraw(p: PreparedOrderDraws, draw: number): OrderDrawResult {
  const values: number[] = [];
  try {
    for (const drawn of p.byOrder) {
      const prepared = preparedScenarioOfDraw(drawn, draw);
      if (!prepared.ok) return { draw, ok: false, reason: prepared.reason };
      // The drawn option: measureAdherence changes options' measures.
      const option = prepared.prepared.scenario.options.find((o) => o.name === p.option.name) ?? p.option;
      const o = simulateOption(prepared.prepared, option, { series: 'summary' });
      values.push(outcomeValue({ deaths: o.deaths, infections: o.infections, yearsOfLifeLost: o.yearsOfLifeLost, admissions: o.healthcare?.admissions ?? null, peakIcuOccupancy: o.healthcare?.icu.peakOccupancy ?? null }, p.outcome));
    }
  } catch (err) {
    return { draw, ok: false, reason: `the run failed: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}` };
  }
  return { draw, ok: true, values };
}

/** The share of draws in which each order is best, from the results of draws 0..N-1. */
export function orderShares(p: PreparedOrderDraws, results: readonly OrderDrawResult[]): OrderShares {
  const good = results.filter((r): r is Extract<OrderDrawResult, { ok: true }> => r.ok);
  const byOrder = p.byOrder.map((_, k) => Float64Array.from(good, (r) => r.values[k]));
  const u = p.byOrder[0]?.uncertainty;
  return { shareOfDrawsBest: probabilityLowest(byOrder), draws: results.length, seed: u?.seed ?? 0, failedDraws: results.length - good.length };
}

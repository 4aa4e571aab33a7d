/**
 * The order comparison as plain data: what a search found, in campaign priorities (band groups)
 * rather than indices into the search's groups, so it can be printed (`mixwise orders`, the
 * report), shown in the app and stored in a workspace without the search's job.
 */
import { priorityOf, type OrderOutcome, type OrderOutcomes, type OrderSearchJob } from './orderEvaluation.ts';
import type { OrderShares } from './orderDraws.ts';
import type { OrderSearchResult } from './orderSearch.ts';

export interface ComparedOrder {
  /** The campaign priority: band groups, first group first. */
  order: number[][];
  value: number;
  /** value - the best value. */
  gap: number;
  outcomes: OrderOutcomes;
  /** Position from which the groups get no doses within the horizon; null if all do. */
  noDosesFrom: number | null;
  /** Share of the uncertainty draws in which this order is the best of the top orders (present with an `uncertainty` section). */
  shareOfDrawsBest?: number;
}

export interface OrderComparison {
  option: string;
  campaign: string;
  outcome: OrderOutcome;
  /** The groups ordered (band indices). */
  groups: number[][];
  method: 'exhaustive' | 'heuristic';
  methodNote: string;
  /** Orders simulated. */
  evaluated: number;
  ordersInAll: number;
  proven: boolean;
  /** Best first. */
  orders: ComparedOrder[];
  builtIn: { name: string; order: number[][]; value: number; outcomes: OrderOutcomes }[];
  /** How the shares of draws were found (present with an `uncertainty` section). */
  draws?: { draws: number; seed: number; failedDraws: number };
}

export function orderComparisonOf(job: OrderSearchJob, result: OrderSearchResult, shares?: OrderShares): OrderComparison {
  return {
    option: job.option.name,
    campaign: job.campaign.campaign.name,
    outcome: result.outcome,
    groups: job.groups.map((g) => [...g]),
    method: result.method,
    methodNote: result.methodNote,
    evaluated: result.evaluated,
    ordersInAll: result.ordersInAll,
    proven: result.proven,
    orders: result.orders.map((o, k) => ({
      order: priorityOf(job, o.permutation),
      value: o.value,
      gap: o.gap,
      outcomes: o.outcomes,
      noDosesFrom: o.noDosesFrom,
      ...(shares === undefined ? {} : { shareOfDrawsBest: shares.shareOfDrawsBest[k] }),
    })),
    builtIn: result.builtIn.map((b) => ({ name: b.name, order: priorityOf(job, b.permutation), value: b.value, outcomes: b.outcomes })),
    ...(shares === undefined ? {} : { draws: { draws: shares.draws, seed: shares.seed, failedDraws: shares.failedDraws } }),
  };
}

/** The context of the `orderDraws` job for the top orders of a search. */
export function topOrdersUnderDraws(job: OrderSearchJob, result: OrderSearchResult): { option: string; outcome: OrderOutcome; priorities: number[][][] } {
  return { option: job.option.name, outcome: result.outcome, priorities: result.orders.map((o) => priorityOf(job, o.permutation)) };
}

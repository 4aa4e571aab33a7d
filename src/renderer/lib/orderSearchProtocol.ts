/**
 * Messages between the "Find the best order" panel and its worker. A search simulates hundreds
 * to thousands of orders, so it runs off the main thread, reports progress after every batch,
 * and is cancelled by ending the worker (the client starts a fresh one for the next search).
 */
import type { OrderOutcomes, OrderSearchRequest, OrderSearchSettings, Scenario, SearchProgress } from '../../engine/index.ts';

export type OrderSearchWorkerRequest = { type: 'search'; id: number; scenario: Scenario; request: OrderSearchRequest; settings: Partial<OrderSearchSettings> };

/** One order as the panel shows it: the campaign priority it stands for and its outcomes. */
export interface FoundOrder {
  priority: number[][];
  value: number;
  gap: number;
  outcomes: OrderOutcomes;
  /** Position from which the groups get no doses within the horizon; null if all do. */
  noDosesFrom: number | null;
}

export interface OrderSearchView {
  outcome: string;
  method: 'exhaustive' | 'heuristic';
  methodNote: string;
  evaluated: number;
  proven: boolean;
  orders: FoundOrder[];
  builtIn: { name: string; priority: number[][]; value: number; outcomes: OrderOutcomes }[];
}

export type OrderSearchWorkerReply =
  | { type: 'progress'; id: number; progress: SearchProgress }
  | { type: 'found'; id: number; view: OrderSearchView }
  | { type: 'refused'; id: number; problems: string[] };

/**
 * Typed messages between the renderer and the engine worker.
 *
 * The renderer sends `run` for every edit with an increasing `runId`. The worker computes
 * option by option and, between options, checks whether a newer run has arrived; if so it
 * drops the older run (`cancelled`). Results carry their `runId` so the renderer only ever
 * shows the newest.
 *
 * `orders` asks for the vaccination order templates of a scenario (the engine's
 * `priorityFromTemplate`) and the coverage needed for R < 1 under one option's campaign
 * (`coverageNeededForRBelowOne`); replies carry their `requestId`, the newest one wins.
 */
import type { Scenario, ScenarioResults, CoverageNeeded, OrderTemplate } from '../../engine/index.ts';

export type EngineRequest =
  | { type: 'run'; runId: number; scenario: Scenario }
  | { type: 'orders'; requestId: number; scenario: Scenario; optionIndex: number };

/** What the engine says about vaccination orders for a scenario and one of its options. */
export interface OrdersInfo {
  /** Every built-in template with its priority groups for this scenario's bands. */
  templates: { id: OrderTemplate; label: string; description: string; priority: number[][] }[];
  /** Coverage needed for R < 1 under the option's campaign and day-0 measures; null without a campaign. */
  coverage: CoverageNeeded | null;
}

export type EngineReply =
  | { type: 'results'; runId: number; results: ScenarioResults; computeMs: number }
  | { type: 'cancelled'; runId: number }
  | { type: 'failed'; runId: number; message: string }
  | { type: 'orders'; requestId: number; orders: OrdersInfo }
  | { type: 'orders-failed'; requestId: number; message: string };

/**
 * The Float64Array buffers of a result (daily series, hospital series, doses), to transfer (not
 * copy) across the worker boundary. Each buffer once: a transfer list must not repeat one.
 */
export function transferablesOf(results: ScenarioResults): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  for (const o of results.options) {
    const s = o.series;
    const arrays = [s.susceptible, s.prevalence, s.incidence, s.deaths, s.rt, s.doses];
    const h = o.healthcare?.series;
    if (h) arrays.push(h.admissions, h.icuAdmissions, h.wardOccupancy, h.icuOccupancy);
    for (const a of arrays) buffers.add(a.buffer as ArrayBuffer);
  }
  return [...buffers];
}

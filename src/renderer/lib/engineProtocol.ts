/**
 * Typed messages between the renderer and the engine worker.
 *
 * The renderer sends `run` for every edit with an increasing `runId`. The worker computes
 * option by option and, between options, checks whether a newer run has arrived; if so it
 * drops the older run (`cancelled`). Results carry their `runId` so the renderer only ever
 * shows the newest.
 */
import type { Scenario } from '../../engine/scenario.ts';
import type { ScenarioResults } from '../../engine/results.ts';

export type EngineRequest = { type: 'run'; runId: number; scenario: Scenario };

export type EngineReply =
  | { type: 'results'; runId: number; results: ScenarioResults; computeMs: number }
  | { type: 'cancelled'; runId: number }
  | { type: 'failed'; runId: number; message: string };

/** The Float64Array buffers of a result, to transfer (not copy) across the worker boundary. */
export function transferablesOf(results: ScenarioResults): ArrayBuffer[] {
  return results.options.flatMap((o) => {
    const s = o.series;
    return [s.susceptible, s.prevalence, s.incidence, s.deaths, s.rt].map((a) => a.buffer as ArrayBuffer);
  });
}

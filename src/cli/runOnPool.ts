/**
 * `mixwise run` over many options: the options go to a pool of worker threads
 * (workerThreads.ts), with the same results as one thread (the engine's
 * `runScenarioSummaryOnPool`: the table, CSV and JSON read outcomes only, so no daily series is kept).
 */
import { availableParallelism } from 'node:os';
import { runScenarioSummary, runScenarioSummaryOnPool, type Calibration, type Scenario, type ScenarioSummary } from '../engine/index.ts';
import { nodeWorkerPool } from './workerThreads.ts';

/**
 * From this many options up, `run` uses one thread per core by default: below it, starting threads
 * (bundling their script, JIT warm-up in each) costs more than they save, now that an option run
 * takes about 0.35 ms. Measured with `mixwise run` of the demo's options with varied multipliers,
 * from process start, on this project's two-core machines (wall time, one thread vs two):
 * 1,000 options 1.22 vs 1.49 s; 4,000 options 2.8 vs 2.75 s; 12,000 options 7.4 vs 6.1 s. With
 * more cores the break-even comes sooner; --workers overrides the default.
 */
export const POOL_THRESHOLD = 2000;

/** Threads for a run: `workers` when given, else one per core from POOL_THRESHOLD options up, else 1. */
export function threadsFor(scenario: Scenario, workers: number | null): number {
  if (workers !== null) return workers;
  return scenario.options.length >= POOL_THRESHOLD ? availableParallelism() : 1;
}

/** Every option of `scenario` on `threads` threads (this one when 1). */
export async function runOnThreads(scenario: Scenario, calibration: Calibration, threads: number): Promise<ScenarioSummary> {
  if (threads <= 1) return runScenarioSummary(scenario, calibration);
  const pool = nodeWorkerPool(Math.min(threads, scenario.options.length));
  try {
    return await runScenarioSummaryOnPool(pool, scenario, calibration);
  } finally {
    pool.close();
  }
}

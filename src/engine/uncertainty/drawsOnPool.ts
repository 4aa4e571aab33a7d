/**
 * The draws of a scenario on a worker pool (pool/pool.ts, job `drawRuns`): the draws are cut into
 * tasks of consecutive draw indices, each worker runs its tasks (every option under each draw),
 * and the outcomes are read here, on the calling thread, in draw order. Draw i is a pure function
 * of (scenario, i) (drawOutcomes.ts), so the results, and the summary built from them, are the
 * same bytes as `evaluateDrawRange` on one thread, whatever the number of workers.
 *
 * Progress counts draws done; aborting `signal` rejects with `PoolCancelled` (pool.ts).
 */
import { type CancelSignal, type WorkerPool } from '../pool/pool.ts';
import type { Scenario } from '../scenario.ts';
import { prepareDraws, readDraw, type DrawRange, type DrawResult, type OutcomeReader } from './drawOutcomes.ts';
import { summariseDraws, type UncertaintyResults } from './ensemble.ts';

/**
 * Draws per task: small enough that progress moves often and a cancel stops soon (one draw of the
 * demo is a few tens of milliseconds), large enough that messages cost little beside the runs.
 */
export const DRAWS_PER_TASK = 8;

export interface DrawMapOptions {
  /** Called after each task with the number of draws done (counted in whole tasks) and the draws asked for. */
  onProgress?(drawsDone: number, total: number): void;
  /** Aborting it rejects with `PoolCancelled`; draws already on a worker finish there and are ignored. */
  signal?: CancelSignal;
}

/** from..to-1 cut into consecutive tasks of `perTask` draws (the last may be shorter). */
export function drawTasks(from: number, to: number, perTask = DRAWS_PER_TASK): DrawRange[] {
  const tasks: DrawRange[] = [];
  for (let a = from; a < to; a += perTask) tasks.push({ from: a, to: Math.min(to, a + perTask) });
  return tasks;
}

/**
 * Draws from..to-1 of `scenario` (which must have an `uncertainty` section) on `pool`, read with
 * `reader`, in draw order: the same results as `evaluateDrawRange(prepareDraws(scenario), from,
 * to, reader)` on one thread.
 */
export async function drawRangeOnPool(pool: WorkerPool, scenario: Scenario, reader: OutcomeReader, from: number, to: number, options: DrawMapOptions = {}): Promise<DrawResult[]> {
  const referenceIndex = prepareDraws(scenario).referenceIndex;
  const tasks = drawTasks(from, to);
  const total = to - from;
  const runs = await pool.map('drawRuns', scenario, tasks, {
    signal: options.signal,
    onProgress: (done) => options.onProgress?.(done === tasks.length ? total : Math.min(total, done * DRAWS_PER_TASK), total),
  });
  return runs.flat().map((run) => readDraw(run, reader, referenceIndex));
}

/**
 * All draws of `scenario` on `pool`, summarised (intervals, chances, PRCC): the same
 * `UncertaintyResults` as `summariseDraws` over the draws run on one thread.
 */
export async function uncertaintyOnPool(pool: WorkerPool, scenario: Scenario, reader: OutcomeReader, options: DrawMapOptions = {}): Promise<UncertaintyResults> {
  const p = prepareDraws(scenario);
  const results = await drawRangeOnPool(pool, scenario, reader, 0, p.uncertainty.draws, options);
  return summariseDraws(p, results, reader.keys);
}

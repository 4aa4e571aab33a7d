/**
 * The draws of a scenario's uncertainty section on the app's worker pool, in slices: each slice
 * is one pool map (`drawRangeOnPool`), so a map asked for meanwhile (the order templates of the
 * vaccination panel) waits for one slice at most, never for every draw. After each slice the draws
 * so far are summarised (a provisional summary of the first k draws; every draw is the same draw
 * however the run is cut) and the full summary follows the last slice: the same numbers as
 * `mixwise run` gives for the scenario. Read with the outcome catalogue, as the CLI reads them.
 */
import { drawRangeOnPool, PoolCancelled, prepareDraws, summariseDraws, type CancelSignal, type DrawResult, type Scenario, type UncertaintyResults, type WorkerPool } from '../../engine/index.ts';
import { catalogueReader } from '../../report/drawOutcomes.ts';

export interface DrawsCallbacks {
  /** Draws done so far, of `total`. */
  onProgress(done: number, total: number): void;
  /** A summary of the first `done` draws; `final` when they are all the draws. */
  onSummary(results: UncertaintyResults, done: number, final: boolean): void;
  onFailure(message: string): void;
}

/** Provisional summaries per run: about one every tenth of the draws. */
const SUMMARIES = 10;

/** Draws in slice k of `total` draws for a pool of `workers`: a tenth of the draws, at least two tasks per worker. */
export function sliceSize(total: number, workers: number): number {
  return Math.max(16 * workers, Math.ceil(total / SUMMARIES));
}

/** Runs every draw of `scenario` slice by slice; stops quietly when `signal` aborts. */
export function runDrawsInSlices(pool: WorkerPool, scenario: Scenario, options: DrawsCallbacks & { signal: CancelSignal }): void {
  void (async () => {
    const p = prepareDraws(scenario);
    const total = p.uncertainty.draws;
    const step = sliceSize(total, pool.size);
    const results: DrawResult[] = [];
    try {
      for (let from = 0; from < total; from += step) {
        const to = Math.min(total, from + step);
        const slice = await drawRangeOnPool(pool, scenario, catalogueReader, from, to, {
          signal: options.signal,
          onProgress: (done) => options.onProgress(from + done, total),
        });
        if (options.signal.aborted) return;
        results.push(...slice);
        const final = to === total;
        // The first `to` draws summarised as if they were the run (the check in summariseDraws counts them).
        const prefix = final ? p : { ...p, uncertainty: { ...p.uncertainty, draws: to } };
        options.onSummary(summariseDraws(prefix, results, catalogueReader.keys), to, final);
      }
    } catch (err) {
      if (err instanceof PoolCancelled || options.signal.aborted) return;
      options.onFailure(err instanceof Error ? err.message : String(err));
    }
  })();
}

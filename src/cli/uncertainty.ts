/**
 * `mixwise run` with an uncertainty section (or `--draws`): the draws of the scenario, their
 * summary attached to the options report, and the checks of `--draws`, `--seed` and
 * `--draw-range` against the scenario. Without a section and without these options nothing here
 * runs and the output is unchanged.
 */
import { availableParallelism } from 'node:os';
import { drawRangeOnPool, drawTasks, evaluateDrawRange, prepareDraws, summariseDraws, withDrawSettings, type DrawResult, type Scenario, type SensitivityEntry, type UncertaintyResults, type UncertaintyRun } from '../engine/index.ts';
import { catalogueReader, DRAW_OUTCOME_KEYS } from '../report/drawOutcomes.ts';
import type { DrawOptions } from './args.ts';
import { usageError } from './words.ts';
import type { OptionsReport } from './optionsReport.ts';
import { nodeWorkerPool } from './workerThreads.ts';

/** From this many draws up, `run` spreads the draws over one thread per core by default (a thread takes a moment to start). */
export const DRAW_POOL_THRESHOLD = 64;

/** Whether the run computes draws: the scenario has an uncertainty section. */
export function hasDraws(s: Scenario): boolean {
  return s.uncertainty !== undefined;
}

/** The scenario with `--draws` and `--seed` applied; a usage error when they (or a range) cannot apply. */
export function scenarioForDraws(s: Scenario, options: DrawOptions): Scenario {
  const asked = options.draws !== undefined || options.seed !== undefined || options.range !== undefined;
  if (s.uncertainty === undefined) {
    if (asked) throw usageError('--draws, --seed and --draw-range need an "uncertainty" section in the scenario listing the uncertain parameters');
    return s;
  }
  const drawn = withDrawSettings(s, options);
  const total = drawn.uncertainty?.draws ?? 0;
  if (options.range !== undefined && options.range.to > total) throw usageError(`--draw-range ${options.range.from}:${options.range.to} goes beyond the ${total} draws`);
  return drawn;
}

/** Draws from..to-1 of the scenario, in this thread. */
export function computeDraws(s: Scenario, from: number, to: number): DrawResult[] {
  return evaluateDrawRange(prepareDraws(s), from, to, catalogueReader);
}

/** Threads for `count` draws: `workers` when given, else one per core from DRAW_POOL_THRESHOLD draws up, else 1. */
export function drawThreadsFor(count: number, workers: number | null): number {
  if (workers !== null) return workers;
  return count >= DRAW_POOL_THRESHOLD ? availableParallelism() : 1;
}

/** Draws from..to-1 of the scenario on `threads` worker threads (this thread when 1): the same results as `computeDraws`. */
export async function computeDrawsOnThreads(s: Scenario, from: number, to: number, threads: number): Promise<DrawResult[]> {
  if (threads <= 1) return computeDraws(s, from, to);
  const pool = nodeWorkerPool(Math.min(threads, drawTasks(from, to).length));
  try {
    return await drawRangeOnPool(pool, s, catalogueReader, from, to);
  } finally {
    pool.close();
  }
}

/** The summary of all draws of the scenario (results = draws 0..N-1 in order). */
export function summarise(s: Scenario, results: readonly DrawResult[]): UncertaintyResults {
  return summariseDraws(prepareDraws(s), results, DRAW_OUTCOME_KEYS);
}

/** The JSON report with draws: each option also has `intervals`, `probabilityBetterThanReference` and `probabilityBest`. */
export type OptionsReportWithDraws = Omit<OptionsReport, 'options'> & { options: Record<string, unknown>[]; uncertainty: UncertaintyRun; sensitivity: SensitivityEntry[] };

/** The options report with the summary: top-level `uncertainty` and `sensitivity`, per option intervals and chances. */
export function withUncertainty(report: OptionsReport, u: UncertaintyResults): OptionsReportWithDraws {
  return {
    ...report,
    options: report.options.map((row, k) => ({ ...row, ...u.options[k] })),
    uncertainty: u.uncertainty,
    sensitivity: u.sensitivity,
  };
}

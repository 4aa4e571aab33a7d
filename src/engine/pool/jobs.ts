/**
 * Jobs a worker pool can run: each is a pure function of (context, task), split into a
 * `prepare` of the context, done once per worker, and a `run` per task. Because a task's result
 * depends on nothing else, a task list mapped over any number of workers, in any order, gives the
 * same results as one thread running them in turn (DESIGN.md section 1, "Many runs, one shape").
 *
 * To add a job: write its prepare and run here (or in the module of its idea and list it below),
 * with `transferables` naming the result's typed-array buffers so they move without copying.
 */
import { prepareScenario, type PreparedScenario } from '../prepare.ts';
import type { OptionResults, OptionSummary } from '../results.ts';
import { scenarioRevision } from '../revision.ts';
import type { PolicyOption, Scenario } from '../scenario.ts';
import { simulateOption } from '../simulate.ts';
import { prepareDraws, runDrawRange, type DrawRange, type DrawRun, type PreparedDraws } from '../uncertainty/drawOutcomes.ts';
import { ordersInfo, type OrdersInfo } from '../vaccination/ordersInfo.ts';
import { evaluateOrder, type OrderEvaluation, type OrderSearchJob } from '../vaccination/orderEvaluation.ts';
import { orderSearchJobOf, type OrderEvaluationContext } from '../vaccination/orderJob.ts';
import { orderValuesUnderDraw, prepareOrderDraws, type OrderDrawResult, type OrderDrawsContext, type PreparedOrderDraws } from '../vaccination/orderDraws.ts';

export interface Job<Context, Prepared, Task, Result> {
  prepare(context: Context): Prepared;
  /**
   * A key of the context's content, when it has a cheap one: equal keys mean interchangeable
   * prepared contexts, across jobs too, so a worker keeps the prepared context for later maps
   * with the same key (pool.ts). Without it, a worker prepares the context anew for every map.
   */
  contextKey?(context: Context): string;
  run(prepared: Prepared, task: Task): Result;
  /** Buffers of the result to transfer across the worker boundary (each once). */
  transferables(result: Result): ArrayBuffer[];
}

/** The typed-array buffers of one option's results (daily series, when it has them, and hospital series). */
export function optionBuffers(o: OptionSummary | OptionResults): ArrayBuffer[] {
  const s = 'series' in o ? o.series : null;
  const arrays = s === null ? [] : [s.susceptible, s.prevalence, s.incidence, s.deaths, s.rt, s.doses];
  const h = o.healthcare?.series;
  if (h) arrays.push(h.admissions, h.icuAdmissions, h.wardOccupancy, h.icuOccupancy);
  return [...new Set(arrays.map((a) => a.buffer as ArrayBuffer))];
}

/** The prepared scenario of a scenario's revision, shared by every job whose context is the scenario alone. */
const scenarioKey = (s: Scenario): string => `scenario ${scenarioRevision(s)}`;

function optionOf(prepared: PreparedScenario, k: number): PolicyOption {
  const option = prepared.scenario.options[k];
  if (option === undefined) throw new Error(`the scenario has no option ${k}`);
  return option;
}

/** Option k of a scenario: context = the validated scenario, task = the option's index. */
const optionRuns: Job<Scenario, PreparedScenario, number, OptionResults> = {
  prepare: prepareScenario,
  contextKey: scenarioKey,
  run: (prepared, k) => simulateOption(prepared, optionOf(prepared, k)),
  transferables: optionBuffers,
};

/** As `optionRuns` without the daily series (simulate.ts, `series: 'summary'`). */
const optionSummaries: Job<Scenario, PreparedScenario, number, OptionSummary> = {
  prepare: prepareScenario,
  contextKey: scenarioKey,
  run: (prepared, k) => simulateOption(prepared, optionOf(prepared, k), { series: 'summary' }),
  transferables: optionBuffers,
};

/** The app's vaccination order panel: context = the scenario, task = the option's index. */
const ordersInfoJob: Job<Scenario, PreparedScenario, number, OrdersInfo> = {
  prepare: prepareScenario,
  contextKey: scenarioKey,
  run: ordersInfo,
  transferables: () => [],
};

/** The order search (vaccination/orderPool.ts, orderJob.ts): context = the scenario and the search request, task = an order of the groups. */
const orderEvaluations: Job<OrderEvaluationContext, OrderSearchJob, number[], OrderEvaluation> = {
  prepare: orderSearchJobOf,
  run: evaluateOrder,
  transferables: () => [],
};

/** The top orders under the uncertainty draws (vaccination/orderDraws.ts): task = a draw index. */
const orderDraws: Job<OrderDrawsContext, PreparedOrderDraws, number, OrderDrawResult> = {
  prepare: prepareOrderDraws,
  run: orderValuesUnderDraw,
  transferables: () => [],
};

/**
 * Uncertainty draws: context = a scenario with an `uncertainty` section, task = a range of draw
 * indices; each draw runs every option as a summary run (drawOutcomes.ts `runDraw`: no daily
 * series, so there is nothing worth transferring). The caller reads the outcomes in draw order (drawsOnPool.ts).
 */
const drawRuns: Job<Scenario, PreparedDraws, DrawRange, DrawRun[]> = {
  prepare: (scenario) => prepareDraws(scenario),
  run: (prepared, range) => runDrawRange(prepared, range.from, range.to),
  transferables: () => [],
};

export const JOBS = {
  optionRuns,
  optionSummaries,
  drawRuns,
  ordersInfo: ordersInfoJob,
  orderEvaluations,
  orderDraws,
};

export type JobName = keyof typeof JOBS;
type JobOf<N extends JobName> = (typeof JOBS)[N];
export type ContextOf<N extends JobName> = JobOf<N> extends Job<infer C, unknown, unknown, unknown> ? C : never;
export type PreparedOf<N extends JobName> = JobOf<N> extends Job<never, infer P, never, unknown> ? P : never;
export type TaskOf<N extends JobName> = JobOf<N> extends Job<never, unknown, infer T, unknown> ? T : never;
export type ResultOf<N extends JobName> = JobOf<N> extends Job<never, unknown, never, infer R> ? R : never;

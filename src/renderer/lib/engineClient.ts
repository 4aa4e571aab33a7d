/**
 * The renderer's side of the engine: a pool of Web Workers (engine.worker.ts) running the
 * engine's jobs (src/engine/pool). `run(scenario)` spreads the options over the pool and assembles
 * the results with the engine (`runScenarioOnPool`); a newer run cancels the older one between
 * options, and only the newest run's results reach `onResults`. `orders(scenario, option)` does
 * the same for vaccination order templates and the coverage needed for R < 1 (newest wins); it
 * queues behind a run's options, so it never delays the redraw after an edit. `findOrders` runs
 * a vaccination order search: the search's bookkeeping here, each batch of orders (and, with an
 * uncertainty section, each draw of the top orders) on the pool, so runs after an edit slip in
 * between batches; aborting its signal stops it. `draws(scenario)` runs the draws of a scenario's
 * uncertainty section (drawSlices.ts), newest wins; an edit cancels them (`cancelDraws`) before the
 * options of the edited scenario run.
 */
import { runDrawsInSlices, type DrawsCallbacks } from './drawSlices.ts';
import {
  formatProblem,
  orderComparisonOf,
  orderShares,
  PoolCancelled,
  poolEvaluator,
  prepareOrderDraws,
  prepareOrderSearch,
  runScenarioOnPool,
  RunRefused,
  searchOrders,
  topOrdersUnderDraws,
  WorkerPool,
  type OrderComparison,
  type OrderSearchRequest,
  type OrderSearchSettings,
  type OrdersInfo,
  type PoolEndpoint,
  type PoolReply,
  type Problem,
  type Scenario,
  type ScenarioResults,
} from '../../engine/index.ts';

/** What an order search came to: the comparison, the request's problems, or cancelled. */
export type OrderSearchOutcome = { kind: 'found'; comparison: OrderComparison } | { kind: 'refused'; problems: string[] } | { kind: 'cancelled' };

/** Progress of an order search: the search itself, then the draws of the top orders. */
export type OrderSearchStep = { stage: 'search'; fraction: number; evaluated: number; ruledOut: number } | { stage: 'draws'; fraction: number; done: number; total: number };

export interface EngineCallbacks {
  onResults(results: ScenarioResults, runId: number, computeMs: number): void;
  /** A run that failed; `problem` when the engine refused the scenario's numbers (RunRefused), not a fault. */
  onFailure(message: string, runId: number, problem?: Problem): void;
  onOrders?(orders: OrdersInfo, requestId: number): void;
  onOrdersFailure?(message: string, requestId: number): void;
}

/** Workers in the app's pool: one per logical core, at most 8 (a scenario has a handful of options). */
function poolSize(): number {
  const cores = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency : 1;
  return Math.max(1, Math.min(8, cores || 1));
}

function spawnWebWorker(): PoolEndpoint {
  const worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'mixwise-engine' });
  return {
    post: (message) => worker.postMessage(message),
    listen(onReply, onCrash) {
      worker.addEventListener('message', (event: MessageEvent<PoolReply>) => onReply(event.data));
      worker.addEventListener('error', (event) => onCrash(event.message || 'the engine worker stopped'));
    },
    terminate: () => worker.terminate(),
  };
}

export class EngineClient {
  private readonly pool = new WorkerPool(spawnWebWorker, poolSize());
  private lastRunId = 0;
  private lastOrdersId = 0;
  private running: AbortController | null = null;
  private asking: AbortController | null = null;
  private drawing: AbortController | null = null;

  constructor(private readonly callbacks: EngineCallbacks) {}

  /** Starts a run of every option; returns its id. Any older run still going is cancelled. */
  run(scenario: Scenario): number {
    const runId = ++this.lastRunId;
    this.running?.abort();
    const control = (this.running = new AbortController());
    const started = performance.now();
    runScenarioOnPool(this.pool, scenario, undefined, { signal: control.signal }).then(
      (results) => {
        if (runId === this.lastRunId) this.callbacks.onResults(results, runId, performance.now() - started);
      },
      (err: unknown) => {
        if (!(err instanceof PoolCancelled) && runId === this.lastRunId) this.callbacks.onFailure(messageOf(err), runId, err instanceof RunRefused ? err.problem : undefined);
      },
    );
    return runId;
  }

  /** Asks for the order templates and option `optionIndex`'s coverage needed for R < 1; returns the request id. */
  orders(scenario: Scenario, optionIndex: number): number {
    const requestId = ++this.lastOrdersId;
    this.asking?.abort();
    const control = (this.asking = new AbortController());
    this.pool.map('ordersInfo', scenario, [optionIndex], { signal: control.signal }).then(
      ([info]) => {
        if (requestId === this.lastOrdersId) this.callbacks.onOrders?.(info, requestId);
      },
      (err: unknown) => {
        if (!(err instanceof PoolCancelled) && requestId === this.lastOrdersId) this.callbacks.onOrdersFailure?.(messageOf(err), requestId);
      },
    );
    return requestId;
  }

  /** Searches the orders of `request` (see the module comment); never rejects. */
  async findOrders(scenario: Scenario, request: OrderSearchRequest, settings: Partial<OrderSearchSettings>, onProgress: (step: OrderSearchStep) => void, signal: AbortSignal): Promise<OrderSearchOutcome> {
    const prepared = prepareOrderSearch(scenario, request);
    if (!prepared.ok) return { kind: 'refused', problems: prepared.problems.map(formatProblem) };
    const job = prepared.job;
    try {
      const result = await searchOrders(job, poolEvaluator(this.pool, { scenario, request }, signal), settings, {
        onProgress: (p) => onProgress({ stage: 'search', fraction: p.fraction, evaluated: p.evaluated, ruledOut: p.ruledOut }),
        isCancelled: () => signal.aborted,
      });
      if (result.cancelled) return { kind: 'cancelled' };
      if (scenario.uncertainty === undefined) return { kind: 'found', comparison: orderComparisonOf(job, result) };
      const context = { scenario, ...topOrdersUnderDraws(job, result) };
      const draws = Array.from({ length: scenario.uncertainty.draws }, (_, i) => i);
      const results = await this.pool.map('orderDraws', context, draws, { signal, onProgress: (done, total) => onProgress({ stage: 'draws', fraction: done / total, done, total }) });
      return { kind: 'found', comparison: orderComparisonOf(job, result, orderShares(prepareOrderDraws(context), results)) };
    } catch (err) {
      if (err instanceof PoolCancelled || signal.aborted) return { kind: 'cancelled' };
      return { kind: 'refused', problems: [messageOf(err)] };
    }
  }

  /** Starts the draws of `scenario` (it has an uncertainty section); any older draws are cancelled. */
  draws(scenario: Scenario, callbacks: DrawsCallbacks): void {
    this.drawing?.abort();
    const control = (this.drawing = new AbortController());
    runDrawsInSlices(this.pool, scenario, { ...callbacks, signal: control.signal });
  }

  /** Cancels the draws in progress (their queued slices are dropped); nothing more is reported. */
  cancelDraws(): void {
    this.drawing?.abort();
    this.drawing = null;
  }

  dispose(): void {
    this.drawing?.abort();
    this.running?.abort();
    this.asking?.abort();
    this.pool.close();
  }
}

function messageOf(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

/**
 * The renderer's side of the engine worker: `run(scenario)` posts a new run and resolves
 * the callback only for the newest run; older replies are ignored. `orders(scenario, option)`
 * does the same for vaccination order templates and coverage needed (newest request wins).
 */
import type { Scenario, ScenarioResults } from '../../engine/index.ts';
import type { EngineReply, EngineRequest, OrdersInfo } from './engineProtocol.ts';

export interface EngineCallbacks {
  onResults(results: ScenarioResults, runId: number, computeMs: number): void;
  onFailure(message: string, runId: number): void;
  onOrders?(orders: OrdersInfo, requestId: number): void;
  onOrdersFailure?(message: string, requestId: number): void;
}

export class EngineClient {
  private readonly worker: Worker;
  private lastRunId = 0;
  private lastOrdersId = 0;

  constructor(private readonly callbacks: EngineCallbacks) {
    this.worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'mixwise-engine' });
    this.worker.addEventListener('message', (event: MessageEvent<EngineReply>) => this.receive(event.data));
    this.worker.addEventListener('error', (event) => this.callbacks.onFailure(event.message || 'The engine worker stopped.', this.lastRunId));
  }

  /** Starts a run of every option; returns its id. Any older run still going is cancelled. */
  run(scenario: Scenario): number {
    const request: EngineRequest = { type: 'run', runId: ++this.lastRunId, scenario };
    this.worker.postMessage(request);
    return request.runId;
  }

  /** Asks for the order templates and option `optionIndex`'s coverage needed for R < 1; returns the request id. */
  orders(scenario: Scenario, optionIndex: number): number {
    const request: EngineRequest = { type: 'orders', requestId: ++this.lastOrdersId, scenario, optionIndex };
    this.worker.postMessage(request);
    return request.requestId;
  }

  private receive(reply: EngineReply): void {
    if (reply.type === 'orders' || reply.type === 'orders-failed') {
      if (reply.requestId !== this.lastOrdersId) return;
      if (reply.type === 'orders') this.callbacks.onOrders?.(reply.orders, reply.requestId);
      else this.callbacks.onOrdersFailure?.(reply.message, reply.requestId);
      return;
    }
    if (reply.runId !== this.lastRunId) return;
    if (reply.type === 'results') this.callbacks.onResults(reply.results, reply.runId, reply.computeMs);
    else if (reply.type === 'failed') this.callbacks.onFailure(reply.message, reply.runId);
  }

  dispose(): void {
    this.worker.terminate();
  }
}

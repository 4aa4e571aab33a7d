/**
 * The panel's side of the order-search worker. `search` resolves with the found orders or the
 * problems of the request; `cancel` ends the worker at once (a search cannot be interrupted
 * inside a batch otherwise) and resolves the pending search as cancelled.
 */
import type { OrderSearchRequest, OrderSearchSettings, Scenario, SearchProgress } from '../../engine/index.ts';
import type { OrderSearchView, OrderSearchWorkerReply, OrderSearchWorkerRequest } from './orderSearchProtocol.ts';

export type OrderSearchOutcome = { kind: 'found'; view: OrderSearchView } | { kind: 'refused'; problems: string[] } | { kind: 'cancelled' };

export class OrderSearchClient {
  private worker: Worker | null = null;
  private lastId = 0;
  private pending: ((outcome: OrderSearchOutcome) => void) | null = null;

  private start(onProgress: (p: SearchProgress) => void): Worker {
    const worker = new Worker(new URL('./orderSearch.worker.ts', import.meta.url), { type: 'module', name: 'mixwise-order-search' });
    worker.addEventListener('message', (event: MessageEvent<OrderSearchWorkerReply>) => {
      const reply = event.data;
      if (reply.id !== this.lastId) return;
      if (reply.type === 'progress') onProgress(reply.progress);
      else this.settle(reply.type === 'found' ? { kind: 'found', view: reply.view } : { kind: 'refused', problems: reply.problems });
    });
    worker.addEventListener('error', (event) => this.settle({ kind: 'refused', problems: [event.message || 'The order search stopped.'] }));
    return worker;
  }

  private settle(outcome: OrderSearchOutcome): void {
    const resolve = this.pending;
    this.pending = null;
    resolve?.(outcome);
  }

  search(scenario: Scenario, request: OrderSearchRequest, settings: Partial<OrderSearchSettings>, onProgress: (p: SearchProgress) => void): Promise<OrderSearchOutcome> {
    this.cancel();
    this.worker = this.start(onProgress);
    const message: OrderSearchWorkerRequest = { type: 'search', id: ++this.lastId, scenario, request, settings };
    return new Promise((resolve) => {
      this.pending = resolve;
      this.worker?.postMessage(message);
    });
  }

  cancel(): void {
    this.worker?.terminate();
    this.worker = null;
    this.settle({ kind: 'cancelled' });
  }
}

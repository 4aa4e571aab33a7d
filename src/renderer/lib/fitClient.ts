/** The panel's side of the fitting worker: `fit(request)` resolves only the newest request's answer. */
import type { FitOutcome, FitRequest } from './fitFromCounts.ts';
import type { FitWorkerReply, FitWorkerRequest } from './fitProtocol.ts';

export class FitClient {
  private readonly worker: Worker;
  private lastId = 0;

  constructor(private readonly onOutcome: (outcome: FitOutcome, computeMs: number) => void) {
    this.worker = new Worker(new URL('./fit.worker.ts', import.meta.url), { type: 'module', name: 'mixwise-fit' });
    this.worker.addEventListener('message', (event: MessageEvent<FitWorkerReply>) => {
      if (event.data.id === this.lastId) this.onOutcome(event.data.outcome, event.data.computeMs);
    });
    this.worker.addEventListener('error', (event) => this.onOutcome({ ok: false, problems: [event.message || 'The fitting worker stopped.'] }, 0));
  }

  fit(request: FitRequest): void {
    const message: FitWorkerRequest = { type: 'fit', id: ++this.lastId, request };
    this.worker.postMessage(message);
  }

  dispose(): void {
    this.worker.terminate();
  }
}

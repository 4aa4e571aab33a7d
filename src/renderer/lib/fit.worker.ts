/** The fitting worker: runs `computeFit` for the newest request (see fitProtocol.ts). */
import { computeFit } from './fitFromCounts.ts';
import type { FitWorkerReply, FitWorkerRequest } from './fitProtocol.ts';

let newest = -1;

self.addEventListener('message', (event: MessageEvent<FitWorkerRequest>) => {
  if (event.data?.type !== 'fit') return;
  newest = Math.max(newest, event.data.id);
  const { id, request } = event.data;
  // Let a newer request that is already queued overtake this one.
  setTimeout(() => {
    if (id !== newest) return;
    const started = performance.now();
    let reply: FitWorkerReply;
    try {
      reply = { type: 'fitted', id, outcome: computeFit(request), computeMs: performance.now() - started };
    } catch (err) {
      reply = { type: 'fitted', id, outcome: { ok: false, problems: [err instanceof Error ? err.message : String(err)] }, computeMs: performance.now() - started };
    }
    (self as unknown as Worker).postMessage(reply);
  }, 0);
});

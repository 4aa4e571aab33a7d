/** The order-search worker: one search at a time, progress after every batch (see orderSearchProtocol.ts). */
import { formatProblem, inThreadEvaluator, prepareOrderSearch, priorityOf, searchOrders } from '../../engine/index.ts';
import type { OrderSearchWorkerReply, OrderSearchWorkerRequest } from './orderSearchProtocol.ts';

const post = (reply: OrderSearchWorkerReply) => (self as unknown as Worker).postMessage(reply);

self.addEventListener('message', (event: MessageEvent<OrderSearchWorkerRequest>) => {
  if (event.data?.type !== 'search') return;
  const { id, scenario, request, settings } = event.data;
  const prepared = prepareOrderSearch(scenario, request);
  if (!prepared.ok) {
    post({ type: 'refused', id, problems: prepared.problems.map(formatProblem) });
    return;
  }
  const job = prepared.job;
  searchOrders(job, inThreadEvaluator(job), settings, { onProgress: (progress) => post({ type: 'progress', id, progress }) }).then(
    (result) =>
      post({
        type: 'found',
        id,
        view: {
          outcome: result.outcome,
          method: result.method,
          methodNote: result.methodNote,
          evaluated: result.evaluated,
          proven: result.proven,
          orders: result.orders.map((o) => ({ priority: priorityOf(job, o.permutation), value: o.value, gap: o.gap, outcomes: o.outcomes, noDosesFrom: o.noDosesFrom })),
          builtIn: result.builtIn.map((b) => ({ name: b.name, priority: priorityOf(job, b.permutation), value: b.value, outcomes: b.outcomes })),
        },
      }),
    (err: unknown) => post({ type: 'refused', id, problems: [err instanceof Error ? err.message : String(err)] }),
  );
});

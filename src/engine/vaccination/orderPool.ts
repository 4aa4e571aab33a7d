/**
 * The order search on a worker pool: each batch of orders (the children of a node of the branch
 * and bound, or a neighbourhood of the local search) is one `pool.map` of the `orderEvaluations`
 * job (pool/jobs.ts), whose context is the scenario and the request, prepared once per worker
 * and batch (about a millisecond, against tens of milliseconds per order). evaluateOrder is
 * pure and the pool returns results in task order, so the search finds the same orders, with
 * the same numbers, whatever the number of workers.
 */
import type { CancelSignal, WorkerPool } from '../pool/pool.ts';
import type { OrderEvaluationContext } from './orderJob.ts';
import type { OrderEvaluator } from './orderSearch.ts';

/** Evaluates each batch on `pool`; aborting `signal` rejects the batch in progress with PoolCancelled. */
export function poolEvaluator(pool: WorkerPool, context: OrderEvaluationContext, signal?: CancelSignal): OrderEvaluator {
  return { evaluate: (permutations) => pool.map('orderEvaluations', context, permutations.map((p) => [...p]), { signal }) };
}

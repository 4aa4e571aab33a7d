/**
 * Messages between a worker pool and its workers (pool.ts, serve.ts). Plain data only, so they
 * cross any worker boundary (worker_threads in Node, Web Workers in a browser) by structured clone.
 *
 * A `map` sends each worker the job's context once (`context`), then its tasks in batches of a few
 * (`tasks`: fewer messages, each worker busy between them); the worker answers each batch with one
 * `batch` reply holding every task's `done` or `failed`, the results' typed arrays transferred, not
 * copied. Contexts are numbered by the pool, which also tells a worker when to drop one
 * (`forget`): the context of a map with a content key (jobs.ts `contextKey`, e.g. the scenario's
 * revision) stays on the workers for later maps with the same key, so repeated maps over one
 * scenario neither send nor prepare it again.
 */
import type { Problem } from '../problems.ts';
import type { JobName } from './jobs.ts';

export type PoolRequest =
  | { type: 'context'; contextId: number; job: JobName; context: unknown }
  | { type: 'tasks'; contextId: number; job: JobName; tasks: { taskId: number; task: unknown }[] }
  | { type: 'forget'; contextId: number };

/** The outcome of one task; a `failed` one carries its error's message and, for a refused run (runRefusal.ts), its problem, so the refusal arrives as one. */
export type TaskReply = { type: 'done'; taskId: number; result: unknown } | { type: 'failed'; taskId: number; message: string; problem?: Problem };

export type PoolReply = { type: 'batch'; replies: TaskReply[] };

/** One worker as the pool sees it: post a message, hear replies, stop it. */
export interface PoolEndpoint {
  post(message: PoolRequest): void;
  /** Registers the handler for the worker's replies (called once, by the pool). */
  listen(onReply: (reply: PoolReply) => void, onCrash: (message: string) => void): void;
  terminate(): void;
}

/** The worker's side: hear requests, post replies (with buffers to transfer rather than copy). */
export interface WorkerSide {
  listen(onRequest: (request: PoolRequest) => void): void;
  post(reply: PoolReply, transfer: ArrayBuffer[]): void;
}

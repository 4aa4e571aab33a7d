/**
 * Messages between a worker pool and its workers (pool.ts, serve.ts). Plain data only, so they
 * cross any worker boundary (worker_threads in Node, Web Workers in a browser) by structured clone.
 *
 * A `map` sends each worker the job's context once (`context`), then tasks one at a time
 * (`task`); the worker answers each task with `done` or `failed`. Contexts are numbered by the
 * pool; a worker keeps the prepared form of the newest few, so a second map over the same
 * context (or a task list spread over several maps) prepares it once per worker.
 */
import type { Problem } from '../problems.ts';
import type { JobName } from './jobs.ts';

export type PoolRequest =
  | { type: 'context'; contextId: number; job: JobName; context: unknown }
  | { type: 'task'; taskId: number; contextId: number; job: JobName; task: unknown };

/** A `failed` task carries its error's message and, for a refused run (runRefusal.ts), its problem, so the refusal arrives as one. */
export type PoolReply = { type: 'done'; taskId: number; result: unknown } | { type: 'failed'; taskId: number; message: string; problem?: Problem };

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

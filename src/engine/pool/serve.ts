/**
 * The worker's side of a pool: prepares contexts as they arrive and answers each task with its
 * result (or the error's message). Platform-free: the worker file wires `WorkerSide` to
 * worker_threads' parentPort or to a Web Worker's `self`.
 */
import { JOBS, type Job, type JobName } from './jobs.ts';
import { RunRefused } from '../runRefusal.ts';
import type { PoolReply, PoolRequest, WorkerSide } from './protocol.ts';

/** Prepared contexts kept per worker (the newest ones; a map needs only its own). */
const KEPT_CONTEXTS = 4;

type AnyJob = Job<unknown, unknown, unknown, unknown>;

export function serveJobs(side: WorkerSide): void {
  const prepared = new Map<number, { job: JobName; value: unknown } | { job: JobName; error: unknown }>();
  side.listen((request: PoolRequest) => {
    if (request.type === 'context') {
      const job = JOBS[request.job] as AnyJob;
      try {
        prepared.set(request.contextId, { job: request.job, value: job.prepare(request.context) });
      } catch (err) {
        prepared.set(request.contextId, { job: request.job, error: err });
      }
      while (prepared.size > KEPT_CONTEXTS) prepared.delete(prepared.keys().next().value as number);
      return;
    }
    const entry = prepared.get(request.contextId);
    if (entry === undefined || 'error' in entry) {
      side.post(failure(request.taskId, entry === undefined ? new Error('the worker lost the task context') : entry.error), []);
      return;
    }
    const job = JOBS[request.job] as AnyJob;
    try {
      const result = job.run(entry.value, request.task);
      side.post({ type: 'done', taskId: request.taskId, result }, job.transferables(result));
    } catch (err) {
      side.post(failure(request.taskId, err), []);
    }
  });
}

/** The `failed` reply for an error: its message, and its problem when the run was refused. */
function failure(taskId: number, err: unknown): PoolReply {
  const message = err instanceof Error ? err.message : String(err);
  return err instanceof RunRefused ? { type: 'failed', taskId, message, problem: err.problem } : { type: 'failed', taskId, message };
}

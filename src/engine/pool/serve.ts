/**
 * The worker's side of a pool: prepares contexts as they arrive, keeps them until the pool says
 * to forget them, and answers each batch of tasks with one message of results (or error
 * messages), transferring the results' typed arrays. Platform-free: the worker file wires
 * `WorkerSide` to worker_threads' parentPort or to a Web Worker's `self`.
 */
import { JOBS, type Job, type JobName } from './jobs.ts';
import { RunRefused } from '../runRefusal.ts';
import type { PoolRequest, TaskReply, WorkerSide } from './protocol.ts';

type AnyJob = Job<unknown, unknown, unknown, unknown>;

export function serveJobs(side: WorkerSide): void {
  const prepared = new Map<number, { value: unknown } | { error: unknown }>();
  side.listen((request: PoolRequest) => {
    if (request.type === 'forget') {
      prepared.delete(request.contextId);
      return;
    }
    const job = JOBS[request.job as JobName] as AnyJob;
    if (request.type === 'context') {
      try {
        prepared.set(request.contextId, { value: job.prepare(request.context) });
      } catch (err) {
        prepared.set(request.contextId, { error: err });
      }
      return;
    }
    const entry = prepared.get(request.contextId);
    const replies: TaskReply[] = [];
    const transfer: ArrayBuffer[] = [];
    for (const { taskId, task } of request.tasks) {
      if (entry === undefined || 'error' in entry) {
        replies.push(failure(taskId, entry === undefined ? new Error('the worker lost the task context') : entry.error));
        continue;
      }
      try {
        const result = job.run(entry.value, task);
        replies.push({ type: 'done', taskId, result });
        transfer.push(...job.transferables(result));
      } catch (err) {
        replies.push(failure(taskId, err));
      }
    }
    side.post({ type: 'batch', replies }, transfer);
  });
}

/** The `failed` reply for an error: its message, and its problem when the run was refused. */
function failure(taskId: number, err: unknown): TaskReply {
  const message = err instanceof Error ? err.message : String(err);
  return err instanceof RunRefused ? { type: 'failed', taskId, message, problem: err.problem } : { type: 'failed', taskId, message };
}

/**
 * The worker's side of a pool: prepares contexts as they arrive and answers each task with its
 * result (or the error's message). Platform-free: the worker file wires `WorkerSide` to
 * worker_threads' parentPort or to a Web Worker's `self`.
 */
import { JOBS, type Job, type JobName } from './jobs.ts';
import type { PoolRequest, WorkerSide } from './protocol.ts';

/** Prepared contexts kept per worker (the newest ones; a map needs only its own). */
const KEPT_CONTEXTS = 4;

type AnyJob = Job<unknown, unknown, unknown, unknown>;

export function serveJobs(side: WorkerSide): void {
  const prepared = new Map<number, { job: JobName; value: unknown } | { job: JobName; error: string }>();
  side.listen((request: PoolRequest) => {
    if (request.type === 'context') {
      const job = JOBS[request.job] as AnyJob;
      try {
        prepared.set(request.contextId, { job: request.job, value: job.prepare(request.context) });
      } catch (err) {
        prepared.set(request.contextId, { job: request.job, error: messageOf(err) });
      }
      while (prepared.size > KEPT_CONTEXTS) prepared.delete(prepared.keys().next().value as number);
      return;
    }
    const entry = prepared.get(request.contextId);
    if (entry === undefined || 'error' in entry) {
      side.post({ type: 'failed', taskId: request.taskId, message: entry?.error ?? 'the worker lost the task context' }, []);
      return;
    }
    const job = JOBS[request.job] as AnyJob;
    try {
      const result = job.run(entry.value, request.task);
      side.post({ type: 'done', taskId: request.taskId, result }, job.transferables(result));
    } catch (err) {
      side.post({ type: 'failed', taskId: request.taskId, message: messageOf(err) }, []);
    }
  });
}

function messageOf(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

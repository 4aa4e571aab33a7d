/**
 * A pool of workers mapping a job over a task list: `pool.map(job, context, tasks)` resolves to
 * the results in task order, identical to `mapInline` on one thread (each task is a pure function
 * of context and task; jobs.ts). Platform-free: the caller passes `spawn`, which starts one worker
 * (worker_threads in Node: src/cli/workerThreads.ts; Web Workers in the app:
 * src/renderer/lib/engineClient.ts).
 *
 * Scheduling: tasks wait in one queue shared by every map in progress and go to the workers with
 * room, in batches (protocol.ts), breadth first (each idle worker one batch before any a second):
 * each worker holds at most PIPELINE batches, so it never waits for the next message while the
 * pool is busy, and a batch takes a share of what is queued
 * (at most MAX_BATCH tasks, down to one as the queue empties, so the workers finish together).
 * A worker receives a map's context once, before its first task of that map; a context with a
 * content key (jobs.ts `contextKey`) stays on the worker for later maps with the same key (at most
 * KEPT_CONTEXTS such per worker, the least recently used dropped first), others are dropped when
 * their map settles.
 * `onProgress(done, total)` follows every result. Aborting `signal` drops the map's queued tasks
 * and rejects it with `PoolCancelled`; tasks already on a worker finish there and are ignored.
 * A failed task rejects its map with the task's message (a refused run as the same RunRefused,
 * runRefusal.ts): the first failed task in task order, as on one thread (`mapInline`), so the map
 * waits for the tasks before it (whichever worker ran them) and drops the queued ones after it.
 */
import type { ContextOf, JobName, PreparedOf, ResultOf, TaskOf } from './jobs.ts';
import { JOBS, type Job } from './jobs.ts';
import type { PoolEndpoint, PoolReply } from './protocol.ts';
import { RunRefused } from '../runRefusal.ts';

/** Batches in flight per worker. */
const PIPELINE = 2;

/** Most tasks in one batch: enough to make the per-message cost small against a task of a millisecond. */
const MAX_BATCH = 8;

/** Contexts with a content key kept per worker. */
const KEPT_CONTEXTS = 4;

/** What the pool needs of an AbortSignal (the engine is compiled without DOM or Node types). */
export interface CancelSignal {
  readonly aborted: boolean;
  addEventListener(type: 'abort', listener: () => void, options?: { once?: boolean }): void;
  removeEventListener(type: 'abort', listener: () => void): void;
}

export interface MapOptions {
  /** Called after each result with the number of tasks done and the total. */
  onProgress?(done: number, total: number): void;
  /** Aborting it cancels the map (see the module comment). */
  signal?: CancelSignal;
}

/** The rejection of a cancelled map. */
export class PoolCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'PoolCancelled';
  }
}

interface MapState {
  contextId: number;
  /** The context's content key, or null: then the workers drop it when the map settles. */
  contextKey: string | null;
  job: JobName;
  context: unknown;
  results: unknown[];
  done: number;
  total: number;
  /** Per task, 1 once its result or failure has come back. */
  finished: Uint8Array;
  /** Every task before this index has come back. */
  finishedBelow: number;
  /** The failure of the lowest task index so far, reported once every task before it has come back. */
  failure: { index: number; error: Error } | null;
  options: MapOptions;
  settled: boolean;
  /** The map's listener on `options.signal`, removed when it settles (one signal may serve many maps). */
  onAbort: (() => void) | null;
  resolve(results: unknown[]): void;
  reject(err: Error): void;
}

interface Queued {
  map: MapState;
  index: number;
  task: unknown;
}

interface Slot {
  endpoint: PoolEndpoint;
  /** Contexts the worker holds, least recently used first. */
  contexts: Set<number>;
  inFlight: Map<number, Queued>;
  batches: number;
}

export class WorkerPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Queued[] = [];
  private nextContextId = 1;
  /** Context ids by content key. */
  private readonly keyed = new Map<string, number>();
  private nextTaskId = 1;
  private closed = false;

  /** Starts `size` workers (at least one) with `spawn`. */
  constructor(
    private readonly spawn: () => PoolEndpoint,
    size: number,
  ) {
    for (let k = 0; k < Math.max(1, Math.floor(size)); k++) this.slots.push(this.start());
  }

  get size(): number {
    return this.slots.length;
  }

  /** Runs `job` over `tasks` with `context`; the results come in task order. */
  map<N extends JobName>(job: N, context: ContextOf<N>, tasks: readonly TaskOf<N>[], options: MapOptions = {}): Promise<ResultOf<N>[]> {
    if (this.closed) return Promise.reject(new Error('the worker pool is closed'));
    if (options.signal?.aborted) return Promise.reject(new PoolCancelled());
    return new Promise<ResultOf<N>[]>((resolve, reject) => {
      const contextKey = (JOBS[job] as unknown as Job<ContextOf<N>, unknown, unknown, unknown>).contextKey?.(context) ?? null;
      let contextId = contextKey === null ? undefined : this.keyed.get(contextKey);
      if (contextId === undefined) {
        contextId = this.nextContextId++;
        if (contextKey !== null) this.keyed.set(contextKey, contextId);
      }
      const map: MapState = {
        contextId,
        contextKey,
        job,
        context,
        results: new Array<unknown>(tasks.length),
        done: 0,
        total: tasks.length,
        finished: new Uint8Array(tasks.length),
        finishedBelow: 0,
        failure: null,
        options,
        settled: false,
        onAbort: null,
        resolve: resolve as (results: unknown[]) => void,
        reject,
      };
      if (tasks.length === 0) return this.settle(map, null);
      if (options.signal !== undefined) {
        map.onAbort = () => this.settle(map, new PoolCancelled());
        options.signal.addEventListener('abort', map.onAbort, { once: true });
      }
      tasks.forEach((task, index) => this.queue.push({ map, index, task }));
      this.dispatch();
    });
  }

  /** Stops every worker; maps in progress are rejected. */
  close(): void {
    this.closed = true;
    for (const q of this.queue.splice(0)) this.settle(q.map, new Error('the worker pool is closed'));
    for (const slot of this.slots) {
      for (const q of slot.inFlight.values()) this.settle(q.map, new Error('the worker pool is closed'));
      slot.endpoint.terminate();
    }
  }

  private start(): Slot {
    const slot: Slot = { endpoint: this.spawn(), contexts: new Set(), inFlight: new Map(), batches: 0 };
    slot.endpoint.listen(
      (reply) => this.receive(slot, reply),
      (message) => this.crashed(slot, message),
    );
    return slot;
  }

  /**
   * Fills the workers breadth first: every worker gets its first batch before any gets a second,
   * so a map of fewer tasks than workers x PIPELINE (the app's handful of options on 8 workers)
   * runs one task per worker at once instead of queueing two on the first few.
   */
  private dispatch(): void {
    for (let depth = 1; depth <= PIPELINE; depth++) {
      for (const slot of this.slots) {
        if (slot.batches >= depth) continue;
        while (this.queue.length > 0 && this.queue[0].map.settled) this.queue.shift();
        if (this.queue.length === 0) return;
        this.sendBatch(slot);
      }
    }
  }

  /** Posts the head of the queue to `slot`: up to a share of what is queued, all of one map. */
  private sendBatch(slot: Slot): void {
    const { map } = this.queue[0];
    const size = Math.max(1, Math.min(MAX_BATCH, Math.floor(this.queue.length / (2 * PIPELINE * this.slots.length))));
    const tasks: { taskId: number; task: unknown }[] = [];
    while (tasks.length < size && this.queue.length > 0 && this.queue[0].map === map) {
      const next = this.queue.shift() as Queued;
      const taskId = this.nextTaskId++;
      slot.inFlight.set(taskId, next);
      tasks.push({ taskId, task: next.task });
    }
    this.provide(slot, map);
    slot.endpoint.post({ type: 'tasks', contextId: map.contextId, job: map.job, tasks });
    slot.batches++;
  }

  /** Sends `map`'s context to the worker unless it holds it; keeps at most KEPT_CONTEXTS keyed ones there. */
  private provide(slot: Slot, map: MapState): void {
    if (slot.contexts.delete(map.contextId)) {
      slot.contexts.add(map.contextId); // most recently used last
      return;
    }
    slot.endpoint.post({ type: 'context', contextId: map.contextId, job: map.job, context: map.context });
    slot.contexts.add(map.contextId);
    if (slot.contexts.size <= KEPT_CONTEXTS) return;
    for (const id of slot.contexts) {
      if (slot.contexts.size <= KEPT_CONTEXTS) break;
      if (id === map.contextId || this.inUse(slot, id)) continue;
      this.forget(slot, id);
    }
  }

  /** True while a task of context `id` is queued or on `slot`. */
  private inUse(slot: Slot, id: number): boolean {
    for (const q of slot.inFlight.values()) if (q.map.contextId === id) return true;
    return this.queue.some((q) => q.map.contextId === id);
  }

  private forget(slot: Slot, id: number): void {
    slot.contexts.delete(id);
    slot.endpoint.post({ type: 'forget', contextId: id });
    if (this.slots.every((other) => !other.contexts.has(id))) {
      for (const [key, kept] of this.keyed) if (kept === id) this.keyed.delete(key);
    }
  }

  private receive(slot: Slot, reply: PoolReply): void {
    slot.batches--;
    for (const task of reply.replies) {
      const entry = slot.inFlight.get(task.taskId);
      slot.inFlight.delete(task.taskId);
      if (entry === undefined || entry.map.settled) continue;
      const { map } = entry;
      if (task.type === 'failed') {
        this.failed(map, entry.index, task.problem === undefined ? new Error(task.message) : new RunRefused(task.problem));
      } else {
        map.results[entry.index] = task.result;
        map.done++;
        map.options.onProgress?.(map.done, map.total);
      }
      map.finished[entry.index] = 1;
      while (map.finishedBelow < map.total && map.finished[map.finishedBelow] === 1) map.finishedBelow++;
      if (map.failure !== null && map.finishedBelow >= map.failure.index) this.settle(map, map.failure.error);
      else if (map.done === map.total) this.settle(map, null);
    }
    this.dispatch();
  }

  /** Keeps the failure of the lowest task index; the queued tasks after it can no longer matter. */
  private failed(map: MapState, index: number, error: Error): void {
    if (map.failure !== null && map.failure.index < index) return;
    map.failure = { index, error };
    for (let k = this.queue.length - 1; k >= 0; k--) if (this.queue[k].map === map && this.queue[k].index > index) this.queue.splice(k, 1);
  }

  private crashed(slot: Slot, message: string): void {
    for (const q of slot.inFlight.values()) this.settle(q.map, new Error(`a worker stopped: ${message}`));
    slot.endpoint.terminate();
    const k = this.slots.indexOf(slot);
    if (k >= 0 && !this.closed) {
      this.slots[k] = this.start();
      this.dispatch();
    }
  }

  private settle(map: MapState, err: Error | null): void {
    if (map.settled) return;
    map.settled = true;
    if (map.onAbort !== null) map.options.signal?.removeEventListener('abort', map.onAbort);
    for (let k = this.queue.length - 1; k >= 0; k--) if (this.queue[k].map === map) this.queue.splice(k, 1);
    if (map.contextKey === null) for (const slot of this.slots) if (slot.contexts.has(map.contextId)) this.forget(slot, map.contextId);
    if (err === null) map.resolve(map.results);
    else map.reject(err);
  }
}

/**
 * The same map on the calling thread, one task after another: the reference a pool's results
 * must equal byte for byte, and the path for one core.
 */
export function mapInline<N extends JobName>(job: N, context: ContextOf<N>, tasks: readonly TaskOf<N>[], options: MapOptions = {}): ResultOf<N>[] {
  return mapPrepared(job, (JOBS[job] as unknown as Job<ContextOf<N>, PreparedOf<N>, TaskOf<N>, ResultOf<N>>).prepare(context), tasks, options);
}

/** `mapInline` with the context already prepared (by the job's own `prepare`). */
export function mapPrepared<N extends JobName>(job: N, prepared: PreparedOf<N>, tasks: readonly TaskOf<N>[], options: MapOptions = {}): ResultOf<N>[] {
  const j = JOBS[job] as unknown as Job<ContextOf<N>, PreparedOf<N>, TaskOf<N>, ResultOf<N>>;
  return tasks.map((task, k) => {
    if (options.signal?.aborted) throw new PoolCancelled();
    const result = j.run(prepared, task);
    options.onProgress?.(k + 1, tasks.length);
    return result;
  });
}

/**
 * How the pool talks to its workers (src/engine/pool/pool.ts, protocol.ts), counted on workers
 * that run in this thread: tasks go in batches, a scenario's prepared context stays on a worker
 * for later maps over the same revision (neither sent nor prepared again), other contexts are
 * dropped, and the results equal one thread's.
 */
import { describe, expect, it } from 'vitest';
import { mapInline, WorkerPool } from '../../src/engine/pool/pool.ts';
import type { PoolEndpoint, PoolReply, PoolRequest } from '../../src/engine/pool/protocol.ts';
import { serveJobs } from '../../src/engine/pool/serve.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';

/** Workers served in this thread (each message delivered on a later turn, as between threads), with every request counted. */
function countingPool(size: number) {
  const requests: PoolRequest[] = [];
  const replies: PoolReply[] = [];
  const spawn = (): PoolEndpoint => {
    let toWorker: ((r: PoolRequest) => void) | null = null;
    let toPool: ((r: PoolReply) => void) | null = null;
    serveJobs({
      listen: (onRequest) => (toWorker = onRequest),
      post: (reply) => {
        replies.push(reply);
        setTimeout(() => toPool?.(structuredClone(reply)), 0);
      },
    });
    return {
      post: (message) => {
        requests.push(message);
        setTimeout(() => toWorker?.(structuredClone(message)), 0);
      },
      listen: (onReply) => (toPool = onReply),
      terminate: () => {},
    };
  };
  return { pool: new WorkerPool(spawn, size), requests, replies };
}

function count(requests: PoolRequest[], type: PoolRequest['type']): number {
  return requests.filter((r) => r.type === type).length;
}

/** The demo with its options repeated, `count` in all, names numbered. */
function many(count: number, s: Scenario = demoScenario()): Scenario {
  return { ...s, options: Array.from({ length: count }, (_, k) => ({ ...s.options[k % s.options.length], name: `option ${k}` })) };
}

describe('pool scheduling', () => {
  it('sends tasks in batches and gives the results of one thread', { timeout: 60_000 }, async () => {
    const { pool, requests, replies } = countingPool(2);
    const s = many(40);
    const tasks = s.options.map((_, k) => k);
    const results = await pool.map('optionSummaries', s, tasks);
    expect(results).toStrictEqual(mapInline('optionSummaries', s, tasks));
    const batches = requests.filter((r) => r.type === 'tasks');
    expect(batches.reduce((n, b) => n + (b.type === 'tasks' ? b.tasks.length : 0), 0)).toBe(40);
    expect(batches.length).toBeLessThan(30);
    expect(Math.max(...batches.map((b) => (b.type === 'tasks' ? b.tasks.length : 0)))).toBeGreaterThan(1);
    expect(replies).toHaveLength(batches.length);
    pool.close();
  });

  it('gives every worker a task before any worker a second one', { timeout: 60_000 }, async () => {
    // The app's case: a scenario's few options on one worker per core (up to 8).
    const { pool, requests } = countingPool(8);
    const s = many(5);
    const results = await pool.map('optionSummaries', s, [0, 1, 2, 3, 4]);
    expect(results).toStrictEqual(mapInline('optionSummaries', s, [0, 1, 2, 3, 4]));
    const batches = requests.filter((r) => r.type === 'tasks');
    expect(batches.map((b) => (b.type === 'tasks' ? b.tasks.length : 0))).toStrictEqual([1, 1, 1, 1, 1]);
    // Each batch went to another worker: each of the five received the scenario.
    expect(count(requests, 'context')).toBe(5);
    pool.close();
  });

  it('rejects with the first failed task in task order, as one thread, whichever worker answers first', async () => {
    // Workers that fail every task with its own message, task 0 answered last.
    const spawn = (): PoolEndpoint => {
      let toPool: ((r: PoolReply) => void) | null = null;
      return {
        post: (message) => {
          if (message.type !== 'tasks') return;
          const replies = message.tasks.map(({ taskId, task }) => ({ type: 'failed' as const, taskId, message: `task ${String(task)} failed` }));
          setTimeout(() => toPool?.({ type: 'batch', replies }), message.tasks.some((t) => t.task === 0) ? 30 : 0);
        },
        listen: (onReply) => (toPool = onReply),
        terminate: () => {},
      };
    };
    const pool = new WorkerPool(spawn, 2);
    await expect(pool.map('optionSummaries', many(4), [0, 1, 2, 3])).rejects.toThrow('task 0 failed');
    pool.close();
  });

  it('keeps a scenario prepared on each worker across maps with the same revision', { timeout: 60_000 }, async () => {
    const { pool, requests } = countingPool(2);
    const s = many(8);
    await pool.map('optionSummaries', s, [0, 1, 2, 3, 4, 5, 6, 7]);
    expect(count(requests, 'context')).toBe(2);
    // The same content in another object, and another job reading the same prepared scenario: nothing sent again.
    await pool.map('optionSummaries', structuredClone(s), [7, 6, 5, 4, 3, 2, 1, 0]);
    await pool.map('optionRuns', s, [0, 1, 2, 3]);
    expect(count(requests, 'context')).toBe(2);
    // An edit is another revision: its context goes to the workers.
    await pool.map('optionSummaries', { ...s, horizonDays: s.horizonDays - 1 }, [0, 1, 2, 3]);
    expect(count(requests, 'context')).toBe(4);
    expect(count(requests, 'forget')).toBe(0);
    pool.close();
  });

  it('drops contexts without a key when their map settles, and keyed ones past the few it keeps', { timeout: 60_000 }, async () => {
    const { pool, requests } = countingPool(1);
    const s = many(2);
    // A job without a content key (here one whose context cannot be prepared, so its task fails): dropped when the map settles.
    await expect(pool.map('drawRuns', s, [{ from: 0, to: 1 }])).rejects.toThrow();
    expect(requests.filter((r) => r.type === 'forget').map((r) => r.contextId)).toStrictEqual(requests.filter((r) => r.type === 'context').map((r) => r.contextId));
    requests.length = 0;
    for (let k = 0; k < 6; k++) await pool.map('optionSummaries', { ...s, horizonDays: 100 + k }, [0]);
    expect(count(requests, 'context')).toBe(6);
    // Four kept: the two oldest forgotten, least recently used first.
    const forgotten = requests.filter((r) => r.type === 'forget').map((r) => r.contextId);
    const sent = requests.filter((r) => r.type === 'context').map((r) => r.contextId);
    expect(forgotten).toStrictEqual(sent.slice(0, 2));
    // The newest is still there: no context sent for it; the oldest is sent again.
    await pool.map('optionSummaries', { ...s, horizonDays: 105 }, [1]);
    expect(count(requests, 'context')).toBe(6);
    await pool.map('optionSummaries', { ...s, horizonDays: 100 }, [1]);
    expect(count(requests, 'context')).toBe(7);
    pool.close();
  });
});
